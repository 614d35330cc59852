import { describe, expect, it } from 'vitest';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';
import {
  BAND_MIN_FRACTION, CHECK_UNAVAILABLE, CheckReportBody, buildFigures, describeSeries, formatBeta, plotDataFromResult, temperatureColours, usableCheck,
} from '../../../services/plot/index.js';
import { BETAS, TIMES, checkReport, plotData } from './fixtures.js';

describe('buildFigures', () => {
  describe('when given a finished sweep without a cross-check', () => {
    const figures = buildFigures(plotData());

    it('should make one time-series figure per series, then four thermodynamics figures', () => {
      expect(figures.map((f) => f.id)).toEqual([
        'series:X:avg', 'series:ZZ:nearest~conn', 'thermo:energy', 'thermo:heatCapacity', 'thermo:entropy', 'thermo:freeEnergy',
      ]);
    });

    it('should draw one line per β, named and coloured on the temperature scale', () => {
      const f = figures[0];
      expect(f.lines.map((l) => l.betaIndex)).toEqual([0, 1, 2]);
      expect(f.lines.map((l) => l.colour)).toEqual(temperatureColours(BETAS));
      expect(f.legend.map((l) => l.name)).toEqual(['β = 0 (T = ∞)', 'β = 0.5 (T = 2)', 'β = 2 (T = 0.5)']);
      expect(f.x).toEqual(TIMES);
      expect(f.lines[2].y).toEqual(plotData().series[0].values[2]);
      expect(f.xLabel).toBe('time t');
      expect(f.yLabel).toBe('⟨X⟩, site average');
    });

    it('should add error bands only where the errors are visible at plot scale', () => {
      expect(figures[0].lines.every((l) => l.lo === null && l.hi === null)).toBe(true);
      const zz = figures[1].lines[1];
      expect(zz.lo).toEqual(zz.y.map((v) => v - 0.02));
      expect(zz.hi).toEqual(zz.y.map((v) => v + 0.02));
    });

    it('should put the thermodynamics per site against β, one marker per β in its colour', () => {
      const e = figures[2];
      expect(e.x).toEqual(BETAS);
      expect(e.lines).toHaveLength(1);
      expect(e.lines[0].y).toEqual([0, -0.5, -2]);
      expect(e.markers.map((m) => [m.x, m.y, m.colour])).toEqual([[0, 0, temperatureColours(BETAS)[0]], [0.5, -0.5, temperatureColours(BETAS)[1]], [2, -2, temperatureColours(BETAS)[2]]]);
      // F = −ln Z/β has no value at β = 0: no marker there.
      expect(figures[5].markers.map((m) => m.betaIndex)).toEqual([1, 2]);
    });

    it('should say the cross-check is not available', () => {
      for (const f of figures) {
        expect(f.check).toBeNull();
        expect(f.checkNote).toBe(CHECK_UNAVAILABLE);
      }
    });
  });

  describe('when points are still arriving', () => {
    it('should keep missing values as NaN and draw no thermodynamics before the first β', () => {
      const data = plotData();
      data.series[0].values[1][3] = Number.NaN;
      data.thermo = [];
      const figures = buildFigures(data);
      expect(figures.map((f) => f.kind)).toEqual(['series', 'series']);
      expect(figures[0].lines[1].y[3]).toBeNaN();
    });
  });

  describe('when the band threshold is reached', () => {
    it('should draw a band just above BAND_MIN_FRACTION of the y-range and none just below', () => {
      const data = plotData();
      const values = data.series[0].values.flat();
      const range = Math.max(...values) - Math.min(...values);
      const withError = (e: number) => {
        data.series[0].errors = data.series[0].errors.map((row) => row.map(() => e));
        return buildFigures(data)[0].lines[0].lo !== null;
      };
      expect(withError(BAND_MIN_FRACTION * range * 1.01)).toBe(true);
      expect(withError(BAND_MIN_FRACTION * range * 0.99)).toBe(false);
    });
  });

  describe('when a cross-check report is given', () => {
    const figures = buildFigures(plotData(), { check: checkReport() });

    it('should draw the series values of each β only inside its trust window, broken outside', () => {
      const c = figures[0].check!;
      expect(c.lines.map((l) => l.betaIndex)).toEqual([0, 1]);
      expect(c.lines[0].y.every(Number.isFinite)).toBe(true);
      expect(c.lines[1].y.map(Number.isFinite)).toEqual([true, true, false, false]);
      expect(c.lines[1].lo[0]).toBeCloseTo(c.lines[1].y[0] - 1e-4, 12);
      expect(c.window).toEqual({ from: 0, to: 1.5 });
    });

    it('should mark each disagreement at the engine value and count the verdicts', () => {
      const c = figures[0].check!;
      expect(c.disagree).toEqual([{ x: 0.5, y: plotData().series[0].values[0][1], betaIndex: 0 }]);
      expect(c.summary).toEqual({ agree: 5, disagree: 1, outsideWindow: 6 });
      expect(figures[0].checkNote).toBe('series check trusted for t in [0, 1.5]: 5 agree, 1 disagree, 6 outside the window');
    });

    it('should overlay the thermodynamics per site over the β range it can judge', () => {
      const e = figures[2].check!;
      expect(e.window).toEqual({ from: 0, to: 0.5 });
      expect(e.lines[0].y.slice(0, 2)).toEqual([0, -0.5]);
      expect(e.lines[0].y[2]).toBeNaN();
    });

    it('should leave figures the report does not mention without overlay lines', () => {
      expect(figures[1].check!.lines).toEqual([]);
      expect(figures[1].check!.window).toBeNull();
      expect(figures[1].checkNote).toBe('series check: no comparisons for this figure');
    });
  });

  describe('when the report comes from the series check of a real sweep', () => {
    it('should accept its shape (as sent over JSON) and draw an overlay from it', async () => {
      const parsed = parseSweepSpec({
        lattice: { kind: 'chain', length: 3 }, h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1 },
        betas: [0.1, 0.3], times: { stop: 0.2, count: 3 }, observables: [{ kind: 'site', pauli: 'X' }], engine: 'exact',
      });
      if (!parsed.success) throw new Error(JSON.stringify(parsed.issues));
      const result = await runSweep(parsed.spec);
      const { checkReport: seriesCheck } = await import('../../../workers/src/series/index.js');
      const wire = CheckReportBody.safeParse(JSON.parse(JSON.stringify(seriesCheck(result))));
      expect(wire.success, JSON.stringify(wire.error?.issues.slice(0, 3))).toBe(true);
      const figures = buildFigures(plotDataFromResult(result), { check: wire.data });
      expect(figures[0].check).not.toBeNull();
      const s = figures[0].check!.summary;
      expect(s.agree + s.disagree + s.outsideWindow).toBe(2 * 3);
    });
  });
});

