/**
 * The exact engine: thermodynamics and quench dynamics of small lattices against closed forms,
 * dense matrix exponentials (mathjs, a general-purpose library, via tests/support/reference),
 * and the built-in invariants (stationarity for H1 = H0, ⟨H1⟩ and norm conservation).
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import {
  denseThermal, denseUnitary, heisenbergExpectations, pauliSumMatrix,
} from '../../support/reference/dense-pauli.js';
import type { DenseTerm } from '../../support/reference/dense-pauli.js';
import { collect, seriesOf, spec } from './collect.js';

const engine = new ExactEngine();

/** H0 and H1 on 3 sites with Y factors (odd Y count in some terms, so H ≠ Hᵀ), and a shift. */
const H0_TERMS: DenseTerm[] = [
  { weight: 0.8, word: 'X0 Y1' }, { weight: -0.5, word: 'Y1 Z2' }, { weight: 0.3, word: 'Y0' },
  { weight: 0.6, word: 'Z0 Z1' }, { weight: -0.4, word: 'X2' }, { weight: 0.25, word: '' },
];
const H1_TERMS: DenseTerm[] = [
  { weight: 0.7, word: 'Y0 Y1' }, { weight: 0.9, word: 'X1 Y2' }, { weight: -0.6, word: 'Y2' },
  { weight: 0.5, word: 'Z0' }, { weight: 0.3, word: 'X0 X1 Z2' },
];

function yInput(h1: DenseTerm[], extra: Partial<SweepSpecInput> = {}): SweepSpecInput {
  return {
    lattice: { kind: 'chain', length: 3 },
    h0: { model: 'pauli-sum', terms: H0_TERMS },
    h1: { model: 'pauli-sum', terms: h1 },
    betas: [0, 0.6, 1.7],
    times: { start: 0, stop: 1.8, count: 4 },
    observables: [
      { kind: 'site', pauli: 'Z', perSite: true },
      { kind: 'site', pauli: 'Y', perSite: true },
      { kind: 'pair', paulis: 'XY', pairs: [[0, 2]] },
      { kind: 'energy', of: 'h1' },
    ],
    ...extra,
  };
}

