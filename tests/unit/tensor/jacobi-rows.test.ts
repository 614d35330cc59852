/**
 * jacobiRows: the rows come out mutually orthogonal (to the convergence tolerance √m·ε
 * relative), the accumulated rotations are unitary, and the Frobenius norm is preserved.
 * Tolerances: orthogonality is tested relative to the row norms at 1e-13 (tol ≈ 1e-15 here);
 * the unitarity of the rotations at 1e-13 (30 sweeps × n rotations of rounding 1e-16).
 */
import { describe, expect, it } from 'vitest';
import { jacobiRowsUnchecked } from '../../../workers/src/tensor/jacobi-rows.js';
import { frob, orthonormalityDefect, randomComplex } from './complex-test-matrices.js';

describe('jacobiRows', () => {
  it('orthogonalises the rows of a random complex matrix with a unitary rotation record', () => {
    const r = 12;
    const m = 20;
    const g = randomComplex(r, m, 3);
    const g0 = g.slice();
    const w = new Float64Array(2 * r * r);
    for (let j = 0; j < r; j++) w[2 * (j * r + j)] = 1;
    const norms = new Float64Array(r);
    const sweeps = jacobiRowsUnchecked(r, m, g, m, r, w, r, norms);
    expect(sweeps).toBeGreaterThan(0);
    for (let p = 0; p < r; p++) {
      for (let q = p + 1; q < r; q++) {
        let re = 0;
        let im = 0;
        for (let k = 0; k < m; k++) {
          re += g[2 * (p * m + k)] * g[2 * (q * m + k)] + g[2 * (p * m + k) + 1] * g[2 * (q * m + k) + 1];
          im += g[2 * (p * m + k)] * g[2 * (q * m + k) + 1] - g[2 * (p * m + k) + 1] * g[2 * (q * m + k)];
        }
        expect(Math.hypot(re, im) / Math.sqrt(norms[p] * norms[q])).toBeLessThan(1e-13);
      }
    }
    expect(orthonormalityDefect(w, r, r, true)).toBeLessThan(1e-13);
    expect(Math.abs(frob(g) - frob(g0)) / frob(g0)).toBeLessThan(1e-14);
    // De Rijk's pivoting leaves the norms non-increasing after the last sweep's pivots.
    const sum = [...norms].reduce((s, x) => s + x, 0);
    expect(Math.abs(sum - frob(g0) ** 2) / sum).toBeLessThan(1e-13);
  });

  it('returns after one sweep without rotating rows that are already orthogonal', () => {
    const g = new Float64Array([1, 0, 0, 0, 0, 0, 2, 0]); // rows (1, 0) and (0, 2)
    const w = new Float64Array([1, 0, 0, 0, 0, 0, 1, 0]);
    const norms = new Float64Array(2);
    expect(jacobiRowsUnchecked(2, 2, g, 2, 2, w, 2, norms)).toBe(1);
    expect([...norms]).toEqual([4, 1]); // pivoted: the larger row first
  });
});
