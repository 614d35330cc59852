/**
 * Checks of the reference-only free-fermion solution (tests/support/reference/free-fermion-ising.ts)
 * BEFORE it is used to judge the engine: the Jordan–Wigner mapping operator by operator, then
 * thermodynamics and quench dynamics against dense exact diagonalisation with mathjs expm.
 * Sources of the method: Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); Pfeuty, Ann. Phys. 57, 79 (1970).
 */
import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import type { Matrix } from 'mathjs';
import { symmetricEigen } from '../support/reference/jacobi-eigen.js';
import {
  bondZZ, evolveCovariance, majoranaEnergy, majoranaMatrix, majoranaPropagator, openTfimQuench, siteX, thermalState,
} from '../support/reference/free-fermion-ising.js';
import {
  denseThermal, denseUnitary, heisenbergExpectations, pauliSumMatrix, type DenseTerm,
} from '../support/reference/dense-pauli.js';

/** Deterministic PRNG (mulberry32) for test inputs. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function maxAbsDiff(a: Matrix, b: Matrix): number {
  const d = math.subtract(a, b) as Matrix;
  let m = 0;
  d.forEach((v) => { m = Math.max(m, math.abs(math.complex(v as never)) as unknown as number); });
  return m;
}

/** The open chain H = −J Σ Z_iZ_{i+1} − h Σ X_i as Pauli terms. */
function tfimTerms(L: number, J: number, h: number): DenseTerm[] {
  const t: DenseTerm[] = [];
  for (let i = 0; i + 1 < L; i++) t.push({ weight: -J, word: `Z${i} Z${i + 1}` });
  for (let i = 0; i < L; i++) t.push({ weight: -h, word: `X${i}` });
  return t;
}

/** Majorana c_{2j} = (Π_{k<j} X_k) Z_j, c_{2j+1} = (Π_{k<j} X_k) Y_j as Pauli words. */
function majoranaWords(L: number): string[] {
  const words: string[] = [];
  for (let j = 0; j < L; j++) {
    const string = [...Array(j).keys()].map((k) => `X${k}`).join(' ');
    words.push(`${string} Z${j}`.trim(), `${string} Y${j}`.trim());
  }
  return words;
}

describe('the reference Jacobi eigensolver', () => {
  it('reconstructs a random symmetric matrix and returns orthonormal eigenvectors', () => {
    const r = rng(7);
    const n = 12;
    const s = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    for (let i = 0; i < n; i++) for (let j = i; j < n; j++) { s[i][j] = s[j][i] = 2 * r() - 1; }
    const { values, vectors } = symmetricEigen(s);
    let recon = 0, ortho = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let a = 0, o = 0;
        for (let k = 0; k < n; k++) { a += vectors[i][k] * values[k] * vectors[j][k]; o += vectors[k][i] * vectors[k][j]; }
        recon = Math.max(recon, Math.abs(a - s[i][j]));
        ortho = Math.max(ortho, Math.abs(o - (i === j ? 1 : 0)));
      }
    }
    // Jacobi is backward stable: errors of a few ulps times n times ‖S‖ (~3 here).
    expect(recon).toBeLessThan(1e-13);
    expect(ortho).toBeLessThan(1e-13);
    for (let k = 1; k < n; k++) expect(values[k]).toBeGreaterThanOrEqual(values[k - 1]);
  });

  it('handles exactly degenerate spectra and the 1 × 1 and empty cases', () => {
    const { values } = symmetricEigen([[2, 0, 0], [0, 2, 0], [0, 0, -1]]);
    expect(values).toEqual([-1, 2, 2]);
    expect(symmetricEigen([[5]]).values).toEqual([5]);
    expect(symmetricEigen([]).values).toEqual([]);
    expect(() => symmetricEigen([[1, Number.NaN], [Number.NaN, 1]])).toThrow(RangeError);
  });
});

