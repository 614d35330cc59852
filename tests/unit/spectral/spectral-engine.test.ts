/**
 * The spectral engine on small systems against references independent of its code:
 * - dense matrix exponentials e^{−βH0}, e^{−iH1t} from the general-purpose library mathjs
 *   (tests/support/reference/dense-pauli.ts) for 3-qubit Hamiltonians with Y factors;
 * - the two-site Heisenberg dimer in closed form (singlet −3J, triplet +J: common practice),
 *   statically and after a staggered-field quench, where ⟨X0X1⟩(t) = (p_T − p_S)·cos(4ht)
 *   (the field splits |01⟩ and |10⟩ by 4h; derived from those levels);
 * and on its own contract: β = 0, diagnostics, resume, abort.
 * Tolerances: values must lie within the engine's reported error plus 1e-12 (mathjs's expm is
 * a Padé approximant accurate to ~1e-14 relative here; closed forms are evaluated in double
 * precision, ~1e-15), and the reported errors must themselves be small (< 1e-10), so the checks
 * cannot pass with vacuous error bars.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { SpectralEngine } from '../../../workers/src/engines/spectral/index.js';
import {
  denseThermal, denseUnitary, heisenbergExpectations, pauliSumMatrix,
} from '../../support/reference/dense-pauli.js';
import type { DenseTerm } from '../../support/reference/dense-pauli.js';
import { collect, seriesOf, spec } from '../exact/collect.js';

const engine = new SpectralEngine();

/** 3-site H0 and H1 with odd-Y terms (H ≠ Hᵀ) and a constant shift. */
const H0_TERMS: DenseTerm[] = [
  { weight: 0.8, word: 'X0 Y1' }, { weight: -0.5, word: 'Y1 Z2' }, { weight: 0.3, word: 'Y0' },
  { weight: 0.6, word: 'Z0 Z1' }, { weight: -0.4, word: 'X2' }, { weight: 0.25, word: '' },
];
const H1_TERMS: DenseTerm[] = [
  { weight: 0.7, word: 'Y0 Y1' }, { weight: 0.9, word: 'X1 Y2' }, { weight: -0.6, word: 'Y2' },
  { weight: 0.5, word: 'Z0' }, { weight: 0.3, word: 'X0 X1 Z2' },
];

