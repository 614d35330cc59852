import { Resvg } from '@resvg/resvg-js';
import { parseHTML } from 'linkedom';
import { describe, expect, it } from 'vitest';
import { buildFigures, renderFigureSvg, renderFiguresSvg, temperatureColours } from '../../../services/plot/index.js';
import { nodeDocument } from '../../../services/plot/render-in-node.js';
import { BETAS, checkReport, plotData } from './fixtures.js';

function parse(svg: string) {
  return parseHTML(`<!doctype html><html><body>${svg}</body></html>`).document;
}

describe('renderFigureSvg', () => {
  describe('when drawing a time-series figure', () => {
    const [fig] = buildFigures(plotData(), { check: checkReport() });
    const svg = renderFigureSvg(fig, { document: nodeDocument() });
    const doc = parse(svg);

    it('should draw exactly one path per β, each labelled and in its colour', () => {
      const paths = [...doc.querySelectorAll('g.bsw-beta-lines path')];
      expect(paths.map((p) => p.getAttribute('aria-label'))).toEqual(['β = 0 (T = ∞)', 'β = 0.5 (T = 2)', 'β = 2 (T = 0.5)']);
      expect(paths.map((p) => p.getAttribute('stroke'))).toEqual(temperatureColours(BETAS));
      for (const p of paths) expect(p.getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+(L[\d.]+,[\d.]+){3}$/);
    });

    it('should carry a legend entry per β and label both axes', () => {
      const entries = [...doc.querySelectorAll('g.bsw-legend-entry')];
      expect(entries.map((e) => e.textContent)).toEqual(['β = 0 (T = ∞)', 'β = 0.5 (T = 2)', 'β = 2 (T = 0.5)']);
      expect(entries.map((e) => e.getAttribute('data-beta'))).toEqual(['0', '0.5', '2']);
      expect(doc.querySelector('g[aria-label="x-axis label"]')?.textContent).toBe('time t →');
      expect(doc.querySelector('g[aria-label="y-axis label"]')?.textContent).toBe('↑ ⟨X⟩, site average');
    });

    it('should overlay the series check: dashed lines, the shaded trust window and the disagreement', () => {
      expect(doc.querySelectorAll('g.bsw-check-lines path').length).toBeGreaterThanOrEqual(2);
      expect(doc.querySelector('g.bsw-check-lines')?.getAttribute('stroke-dasharray')).toBe('5,4');
      expect(doc.querySelectorAll('g.bsw-trust-window rect')).toHaveLength(1);
      expect(doc.querySelectorAll('g.bsw-check-disagree path')).toHaveLength(1);
      expect([...doc.querySelectorAll('g.bsw-legend-extra')].map((e) => e.textContent)).toEqual(['series check', 'trust window', 'disagrees with series']);
    });

    it('should be a titled, described, well-formed SVG document that resvg can draw', () => {
      expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
      expect(doc.querySelector('title')?.textContent).toBe('⟨X⟩, site average after the quench');
      expect(doc.querySelector('desc')?.textContent).toContain('3 inverse temperatures');
      // resvg parses strictly (roxmltree): a malformed document throws here.
      const png = new Resvg(svg).render();
      expect(png.width).toBe(760);
    });
  });

  describe('when the errors are visible', () => {
    it('should draw a band per β under the lines', () => {
      const fig = buildFigures(plotData())[1];
      const doc = parse(renderFigureSvg(fig, { document: nodeDocument() }));
      expect(doc.querySelectorAll('g.bsw-error-bands path')).toHaveLength(3);
      expect(doc.querySelectorAll('g.bsw-check-lines')).toHaveLength(0);
    });
  });

  describe('when drawing a thermodynamics figure', () => {
    it('should draw one marker per β in its colour on a neutral line', () => {
      const fig = buildFigures(plotData())[2];
      const doc = parse(renderFigureSvg(fig, { document: nodeDocument() }));
      expect([...doc.querySelectorAll('g.bsw-beta-markers circle')].map((c) => c.getAttribute('fill'))).toEqual(temperatureColours(BETAS));
      expect(doc.querySelectorAll('g.bsw-trend-line path')).toHaveLength(1);
      expect(doc.querySelector('g[aria-label="x-axis label"]')?.textContent).toBe('inverse temperature β →');
    });
  });

  describe('when the figure is narrow', () => {
    it('should put the legend under the plot', () => {
      const [fig] = buildFigures(plotData());
      const svg = renderFigureSvg(fig, { document: nodeDocument(), width: 400 });
      const doc = parse(svg);
      const y = Number(doc.querySelector('g.bsw-legend-entry text')?.getAttribute('y'));
      expect(y).toBeGreaterThan(48 + 300);
      expect(svg).toMatch(/^<svg[^>]* width="400"/);
    });
  });
});

describe('renderFiguresSvg', () => {
  it('should stack every figure in one document under a heading', () => {
    const figures = buildFigures(plotData());
    const doc = parse(renderFiguresSvg(figures, { document: nodeDocument(), heading: 'fixture' }));
    expect([...doc.querySelectorAll('svg.bsw-figure')].map((s) => s.getAttribute('data-figure'))).toEqual(figures.map((f) => f.id));
    expect(doc.querySelector('text.bsw-heading')?.textContent).toBe('fixture');
    const ys = [...doc.querySelectorAll('svg.bsw-figure')].map((s) => Number(s.getAttribute('y')));
    expect(ys).toEqual([...ys].sort((a, b) => a - b));
    expect(new Set(ys).size).toBe(ys.length);
  });
});