describe('ExactEngine', () => {
  describe('when β = 0', () => {
    it('gives ⟨Z_i⟩ = 0, E = the identity weight, ln Z = S = N ln 2 and no free energy, at every time', async () => {
      const s = spec({ ...yInput(H1_TERMS), betas: [0], observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'energy', of: 'h0' }] });
      const out = await collect(engine, s, [0]);
      const t = out.thermo[0];
      expect(t.lnZ).toBeCloseTo(3 * Math.LN2, 14);
      expect(t.entropy).toBeCloseTo(3 * Math.LN2, 14);
      expect(t.energy).toBeCloseTo(0.25, 14); // Tr(H0)/2^N = identity weight
      expect(t.freeEnergy).toBeNull();
      expect(t.errors.freeEnergy).toBeNull();
      expect(t.heatCapacity).toBe(0);
      expect(out.points).toHaveLength(4);
      const e0 = seriesOf(engine, s, 'E:h0');
      for (const p of out.points) {
        for (let k = 0; k < 4; k++) expect(Math.abs(p.values[k])).toBeLessThan(1e-14); // Z:avg, Z@0..2
        expect(p.values[e0]).toBeCloseTo(0.25, 12);
      }
    });
  });

  describe('when the model is the two-site Heisenberg dimer', () => {
    // J(XX + YY + ZZ) on two sites: singlet −3J, triplet +J (common practice).
    it('reproduces ln Z, E, C, F and S in closed form within the reported errors', async () => {
      const J = 0.8;
      const betas = [0.3, 1, 2.5, 6];
      const s = spec({
        lattice: { kind: 'chain', length: 2 }, h0: { model: 'xxz', J, delta: 1 }, h1: { model: 'xxz', J, delta: 1 },
        betas, times: { start: 0, stop: 1, count: 2 }, observables: [{ kind: 'pair', paulis: 'ZZ' }],
      });
      const out = await collect(engine, s, [0, 1, 2, 3]);
      expect(out.thermo.map((r) => r.betaIndex)).toEqual([0, 1, 2, 3]);
      for (const r of out.thermo) {
        const b = r.beta;
        const levels = [-3 * J, J, J, J];
        const z = levels.reduce((acc, e) => acc + Math.exp(-b * e), 0);
        const e1 = levels.reduce((acc, e) => acc + e * Math.exp(-b * e), 0) / z;
        const e2 = levels.reduce((acc, e) => acc + e * e * Math.exp(-b * e), 0) / z;
        const lnZ = Math.log(z);
        // Reported errors are bounds on truncation; 1e-12 covers rounding of the check itself.
        expect(Math.abs(r.lnZ - lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-12);
        expect(Math.abs(r.energy - e1)).toBeLessThanOrEqual(r.errors.energy + 1e-12);
        expect(Math.abs(r.heatCapacity - b * b * (e2 - e1 * e1))).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-11);
        expect(Math.abs(r.freeEnergy! + lnZ / b)).toBeLessThanOrEqual(r.errors.freeEnergy! + 1e-12);
        expect(Math.abs(r.entropy - (lnZ + b * e1))).toBeLessThanOrEqual(r.errors.entropy + 1e-11);
        // The budget keeps every thermodynamic error within the spec tolerance (error-budget.ts).
        for (const key of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) expect(r.errors[key]).toBeLessThanOrEqual(s.tolerance);
      }
      // ⟨ZZ⟩ = (e^{−βJ} − e^{3βJ}) / (3e^{−βJ} + e^{3βJ}) (from the same levels).
      for (const p of out.points) {
        const b = betas[p.betaIndex];
        const ref = (Math.exp(-b * J) - Math.exp(3 * b * J)) / (3 * Math.exp(-b * J) + Math.exp(3 * b * J));
        expect(Math.abs(p.values[0] - ref)).toBeLessThanOrEqual(p.errors[0] + 1e-12);
      }
    });
  });

  describe('when H0 and H1 contain Y factors', () => {
    it('matches dense e^{−βH0} and e^{−iH1t} (mathjs expm) for every series within the reported errors', async () => {
      const s = spec(yInput(H1_TERMS));
      const out = await collect(engine, s, [0, 1, 2]);
      const h0 = pauliSumMatrix(H0_TERMS, 3);
      const h1 = pauliSumMatrix(H1_TERMS, 3);
      const ops = [
        ...[0, 1, 2].map((i) => pauliSumMatrix([{ weight: 1, word: `Z${i}` }], 3)),
        ...[0, 1, 2].map((i) => pauliSumMatrix([{ weight: 1, word: `Y${i}` }], 3)),
        pauliSumMatrix([{ weight: 1, word: 'X0 Y2' }], 3),
        h1,
      ];
      const idx = ['Z@0', 'Z@1', 'Z@2', 'Y@0', 'Y@1', 'Y@2'].map((l) => seriesOf(engine, s, l));
      const labels = engine.series(s);
      idx.push(labels.findIndex((x) => x.observable === 2), seriesOf(engine, s, 'E:h1'));
      const times = [0, 0.6, 1.2, 1.8];
      let worst = 0;
      for (const r of out.thermo) {
        const ref = denseThermal(h0, r.beta);
        expect(Math.abs(r.lnZ - ref.lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-12);
        expect(Math.abs(r.energy - ref.energy)).toBeLessThanOrEqual(r.errors.energy + 1e-12);
        expect(Math.abs(r.heatCapacity - ref.heatCapacity)).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-11);
      }
      expect(out.points).toHaveLength(12);
      for (const p of out.points) {
        const ref = heisenbergExpectations(denseThermal(h0, [0, 0.6, 1.7][p.betaIndex]).rho, denseUnitary(h1, times[p.timeIndex]), ops);
        idx.forEach((k, j) => {
          const diff = Math.abs(p.values[k] - ref[j]);
          worst = Math.max(worst, diff);
          expect(diff).toBeLessThanOrEqual(p.errors[k] + 1e-11);
          expect(p.errors[k]).toBeLessThan(s.tolerance);
        });
      }
      // The quench moves things: the check is not comparing constants.
      const first = out.points.find((p) => p.betaIndex === 2 && p.timeIndex === 0)!;
      const last = out.points.find((p) => p.betaIndex === 2 && p.timeIndex === 3)!;
      expect(Math.abs(first.values[idx[0]] - last.values[idx[0]])).toBeGreaterThan(0.01);
      expect(worst).toBeLessThan(1e-9);
    });

    it('keeps the state stationary when H1 = H0 (residual < 1e-10) and the observables constant', async () => {
      const s = spec(yInput(H0_TERMS));
      const out = await collect(engine, s, [0, 1, 2]);
      for (const d of out.diagnostics) {
        expect(d.stationarityResidual).not.toBeNull();
        expect(d.stationarityResidual!).toBeLessThan(1e-10);
      }
      for (const p of out.points) {
        const p0 = out.points.find((q) => q.betaIndex === p.betaIndex && q.timeIndex === 0)!;
        p.values.forEach((v, k) => expect(Math.abs(v - p0.values[k])).toBeLessThan(1e-10));
      }
    });

    it('breaks stationarity without the transpose, while physical observables stay the same to 1e-10', async () => {
      const plain = new ExactEngine({ auxiliary: 'plain' });
      const same = spec(yInput(H0_TERMS));
      const a = await collect(plain, same, [1, 2]);
      for (const d of a.diagnostics) expect(d.stationarityResidual!).toBeGreaterThan(1e-3);
      const b = await collect(engine, same, [1, 2]);
      for (const d of b.diagnostics) expect(d.stationarityResidual!).toBeLessThan(1e-10);
      const quench = spec(yInput(H1_TERMS));
      const c = await collect(plain, quench, [0, 1, 2]);
      const d = await collect(engine, quench, [0, 1, 2]);
      expect(c.points).toHaveLength(d.points.length);
      c.points.forEach((p, k) => p.values.forEach((v, j) => expect(Math.abs(v - d.points[k].values[j])).toBeLessThan(1e-10)));
    });

    it('conserves ⟨H1⟩ and the norm during the quench', async () => {
      const s = spec(yInput(H1_TERMS, { times: { start: 0, stop: 6, count: 13 } }));
      const out = await collect(engine, s, [0, 1, 2]);
      const e1 = seriesOf(engine, s, 'E:h1');
      for (const d of out.diagnostics) {
        expect(d.h1Drift).toBeLessThan(1e-10);
        expect(d.normDrift).toBeLessThanOrEqual(d.propagatorErrorBound + 1e-13);
        expect(d.extra.maxImag as number).toBeLessThan(1e-13);
        // |I⟩ (β = 0) is exactly stationary and is not propagated; every other β is.
        if (d.betaIndex === 0) expect(d.extra.quenchMatvecs).toBe(0);
        else expect(d.extra.quenchMatvecs as number).toBeGreaterThan(0);
      }
      for (const p of out.points) {
        const p0 = out.points.find((q) => q.betaIndex === p.betaIndex && q.timeIndex === 0)!;
        expect(Math.abs(p.values[e1] - p0.values[e1])).toBeLessThan(1e-10);
      }
    });
  });

  describe('when a branch holds several β', () => {
    it('carries the state from β to β and agrees with one-β branches within the reported errors', async () => {
      const s = spec(yInput(H1_TERMS));
      const all = await collect(engine, s, [2, 0, 1]); // any order in, ascending β out
      expect(all.thermo.map((r) => r.betaIndex)).toEqual([0, 1, 2]);
      for (const b of [1, 2]) {
        const one = await collect(engine, s, [b]);
        expect(Math.abs(one.thermo[0].lnZ - all.thermo[b].lnZ)).toBeLessThanOrEqual(one.thermo[0].errors.lnZ + all.thermo[b].errors.lnZ + 1e-13);
        one.points.forEach((p) => {
          const q = all.points.find((x) => x.betaIndex === b && x.timeIndex === p.timeIndex)!;
          p.values.forEach((v, k) => expect(Math.abs(v - q.values[k])).toBeLessThanOrEqual(p.errors[k] + q.errors[k] + 1e-13));
        });
      }
    });
  });

  describe('when resuming or aborting', () => {
    it('skips points below resumeFrom but emits the rest unchanged', async () => {
      const s = spec(yInput(H1_TERMS));
      const full = await collect(engine, s, [1]);
      const resumed = await collect(engine, s, [1], { resumeFrom: { 1: 2 } });
      expect(resumed.points.map((p) => p.timeIndex)).toEqual([2, 3]);
      expect(resumed.points).toEqual(full.points.slice(2));
      expect(resumed.thermo).toHaveLength(1);
      expect(resumed.diagnostics).toHaveLength(1);
    });

    it('rejects with an AbortError between time steps when the signal fires', async () => {
      const s = spec(yInput(H1_TERMS));
      const controller = new AbortController();
      const points: number[] = [];
      const run = engine.runBranch(s, [0, 1], {
        thermo: () => {}, diagnostics: () => {},
        point: (p) => { points.push(p.timeIndex); if (points.length === 2) controller.abort(); },
      }, { signal: controller.signal });
      await expect(run).rejects.toMatchObject({ name: 'AbortError' });
      expect(points).toEqual([0, 1]);
    });
  });

  describe('when the time grid is explicit', () => {
    it('emits points in ascending time order whatever order the values come in', async () => {
      const s = spec(yInput(H1_TERMS, { times: { values: [1.2, 0.3, 0] } }));
      const out = await collect(engine, s, [1]);
      const ref = await collect(engine, spec(yInput(H1_TERMS, { times: { values: [0, 0.3, 1.2] } })), [1]);
      expect(out.points.map((p) => p.timeIndex)).toEqual([0, 1, 2]);
      expect(out.points).toEqual(ref.points);
    });
  });
});
