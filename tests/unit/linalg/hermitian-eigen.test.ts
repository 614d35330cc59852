/**
 * hermitianEigen (workers/src/linalg/hermitian-eigen.ts): invariants A·V = V·D and VᴴV = I on
 * random, degenerate, diagonal and edge-case matrices, closed-form spectra, and a comparison
 * with the eigenvalues of the general-purpose library mathjs on a small real symmetric matrix.
 *
 * Tolerances. The solver is backward stable: ‖AV − VD‖ and ‖VᴴV − I‖ are O(n·ε·‖A‖) and O(n·ε)
 * (LAPACK Users' Guide, 3rd ed., §4.7). We assert 1e-12·‖A‖ and 1e-12 for n ≤ 256, which
 * leaves a factor ≈ 20 over n·ε at n = 256 and still fails on any algebraic mistake (those give
 * O(1) or O(√ε) errors). ‖A‖ is the largest column 1-norm (an upper bound of ‖A‖₂).
 */
import * as math from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  createHermitianEigenWorkspace, hermitianEigen,
} from '../../../workers/src/linalg/hermitian-eigen.js';
import { seededRandom } from '../../bench/bench-record.js';

/** Column-major complex n×n. */
type Mat = Float64Array;

function randomHermitian(n: number, seed: number, real = false): Mat {
  const r = seededRandom(seed);
  const a = new Float64Array(2 * n * n);
  for (let c = 0; c < n; c++) {
    for (let i = c; i < n; i++) {
      const re = r() - 0.5;
      const im = i === c || real ? 0 : r() - 0.5;
      a[2 * (i + c * n)] = re; a[2 * (i + c * n) + 1] = im;
      a[2 * (c + i * n)] = re; a[2 * (c + i * n) + 1] = -im;
    }
  }
  return a;
}

/** Largest column 1-norm of a full complex matrix. */
function norm1(n: number, a: Mat): number {
  let m = 0;
  for (let c = 0; c < n; c++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += Math.hypot(a[2 * (i + c * n)], a[2 * (i + c * n) + 1]);
    m = Math.max(m, s);
  }
  return m;
}

/** max_k ‖A v_k − λ_k v_k‖₂ (full A, both triangles). */
function residual(n: number, a: Mat, w: Float64Array, v: Mat): number {
  let worst = 0;
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) {
      let yr = -w[k] * v[2 * (i + k * n)];
      let yi = -w[k] * v[2 * (i + k * n) + 1];
      for (let j = 0; j < n; j++) {
        const ar = a[2 * (i + j * n)], ai = a[2 * (i + j * n) + 1];
        const vr = v[2 * (j + k * n)], vi = v[2 * (j + k * n) + 1];
        yr += ar * vr - ai * vi;
        yi += ar * vi + ai * vr;
      }
      s += yr * yr + yi * yi;
    }
    worst = Math.max(worst, Math.sqrt(s));
  }
  return worst;
}

/** max_kl |(VᴴV − I)_kl|. */
function orthogonality(n: number, v: Mat): number {
  let worst = 0;
  for (let k = 0; k < n; k++) {
    for (let l = 0; l < n; l++) {
      let sr = 0, si = 0;
      for (let i = 0; i < n; i++) {
        const ar = v[2 * (i + k * n)], ai = v[2 * (i + k * n) + 1];
        const br = v[2 * (i + l * n)], bi = v[2 * (i + l * n) + 1];
        sr += ar * br + ai * bi;
        si += ar * bi - ai * br;
      }
      worst = Math.max(worst, Math.hypot(sr - (k === l ? 1 : 0), si));
    }
  }
  return worst;
}

/**
 * Q·diag(λ)·Qᴴ with Q a product of n random complex Householder reflectors I − 2uuᴴ/‖u‖²
 * (unitary by construction, independent of the solver's code).
 */
