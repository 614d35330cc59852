/**
 * Unit tests of checkReport (workers/src/series/check-report.ts): a sweep from the exact engine
 * agrees with its series inside the window, a tampered value is flagged, and points beyond the
 * series' reach are reported as outside the window rather than judged.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult, SweepSpecInput } from '../../../shared-types/src/index.js';
import { checkReport, checkVerdict, computeSweepSeries } from '../../../workers/src/series/index.js';
import { runReferenceSweep } from '../../support/reference/run-reference-sweep.js';

const INPUT: SweepSpecInput = {
  lattice: { kind: 'chain', length: 6, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7, hz: 0.2 },
  h1: { model: 'ising', J: 1, hx: 1.3, hz: 0 },
  betas: [0.05, 0.1, 4],
  times: { values: [0, 0.05, 3] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
  engine: 'exact',
  tolerance: 1e-10,
};

let result: SweepResult;
beforeAll(async () => {
  result = await runReferenceSweep(INPUT);
});

describe('checkVerdict', () => {
  it('agrees within sigma times the summed errors and disagrees beyond', () => {
    expect(checkVerdict(1, 1e-6, 1 + 1.5e-6, 1e-6, 1, 1e-3)).toBe('agree');
    expect(checkVerdict(1, 1e-6, 1 + 3e-6, 1e-6, 1, 1e-3)).toBe('disagree');
    expect(checkVerdict(1, 1e-6, 1 + 3e-6, 1e-6, 2, 1e-3)).toBe('agree');
  });

  it('is outside the window for an infinite, NaN or too large series error', () => {
    expect(checkVerdict(1, Infinity, 5, 0, 1, 1e-3)).toBe('outside-window');
    expect(checkVerdict(Number.NaN, 0, 5, 0, 1, 1e-3)).toBe('outside-window');
    expect(checkVerdict(100, 0.2, 100, 0, 1, 1e-3)).toBe('outside-window');
    expect(checkVerdict(100, 0.05, 100, 0, 1, 1e-3)).toBe('agree');
  });

  it('allows double rounding on exactly computed values', () => {
    expect(checkVerdict(2, 0, 2 + 1e-13, 0, 1, 1e-3)).toBe('agree');
  });
});

describe('checkReport', () => {
  it('agrees with the exact engine inside the window and leaves large β and t outside it', () => {
    const report = checkReport(result, { thermoOrder: 10, quenchOrder: 8 });
    expect(report.format).toBe('betasweep.check/1');
    expect(report.flagged).toBe(false);
    expect(report.summary.disagree).toBe(0);
    const small = report.entries.filter((e) => e.beta <= 0.1 && (e.time === null || e.time <= 0.05));
    expect(small.length).toBeGreaterThan(10);
    for (const e of small) expect(e.verdict).toBe('agree');
    const far = report.entries.filter((e) => e.beta === 4 || e.time === 3);
    expect(far.length).toBeGreaterThan(0);
    for (const e of far) expect(e.verdict).toBe('outside-window');
    expect(report.summary.agree + report.summary.outsideWindow).toBe(report.entries.length);
    // Thermodynamics: 5 quantities at β > 0 for each of the 3 β.
    expect(report.entries.filter((e) => e.quantity.startsWith('thermo:'))).toHaveLength(15);
  });

  it('flags a value changed by 1e−4 inside the window', () => {
    const tampered = structuredClone(result);
    tampered.series[1].values[1][1] += 1e-4;
    const series = computeSweepSeries(result.spec, { thermoOrder: 10, quenchOrder: 8 });
    const report = checkReport(tampered, { series });
    expect(report.flagged).toBe(true);
    const bad = report.entries.filter((e) => e.verdict === 'disagree');
    expect(bad).toHaveLength(1);
    expect(bad[0]).toMatchObject({ quantity: 'ZZ:nearest', betaIndex: 1, timeIndex: 1 });
  });

  it('compares only the first time with times: first, and refuses bad options or foreign labels', () => {
    const series = computeSweepSeries(result.spec, { thermoOrder: 6, quenchOrder: 4 });
    const report = checkReport(result, { series, times: 'first' });
    expect(report.entries.every((e) => e.timeIndex === null || e.timeIndex === 0)).toBe(true);
    expect(() => checkReport(result, { series, sigma: 0 })).toThrow(RangeError);
    expect(() => checkReport(result, { series, windowError: -1 })).toThrow(RangeError);
    const foreign = structuredClone(result);
    foreign.series[0].label = 'Q:nothing';
    expect(() => checkReport(foreign, { series })).toThrow(RangeError);
  });
});
