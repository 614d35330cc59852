/**
 * Error bars of the typical engine shrink as 1/√R (R samples), and they describe the actual
 * scatter of independent estimates. One 256-sample run per seed is cut into 16 batches of 16,
 * 4 of 64 and the whole (mergeTypicalSamples / record subsets: the same samples either way).
 *
 * Bands. Each jackknife error is itself estimated, with relative scatter ≈ 1/√(2(R − 1))
 * (18 % at R = 16, 9 % at 64); averaging over batches and taking the geometric mean over the
 * 3 thermodynamic and 12 series values (correlated) leaves a few per cent. Measured on
 * seeds 1–6: se(64)/se(256) = 1.97–2.00, se(16)/se(64) = 1.94–1.97 (the jackknife error of
 * 16 samples is biased low by ~2 %, like any sample standard deviation), scatter/se at
 * R = 16 = 0.96–1.24. Bands: [1.8, 2.2] for the ratios (1/√R predicts 2; a 1/R or 1/R^{1/4}
 * law gives 4 or 1.4) and [0.7, 1.4] for scatter/se (16 estimates: ±18 % on their spread).
 */
import { describe, expect, it } from 'vitest';
import {
  estimateTypicalBeta, mergeTypicalSamples, runTypicalSamples, typicalLayout,
  type TypicalSamples,
} from '../../../workers/src/engines/typical/index.js';
import { spec } from '../exact/collect.js';

const BASE = spec({
  lattice: { kind: 'chain', length: 8, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [1], times: { values: [0, 0.5, 1] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 1e-2,
});

const subset = (all: TypicalSamples, start: number, count: number): TypicalSamples =>
  ({ ...all, records: all.records.filter((r) => r.sample >= start && r.sample < start + count) });
const mean = (xs: number[]) => xs.reduce((a, x) => a + x, 0) / xs.length;
const geometricMean = (xs: number[]) => Math.exp(mean(xs.map(Math.log)));

describe('typical error bars', () => {
  describe('when the number of samples grows fourfold', () => {
    it('should halve (1/√R) for seeds 1, 2, 3, and match the scatter of independent 16-sample estimates', async () => {
      for (const seed of [1, 2, 3]) {
        const s = { ...BASE, seed };
        const layout = typicalLayout(s);
        const all = await runTypicalSamples(s, [0], { start: 0, count: 256 });
        const est = (smp: TypicalSamples) => {
          const e = estimateTypicalBeta(layout, smp, 0, { errorTarget: 1 });
          return {
            values: [e.thermo.energy, e.thermo.heatCapacity, e.thermo.lnZ, ...e.points.flatMap((p) => p.values)],
            errors: [e.thermo.errors.energy, e.thermo.errors.heatCapacity, e.thermo.errors.lnZ, ...e.points.flatMap((p) => p.errors)],
          };
        };
        const whole = est(all);
        // The 4 × 64 batches go through the merge path: merged pairs of halves.
        const b64 = [0, 1, 2, 3].map((k) => est(mergeTypicalSamples([subset(all, 64 * k + 32, 32), subset(all, 64 * k, 32)])));
        const b16 = Array.from({ length: 16 }, (_, k) => est(subset(all, 16 * k, 16)));
        const n = whole.errors.length;
        expect(n).toBe(3 + 3 * 2);
        const r64 = geometricMean(whole.errors.map((e, j) => mean(b64.map((b) => b.errors[j])) / e));
        const r16 = geometricMean(whole.errors.map((_, j) => mean(b16.map((b) => b.errors[j])) / mean(b64.map((b) => b.errors[j]))));
        const scatter = geometricMean(whole.errors.map((_, j) => {
          const m = mean(b16.map((b) => b.values[j]));
          const sd = Math.sqrt(b16.reduce((a, b) => a + (b.values[j] - m) ** 2, 0) / 15);
          return sd / mean(b16.map((b) => b.errors[j]));
        }));
        expect(r64, `seed ${seed}: se(64)/se(256)`).toBeGreaterThan(1.8);
        expect(r64, `seed ${seed}: se(64)/se(256)`).toBeLessThan(2.2);
        expect(r16, `seed ${seed}: se(16)/se(64)`).toBeGreaterThan(1.8);
        expect(r16, `seed ${seed}: se(16)/se(64)`).toBeLessThan(2.2);
        expect(scatter, `seed ${seed}: scatter/se at R = 16`).toBeGreaterThan(0.7);
        expect(scatter, `seed ${seed}: scatter/se at R = 16`).toBeLessThan(1.4);
      }
    });
  });
});