function withSpectrum(lambda: readonly number[], seed: number): Mat {
  const n = lambda.length;
  const r = seededRandom(seed);
  const q = new Float64Array(2 * n * n);
  for (let k = 0; k < n; k++) q[2 * (k + k * n)] = 1;
  for (let h = 0; h < n; h++) {
    const u = Array.from({ length: 2 * n }, () => r() - 0.5);
    const uu = u.reduce((s, x) => s + x * x, 0);
    for (let c = 0; c < n; c++) {
      // s = uᴴ q_c ; q_c ← q_c − (2/‖u‖²)·u·s
      let sr = 0, si = 0;
      for (let i = 0; i < n; i++) {
        const ur = u[2 * i], ui = u[2 * i + 1], xr = q[2 * (i + c * n)], xi = q[2 * (i + c * n) + 1];
        sr += ur * xr + ui * xi;
        si += ur * xi - ui * xr;
      }
      for (let i = 0; i < n; i++) {
        const ur = u[2 * i], ui = u[2 * i + 1];
        q[2 * (i + c * n)] -= (2 / uu) * (ur * sr - ui * si);
        q[2 * (i + c * n) + 1] -= (2 / uu) * (ur * si + ui * sr);
      }
    }
  }
  const a = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sr = 0, si = 0;
      for (let k = 0; k < n; k++) {
        const xr = q[2 * (i + k * n)], xi = q[2 * (i + k * n) + 1];
        const yr = q[2 * (j + k * n)], yi = -q[2 * (j + k * n) + 1]; // conj(Q_jk)
        sr += lambda[k] * (xr * yr - xi * yi);
        si += lambda[k] * (xr * yi + xi * yr);
      }
      a[2 * (i + j * n)] = sr;
      a[2 * (i + j * n) + 1] = si;
    }
  }
  return a;
}

function solve(n: number, a: Mat, options = {}) {
  const w = new Float64Array(n);
  const v = new Float64Array(2 * n * n);
  const rep = hermitianEigen(n, a, w, v, options);
  return { w, v, rep };
}