describe('usableCheck', () => {
  it('should pass a report through, and turn a stored failure or a foreign shape into the note', () => {
    expect(usableCheck({ ...checkReport(), error: null }, 'x').check?.entries).toHaveLength(15);
    const failed = { format: 'betasweep.check/1', series: null, entries: [], summary: { agree: 0, disagree: 0, outsideWindow: 0 }, flagged: false, error: 'no series fits the budget' };
    expect(usableCheck(failed, 'the service')).toEqual({ check: null, note: 'cross-check not available: no series fits the budget' });
    expect(usableCheck({ verdicts: [] }, 'the service')).toEqual({ check: null, note: 'cross-check not available: the service sent an unexpected shape' });
  });
});

describe('describeSeries', () => {
  it('should name the series labels the observables produce, and leave unknown labels alone', () => {
    expect(describeSeries('X:avg')).toBe('⟨X⟩, site average');
    expect(describeSeries('Z@12')).toBe('⟨Z₁₂⟩');
    expect(describeSeries('ZZ:nearest')).toBe('⟨ZZ⟩, nearest pairs');
    expect(describeSeries('XY@0-3~conn')).toBe('⟨X₀Y₃⟩ connected');
    expect(describeSeries('ZZ:d=1.414')).toBe('⟨ZZ⟩, distance 1.414');
    expect(describeSeries('E:h1')).toBe('⟨H1⟩');
    expect(describeSeries('mZ:staggered')).toBe('mZ, staggered pattern');
    expect(describeSeries('S_ZZ(3.1416,0)')).toBe('S_ZZ(q = 3.1416, 0)');
    expect(describeSeries('something else')).toBe('something else');
  });
});

describe('formatBeta', () => {
  it('should give β and T, with T = ∞ at β = 0 and typeset minus signs', () => {
    expect(formatBeta(0)).toBe('β = 0 (T = ∞)');
    expect(formatBeta(0.25)).toBe('β = 0.25 (T = 4)');
    expect(formatBeta(3)).toBe('β = 3 (T = 0.3333)');
    expect(formatBeta(-1)).toBe('β = −1 (T = −1)');
  });
});
