/**
 * Regression test: the trust window of the quench double series must be honest. On an open
 * 4-site transverse-field Ising chain quenched from hx = 0.5 to hx = 1.5, checkReport against
 * the exact engine once judged ⟨X⟩ at β = 0.5, t ≈ 0.4 with a claimed series error ~5e-13 while
 * the series was ~0.05 off (the λ-series of the double series has vanishing coefficients at
 * some orders there, so the last non-zero terms understated the tail). With an exact engine
 * no entry may disagree: inside the window |series − exact| ≤ series error + engine error.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult, SweepSpecInput } from '../../../shared-types/src/index.js';
import { checkReport } from '../../../workers/src/series/index.js';
import { resumSeries } from '../../../workers/src/series/resum-series.js';
import { runReferenceSweep } from '../../support/reference/run-reference-sweep.js';

const INPUT: SweepSpecInput = {
  lattice: { kind: 'chain', length: 4, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1, 2],
  times: { start: 0, stop: 2, count: 11 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
  engine: 'exact',
};

let result: SweepResult;
beforeAll(async () => {
  result = await runReferenceSweep(INPUT);
});

describe('quench series trust window', () => {
  for (const quenchOrder of [4, 5, 6, 7, 8, 10]) {
    it(`never disagrees with the exact engine (quench order ${quenchOrder})`, () => {
      const report = checkReport(result, { thermoOrder: 10, quenchOrder });
      const bad = report.entries.filter((e) => e.verdict === 'disagree');
      expect(bad.map((e) => `${e.quantity} β=${e.beta} t=${String(e.time)} series=${e.seriesValue}±${e.seriesError} exact=${e.engineValue}`)).toEqual([]);
      expect(report.flagged).toBe(false);
      for (const e of report.entries) {
        if (e.verdict === 'outside-window') continue;
        const engineError = Number.isFinite(e.engineError) ? e.engineError : 0;
        expect(Math.abs(e.seriesValue - e.engineValue)).toBeLessThanOrEqual(e.seriesError + engineError + 1e-12 * Math.max(1, Math.abs(e.seriesValue)));
      }
    });
  }

  it('still judges the short-time, high-temperature corner', () => {
    const report = checkReport(result, { thermoOrder: 10, quenchOrder: 8 });
    const judged = report.entries.filter((e) => e.time !== null && e.verdict === 'agree');
    expect(judged.length).toBeGreaterThan(0);
    expect(judged.some((e) => e.time === 0)).toBe(true);
  });

  it('does not count the repeated approximants of an odd series as agreement', () => {
    // λ-series of ⟨X⟩ at β = 2, t = 0.4 (quench order 6): odd in λ, radius ≈ 0.55 < 1. Every
    // Padé approximant reduces to the same one, which is off by ≈ 0.06 (exact 0.62438).
    const d = [0, 1, 0, -1.3733333333333333, 0, 4.5862666666666665, 0];
    const est = resumSeries(d, 1);
    expect(est.error).toBeGreaterThan(Math.abs(est.value - 0.6243799804102633));
  });
});
