/**
 * The typical engine on narrowed Chebyshev intervals (typical-intervals.ts): narrower than the
 * Σ|w| bounds, the same samples within the records' own error estimates, and a sample whose
 * interval misses part of the spectrum detected and redone on the bounds.
 */
import { describe, expect, it } from 'vitest';
import {
  IntervalMissError, TypicalSampleRunner, typicalSetup,
} from '../../../workers/src/engines/typical/index.js';
import type { TypicalSampleRecord, TypicalSetup } from '../../../workers/src/engines/typical/index.js';
import { spec } from '../exact/collect.js';

/** Transverse-field Ising quench hx 0.7 → 1.5 on an open chain of 8. */
const QUENCH = spec({
  lattice: { kind: 'chain', length: 8, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 2], times: { start: 0, stop: 3, count: 13 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 6e-3, seed: 5,
});

const byKey = (recs: readonly TypicalSampleRecord[]) => new Map(recs.map((r) => [`${r.betaIndex}/${r.sample}`, r]));

/** Largest |a − b| over lnWeight and every primitive, each relative to 2.1·(δ_a + δ_b) (ratio ≤ 1 passes). */
function worstRatio(a: readonly TypicalSampleRecord[], b: readonly TypicalSampleRecord[], np: number): number {
  const other = byKey(b);
  let worst = 0;
  for (const r of a) {
    const w = other.get(`${r.betaIndex}/${r.sample}`)!;
    worst = Math.max(worst, Math.abs(r.lnWeight - w.lnWeight) / (2.1 * (r.thermalError + w.thermalError)));
    for (let k = 0; k < r.primitives.length; k++) {
      const t = Math.floor(k / np);
      worst = Math.max(worst, Math.abs(r.primitives[k] - w.primitives[k]) / (2.1 * (r.stateErrors[t] + w.stateErrors[t])));
    }
  }
  return worst;
}

describe('narrowed intervals of the typical engine', () => {
  describe('when the Lanczos estimate holds', () => {
    it('should run inside the bounds on narrower intervals, agree with the bound run within the records\' own errors and spend fewer applications', async () => {
      const narrow = new TypicalSampleRunner(QUENCH, [0, 1]);
      const wide = new TypicalSampleRunner(QUENCH, [0, 1], undefined, { narrow: false });
      const s = narrow.setup;
      expect(narrow.intervals).not.toBeNull();
      expect(wide.intervals).toBeNull();
      for (const [i, b] of [[s.h0Interval, s.h0Bound], [s.h1Interval, s.h1Bound]]) {
        expect(i.lo).toBeGreaterThan(b.lo);
        expect(i.hi).toBeLessThan(b.hi);
      }
      expect(s.h0Ground).toBeGreaterThan(s.h0Interval.lo);
      expect(s.h0Ground).toBeLessThan(s.h0Interval.hi);
      const a = await narrow.run({ start: 0, count: 3 });
      const b = await wide.run({ start: 0, count: 3 });
      expect(narrow.fallbacks).toBe(0);
      const np = a.primitives;
      expect(worstRatio(a.records, b.records, np)).toBeLessThanOrEqual(1);
      // Error estimates stay small (the budget is 1 % of the tolerance); not a vacuous bound.
      for (const r of a.records) expect(r.stateErrors[12]).toBeLessThan(1e-4);
      const spent = (x: typeof a) => x.records.reduce((m, r) => m + r.matvecs, 0);
      expect(spent(a)).toBeLessThan(0.8 * spent(b));
    });
  });

  describe('when an interval misses part of the spectrum', () => {
    const base = typicalSetup(QUENCH);
    const shrink = (i: { lo: number; hi: number }, f: number) => ({ lo: i.lo * f, hi: i.hi * f });
    const cases: Array<[string, TypicalSetup, RegExp]> = [
      // H1: Σ|w| = 19 and the spectrum reaches ±13.19 (Lanczos, seen); 0.45·19 = 8.55 cuts
      // deep into it, and the outputs lose their unit norm.
      ['H1', { ...base, h1Interval: shrink(base.h1Bound, 0.45) }, /H1's interval/],
      // H0: Σ|w| = 12.6; 0.5·12.6 = 6.3 lies above −E(β = 2) ≈ 8.0 (seen), so ⟨H0⟩ < lo.
      ['H0', { ...base, h0Interval: shrink(base.h0Bound, 0.5), h0Ground: base.h0Bound.hi * 0.5 }, /H0's interval/],
    ];
    for (const [name, bad, message] of cases) {
      it(`should detect a missed ${name} interval and redo the sample on the bounds`, async () => {
        const runner = new TypicalSampleRunner(QUENCH, [0, 1], bad, { narrow: false });
        const wide = new TypicalSampleRunner(QUENCH, [0, 1], base, { narrow: false });
        const got = await runner.run({ start: 0, count: 2 });
        const want = await wide.run({ start: 0, count: 2 });
        expect(runner.fallbacks).toBe(2);
        // The fallback may cut the quench into other blocks (its block outputs are the narrow
        // schedule's): rounding-level differences only.
        const other = byKey(want.records);
        for (const r of got.records) {
          const w = other.get(`${r.betaIndex}/${r.sample}`)!;
          expect(r.lnWeight).toBe(w.lnWeight);
          for (let k = 0; k < r.primitives.length; k++) expect(Math.abs(r.primitives[k] - w.primitives[k])).toBeLessThan(1e-12);
        }
        // The miss itself, as runSample reports it.
        const probe = new TypicalSampleRunner(QUENCH, [0, 1], bad, { narrow: false });
        await expect(probeSample(probe)).rejects.toThrow(message);
      });
    }
  });
});

/** Runs sample 0 of a runner's setup through runSample itself (the runner would hide the miss by falling back). */
async function probeSample(runner: TypicalSampleRunner): Promise<unknown> {
  const { runSample, allocateSampleBuffers } = await import('../../../workers/src/engines/typical/run-sample.js');
  const { typicalBudget } = await import('../../../workers/src/engines/typical/typical-budget.js');
  const s = runner.setup;
  const budget = typicalBudget(s.layout, QUENCH.tolerance, s.sites, s.h0NormBound, [0.5, 2]);
  return runSample({
    setup: s, budget, order: runner.order, sample: 0, buffers: allocateSampleBuffers(s.dim, true, 32),
    blocks: runner.blocks, blockTolerance: budget.realTolerance / 13,
  }).catch((e: unknown) => { expect(e).toBeInstanceOf(IntervalMissError); throw e; });
}

describe('normSlack', () => {
  it('should cover the worst-case rounding of two 2^(N+1)-term sums and never go below 1e-12', async () => {
    const { normSlack, NORM_SLACK } = await import('../../../workers/src/engines/typical/run-sample.js');
    expect(normSlack(2)).toBe(NORM_SLACK);
    expect(normSlack(2 ** 16)).toBeCloseTo(4 * 2 ** 16 * Number.EPSILON, 25);
    // N = 24: 4·2^24·ε = 1.49e-8.
    expect(normSlack(2 ** 24)).toBeGreaterThan(1.4e-8);
    expect(normSlack(2 ** 24)).toBeLessThan(1.6e-8);
  });
});
