/**
 * External check: the exact engine on 3-qubit Pauli-sum Hamiltonians (with Y terms) against
 * dense matrix exponentials from the general-purpose library mathjs (`expm`, Padé with scaling
 * and squaring): ρ = e^{−βH0}/Z, ⟨O(t)⟩ = Tr(ρ U† O U), U = e^{−iH1 t}. Dense matrices are built
 * in tests/support/reference/dense-pauli.ts straight from the Pauli matrices (DESIGN.md §2).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Matrix } from 'mathjs';
import type { SweepResult } from '../../shared-types/src/index.js';
import {
  denseThermal, denseUnitary, heisenbergExpectations, pauliSumMatrix, type DenseTerm, type DenseThermal,
} from '../support/reference/dense-pauli.js';
import { runReferenceSweep, seriesByLabel } from '../support/reference/run-reference-sweep.js';

/** H0 with Y terms, a three-body term and an identity offset (shifts ln Z and E only). */
const H0_TERMS: DenseTerm[] = [
  { weight: 0.7, word: 'X0 Y1' }, { weight: 0.3, word: 'Y0 Z2' }, { weight: -0.5, word: 'Z1' },
  { weight: 0.4, word: 'X2' }, { weight: 0.25, word: 'Y1 Y2' }, { weight: -0.6, word: 'Z0 Z1' },
  { weight: 0.35, word: 'X0 Z1 Y2' }, { weight: 0.2, word: '' },
];
/** H1 does not commute with H0 and contains Y terms (so H1ᵀ ≠ H1). */
const H1_TERMS: DenseTerm[] = [
  { weight: 0.9, word: 'Y0 Y1' }, { weight: -0.45, word: 'X1 Z2' }, { weight: 0.35, word: 'Y2' },
  { weight: 0.5, word: 'Z0 X2' }, { weight: 0.3, word: 'X0 Y1 Z2' }, { weight: -0.2, word: 'Y0' },
];
const PAIRS: Array<[number, number]> = [[0, 1], [1, 2], [0, 2], [2, 0]];
/**
 * Both sides are accurate to ~1e-13 here (8 × 8 matrices, ‖H t‖ ≲ 10): 1e-10 absolute leaves
 * margin for expm's Padé error and for ln Z (|ln Z| ≲ 10) rounding.
 */
const TOL = 1e-10;

let result: SweepResult;
let thermals: DenseThermal[];
let unitaries: Matrix[];

beforeAll(async () => {
  result = await runReferenceSweep({
    lattice: { kind: 'chain', length: 3 },
    h0: { model: 'pauli-sum', terms: H0_TERMS },
    h1: { model: 'pauli-sum', terms: H1_TERMS },
    betas: [0, 0.5, 2],
    times: { start: 0, stop: 3, count: 7 },
    observables: [
      { kind: 'site', pauli: 'X', perSite: true },
      { kind: 'site', pauli: 'Y', perSite: true },
      { kind: 'site', pauli: 'Z', perSite: true },
      { kind: 'pair', paulis: 'XY', pairs: PAIRS, perPair: true },
      { kind: 'pair', paulis: 'YZ', pairs: PAIRS, perPair: true },
      { kind: 'energy', of: 'h0' },
      { kind: 'energy', of: 'h1' },
    ],
    engine: 'exact',
    tolerance: 1e-11,
  });
  const h0 = pauliSumMatrix(H0_TERMS, 3);
  thermals = result.betas.map((beta) => denseThermal(h0, beta));
  unitaries = result.times.map((t) => denseUnitary(pauliSumMatrix(H1_TERMS, 3), t));
}, 120_000);

/** Dense reference ⟨O(t)⟩ for each (β index, time index). */
function reference(terms: DenseTerm[]): number[][] {
  const op = pauliSumMatrix(terms, 3);
  return thermals.map((th) => unitaries.map((u) => heisenbergExpectations(th.rho, u, [op])[0]));
}

function expectSeries(label: string, terms: DenseTerm[]): void {
  const want = reference(terms);
  const s = seriesByLabel(result, label);
  s.values.forEach((row, b) => row.forEach((v, t) => {
    expect(Math.abs(v - want[b][t]), `${label} β=${result.betas[b]} t=${result.times[t]}`).toBeLessThan(TOL);
  }));
}

describe('the exact engine against mathjs expm on 3-qubit Pauli sums with Y terms', () => {
  it('matches ln Z, E and C of e^{−βH0} (identity offset included)', () => {
    result.thermo.forEach((rec) => {
      const d = thermals[rec.betaIndex];
      expect(Math.abs(rec.lnZ - d.lnZ)).toBeLessThan(TOL);
      expect(Math.abs(rec.energy - d.energy)).toBeLessThan(TOL);
      expect(Math.abs(rec.heatCapacity - d.heatCapacity)).toBeLessThan(TOL);
    });
    // β = 0: Z = Tr 1 = 8 exactly, E = Tr H0 / 8 = the identity weight.
    expect(Math.abs(result.thermo[0].lnZ - 3 * Math.LN2)).toBeLessThan(1e-14);
    expect(Math.abs(result.thermo[0].energy - 0.2)).toBeLessThan(1e-14);
  });

  it('matches ⟨X_i⟩(t), ⟨Y_i⟩(t), ⟨Z_i⟩(t) on every site', () => {
    for (const p of ['X', 'Y', 'Z']) for (let i = 0; i < 3; i++) expectSeries(`${p}@${i}`, [{ weight: 1, word: `${p}${i}` }]);
  });

  it('matches two-site correlators with the first letter on the first site, including a reversed pair', () => {
    for (const ab of ['XY', 'YZ']) {
      for (const [i, j] of PAIRS) expectSeries(`${ab}@${i}-${j}`, [{ weight: 1, word: `${ab[0]}${i} ${ab[1]}${j}` }]);
      expectSeries(`${ab}:pairs`, PAIRS.map(([i, j]) => ({ weight: 1 / PAIRS.length, word: `${ab[0]}${i} ${ab[1]}${j}` })));
    }
  });

  it('matches ⟨H0⟩(t) and keeps ⟨H1⟩(t) constant at Tr(ρ H1)', () => {
    expectSeries('E:h0', H0_TERMS);
    expectSeries('E:h1', H1_TERMS);
    const want = reference(H1_TERMS);
    for (const row of want) for (const v of row) expect(Math.abs(v - row[0])).toBeLessThan(1e-12);
  });

  it('gives zero for every traceless observable at β = 0 (ρ ∝ 1 is invariant)', () => {
    for (const s of result.series) {
      if (s.label === 'E:h0') continue;
      for (const v of s.values[0]) expect(Math.abs(v)).toBeLessThan(1e-13);
    }
  });

  it('would see the difference if the quench were e^{+iH1t} (the check discriminates)', () => {
    const op = pauliSumMatrix([{ weight: 1, word: 'X0' }], 3);
    const s = seriesByLabel(result, 'X@0');
    const wrongU = denseUnitary(pauliSumMatrix(H1_TERMS.map((x) => ({ ...x, weight: -x.weight })), 3), result.times[3]);
    const wrong = heisenbergExpectations(thermals[2].rho, wrongU, [op])[0];
    expect(Math.abs(s.values[2][3] - wrong)).toBeGreaterThan(1e-3);
  });
});
