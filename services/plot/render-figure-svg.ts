/**
 * Draws a {@link Figure} as a standalone SVG document with Observable Plot: title, axes with
 * labels, one path per β (group `bsw-beta-lines`, each path labelled "β = …"), error bands,
 * the series check (dashed, inside the shaded trust window; disagreements as crosses) and a
 * legend inside the SVG (group `bsw-legend`, one `bsw-legend-entry` per β). Runs wherever a
 * DOM `document` is at hand: the browser's, or linkedom's in Node (`betasweep plot`).
 */
import * as Plot from '@observablehq/plot';
import type { Figure } from './figure-model.js';

/** Options of {@link renderFigureSvg}. */
export interface RenderSvgOptions {
  /** A DOM document to build Plot's elements in (the page's, or linkedom's). */
  document: Document;
  /** Width of the whole figure, px. @defaultValue 760 */
  width?: number;
  /** Height of the plot frame with its axes, px. @defaultValue 300 */
  plotHeight?: number;
}

/** Font stack for exports: the first two are what resvg and Debian have; the rest for browsers. */
export const SVG_FONT = "'DejaVu Sans', 'Liberation Sans', system-ui, sans-serif";

const SVG_NS = 'http://www.w3.org/2000/svg';
const TITLE_HEIGHT = 48;
const LEGEND_WIDTH = 190;
const LEGEND_ROW = 18;
/** Below this width the legend goes under the plot instead of beside it. */
const NARROW = 560;

/** Escapes text for XML content and attribute values. */
export function escapeXml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

function serialize(el: Element): string {
  const Serializer = (globalThis as { XMLSerializer?: new () => { serializeToString(n: Node): string } }).XMLSerializer;
  const text = Serializer ? new Serializer().serializeToString(el) : el.outerHTML;
  // HTML serializers may write named entities XML does not know.
  return text.replace(/&nbsp;/g, '&#160;');
}

interface Row { key: string; x: number; y: number; lo?: number; hi?: number; colour: string; label: string }

/** Plot's marks for one figure. */
function marks(fig: Figure): Plot.Markish[] {
  const out: Plot.Markish[] = [];
  if (fig.check?.window) {
    const w = fig.check.window;
    const pad = w.from === w.to ? (Math.max(...fig.x) - Math.min(...fig.x) || 1) * 0.01 : 0;
    out.push(Plot.rectX([{ x1: w.from - pad, x2: w.to + pad }], {
      x1: 'x1', x2: 'x2', fill: '#8fa3b8', fillOpacity: 0.16, className: 'bsw-trust-window',
      ariaLabel: () => `trust window of the series check: ${w.from} to ${w.to}`,
    }));
  }
  const bandRows: Row[] = [];
  const lineRows: Row[] = [];
  for (const l of fig.lines) {
    fig.x.forEach((x, i) => {
      const y = l.y[i];
      lineRows.push({ key: l.key, x, y: Number.isFinite(y) ? y : NaN, colour: l.colour, label: l.name });
      if (l.lo && l.hi && Number.isFinite(l.lo[i]) && Number.isFinite(l.hi[i])) {
        bandRows.push({ key: l.key, x, y, lo: l.lo[i], hi: l.hi[i], colour: l.colour, label: l.name });
      }
    });
  }
  if (bandRows.length) {
    out.push(Plot.areaY(bandRows, { x: 'x', y1: 'lo', y2: 'hi', z: 'key', fill: 'colour', fillOpacity: 0.18, className: 'bsw-error-bands' }));
  }
  if (fig.check) {
    const rows: Row[] = [];
    const bands: Row[] = [];
    for (const c of fig.check.lines) {
      c.x.forEach((x, i) => {
        rows.push({ key: c.key, x, y: c.y[i], colour: c.colour, label: 'series check' });
        bands.push({ key: c.key, x, y: c.y[i], lo: c.lo[i], hi: c.hi[i], colour: c.colour, label: 'series check' });
      });
    }
    if (bands.length) out.push(Plot.areaY(bands, { x: 'x', y1: 'lo', y2: 'hi', z: 'key', fill: 'colour', fillOpacity: 0.1, clip: true, className: 'bsw-check-bands' }));
    if (rows.length) {
      out.push(Plot.line(rows, {
        x: 'x', y: 'y', z: 'key', stroke: 'colour', strokeWidth: 1.5, strokeDasharray: '5,4', clip: true, className: 'bsw-check-lines',
        ariaLabel: (d: Row) => `series check, ${d.key}`,
      }));
    }
  }
  out.push(Plot.line(lineRows, {
    x: 'x', y: 'y', z: 'key', stroke: 'colour', strokeWidth: fig.kind === 'thermo' ? 1.5 : 2,
    className: fig.kind === 'series' ? 'bsw-beta-lines' : 'bsw-trend-line', ariaLabel: (d: Row) => d.label,
  }));
  if (fig.markers.length) {
    const bars = fig.markers.filter((m) => m.lo !== null && m.hi !== null);
    if (bars.length) {
      out.push(Plot.ruleX(bars, { x: 'x', y1: 'lo', y2: 'hi', stroke: 'colour', strokeWidth: 1.5, className: 'bsw-error-bars' }));
    }
    out.push(Plot.dot(fig.markers, {
      x: 'x', y: 'y', fill: 'colour', stroke: 'white', r: 4.5, className: 'bsw-beta-markers',
      ariaLabel: (m: Figure['markers'][number]) => fig.legend[m.betaIndex]?.name ?? '',
    }));
  }
  if (fig.check?.disagree.length) {
    out.push(Plot.dot(fig.check.disagree, {
      x: 'x', y: 'y', symbol: 'times', stroke: '#c0182b', strokeWidth: 2, r: 5, className: 'bsw-check-disagree',
    }));
  }
  return out;
}

