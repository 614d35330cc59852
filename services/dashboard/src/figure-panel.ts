/**
 * One figure on the page: the chart (uPlot on a canvas, redrawn as points arrive), axis labels,
 * a legend whose β entries switch their line on and off, export buttons (SVG, PNG, CSV) and
 * a data table for screen readers and keyboard users. The chart draws the same {@link Figure}
 * the SVG export and `betasweep plot` draw.
 */
import uPlot from 'uplot';
import type { Figure } from '../../plot/figure-model.js';
import { figureCsv, figureFileStem } from '../../plot/figure-csv.js';
import { formatNumber } from '../../plot/format-number.js';
import { announce, h, replace } from './dom.js';
import { download, figureSvg, svgToPng } from './export-files.js';

/** What each uPlot series is, so the legend can switch a β's line, band and check together. */
interface SeriesRole {
  role: 'beta-line' | 'trend' | 'band-edge' | 'check';
  betaIndex: number | null;
}

const WINDOW_FILL = 'rgba(143, 163, 184, 0.18)';
const DISAGREE = '#c0182b';
/** At most this many cells in the on-page data table (the CSV has everything). */
const TABLE_CELLS = 4000;

const toNull = (v: number | undefined) => (v === undefined || !Number.isFinite(v) ? null : v);

