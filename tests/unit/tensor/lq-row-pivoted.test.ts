/**
 * lqRowPivoted / applyLqRows: Π·A = L·Q_r + E with orthonormal rows of Q_r, L lower trapezoidal,
 * the reported ‖E‖² exact, and the stop rules (weight threshold, rank cap).
 * Tolerance 1e-13 relative: Householder factorisations are backward stable with errors
 * O(n·ε·‖A‖), ≈ 1e-15 at these sizes.
 */
import { describe, expect, it } from 'vitest';
import { applyLqRowsUnchecked, lqRowPivotedUnchecked } from '../../../workers/src/tensor/lq-row-pivoted.js';
import { frob, orthonormalityDefect, randomComplex, withSpectrum } from './complex-test-matrices.js';

function factor(m: number, n: number, a0: Float64Array, stop = 0, cap = Infinity) {
  const a = a0.slice();
  const perm = new Int32Array(m);
  const tau = new Float64Array(2 * Math.min(m, n));
  const norms = new Float64Array(m);
  const weights = new Float64Array(2);
  const r = lqRowPivotedUnchecked(m, n, a, n, perm, tau, norms, stop, weights, cap);
  const q = new Float64Array(2 * r * n);
  for (let j = 0; j < r; j++) q[2 * (j * n + j)] = 1;
  applyLqRowsUnchecked(r, n, a, n, tau, r, q, n);
  // Reconstruct Π·A ≈ L·Q_r and measure the residual.
  let res = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let re = a0[2 * (perm[i] * n + j)];
      let im = a0[2 * (perm[i] * n + j) + 1];
      const lEnd = Math.min(i + 1, r);
      for (let l = 0; l < lEnd; l++) {
        const lr = a[2 * (i * n + l)];
        const li = a[2 * (i * n + l) + 1];
        re -= lr * q[2 * (l * n + j)] - li * q[2 * (l * n + j) + 1];
        im -= lr * q[2 * (l * n + j) + 1] + li * q[2 * (l * n + j)];
      }
      res += re * re + im * im;
    }
  }
  return { r, perm, weights, q, res, a };
}

describe('lqRowPivoted', () => {
  for (const [m, n] of [[1, 1], [5, 9], [9, 5], [30, 30]] as const) {
    it(`factors a random ${m}×${n} matrix completely with orthonormal Q rows`, () => {
      const a0 = randomComplex(m, n, m * 31 + n);
      const { r, perm, weights, q, res } = factor(m, n, a0);
      expect(r).toBe(Math.min(m, n));
      expect(Math.sqrt(res) / frob(a0)).toBeLessThan(1e-13);
      expect(orthonormalityDefect(q, r, n, true)).toBeLessThan(1e-13);
      expect([...perm].sort((x, y) => x - y)).toEqual(Array.from({ length: m }, (_, i) => i));
      expect(Math.abs(weights[0] - frob(a0) ** 2) / weights[0]).toBeLessThan(1e-14);
      expect(weights[1]).toBeLessThan(1e-24 * weights[0]);
    });
  }

  it('puts the largest row first and makes the diagonal of L real with decreasing magnitude', () => {
    const a0 = withSpectrum(12, 10, [5, 1, 0.1, 0.01], 4);
    const { r, a } = factor(12, 10, a0, 1e-28);
    expect(r).toBe(4);
    let prev = Infinity;
    for (let j = 0; j < r; j++) {
      expect(a[2 * (j * 10 + j) + 1]).toBe(0);
      const d = Math.abs(a[2 * (j * 10 + j)]);
      expect(d).toBeLessThanOrEqual(prev * (1 + 1e-12));
      prev = d;
    }
  });

  it('stops at the rank cap and reports the unreduced weight exactly', () => {
    const a0 = randomComplex(20, 16, 77);
    const { r, weights, res } = factor(20, 16, a0, 0, 6);
    expect(r).toBe(6);
    // ‖Π·A − L·Q_r‖² is the weight of the unreduced rows.
    expect(Math.abs(res - weights[1]) / weights[1]).toBeLessThan(1e-12);
    expect(weights[1]).toBeGreaterThan(0);
  });

  it('stops when the remaining weight falls below the relative threshold', () => {
    const a0 = withSpectrum(15, 15, [1, 0.5, 1e-5, 1e-6], 8);
    const { r, weights } = factor(15, 15, a0, 1e-9);
    expect(r).toBe(2);
    expect(weights[1] / weights[0]).toBeLessThanOrEqual(1e-9);
  });
});