describe('the Jordan–Wigner mapping of the open transverse-field Ising chain', () => {
  for (const L of [3, 4]) {
    it(`gives anticommuting Majoranas and H = (i/4) Σ A_mn c_m c_n exactly at L = ${L}`, () => {
      const J = 0.8, h = 0.37;
      const c = majoranaWords(L).map((w) => pauliSumMatrix([{ weight: 1, word: w }], L));
      const dim = 2 ** L;
      const id = math.identity(dim) as Matrix;
      // {c_m, c_n} = 2δ_mn: entries are small integers, so the check is exact.
      for (let m = 0; m < 2 * L; m++) {
        for (let n = 0; n < 2 * L; n++) {
          const ac = math.add(math.multiply(c[m], c[n]), math.multiply(c[n], c[m])) as Matrix;
          expect(maxAbsDiff(ac, m === n ? (math.multiply(2, id) as Matrix) : (math.multiply(0, id) as Matrix))).toBe(0);
        }
      }
      // X_j = i a_j b_j and Z_j Z_{j+1} = i b_j a_{j+1} (exact: entries 0, ±1, ±i).
      const i = math.complex(0, 1);
      for (let j = 0; j < L; j++) {
        const x = pauliSumMatrix([{ weight: 1, word: `X${j}` }], L);
        expect(maxAbsDiff(math.multiply(i, math.multiply(c[2 * j], c[2 * j + 1])) as Matrix, x)).toBe(0);
        if (j + 1 < L) {
          const zz = pauliSumMatrix([{ weight: 1, word: `Z${j} Z${j + 1}` }], L);
          expect(maxAbsDiff(math.multiply(i, math.multiply(c[2 * j + 1], c[2 * j + 2])) as Matrix, zz)).toBe(0);
        }
      }
      // The whole Hamiltonian: rounding only from summing a few weights (1e-14 is ~50 ulps of ‖H‖).
      const a = majoranaMatrix({ length: L, J, h });
      let hq = math.multiply(0, id) as Matrix;
      for (let m = 0; m < 2 * L; m++) {
        for (let n = 0; n < 2 * L; n++) {
          if (a[m][n] === 0) continue;
          hq = math.add(hq, math.multiply(math.complex(0, a[m][n] / 4), math.multiply(c[m], c[n]))) as Matrix;
        }
      }
      expect(maxAbsDiff(hq, pauliSumMatrix(tfimTerms(L, J, h), L))).toBeLessThan(1e-14);
    });
  }
});

describe('the free-fermion reference against dense exact diagonalisation (mathjs expm)', () => {
  const times = [...Array(21).keys()].map((k) => 0.2 * k);
  for (const L of [1, 3, 4]) {
    it(`matches ln Z, E, C, ⟨X_j⟩(t) and ⟨Z_jZ_j+1⟩(t) after h0 = 0.5 → h1 = 1.5 at L = ${L}`, () => {
      const J = 1, h0 = 0.5, h1 = 1.5;
      const H0 = pauliSumMatrix(tfimTerms(L, J, h0), L);
      const H1 = pauliSumMatrix(tfimTerms(L, J, h1), L);
      const ops = [
        ...[...Array(L).keys()].map((j) => pauliSumMatrix([{ weight: 1, word: `X${j}` }], L)),
        ...[...Array(L - 1).keys()].map((j) => pauliSumMatrix([{ weight: 1, word: `Z${j} Z${j + 1}` }], L)),
      ];
      const us = times.map((t) => denseUnitary(H1, t));
      let worst = 0;
      for (const beta of [0, 0.3, 1, 3]) {
        const dense = denseThermal(H0, beta);
        const ref = openTfimQuench({ length: L, J, h0, h1, beta, times });
        // Thermodynamics: both sides are accurate to ~1e-14 relative; 1e-11 leaves room for expm's
        // Padé error at β‖H‖ ≈ 20 and for C's difference of two O(10) numbers.
        expect(Math.abs(ref.thermo.lnZ - dense.lnZ)).toBeLessThan(1e-11 * Math.max(1, Math.abs(dense.lnZ)));
        expect(Math.abs(ref.thermo.energy - dense.energy)).toBeLessThan(1e-11 * Math.max(1, Math.abs(dense.energy)));
        expect(Math.abs(ref.thermo.heatCapacity - dense.heatCapacity)).toBeLessThan(1e-10);
        times.forEach((_, k) => {
          const d = heisenbergExpectations(dense.rho, us[k], ops);
          const r = [...ref.x[k], ...ref.zz[k]];
          r.forEach((v, q) => { worst = Math.max(worst, Math.abs(v - d[q])); });
        });
        // Conservation of ⟨H1⟩ by the orthogonal R(t): rounding only.
        for (const e of ref.h1Energy) expect(Math.abs(e - ref.h1Energy[0])).toBeLessThan(1e-12);
      }
      // Observables are O(1); both routes are accurate to ~1e-13 at t ≤ 4 (‖H1 t‖ ≲ 40).
      expect(worst).toBeLessThan(1e-11);
    });
  }

  it('detects a wrong sign of the field (the comparison can fail)', () => {
    const L = 3;
    const dense = denseThermal(pauliSumMatrix(tfimTerms(L, 1, 0.5), L), 1);
    const wrong = thermalState({ length: L, J: 1, h: -0.5 }, 1).gamma;
    const x0 = heisenbergExpectations(dense.rho, math.identity(8) as Matrix, [pauliSumMatrix([{ weight: 1, word: 'X0' }], L)])[0];
    expect(Math.abs(siteX(wrong, 0) - x0)).toBeGreaterThan(0.1);
  });
});

