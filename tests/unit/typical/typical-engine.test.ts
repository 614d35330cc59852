/**
 * TypicalEngine.runBranch: adaptive sample counts against the tolerance, honest diagnostics
 * when the cap is reached, determinism by seed, fan-out (split + merge) equivalence, and the
 * branch contract (abort, resume, β = 0, bad indices).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import {
  estimateTypicalBeta, MIN_SAMPLES, mergeTypicalSamples, PILOT_SAMPLES, runTypicalSamples, TRUNCATION_SHARE,
  TypicalEngine, typicalLayout,
} from '../../../workers/src/engines/typical/index.js';
import { collect, seriesOf, spec, type Collected } from '../exact/collect.js';

/** 8-site TFIM quench, two temperatures, three times. */
const QUENCH = spec({
  lattice: { kind: 'chain', length: 8, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 2], times: { values: [0, 0.5, 1] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 6e-3,
  seed: 11,
});

let exact: Collected;
beforeAll(async () => {
  exact = await collect(new ExactEngine(), { ...QUENCH, tolerance: 1e-8 }, [0, 1]);
}, 60_000);

describe('TypicalEngine', () => {
  describe('when the tolerance is reachable', () => {
    it('should add samples after the pilot until every series error is within the tolerance, and agree with exact', async () => {
      const engine = new TypicalEngine();
      const out = await collect(engine, QUENCH, [0, 1]);
      expect(out.thermo.map((t) => t.betaIndex)).toEqual([0, 1]);
      // Every record is valid against the shared result schemas (what the service stores).
      for (const t of out.thermo) expect(ThermoRecord.safeParse(t).success).toBe(true);
      for (const p of out.points) expect(SweepPoint.safeParse(p).success).toBe(true);
      for (const d of out.diagnostics) expect(DiagnosticsRecord.safeParse(d).success).toBe(true);
      expect(out.points).toHaveLength(6);
      for (const d of out.diagnostics) {
        expect(d.extra.met).toBe(true);
        expect(d.extra.errorTarget).toBe(QUENCH.tolerance);
        expect(d.extra.pilotSamples).toBe(PILOT_SAMPLES);
        expect(Number(d.extra.rounds)).toBeGreaterThanOrEqual(2);
        expect(Number(d.extra.samples)).toBeGreaterThanOrEqual(MIN_SAMPLES);
        expect(Number(d.extra.samples)).toBeLessThanOrEqual(Number(d.extra.sampleCap));
        expect(d.stationarityResidual).toBeNull();
        // ⟨H1⟩ and the norm are conserved by each sample's unitary evolution; the propagator's
        // state error δ (kept ≤ TRUNCATION_SHARE × tolerance) bounds the drifts: |Δ⟨H1⟩| ≤ 2δ‖H1‖
        // with ‖H1‖ ≤ Σ|w| = 7 + 8·1.5 = 19, |Δ‖ψ‖| ≤ δ (plus 1e-12 for rounding).
        expect(d.propagatorErrorBound).toBeLessThan(TRUNCATION_SHARE * QUENCH.tolerance);
        expect(d.h1Drift).toBeLessThan(2 * d.propagatorErrorBound * 19 + 1e-12);
        expect(d.normDrift).toBeLessThan(d.propagatorErrorBound + 1e-12);
      }
      for (const p of out.points) {
        const q = exact.points.find((u) => u.betaIndex === p.betaIndex && u.timeIndex === p.timeIndex)!;
        p.values.forEach((v, k) => {
          expect(p.errors[k]).toBeLessThanOrEqual(QUENCH.tolerance);
          // 4σ: 12 values, one seed (see typical-vs-exact.test.ts for the statistics).
          expect(Math.abs(v - q.values[k])).toBeLessThan(4 * p.errors[k]);
        });
      }
      for (const t of out.thermo) {
        const x = exact.thermo.find((u) => u.betaIndex === t.betaIndex)!;
        for (const key of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) {
          expect(Math.abs(t[key] - x[key]), key).toBeLessThan(4 * t.errors[key]);
        }
        expect(t.freeEnergy).toBeCloseTo(-t.lnZ / t.beta, 12);
      }
    });
  });

  describe('when the sample cap is below what the tolerance needs', () => {
    it('should stop at the cap and say the tolerance was not met, reporting the larger measured error', async () => {
      const engine = new TypicalEngine({ maxSamples: 8 });
      const tight = { ...QUENCH, tolerance: 1e-3 };
      const out = await collect(engine, tight, [1]);
      const d = out.diagnostics[0];
      expect(d.extra.met).toBe(false);
      expect(d.extra.samples).toBe(8);
      expect(d.extra.sampleCap).toBe(8);
      const worst = Math.max(...out.points.flatMap((p) => p.errors));
      expect(worst).toBeGreaterThan(tight.tolerance);
      expect(Number(d.extra.statErrorMax)).toBeGreaterThan(0.99 * tight.tolerance);
    });
  });

  describe('when the same spec runs twice', () => {
    it('should emit identical records for the same seed and different values for another seed', async () => {
      const engine = new TypicalEngine({ maxSamples: 8 });
      const a = await collect(engine, QUENCH, [0]);
      const b = await collect(engine, QUENCH, [0]);
      expect(b).toEqual(a);
      const c = await collect(engine, { ...QUENCH, seed: 12 }, [0]);
      expect(c.points[1].values).not.toEqual(a.points[1].values);
      expect(c.thermo[0].energy).not.toBe(a.thermo[0].energy);
    });
  });

  describe('when samples are split over branches and merged', () => {
    it('should give the same estimates as one run, in any merge order, ignoring repeated samples', async () => {
      const layout = typicalLayout(QUENCH);
      const whole = await runTypicalSamples(QUENCH, [0, 1], { start: 0, count: 12 });
      const first = await runTypicalSamples(QUENCH, [1, 0], { start: 0, count: 5 });
      const second = await runTypicalSamples(QUENCH, [0, 1], { start: 5, count: 7 });
      const merged = mergeTypicalSamples([second, first, second]);
      expect(merged.records.length).toBe(24);
      expect(merged.records.map((r) => [r.betaIndex, r.sample])).toEqual(whole.records.map((r) => [r.betaIndex, r.sample]));
      for (const b of [0, 1]) {
        expect(estimateTypicalBeta(layout, merged, b, { errorTarget: 1 })).toEqual(estimateTypicalBeta(layout, whole, b, { errorTarget: 1 }));
      }
      // A single-β branch reproduces the same per-sample numbers as a two-β branch (each sample
      // walks imaginary time from β = 0; the propagators truncate differently, so the two agree
      // within the sum of their own error estimates: ln‖ψ‖² moves by ≤ 2δ for a relative state
      // error δ, and an expectation of a Pauli string (norm 1) by ≤ 2δ + δ²).
      const single = await runTypicalSamples(QUENCH, [1], { start: 0, count: 3 });
      const t5 = Math.floor(5 / whole.primitives);
      for (const r of single.records) {
        const w = whole.records.find((x) => x.betaIndex === 1 && x.sample === r.sample)!;
        expect(Math.abs(r.lnWeight - w.lnWeight)).toBeLessThan(2.1 * (r.thermalError + w.thermalError));
        expect(r.thermalError + w.thermalError).toBeLessThan(1e-7);
        expect(Math.abs(r.primitives[5] - w.primitives[5])).toBeLessThan(2.1 * (r.stateErrors[t5] + w.stateErrors[t5]));
      }
    });

    it('should refuse to merge samples of different specs or layouts', async () => {
      const a = await runTypicalSamples(QUENCH, [0], { start: 0, count: 2 });
      const b = await runTypicalSamples({ ...QUENCH, seed: 3 }, [0], { start: 2, count: 2 });
      expect(() => mergeTypicalSamples([a, b])).toThrow(/spec/);
      expect(() => mergeTypicalSamples([a, { ...a, times: 4 }])).toThrow(/primitives/);
      expect(() => mergeTypicalSamples([])).toThrow(RangeError);
      expect(() => estimateTypicalBeta(typicalLayout(QUENCH), { ...a, records: a.records.slice(0, 1) }, 0, { errorTarget: 1 })).toThrow(/at least 2 samples/);
    });
  });

  describe('when β = 0 and the observables are diagonal', () => {
    it('should give ln Z = S = N ln 2 and ⟨H0⟩, ⟨Z⟩ at t = 0 exactly, with zero error bars (random phases estimate diagonal operators exactly)', async () => {
      const s = spec({
        lattice: { kind: 'chain', length: 6 }, h0: { model: 'pauli-sum', terms: [{ weight: 0.4, word: '' }, { weight: 1, word: 'Z0 Z1' }, { weight: -0.3, word: 'Z2' }] },
        h1: { model: 'ising', J: 1, hx: 1 }, betas: [0], times: { values: [0, 0.5] },
        observables: [{ kind: 'site', pauli: 'Z' }, { kind: 'energy', of: 'h0' }], tolerance: 0.05,
      });
      const engine = new TypicalEngine({ maxSamples: 8 });
      const out = await collect(engine, s, [0]);
      const t = out.thermo[0];
      expect(t.lnZ).toBe(6 * Math.LN2);
      expect(t.entropy).toBe(6 * Math.LN2);
      expect(t.errors.lnZ).toBe(0);
      expect(t.freeEnergy).toBeNull();
      expect(t.errors.freeEnergy).toBeNull();
      expect(Math.abs(t.energy - 0.4)).toBeLessThan(1e-14);
      expect(t.errors.energy).toBeLessThan(1e-14);
      const z = seriesOf(engine, s, 'Z:avg');
      const e = seriesOf(engine, s, 'E:h0');
      expect(Math.abs(out.points[0].values[z])).toBeLessThan(1e-14);
      expect(out.points[0].errors[z]).toBeLessThan(1e-13);
      expect(Math.abs(out.points[0].values[e] - 0.4)).toBeLessThan(1e-14);
      // After the quench ⟨Z(t)⟩ is no longer diagonal: a genuine statistical error appears.
      expect(out.points[1].errors[z]).toBeGreaterThan(1e-6);
    });
  });

  describe('when one quench step is longer than a Chebyshev block may span', () => {
    it('should sub-step it and still agree with the exact engine within the error bars', async () => {
      // H1 half-width Σ|w| = 5 + 6·1.5 = 14: t = 30 is τ = 420 > MAX_REAL_TIME_TAU (250).
      const s = spec({
        lattice: { kind: 'chain', length: 6, boundary: 'open' },
        h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
        betas: [1], times: { values: [0, 30] },
        observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }], tolerance: 1e-3, seed: 4,
      });
      const ex = await collect(new ExactEngine(), { ...s, tolerance: 1e-8 }, [0]);
      const samples = await runTypicalSamples(s, [0], { start: 0, count: 32 });
      const est = estimateTypicalBeta(typicalLayout(s), samples, 0, { errorTarget: s.tolerance });
      const p = est.points[1];
      p.values.forEach((v, k) => expect(Math.abs(v - ex.points[1].values[k])).toBeLessThan(4 * p.errors[k]));
      expect(est.diagnostics.h1Drift).toBeLessThan(1e-6);
      expect(est.diagnostics.normDrift).toBeLessThan(1e-6);
    });
  });

  describe('when the branch is resumed, aborted or given a bad index', () => {
    it('should skip the points before resumeFrom, reject with an AbortError, and throw a RangeError', async () => {
      const engine = new TypicalEngine({ maxSamples: 4, pilotSamples: 4 });
      const out = await collect(engine, QUENCH, [0], { resumeFrom: { 0: 2 } });
      expect(out.points.map((p) => p.timeIndex)).toEqual([2]);
      expect(out.thermo).toHaveLength(1);
      const ctrl = new AbortController();
      ctrl.abort();
      await expect(collect(engine, QUENCH, [0], { signal: ctrl.signal })).rejects.toMatchObject({ name: 'AbortError' });
      await expect(collect(engine, QUENCH, [2])).rejects.toThrow(RangeError);
      await expect(runTypicalSamples(QUENCH, [0], { start: -1, count: 2 })).rejects.toThrow(/sampleRange\.start/);
      expect(() => new TypicalEngine({ maxSamples: 1 })).toThrow(/maxSamples/);
      expect(() => new TypicalEngine({ pilotSamples: 1 })).toThrow(/pilotSamples/);
      const none = await collect(engine, QUENCH, []);
      expect(none.points).toHaveLength(0);
    });
  });
});