function yInput(extra: Partial<SweepSpecInput> = {}): SweepSpecInput {
  return {
    lattice: { kind: 'chain', length: 3 },
    h0: { model: 'pauli-sum', terms: H0_TERMS },
    h1: { model: 'pauli-sum', terms: H1_TERMS },
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

describe('SpectralEngine', () => {
  describe('when H0 and H1 contain Y factors (3 qubits)', () => {
    it('matches mathjs expm for ln Z, E, C and every series at every time, within the reported errors', async () => {
      const s = spec(yInput());
      const out = await collect(engine, s, [0, 1, 2]);
      const h0 = pauliSumMatrix(H0_TERMS, 3);
      const h1 = pauliSumMatrix(H1_TERMS, 3);
      const ops = [
        ...[0, 1, 2].map((i) => pauliSumMatrix([{ weight: 1, word: `Z${i}` }], 3)),
        ...[0, 1, 2].map((i) => pauliSumMatrix([{ weight: 1, word: `Y${i}` }], 3)),
        pauliSumMatrix([{ weight: 1, word: 'X0 Y2' }], 3),
        h1,
      ];
      const idx = ['Z@0', 'Z@1', 'Z@2', 'Y@0', 'Y@1', 'Y@2', 'XY:pairs', 'E:h1'].map((l) => seriesOf(engine, s, l));
      const betas = [0, 0.6, 1.7];
      const times = [0, 0.6, 1.2, 1.8];
      for (const r of out.thermo) {
        const ref = denseThermal(h0, r.beta);
        expect(Math.abs(r.lnZ - ref.lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-12);
        expect(Math.abs(r.energy - ref.energy)).toBeLessThanOrEqual(r.errors.energy + 1e-12);
        expect(Math.abs(r.heatCapacity - ref.heatCapacity)).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-12);
        expect(r.errors.heatCapacity).toBeLessThan(1e-10);
      }
      expect(out.points).toHaveLength(12);
      let worst = 0;
      for (const p of out.points) {
        const ref = heisenbergExpectations(denseThermal(h0, betas[p.betaIndex]).rho, denseUnitary(h1, times[p.timeIndex]), ops);
        idx.forEach((k, j) => {
          const diff = Math.abs(p.values[k] - ref[j]);
          worst = Math.max(worst, diff);
          expect(diff).toBeLessThanOrEqual(p.errors[k] + 1e-12);
          expect(p.errors[k]).toBeLessThan(1e-10);
        });
      }
      expect(worst).toBeLessThan(1e-12);
      // The quench moves ⟨Z0⟩ at β = 1.7: the comparison is not between constants.
      const at = (t: number) => out.points.find((p) => p.betaIndex === 2 && p.timeIndex === t)!.values[idx[0]];
      expect(Math.abs(at(0) - at(3))).toBeGreaterThan(0.01);
      // No magnetisation symmetry here: one complex block of 8 states.
      expect(out.diagnostics[0].extra).toMatchObject({ jointBlocks: 1, largestBlock: 8, realQuenchBlocks: 0 });
    });
  });

  describe('when the model is the two-site Heisenberg dimer', () => {
    const J = 0.8;
    const levels = [-3 * J, J, J, J];
    const betas = [0.3, 1, 2.5, 6];

    it('reproduces ln Z, E, C, F and S in closed form within the reported errors', async () => {
      const s = spec({
        lattice: { kind: 'chain', length: 2 }, h0: { model: 'xxz', J, delta: 1 }, h1: { model: 'xxz', J, delta: 1 },
        betas, times: { start: 0, stop: 1, count: 2 }, observables: [{ kind: 'pair', paulis: 'ZZ' }],
      });
      const out = await collect(engine, s, [0, 1, 2, 3]);
      expect(out.thermo.map((r) => r.betaIndex)).toEqual([0, 1, 2, 3]);
      for (const r of out.thermo) {
        const b = r.beta;
        const z = levels.reduce((acc, e) => acc + Math.exp(-b * e), 0);
        const e1 = levels.reduce((acc, e) => acc + e * Math.exp(-b * e), 0) / z;
        const e2 = levels.reduce((acc, e) => acc + e * e * Math.exp(-b * e), 0) / z;
        const lnZ = Math.log(z);
        expect(Math.abs(r.lnZ - lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-13);
        expect(Math.abs(r.energy - e1)).toBeLessThanOrEqual(r.errors.energy + 1e-13);
        expect(Math.abs(r.heatCapacity - b * b * (e2 - e1 * e1))).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-12);
        expect(Math.abs(r.freeEnergy! + lnZ / b)).toBeLessThanOrEqual(r.errors.freeEnergy! + 1e-13);
        expect(Math.abs(r.entropy - (lnZ + b * e1))).toBeLessThanOrEqual(r.errors.entropy + 1e-12);
        for (const key of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) expect(r.errors[key]).toBeLessThan(1e-11);
      }
      for (const p of out.points) {
        const b = betas[p.betaIndex];
        const ref = (Math.exp(-b * J) - Math.exp(3 * b * J)) / (3 * Math.exp(-b * J) + Math.exp(3 * b * J));
        expect(Math.abs(p.values[0] - ref)).toBeLessThanOrEqual(p.errors[0] + 1e-13);
      }
      for (const d of out.diagnostics) {
        expect(d.stationarityResidual).not.toBeNull();
        expect(d.stationarityResidual!).toBeLessThan(1e-13);
      }
    });

    it('gives ⟨X0X1⟩(t) = (p_T − p_S)·cos(4ht) after a staggered-field quench h(Z0 − Z1)', async () => {
      const h = 0.45;
      const times = [0, 0.3, 0.9, 1.7, 2.2];
      const s = spec({
        lattice: { kind: 'chain', length: 2 }, h0: { model: 'xxz', J, delta: 1 },
        h1: { model: 'pauli-sum', terms: [{ weight: h, word: 'Z0' }, { weight: -h, word: 'Z1' }] },
        betas, times: { values: times },
        observables: [{ kind: 'pair', paulis: 'XX' }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'energy', of: 'h1' }],
      });
      const out = await collect(engine, s, [0, 1, 2, 3]);
      const xx = seriesOf(engine, s, 'XX:nearest');
      const zz = seriesOf(engine, s, 'ZZ:nearest');
      for (const p of out.points) {
        const b = betas[p.betaIndex];
        const z = 3 * Math.exp(-b * J) + Math.exp(3 * b * J);
        const pT = Math.exp(-b * J) / z;
        const pS = Math.exp(3 * b * J) / z;
        expect(Math.abs(p.values[xx] - (pT - pS) * Math.cos(4 * h * times[p.timeIndex]))).toBeLessThanOrEqual(p.errors[xx] + 1e-13);
        expect(Math.abs(p.values[zz] - (pT - pS))).toBeLessThanOrEqual(p.errors[zz] + 1e-13); // Z0Z1 commutes with H1
        expect(p.errors[xx]).toBeLessThan(1e-12);
      }
      for (const d of out.diagnostics) {
        expect(d.stationarityResidual).toBeNull();
        expect(d.h1Drift).toBeLessThan(1e-14);
        expect(d.normDrift).toBeLessThan(1e-14);
      }
    });
  });

  describe('when β = 0', () => {
    it('gives ln Z = S = N ln 2, E = Tr(H0)/2^N, no free energy, and infinite-temperature expectations', async () => {
      const s = spec(yInput({ betas: [0] }));
      const out = await collect(engine, s, [0]);
      const t = out.thermo[0];
      expect(Math.abs(t.lnZ - 3 * Math.LN2)).toBeLessThanOrEqual(t.errors.lnZ);
      expect(Math.abs(t.entropy - 3 * Math.LN2)).toBeLessThanOrEqual(t.errors.entropy);
      expect(Math.abs(t.energy - 0.25)).toBeLessThanOrEqual(t.errors.energy);
      expect(t.freeEnergy).toBeNull();
      expect(t.errors.freeEnergy).toBeNull();
      expect(t.heatCapacity).toBe(0);
      for (const p of out.points) for (let k = 0; k < 7; k++) expect(Math.abs(p.values[k])).toBeLessThanOrEqual(p.errors[k]);
    });
  });

  describe('diagnostics', () => {
    it('reports measured ⟨H1⟩ and norm drifts at rounding level, and a propagator bound from the residuals', async () => {
      const s = spec({
        lattice: { kind: 'chain', length: 6, boundary: 'periodic' },
        h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.3 }, h1: { model: 'xxz', J: 1, delta: 2 },
        betas: [0.5, 3], times: { start: 0, stop: 20, count: 41 }, observables: [{ kind: 'energy', of: 'h1' }],
      });
      const out = await collect(engine, s, [0, 1]);
      for (const d of out.diagnostics) {
        const x = d.extra;
        expect(x.symmetry).toBe('magnetisation + translation a1 (order 6) + reflection inversion');
        expect(x.symmetryDropped).toBe('');
        // Vectors per momentum (character counting, dim_k = (1/6)·Σ_a e^{2πika/6}·2^{gcd(a,6)}):
        // k = 0: 14, k = 3: 10 (both split by parity), k = 1: 9 and k = 2: 11, which also stand
        // for k = 5 and 4 — 14 + 10 + 9 + 11 = 44 kept of 64.
        expect(x.basisVectors).toBe(44);
        expect(x.mirroredBlocks as number).toBeGreaterThan(0);
        expect(x.h0BackwardError as number).toBeLessThan(1e-12);
        expect(x.h1BackwardError as number).toBeLessThan(1e-12);
        expect(d.propagatorErrorBound).toBeGreaterThan(0);
        expect(d.propagatorErrorBound).toBeLessThan(20 * 1e-12 + 1e-12);
        // ⟨H1⟩ ≈ −6 at β = 3; the drift over t ≤ 20 stays at a few ulps of it.
        expect(d.h1Drift).toBeLessThan(1e-12);
        expect(d.normDrift).toBeLessThan(1e-13);
      }
      // The series E:h1 is the same conserved quantity, measured through the series path.
      for (const b of [0, 1]) {
        const pts = out.points.filter((p) => p.betaIndex === b);
        for (const p of pts) expect(Math.abs(p.values[0] - pts[0].values[0])).toBeLessThan(1e-12);
      }
    });
  });

  describe('branch contract', () => {
    const s = spec(yInput());

    it('skips points below resumeFrom without changing the others', async () => {
      const full = await collect(engine, s, [0, 1, 2]);
      const resumed = await collect(engine, s, [2, 1], { resumeFrom: { 2: 3, 1: 1 } });
      expect(resumed.points.filter((p) => p.betaIndex === 2).map((p) => p.timeIndex)).toEqual([3]);
      expect(resumed.points.filter((p) => p.betaIndex === 1).map((p) => p.timeIndex)).toEqual([1, 2, 3]);
      for (const p of resumed.points) {
        const q = full.points.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex)!;
        expect(p.values).toEqual(q.values);
      }
      expect(resumed.thermo.map((t) => t.betaIndex)).toEqual([1, 2]);
    });

    it('rejects with an AbortError when the signal fires, and a RangeError for a bad β index', async () => {
      const controller = new AbortController();
      controller.abort(new Error('stop'));
      await expect(collect(engine, s, [0], { signal: controller.signal })).rejects.toMatchObject({ name: 'AbortError' });
      await expect(collect(engine, s, [3])).rejects.toThrow(RangeError);
    });

    it('names its series like the observables layer and does nothing for an empty branch', async () => {
      expect(engine.series(s).map((x) => x.label)).toEqual(
        ['Z:avg', 'Z@0', 'Z@1', 'Z@2', 'Y:avg', 'Y@0', 'Y@1', 'Y@2', 'XY:pairs', 'E:h1']);
      const out = await collect(engine, s, []);
      expect(out.points).toHaveLength(0);
      expect(() => new SpectralEngine({ symmetry: 'momentum' as never })).toThrow(/one of none, magnetisation, translations, all/);
    });
  });
});