describe('invariants of the free-fermion reference', () => {
  it('gives Γ = 0 at β = 0, an antisymmetric Γ with |⟨iP_k⟩| ≤ 1, and an orthogonal R(t)', () => {
    const L = 8;
    expect(thermalState({ length: L, J: 1, h: 0.5 }, 0).gamma.flat().every((v) => v === 0 || Object.is(v, -0))).toBe(true);
    const { gamma, thermo } = thermalState({ length: L, J: 1, h: 0.5 }, 3);
    // Γ = −A g(AᵀA) is antisymmetric up to rounding of 16-term sums of entries ≤ 1 (~16 ulp).
    for (let m = 0; m < 2 * L; m++) for (let n = 0; n < 2 * L; n++) expect(Math.abs(gamma[m][n] + gamma[n][m])).toBeLessThan(1e-14);
    // ΓᵀΓ has eigenvalues tanh²(βε_k/2) ≤ 1 (a physical Gaussian state).
    const gtg = gamma.map((_, i) => gamma.map((__, j) => gamma.reduce((s, row) => s + row[i] * row[j], 0)));
    const ev = symmetricEigen(gtg).values;
    for (const v of ev) expect(v).toBeLessThanOrEqual(1 + 1e-14);
    const expected = thermo.modes.flatMap((e) => [Math.tanh(1.5 * e) ** 2, Math.tanh(1.5 * e) ** 2]).sort((a, b) => a - b);
    ev.forEach((v, k) => expect(Math.abs(v - expected[k])).toBeLessThan(1e-13));
    // E from the covariance equals E from the modes (two routes through the same derivation).
    expect(Math.abs(majoranaEnergy(majoranaMatrix({ length: L, J: 1, h: 0.5 }), gamma) - thermo.energy)).toBeLessThan(1e-12);
    const r = majoranaPropagator(majoranaMatrix({ length: L, J: 1, h: 1.5 }), 2.7);
    let dev = 0;
    for (let i = 0; i < 2 * L; i++) {
      for (let j = 0; j < 2 * L; j++) {
        const s = r.reduce((acc, row) => acc + row[i] * row[j], 0);
        dev = Math.max(dev, Math.abs(s - (i === j ? 1 : 0)));
      }
    }
    expect(dev).toBeLessThan(1e-13);
    const g2 = evolveCovariance(gamma, r);
    expect(Number.isFinite(bondZZ(g2, L - 2))).toBe(true);
  });

  it('reproduces the single-site closed form ⟨X⟩ = tanh(βh), constant under X-field quenches', () => {
    const q = openTfimQuench({ length: 1, J: 1, h0: 0.5, h1: 1.5, beta: 2, times: [0, 1, 3] });
    for (const row of q.x) expect(Math.abs(row[0] - Math.tanh(1))).toBeLessThan(1e-15);
    expect(q.zz.every((row) => row.length === 0)).toBe(true);
    expect(Math.abs(q.thermo.lnZ - Math.log(2 * Math.cosh(1)))).toBeLessThan(1e-15);
  });
});
