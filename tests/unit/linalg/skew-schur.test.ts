/**
 * skewSchur (and the Householder reduction under it) checked by invariants, as mljs/matrix does
 * for its decompositions: A·O = O·Λ (Λ = ⊕ε_k J), OᵀO = 1, ε_k ≥ 0, Pf(A) = det O·Π ε_k, and
 * the tridiagonal reduction A = Q T Qᵀ. Tolerances: backward-stable O(n³) algorithms on entries
 * ≤ 1 give residuals ≈ c·n·u·‖A‖ (u = 2⁻⁵³); at n ≤ 120, 1e−12 leaves a margin of ~10.
 */
import { describe, expect, it } from 'vitest';
import { applyHouseholderQ } from '../../../workers/src/linalg/apply-householder-q.js';
import { pfaffian } from '../../../workers/src/linalg/pfaffian.js';
import { skewSchur, type SkewSchur } from '../../../workers/src/linalg/skew-schur.js';
import { skewTridiagonalize } from '../../../workers/src/linalg/skew-tridiagonalize.js';
import { orthogonalityError, randomSkew } from './random-matrices.js';

const TOL = 1e-12;

/** max |(A O − O Λ)_ij|. */
function residual(a: Float64Array, s: SkewSchur): number {
  const { n, o, eps } = s;
  let worst = 0;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n / 2; k++) {
      let s0 = 0, s1 = 0;
      for (let l = 0; l < n; l++) { s0 += a[i * n + l] * o[l * n + 2 * k]; s1 += a[i * n + l] * o[l * n + 2 * k + 1]; }
      worst = Math.max(worst, Math.abs(s0 + eps[k] * o[i * n + 2 * k + 1]), Math.abs(s1 - eps[k] * o[i * n + 2 * k]));
    }
  }
  return worst;
}

function ring(L: number, h: number, J: number, boundary: 1 | -1 = 1): Float64Array {
  // The Majorana matrix of a periodic transverse-field chain in one parity sector (translation
  // invariant: doubly degenerate ε_k = ε_{−k}), the case that stresses degenerate singular values.
  // boundary = +1: antiperiodic fermions (even sector), −1: periodic fermions (odd sector).
  const n = 2 * L;
  const a = new Float64Array(n * n);
  const set = (m: number, q: number, v: number) => { a[m * n + q] = v; a[q * n + m] = -v; };
  for (let j = 0; j < L; j++) {
    set(2 * j, 2 * j + 1, -2 * h);
    if (j + 1 < L) set(2 * j + 1, 2 * j + 2, -2 * J); else set(2 * j + 1, 0, 2 * J * boundary);
  }
  return a;
}