function alpha(hex: string, a: number): string {
  const n = parseInt(hex.slice(1), 16);
  return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${a})`;
}

/** uPlot options and data for a figure (pure apart from the hooks' drawing). */
function chartSetup(fig: Figure, width: number, height: number, hidden: ReadonlySet<number>, current: () => Figure) {
  const roles: SeriesRole[] = [{ role: 'trend', betaIndex: null }];
  const series: uPlot.Series[] = [{}];
  const data: (number | null)[][] = [fig.x.slice()];
  const bands: uPlot.Band[] = [];
  const xIndex = new Map(fig.x.map((x, i) => [x, i]));
  const show = (b: number | null) => b === null || !hidden.has(b);

  if (fig.check) {
    for (const c of fig.check.lines) {
      const aligned = fig.x.map(() => null as number | null);
      c.x.forEach((x, i) => { const k = xIndex.get(x); if (k !== undefined) aligned[k] = toNull(c.y[i]); });
      series.push({ label: 'series check', stroke: c.colour, width: 1.5, dash: [5, 4], points: { show: false }, show: show(c.betaIndex), spanGaps: false });
      roles.push({ role: 'check', betaIndex: c.betaIndex });
      data.push(aligned);
    }
  }
  for (const l of fig.lines) {
    if (l.lo && l.hi) {
      const hiIdx = series.length;
      series.push({ label: `${l.name} upper`, stroke: 'transparent', width: 0, points: { show: false }, show: show(l.betaIndex) });
      roles.push({ role: 'band-edge', betaIndex: l.betaIndex });
      data.push(l.hi.map(toNull));
      series.push({ label: `${l.name} lower`, stroke: 'transparent', width: 0, points: { show: false }, show: show(l.betaIndex) });
      roles.push({ role: 'band-edge', betaIndex: l.betaIndex });
      data.push(l.lo.map(toNull));
      bands.push({ series: [hiIdx, hiIdx + 1], fill: alpha(l.colour, 0.18) });
    }
  }
  for (const l of fig.lines) {
    series.push({
      label: l.name, stroke: l.colour, width: fig.kind === 'thermo' ? 1.5 : 2, points: { show: false }, show: show(l.betaIndex),
    });
    roles.push({ role: l.betaIndex === null ? 'trend' : 'beta-line', betaIndex: l.betaIndex });
    data.push(l.y.map(toNull));
  }

  // The hooks outlive this call (new data reuses the chart): they read the figure shown now.
  const drawWindow = (u: uPlot) => {
    const w = current().check?.window;
    if (!w) return;
    const ctx = u.ctx;
    const x0 = u.valToPos(w.from, 'x', true);
    const x1 = u.valToPos(w.to, 'x', true);
    const pad = x1 - x0 < 4 ? 2 * devicePixelRatio : 0;
    ctx.save();
    ctx.fillStyle = WINDOW_FILL;
    ctx.fillRect(Math.max(u.bbox.left, x0 - pad), u.bbox.top, Math.min(x1 + pad, u.bbox.left + u.bbox.width) - Math.max(u.bbox.left, x0 - pad), u.bbox.height);
    ctx.restore();
  };
  const drawMarks = (u: uPlot) => {
    const ctx = u.ctx;
    const dpr = devicePixelRatio;
    ctx.save();
    const now = current();
    for (const m of now.markers) {
      if (!show(m.betaIndex)) continue;
      const cx = u.valToPos(m.x, 'x', true);
      const cy = u.valToPos(m.y, 'y', true);
      if (m.lo !== null && m.hi !== null) {
        ctx.strokeStyle = m.colour;
        ctx.lineWidth = 1.5 * dpr;
        ctx.beginPath();
        ctx.moveTo(cx, u.valToPos(m.lo, 'y', true));
        ctx.lineTo(cx, u.valToPos(m.hi, 'y', true));
        ctx.stroke();
      }
      ctx.fillStyle = m.colour;
      ctx.strokeStyle = 'white';
      ctx.lineWidth = 1 * dpr;
      ctx.beginPath();
      ctx.arc(cx, cy, 4.5 * dpr, 0, 2 * Math.PI);
      ctx.fill();
      ctx.stroke();
    }
    for (const d of now.check?.disagree ?? []) {
      if (!show(d.betaIndex) || !Number.isFinite(d.y)) continue;
      const cx = u.valToPos(d.x, 'x', true);
      const cy = u.valToPos(d.y, 'y', true);
      const r = 4 * dpr;
      ctx.strokeStyle = DISAGREE;
      ctx.lineWidth = 2 * dpr;
      ctx.beginPath();
      ctx.moveTo(cx - r, cy - r); ctx.lineTo(cx + r, cy + r);
      ctx.moveTo(cx - r, cy + r); ctx.lineTo(cx + r, cy - r);
      ctx.stroke();
    }
    ctx.restore();
  };

  const axis: uPlot.Axis = { stroke: '#3b4048', grid: { stroke: '#e4e7eb', width: 1 }, ticks: { stroke: '#c9ced4', width: 1 }, font: '11px system-ui, sans-serif' };
  const opts: uPlot.Options = {
    width,
    height,
    series,
    bands,
    legend: { show: false },
    cursor: { drag: { x: false, y: false }, points: { show: false } },
    scales: { x: { time: false } },
    axes: [{ ...axis }, { ...axis, size: 64 }],
    hooks: { drawAxes: [drawWindow], draw: [drawMarks] },
    padding: [12, 16, 0, 0],
  };
  return { opts, data: data as uPlot.AlignedData, roles };
}

/** Which structure a figure needs; a change means a new chart instead of new data. */
const signature = (fig: Figure) =>
  `${fig.x.length}|${fig.lines.map((l) => l.key + (l.lo ? '+' : '')).join(',')}|${fig.check?.lines.map((c) => c.key).join(',') ?? '-'}` +
  `|${fig.check?.disagree.length ? 'x' : ''}|${fig.markers.some((m) => m.lo !== null) ? 'bars' : ''}`;

/** One figure's panel; call {@link FigurePanel.update} with each new figure of the same id. */
export class FigurePanel {
  readonly el: HTMLElement;
  private fig: Figure;
  private chart: uPlot | null = null;
  private roles: SeriesRole[] = [];
  private sig = '';
  private readonly hidden = new Set<number>();
  private readonly chartBox: HTMLDivElement;
  private readonly note: HTMLElement;
  private readonly legend: HTMLUListElement;
  private readonly table: HTMLDetailsElement;
  private readonly observer: ResizeObserver;

  constructor(fig: Figure, private readonly fileStem: string) {
    this.fig = fig;
    const capId = `cap-${figureFileStem(fig)}`;
    this.note = h('p', { class: 'fig-note' });
    this.chartBox = h('div', { class: 'chart', role: 'img' });
    this.legend = h('ul', { class: 'legend', 'aria-label': `Legend of ${fig.title}: inverse temperatures β` });
    this.table = h('details', { class: 'data-table' }, h('summary', {}, 'Data table'));
    this.table.addEventListener('toggle', () => this.renderTable());
    const exportGroup = h('div', { class: 'fig-actions', role: 'group', 'aria-label': `Export ${fig.title}` },
      h('span', { class: 'fig-actions-label', 'aria-hidden': 'true' }, 'Export'),
      h('button', { type: 'button', class: 'export-svg', onclick: () => this.exportSvg(), 'aria-label': `Save ${fig.title} as SVG` }, 'SVG'),
      h('button', { type: 'button', class: 'export-png', onclick: () => void this.exportPng(), 'aria-label': `Save ${fig.title} as PNG` }, 'PNG'),
      h('button', { type: 'button', class: 'export-csv', onclick: () => this.exportCsv(), 'aria-label': `Save the data of ${fig.title} as CSV` }, 'CSV'),
    );
    this.el = h('figure', { class: `fig fig-${fig.kind}`, 'aria-labelledby': capId, 'data-figure': fig.id },
      h('figcaption', { id: capId }, fig.title),
      this.note,
      h('div', { class: 'fig-body' },
        h('div', { class: 'plot-area' },
          h('div', { class: 'axis-label axis-label-y', 'aria-hidden': 'true' }, `↑ ${fig.yLabel}`),
          this.chartBox,
          h('div', { class: 'axis-label axis-label-x', 'aria-hidden': 'true' }, `${fig.xLabel} →`),
        ),
        this.legend,
      ),
      exportGroup,
      this.table,
    );
    this.observer = new ResizeObserver(() => this.resize());
    this.observer.observe(this.chartBox);
    this.update(fig);
  }

  private size(): { width: number; height: number } {
    const width = Math.max(240, Math.floor(this.chartBox.clientWidth || 600));
    const height = width < 480 ? 220 : this.fig.kind === 'thermo' ? 230 : 280;
    return { width, height };
  }

  private resize(): void {
    if (!this.chart) return;
    const { width, height } = this.size();
    if (Math.abs(this.chart.width - width) > 1 || this.chart.height !== height) this.chart.setSize({ width, height });
  }

  /** Shows a new state of the figure (same id). */
  update(fig: Figure): void {
    this.fig = fig;
    this.note.textContent = fig.checkNote;
    const lines = fig.lines.filter((l) => l.betaIndex !== null).length;
    const filled = fig.lines.reduce((n, l) => n + l.y.filter(Number.isFinite).length, 0);
    this.chartBox.setAttribute('aria-label',
      `${fig.kind === 'series' ? 'Line chart' : 'Chart'} of ${fig.yLabel} against ${fig.xLabel}: ` +
      (fig.kind === 'series' ? `${lines} lines, one per β (${fig.legend.map((l) => formatNumber(l.beta)).join(', ')})` : `one marker per β (${fig.markers.length} of ${fig.legend.length})`) +
      `; ${filled} values. ${fig.checkNote}. The data table below lists every value.`);
    const { width, height } = this.size();
    const sig = signature(fig);
    const { opts, data, roles } = chartSetup(fig, width, height, this.hidden, () => this.fig);
    if (!this.chart || sig !== this.sig) {
      this.chart?.destroy();
      this.chartBox.replaceChildren();
      this.chart = new uPlot(opts, data, this.chartBox);
      this.chart.root.setAttribute('aria-hidden', 'true');
      this.roles = roles;
      this.sig = sig;
      this.renderLegend();
    } else {
      this.chart.setData(data);
    }
    this.chartBox.dataset.lines = String(this.roles.filter((r, i) => r.role === 'beta-line' && this.chart!.series[i].show).length);
    this.chartBox.dataset.points = String(filled);
    if (this.table.open) this.renderTable();
  }

  private renderLegend(): void {
    const fig = this.fig;
    const items: HTMLElement[] = fig.legend.map((l) => {
      const on = !this.hidden.has(l.betaIndex);
      const button = h('button', {
        type: 'button', class: 'legend-entry', 'aria-pressed': String(on), 'data-beta': l.beta,
        title: `Show or hide ${l.name}`,
        onclick: () => {
          if (this.hidden.has(l.betaIndex)) this.hidden.delete(l.betaIndex);
          else this.hidden.add(l.betaIndex);
          const visible = !this.hidden.has(l.betaIndex);
          button.setAttribute('aria-pressed', String(visible));
          this.roles.forEach((r, i) => { if (r.betaIndex === l.betaIndex) this.chart?.setSeries(i, { show: visible }); });
          this.chart?.redraw();
          this.chartBox.dataset.lines = String(this.roles.filter((r, i) => r.role === 'beta-line' && this.chart!.series[i].show).length);
          announce(`${l.name} ${visible ? 'shown' : 'hidden'}`);
        },
      },
      h('span', { class: `swatch swatch-${fig.kind === 'series' ? 'line' : 'dot'}`, style: `--swatch: ${l.colour}`, 'aria-hidden': 'true' }),
      l.name);
      return h('li', {}, button);
    });
    const extra = (cls: string, text: string) => h('li', { class: 'legend-extra' }, h('span', { class: `swatch ${cls}`, 'aria-hidden': 'true' }), text);
    if (fig.lines.some((l) => l.lo) || fig.markers.some((m) => m.lo !== null)) items.push(extra('swatch-band', 'error estimate'));
    if (fig.check?.lines.length) {
      items.push(extra('swatch-dash', 'series check'));
      items.push(extra('swatch-window', 'trust window'));
    }
    if (fig.check?.disagree.length) items.push(extra('swatch-cross', 'disagrees with series'));
    replace(this.legend, ...items);
  }

  private renderTable(): void {
    if (!this.table.open) return;
    const fig = this.fig;
    const caption = h('caption', {}, `${fig.title}: values by ${fig.xLabel} (rows) and β (columns)`);
    const cols = fig.kind === 'series' ? fig.legend : [];
    if (fig.x.length * Math.max(1, cols.length) > TABLE_CELLS) {
      replace(this.table, h('summary', {}, 'Data table'), h('p', {}, `Too many values to list here (${fig.x.length} × ${cols.length}); save the CSV instead.`));
      return;
    }
    const head = fig.kind === 'series'
      ? h('tr', {}, h('th', { scope: 'col' }, fig.xLabel), ...cols.map((l) => h('th', { scope: 'col' }, l.name)))
      : h('tr', {}, h('th', { scope: 'col' }, 'β'), h('th', { scope: 'col' }, fig.yLabel), h('th', { scope: 'col' }, 'error'));
    const rows = fig.x.map((x, i) => {
      if (fig.kind === 'series') {
        return h('tr', {}, h('th', { scope: 'row' }, formatNumber(x)), ...fig.lines.map((l) => {
          const v = l.y[i];
          return h('td', {}, Number.isFinite(v) ? formatNumber(v, 6) : '—');
        }));
      }
      const m = fig.markers.find((k) => k.betaIndex === i);
      const err = m && m.lo !== null && m.hi !== null ? formatNumber((m.hi - m.lo) / 2, 3) : '—';
      return h('tr', {}, h('th', { scope: 'row' }, formatNumber(x)), h('td', {}, m ? formatNumber(m.y, 6) : '—'), h('td', {}, err));
    });
    replace(this.table, h('summary', {}, 'Data table'),
      h('div', { class: 'table-scroll', tabindex: '0', role: 'region', 'aria-label': `Data of ${fig.title}` },
        h('table', {}, caption, h('thead', {}, head), h('tbody', {}, ...rows))));
  }

  private exportSvg(): void {
    download(new Blob([figureSvg(this.fig)], { type: 'image/svg+xml' }), `${this.fileStem}-${figureFileStem(this.fig)}.svg`);
    announce(`Saved ${this.fig.title} as SVG`);
  }

  private async exportPng(): Promise<void> {
    try {
      download(await svgToPng(figureSvg(this.fig)), `${this.fileStem}-${figureFileStem(this.fig)}.png`);
      announce(`Saved ${this.fig.title} as PNG`);
    } catch (err) {
      announce(`Could not make the PNG: ${(err as Error).message}`);
    }
  }

  private exportCsv(): void {
    download(new Blob([figureCsv(this.fig)], { type: 'text/csv' }), `${this.fileStem}-${figureFileStem(this.fig)}.csv`);
    announce(`Saved the data of ${this.fig.title} as CSV`);
  }

  /** Stops observing and frees the chart. */
  destroy(): void {
    this.observer.disconnect();
    this.chart?.destroy();
    this.chart = null;
  }
}