interface LegendItem { kind: 'line' | 'dot' | 'dash' | 'area' | 'cross'; colour: string; text: string; beta?: number; cls: string }

function legendItems(fig: Figure): LegendItem[] {
  const items: LegendItem[] = fig.legend.map((l) => ({
    kind: fig.kind === 'series' ? 'line' : 'dot', colour: l.colour, text: l.name, beta: l.beta, cls: 'bsw-legend-entry',
  }));
  if (fig.lines.some((l) => l.lo) || fig.markers.some((m) => m.lo !== null)) {
    items.push({ kind: 'area', colour: '#777777', text: 'error estimate', cls: 'bsw-legend-extra' });
  }
  if (fig.check?.lines.length) {
    items.push({ kind: 'dash', colour: '#555555', text: 'series check', cls: 'bsw-legend-extra' });
    items.push({ kind: 'area', colour: '#8fa3b8', text: 'trust window', cls: 'bsw-legend-extra' });
  }
  if (fig.check?.disagree.length) items.push({ kind: 'cross', colour: '#c0182b', text: 'disagrees with series', cls: 'bsw-legend-extra' });
  return items;
}

function legendSvg(items: LegendItem[], x0: number, y0: number, columns: number, columnWidth: number): string {
  const parts = items.map((it, i) => {
    const x = x0 + (i % columns) * columnWidth;
    const y = y0 + Math.floor(i / columns) * LEGEND_ROW;
    let swatch: string;
    switch (it.kind) {
      case 'line': swatch = `<line x1="${x}" x2="${x + 22}" y1="${y}" y2="${y}" stroke="${it.colour}" stroke-width="3"/>`; break;
      case 'dash': swatch = `<line x1="${x}" x2="${x + 22}" y1="${y}" y2="${y}" stroke="${it.colour}" stroke-width="1.5" stroke-dasharray="5,4"/>`; break;
      case 'dot': swatch = `<circle cx="${x + 11}" cy="${y}" r="5" fill="${it.colour}"/>`; break;
      case 'cross': swatch = `<path d="M${x + 7},${y - 4}L${x + 15},${y + 4}M${x + 7},${y + 4}L${x + 15},${y - 4}" stroke="${it.colour}" stroke-width="2"/>`; break;
      default: swatch = `<rect x="${x}" y="${y - 6}" width="22" height="12" fill="${it.colour}" fill-opacity="0.3"/>`;
    }
    const beta = it.beta === undefined ? '' : ` data-beta="${it.beta}"`;
    return `<g class="${it.cls}"${beta} role="listitem" aria-label="${escapeXml(it.text)}">${swatch}` +
      `<text x="${x + 28}" y="${y}" dy="0.35em" font-size="12">${escapeXml(it.text)}</text></g>`;
  });
  return `<g class="bsw-legend" role="list" aria-label="Legend: inverse temperature β" text-anchor="start">${parts.join('')}</g>`;
}