describe('skewSchur', () => {
  const cases: Array<[string, Float64Array, number]> = [
    ['a dense random matrix (n = 40)', randomSkew(40, 11), 40],
    ['a dense random matrix (n = 120)', randomSkew(120, 12), 120],
    ['a skew tridiagonal matrix (no Householder step)', randomSkew(60, 13, 1), 60],
    ['a banded matrix (bandwidth 3)', randomSkew(50, 14, 3), 50],
    ['a translation-invariant ring with degenerate pairs', ring(30, 0.7, 1), 60],
    ['a critical ring with an exact zero mode', ring(16, 1, 1, -1), 32],
  ];
  for (const [what, a, n] of cases) {
    it(`gives A·O = O·Λ, OᵀO = 1 and ε ≥ 0 for ${what}`, () => {
      const s = skewSchur(n, a.slice());
      expect(residual(a, s)).toBeLessThan(TOL);
      expect(orthogonalityError(s.o, n)).toBeLessThan(TOL);
      for (const e of s.eps) expect(e).toBeGreaterThanOrEqual(0);
    });
  }

  it('uses no Householder step for tridiagonal input and one for a ring', () => {
    expect(skewSchur(60, randomSkew(60, 13, 1)).tridiagonalInput).toBe(true);
    expect(skewSchur(60, ring(30, 0.7, 1)).tridiagonalInput).toBe(false);
  });

  it('returns det O consistent with the Pfaffian: Pf(A) = det O · Π ε_k', () => {
    for (const [seed, band] of [[21, Infinity], [22, 1], [23, 2], [24, Infinity]] as const) {
      const n = 24;
      const a = randomSkew(n, seed, band);
      const s = skewSchur(n, a.slice());
      const pf = pfaffian(n, a, n, new Float64Array(n * n));
      let logProd = 0;
      for (const e of s.eps) logProd += Math.log(e);
      expect(pf.sign).toBe(s.det);
      // Both routes are backward stable: log-magnitudes agree to ~n·u·cond.
      expect(Math.abs(pf.logAbs - logProd)).toBeLessThan(1e-11);
    }
  });

  it('finds a 1 × 1 block exactly: [[0, a], [−a, 0]] has ε = |a| and det O = sign a', () => {
    for (const v of [2.5, -0.75]) {
      const a = Float64Array.from([0, v, -v, 0]);
      const s = skewSchur(2, a.slice());
      expect(s.eps[0]).toBe(Math.abs(v));
      expect(s.det).toBe(v > 0 ? 1 : -1);
      expect(residual(a, s)).toBe(0);
    }
  });

  it('reproduces the ring spectra ε_k = 2|h − J e^{ik}| with the zero mode of the critical periodic sector', () => {
    // Translation-invariant chain: ε_k = 2√(J² + h² − 2Jh cos k) (Pfeuty 1970, in our Pauli
    // units), k = 2πm/L for periodic fermions, π(2m+1)/L for antiperiodic ones.
    const L = 16;
    for (const [h, boundary] of [[1, -1], [1, 1], [0.6, -1], [0.6, 1]] as const) {
      const s = skewSchur(2 * L, ring(L, h, 1, boundary));
      const got = Array.from(s.eps).sort((x, y) => x - y);
      const want = Array.from({ length: L }, (_, m) => {
        const k = boundary === -1 ? (2 * Math.PI * m) / L : (Math.PI * (2 * m + 1)) / L;
        return 2 * Math.sqrt(1 + h * h - 2 * h * Math.cos(k));
      }).sort((x, y) => x - y);
      expect(Math.max(...got.map((v, i) => Math.abs(v - want[i])))).toBeLessThan(1e-13);
    }
    const critical = Array.from(skewSchur(2 * L, ring(L, 1, 1, -1)).eps).sort((x, y) => x - y);
    expect(critical[0]).toBeLessThan(1e-14);
    expect(critical[1]).toBeGreaterThan(0.7);
  });

  it('handles the empty matrix and rejects odd or non-finite input', () => {
    expect(skewSchur(0, new Float64Array(0)).eps.length).toBe(0);
    expect(() => skewSchur(3, new Float64Array(9))).toThrow(RangeError);
    const bad = randomSkew(4, 1);
    bad[2 * 4 + 1] = Number.NaN;
    expect(() => skewSchur(4, bad)).toThrow(/not finite/);
  });
});

describe('skewTridiagonalize with applyHouseholderQ', () => {
  it('reconstructs A = Q T Qᵀ with Q orthogonal', () => {
    const n = 30;
    const a = randomSkew(n, 31);
    const work = a.slice();
    const sub = new Float64Array(n - 1);
    const tau = new Float64Array(n - 2);
    const reflections = skewTridiagonalize(n, work, { sub, tau, w: new Float64Array(n), v: new Float64Array(n) });
    expect(reflections).toBe(n - 2);
    const q = new Float64Array(n * n);
    for (let i = 0; i < n; i++) q[i * n + i] = 1;
    applyHouseholderQ(n, work, tau, q, n, new Float64Array(n));
    expect(orthogonalityError(q, n)).toBeLessThan(TOL);
    // (Q T Qᵀ)_ij with T_{i+1,i} = sub[i], T_{i,i+1} = −sub[i].
    let worst = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let s = 0;
        for (let k = 0; k + 1 < n; k++) {
          s += q[i * n + k + 1] * sub[k] * q[j * n + k] - q[i * n + k] * sub[k] * q[j * n + k + 1];
        }
        worst = Math.max(worst, Math.abs(s - a[i * n + j]));
      }
    }
    expect(worst).toBeLessThan(TOL);
  });

  it('skips the reflector of a column that is already reduced (τ = 0)', () => {
    const n = 6;
    const a = randomSkew(n, 32, 1);
    const tau = new Float64Array(n - 2);
    const reflections = skewTridiagonalize(n, a, { sub: new Float64Array(n - 1), tau, w: new Float64Array(n), v: new Float64Array(n) });
    expect(reflections).toBe(0);
    expect(Array.from(tau)).toEqual([0, 0, 0, 0]);
  });

  it('rejects short buffers', () => {
    expect(() => skewTridiagonalize(4, new Float64Array(15), { sub: new Float64Array(3), tau: new Float64Array(2), w: new Float64Array(4), v: new Float64Array(4) })).toThrow(RangeError);
  });
});
