/**
 * bidiagonalSvd checked by invariants (C = X Σ Yᵀ, XᵀX = YᵀY = 1, σ ≥ 0), by the deflation
 * branches for zero diagonal entries, by its determinant bookkeeping, and against a closed form:
 * the n × n upper bidiagonal matrix with all entries 1 has singular values 2cos(kπ/(2n+1)),
 * k = 1..n (CᵀC is the tridiagonal [1,2,…,2 | 1] matrix; value from memory, re-derived from its
 * Chebyshev eigenvectors — and cross-checked here by the invariants).
 */
import { describe, expect, it } from 'vitest';
import { bidiagonalSvd } from '../../../workers/src/linalg/bidiagonal-svd.js';
import { determinant as det, maxAbsDiff, orthogonalityError, rng } from './random-matrices.js';

function identity(n: number): Float64Array {
  const x = new Float64Array(n * n);
  for (let i = 0; i < n; i++) x[i * n + i] = 1;
  return x;
}

/** max |C − X Σ Yᵀ| with vectors stored as rows (xt[j·n + i] = X[i][j]). */
function reconstructionError(d0: number[], e0: number[], sigma: Float64Array, xt: Float64Array, yt: Float64Array): number {
  const n = d0.length;
  let worst = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += xt[k * n + i] * sigma[k] * yt[k * n + j];
    const c = i === j ? d0[i] : j === i + 1 ? e0[i] : 0;
    worst = Math.max(worst, Math.abs(s - c));
  }
  return worst;
}

function run(d0: number[], e0: number[]) {
  const n = d0.length;
  const d = Float64Array.from(d0);
  const e = Float64Array.from([...e0, 0]);
  const xt = identity(n);
  const yt = identity(n);
  const report = bidiagonalSvd(n, d, e, xt, yt);
  return { d, xt, yt, report };
}

describe('bidiagonalSvd', () => {
  it('decomposes random bidiagonal matrices: C = XΣYᵀ, X and Y orthogonal, σ ≥ 0', () => {
    const r = rng(5);
    for (const n of [1, 2, 5, 40, 150]) {
      const d0 = Array.from({ length: n }, () => 2 * r() - 1);
      const e0 = Array.from({ length: n - 1 }, () => 2 * r() - 1);
      const { d, xt, yt } = run(d0, e0);
      // Backward stable: errors ≈ c·n·u·‖C‖ (‖C‖ ≤ 2); 1e−12 at n = 150.
      expect(reconstructionError(d0, e0, d, xt, yt)).toBeLessThan(1e-12);
      expect(orthogonalityError(xt, n)).toBeLessThan(1e-12);
      expect(orthogonalityError(yt, n)).toBeLessThan(1e-12);
      for (const s of d) expect(s).toBeGreaterThanOrEqual(0);
    }
  });

  it('reproduces 2cos(kπ/(2n+1)) for the all-ones bidiagonal matrix', () => {
    const n = 12;
    const { d } = run(new Array(n).fill(1), new Array(n - 1).fill(1));
    const got = Array.from(d).sort((a, b) => a - b);
    const want = Array.from({ length: n }, (_, k) => 2 * Math.cos(((k + 1) * Math.PI) / (2 * n + 1))).sort((a, b) => a - b);
    expect(maxAbsDiff(got, want)).toBeLessThan(1e-14);
  });

  it('deflates zero diagonal entries in the middle and at the end (exact zero singular values)', () => {
    for (const d0 of [[1, 0, 2, 3], [1, 2, 3, 0], [0, 1, 1, 1]]) {
      const e0 = [0.5, -0.7, 0.9];
      const { d, xt, yt } = run(d0, e0);
      expect(reconstructionError(d0, e0, d, xt, yt)).toBeLessThan(1e-14);
      expect(orthogonalityError(xt, 4)).toBeLessThan(1e-14);
      expect(orthogonalityError(yt, 4)).toBeLessThan(1e-14);
      expect(Math.min(...d)).toBeLessThan(1e-15);
    }
  });

  it('reports sign flips so that det X · det Y = (−1)^negations', () => {
    const r = rng(9);
    for (let trial = 0; trial < 5; trial++) {
      const n = 7;
      const d0 = Array.from({ length: n }, () => 2 * r() - 1);
      const e0 = Array.from({ length: n - 1 }, () => 2 * r() - 1);
      const { xt, yt, report } = run(d0, e0);
      const product = det(xt, n) * det(yt, n);
      expect(Math.abs(product - (report.negations % 2 === 0 ? 1 : -1))).toBeLessThan(1e-12);
    }
  });

  it('works without vectors and on the empty matrix, and rejects non-finite input', () => {
    const d = Float64Array.from([3, -4]);
    bidiagonalSvd(2, d, Float64Array.from([0, 0]), null, null);
    expect(Array.from(d).sort()).toEqual([3, 4]);
    expect(bidiagonalSvd(0, new Float64Array(0), new Float64Array(0), null, null).sweeps).toBe(0);
    expect(() => bidiagonalSvd(2, Float64Array.from([1, Number.NaN]), new Float64Array(2), null, null)).toThrow(RangeError);
  });
});