describe('hermitianEigen', () => {
  describe('on random Hermitian matrices', () => {
    for (const n of [2, 3, 7, 32, 100, 256]) {
      it(`satisfies A·V = V·D and VᴴV = I to 1e-12·‖A‖ at n = ${n}, eigenvalues ascending`, () => {
        const a = randomHermitian(n, 1000 + n);
        const copy = a.slice();
        const { w, v, rep } = solve(n, a);
        expect(rep.real).toBe(false);
        expect(a).toEqual(copy); // input not modified
        expect(residual(n, a, w, v)).toBeLessThanOrEqual(1e-12 * norm1(n, a));
        expect(orthogonality(n, v)).toBeLessThanOrEqual(1e-12);
        for (let k = 1; k < n; k++) expect(w[k]).toBeGreaterThanOrEqual(w[k - 1]);
      });
    }

    it('takes the real fast path on real symmetric input and returns real eigenvectors', () => {
      const n = 64;
      const a = randomHermitian(n, 77, true);
      const { w, v, rep } = solve(n, a);
      expect(rep.real).toBe(true);
      for (let k = 1; k < 2 * n * n; k += 2) expect(v[k]).toBe(0);
      expect(residual(n, a, w, v)).toBeLessThanOrEqual(1e-12 * norm1(n, a));
      expect(orthogonality(n, v)).toBeLessThanOrEqual(1e-12);
    });

    it('gives the same eigenvalues with the real fast path switched off (to 1e-13·‖A‖)', () => {
      const n = 40;
      const a = randomHermitian(n, 5, true);
      const fast = solve(n, a);
      const slow = solve(n, a, { realFastPath: false });
      expect(slow.rep.real).toBe(false);
      expect(residual(n, a, slow.w, slow.v)).toBeLessThanOrEqual(1e-12 * norm1(n, a));
      for (let k = 0; k < n; k++) expect(Math.abs(fast.w[k] - slow.w[k])).toBeLessThanOrEqual(1e-13 * norm1(n, a));
    });
  });

  describe('when the spectrum is known', () => {
    it('recovers a prescribed spectrum with threefold and fourfold degeneracies, with orthonormal vectors inside each eigenspace', () => {
      const lambda = [-2, -2, -2, 0, 1, 1, 3, 3, 3, 3, 4.5, -0.5, 7, 0.25];
      const n = lambda.length;
      const a = withSpectrum(lambda, 31);
      const { w, v } = solve(n, a);
      const sorted = [...lambda].sort((p, q) => p - q);
      // Eigenvalues move by at most ‖E‖ = O(n·ε·‖A‖) (Weyl); 1e-13·‖A‖ is ~70·n·ε·‖A‖ here.
      sorted.forEach((x, k) => expect(Math.abs(w[k] - x)).toBeLessThanOrEqual(1e-13 * norm1(n, a)));
      expect(residual(n, a, w, v)).toBeLessThanOrEqual(1e-12 * norm1(n, a));
      expect(orthogonality(n, v)).toBeLessThanOrEqual(1e-12);
    });

    it('reproduces the closed-form spectrum 2 − 2cos(kπ/(n+1)) of the tridiagonal Toeplitz matrix, also with complex off-diagonal phases', () => {
      // tridiag(−e^{iθ_j}, 2, −e^{−iθ_j}) is unitarily similar (diagonal phases) to tridiag(−1, 2, −1),
      // whose eigenvalues are 2 − 2cos(kπ/(n+1)) (common practice; e.g. Golub & Van Loan, 4th ed.).
      const n = 50;
      for (const complex of [false, true]) {
        const a = new Float64Array(2 * n * n);
        for (let j = 0; j < n; j++) {
          a[2 * (j + j * n)] = 2;
          if (j + 1 < n) {
            const th = complex ? 0.37 * (j + 1) : 0;
            a[2 * (j + 1 + j * n)] = -Math.cos(th); a[2 * (j + 1 + j * n) + 1] = -Math.sin(th);
            a[2 * (j + (j + 1) * n)] = -Math.cos(th); a[2 * (j + (j + 1) * n) + 1] = Math.sin(th);
          }
        }
        const { w, v, rep } = solve(n, a);
        expect(rep.real).toBe(!complex);
        for (let k = 1; k <= n; k++) expect(Math.abs(w[k - 1] - (2 - 2 * Math.cos((k * Math.PI) / (n + 1))))).toBeLessThanOrEqual(1e-14 * 4 * n);
        expect(residual(n, a, w, v)).toBeLessThanOrEqual(1e-13);
      }
    });

    it('agrees with the eigenvalues of mathjs (a general-purpose library) on a 6×6 real symmetric matrix to 1e-12', () => {
      const rows = [
        [4, 1, -2, 0.5, 0, 3], [1, 2, 0, 1, -1, 0], [-2, 0, 3, 0.25, 2, 1],
        [0.5, 1, 0.25, -1, 0, 0.75], [0, -1, 2, 0, 5, -2], [3, 0, 1, 0.75, -2, 0],
      ];
      const n = 6;
      const a = new Float64Array(2 * n * n);
      rows.forEach((row, i) => row.forEach((x, j) => { a[2 * (i + j * n)] = x; }));
      const { w } = solve(n, a);
      const ref = (math.eigs(rows).values as number[]).slice().sort((p, q) => p - q);
      ref.forEach((x, k) => expect(Math.abs(w[k] - x)).toBeLessThanOrEqual(1e-12));
    });
  });

  describe('at the edges', () => {
    it('returns a diagonal matrix’s entries exactly, sorted, with a permutation as eigenvectors', () => {
      const d = [3, -1, 0.5, -7, 2, 2, 0];
      const n = d.length;
      const a = new Float64Array(2 * n * n);
      d.forEach((x, i) => { a[2 * (i + i * n)] = x; });
      const { w, v } = solve(n, a);
      expect(Array.from(w)).toEqual([...d].sort((p, q) => p - q)); // no arithmetic happens: exact
      for (let k = 0; k < n; k++) {
        let ones = 0;
        for (let i = 0; i < n; i++) {
          const x = v[2 * (i + k * n)];
          expect(x === 0 || x === 1).toBe(true);
          ones += x;
          if (x === 1) expect(d[i]).toBe(w[k]);
        }
        expect(ones).toBe(1);
      }
    });

    it('scales: a matrix times 1e−300 or 1e300 has its eigenvalues times the same factor (to 1e-13 relative)', () => {
      const n = 12;
      const a = randomHermitian(n, 21);
      const ref = solve(n, a).w;
      for (const f of [1e-300, 1e300]) {
        const { w, v } = solve(n, a.map((x) => x * f));
        for (let k = 0; k < n; k++) expect(Math.abs(w[k] / f - ref[k])).toBeLessThanOrEqual(1e-13 * norm1(n, a));
        expect(orthogonality(n, v)).toBeLessThanOrEqual(1e-12);
      }
    });

    it('handles a 1×1 matrix, ignoring the imaginary part of the diagonal', () => {
      const { w, v } = solve(1, Float64Array.from([-2.5, 0.3]));
      expect(w[0]).toBe(-2.5);
      expect(Array.from(v)).toEqual([1, 0]);
    });

    it('does nothing when n = 0', () => {
      expect(hermitianEigen(0, new Float64Array(0), new Float64Array(0), new Float64Array(0))).toEqual({ real: true });
    });

    it('decomposes the zero matrix into zeros and an orthonormal basis', () => {
      const n = 5;
      const a = new Float64Array(2 * n * n);
      const { w, v } = solve(n, a);
      expect(Array.from(w)).toEqual([0, 0, 0, 0, 0]);
      expect(orthogonality(n, v)).toBe(0);
    });

    it('reads only the lower triangle: NaN above the diagonal changes nothing', () => {
      const n = 9;
      const a = randomHermitian(n, 9);
      const ref = solve(n, a);
      const b = a.slice();
      for (let c = 1; c < n; c++) for (let i = 0; i < c; i++) { b[2 * (i + c * n)] = NaN; b[2 * (i + c * n) + 1] = NaN; }
      const got = solve(n, b);
      expect(Array.from(got.w)).toEqual(Array.from(ref.w));
      expect(Array.from(got.v)).toEqual(Array.from(ref.v));
    });

    it('computes eigenvalues only when vectors is null', () => {
      const n = 20;
      const a = randomHermitian(n, 4);
      const w = new Float64Array(n);
      hermitianEigen(n, a, w, null);
      const ref = solve(n, a);
      for (let k = 0; k < n; k++) expect(Math.abs(w[k] - ref.w[k])).toBeLessThanOrEqual(1e-13 * norm1(n, a));
    });

    it('reuses a larger workspace and rejects a smaller one', () => {
      const ws = createHermitianEigenWorkspace(8);
      const a = randomHermitian(5, 2);
      const w = new Float64Array(5);
      const v = new Float64Array(50);
      hermitianEigen(5, a, w, v, {}, ws);
      expect(residual(5, a, w, v)).toBeLessThanOrEqual(1e-13);
      expect(() => hermitianEigen(9, randomHermitian(9, 1), new Float64Array(9), new Float64Array(162), {}, ws)).toThrow(/workspace/);
    });

    it('throws a RangeError naming the argument for bad sizes and non-finite entries', () => {
      const a = randomHermitian(3, 1);
      expect(() => hermitianEigen(-1, a, new Float64Array(3), null)).toThrow(RangeError);
      expect(() => hermitianEigen(1.5, a, new Float64Array(3), null)).toThrow(/n must be/);
      expect(() => hermitianEigen(4, a, new Float64Array(4), null)).toThrow(/a must hold/);
      expect(() => hermitianEigen(3, a, new Float64Array(2), null)).toThrow(/values must hold/);
      expect(() => hermitianEigen(3, a, new Float64Array(3), new Float64Array(17))).toThrow(/vectors must hold/);
      const bad = a.slice();
      bad[2 * (2 + 0 * 3) + 1] = NaN; // lower triangle (2, 0)
      expect(() => hermitianEigen(3, bad, new Float64Array(3), null)).toThrow(/non-finite entry at \(2, 0\)/);
      const badDiag = a.slice();
      badDiag[2 * (1 + 3)] = Infinity;
      expect(() => hermitianEigen(3, badDiag, new Float64Array(3), null)).toThrow(/non-finite diagonal entry at \(1, 1\)/);
    });
  });
});