/** The figure as an SVG document (a string starting with `<svg`). */
export function renderFigureSvg(fig: Figure, options: RenderSvgOptions): string {
  const { document, width = 760, plotHeight = 300 } = options;
  const narrow = width < NARROW;
  const items = legendItems(fig);
  const plotWidth = narrow ? width : width - LEGEND_WIDTH;
  const columns = narrow ? Math.max(1, Math.floor((width - 16) / 170)) : 1;
  const legendRows = Math.ceil(items.length / columns);
  const plot = Plot.plot({
    document,
    width: plotWidth,
    height: plotHeight,
    marginLeft: 64,
    marginRight: 16,
    marginBottom: 40,
    style: { fontFamily: SVG_FONT, fontSize: '11px', background: 'white', color: '#1d2127' },
    x: { label: `${fig.xLabel} →`, labelAnchor: 'right', grid: true, nice: false },
    y: { label: `↑ ${fig.yLabel}`, grid: true },
    marks: marks(fig),
  }) as unknown as Element;
  const plotSvg = serialize(plot).replace(/^<svg\b/, `<svg x="0" y="${TITLE_HEIGHT}"`);
  const legendTop = narrow ? TITLE_HEIGHT + plotHeight + 18 : TITLE_HEIGHT + 16;
  const legend = legendSvg(items, narrow ? 16 : plotWidth + 12, legendTop, columns, narrow ? Math.floor((width - 16) / columns) : LEGEND_WIDTH);
  const height = Math.max(TITLE_HEIGHT + plotHeight + 8, legendTop + legendRows * LEGEND_ROW + 4);
  const titleId = `t-${fig.id.replace(/[^A-Za-z0-9_-]/g, '_')}`;
  const desc = `${fig.title}: ${fig.legend.length} inverse temperature${fig.legend.length === 1 ? '' : 's'}; x axis ${fig.xLabel}, y axis ${fig.yLabel}. ${fig.checkNote}.`;
  return `<svg xmlns="${SVG_NS}" class="bsw-figure" data-figure="${escapeXml(fig.id)}" width="${width}" height="${height}" ` +
    `viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${titleId}" font-family="${escapeXml(SVG_FONT)}">` +
    `<title id="${titleId}">${escapeXml(fig.title)}</title><desc>${escapeXml(desc)}</desc>` +
    `<rect width="${width}" height="${height}" fill="white"/>` +
    `<text class="bsw-figure-title" x="16" y="22" font-size="15" font-weight="bold" fill="#1d2127">${escapeXml(fig.title)}</text>` +
    `<text class="bsw-figure-note" x="16" y="40" font-size="11" fill="#4a4f57">${escapeXml(fig.checkNote)}</text>` +
    plotSvg + legend + '</svg>';
}

/**
 * Several figures stacked in one SVG document (what `betasweep plot` writes by default), with
 * the sweep's label as a heading.
 */
export function renderFiguresSvg(figures: Figure[], options: RenderSvgOptions & { heading?: string }): string {
  const { width = 760, heading } = options;
  const parts: string[] = [];
  let y = 0;
  if (heading) {
    parts.push(`<text class="bsw-heading" x="16" y="28" font-size="18" font-weight="bold" fill="#1d2127">${escapeXml(heading)}</text>`);
    y = 44;
  }
  for (const fig of figures) {
    const svg = renderFigureSvg(fig, options);
    const h = Number(/\bheight="(\d+(?:\.\d+)?)"/.exec(svg)?.[1] ?? 0);
    parts.push(svg.replace(/^<svg xmlns="[^"]*"/, `<svg x="0" y="${y}"`));
    y += h + 12;
  }
  return `<svg xmlns="${SVG_NS}" width="${width}" height="${y}" viewBox="0 0 ${width} ${y}" role="document" ` +
    `font-family="${escapeXml(SVG_FONT)}"><rect width="${width}" height="${y}" fill="white"/>${parts.join('')}</svg>`;
}
