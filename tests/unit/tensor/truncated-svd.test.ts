/**
 * truncatedSvd (pivoted LQ + one-sided Jacobi): invariants U·S·Vh = A, UᴴU = I, VhVhᴴ = I,
 * descending singular values, prescribed spectra recovered, rank-deficient and zero input,
 * and the truncation rules (rank cap, discarded-weight threshold, exact discarded weight).
 *
 * Tolerances: the decomposition is backward stable, so residuals are O(√m·ε·‖A‖); sizes here are
 * ≤ 96, where 1e-13 relative leaves a margin of ~50× over the observed ~1e-15.
 */
import { describe, expect, it } from 'vitest';
import { chooseRank, truncatedSvd } from '../../../workers/src/tensor/truncated-svd.js';
import {
  frob, orthonormalityDefect, randomComplex, reconstructionError, withSpectrum,
} from './complex-test-matrices.js';

const RESIDUAL = 1e-13;

function checkFull(m: number, n: number, a: Float64Array): { s: Float64Array } {
  const { u, s, vh, report } = truncatedSvd(m, n, a);
  const k = s.length;
  expect(reconstructionError(m, n, a, u, s, vh) / frob(a)).toBeLessThan(RESIDUAL);
  expect(orthonormalityDefect(u, m, k, false)).toBeLessThan(RESIDUAL);
  expect(orthonormalityDefect(vh, k, n, true)).toBeLessThan(RESIDUAL);
  for (let j = 1; j < k; j++) expect(s[j]).toBeLessThanOrEqual(s[j - 1]);
  for (let j = 0; j < k; j++) expect(s[j]).toBeGreaterThan(0);
  expect(report.discardedWeight / report.totalWeight).toBeLessThan(1e-28);
  return { s };
}

describe('truncatedSvd', () => {
  describe('when nothing is truncated', () => {
    for (const [m, n] of [[1, 1], [1, 7], [7, 1], [12, 12], [40, 17], [17, 40], [96, 96]] as const) {
      it(`reconstructs a random ${m}×${n} complex matrix with orthonormal factors and descending σ`, () => {
        const { s } = checkFull(m, n, randomComplex(m, n, 11 * m + n));
        expect(s.length).toBe(Math.min(m, n));
      });
    }

    it('recovers a prescribed spectrum spanning 12 decades to 1e-14·σ_max', () => {
      const sigma = Array.from({ length: 24 }, (_, j) => 10 ** (-j / 2));
      const a = withSpectrum(50, 30, sigma, 5);
      const { s } = checkFull(50, 30, a);
      expect(s.length).toBe(24);
      // Building A in floating point already perturbs it by ~1e-16·‖A‖, so only absolute
      // accuracy at that level is testable (observed ≈ 5e-24 at σ = 3e-12).
      for (let j = 0; j < 24; j++) expect(Math.abs(s[j] - sigma[j])).toBeLessThan(1e-14);
    });

    it('returns the numerical rank of a rank-deficient product and still reconstructs it', () => {
      const sigma = [3, 2, 2, 1, 0.5];
      const a = withSpectrum(33, 21, sigma, 9);
      const { s } = checkFull(33, 21, a);
      expect(s.length).toBe(5);
      for (let j = 0; j < 5; j++) expect(Math.abs(s[j] - sigma[j])).toBeLessThan(1e-13);
    });

    it('returns rank 0 and zero weights for the zero matrix', () => {
      const { s, report } = truncatedSvd(4, 6, new Float64Array(48));
      expect(s.length).toBe(0);
      expect(report.totalWeight).toBe(0);
      expect(report.discardedWeight).toBe(0);
    });

    it('handles a purely real input and a single row of equal entries', () => {
      const a = randomComplex(9, 13, 3);
      for (let k = 1; k < a.length; k += 2) a[k] = 0;
      checkFull(9, 13, a);
      const row = new Float64Array(2 * 5).fill(0);
      for (let j = 0; j < 5; j++) row[2 * j] = 1;
      const { s } = checkFull(1, 5, row);
      expect(s[0]).toBeCloseTo(Math.sqrt(5), 14);
    });
  });

  describe('when truncating', () => {
    const sigma = [1, 0.5, 0.25, 0.1, 0.05, 0.01, 0.001];
    const a = withSpectrum(20, 16, sigma, 21);
    const total = sigma.reduce((t, x) => t + x * x, 0);

    it('keeps at most maxRank values and reports the exact tail weight', () => {
      const { u, s, vh, report } = truncatedSvd(20, 16, a, { maxRank: 3 });
      expect(s.length).toBe(3);
      const tail = sigma.slice(3).reduce((t, x) => t + x * x, 0);
      expect(Math.abs(report.discardedWeight - tail) / tail).toBeLessThan(1e-10);
      // ‖A − U S Vh‖² equals the reported discarded weight (Eckart–Young).
      expect(Math.abs(reconstructionError(20, 16, a, u, s, vh) ** 2 - report.discardedWeight) / tail).toBeLessThan(1e-9);
    });

    it('drops the smallest values while the relative discarded weight stays within maxWeight', () => {
      // Tail weights relative to the total: after 0.05 → (0.01² + 0.001²)/total ≈ 7.8e-5.
      const { s, report } = truncatedSvd(20, 16, a, { maxWeight: 1e-4 });
      expect(s.length).toBe(5);
      expect(report.discardedWeight / total).toBeLessThanOrEqual(1e-4);
      const { s: s2 } = truncatedSvd(20, 16, a, { maxWeight: 7e-5 });
      expect(s2.length).toBe(6);
    });

    it('reports the exact discarded weight when the LQ step is capped below the numerical rank', () => {
      const { u, s, vh, report } = truncatedSvd(20, 16, a, { maxRank: 2, lqRankCap: 3 });
      expect(report.lqRank).toBe(3);
      expect(s.length).toBe(2);
      const err2 = reconstructionError(20, 16, a, u, s, vh) ** 2;
      expect(Math.abs(err2 - report.discardedWeight) / err2).toBeLessThan(1e-9);
      // Never better than the optimal (Eckart–Young) tail; with this tight cap 11 % above it.
      const optimal = sigma.slice(2).reduce((t, x) => t + x * x, 0);
      expect(report.discardedWeight).toBeGreaterThanOrEqual(optimal * (1 - 1e-12));
      expect(report.discardedWeight).toBeLessThan(optimal * 1.2);
      expect(orthonormalityDefect(u, 20, 2, false)).toBeLessThan(RESIDUAL);
      expect(orthonormalityDefect(vh, 2, 16, true)).toBeLessThan(RESIDUAL);
    });

    it('chooses the rank by the cap first and then the threshold', () => {
      const sq = [1, 0.1, 0.01, 0.001];
      expect(chooseRank(sq, 4, 0, 4, 0, 0)).toBe(4);
      expect(chooseRank(sq, 4, 0, 2, 0, 0)).toBe(2);
      expect(chooseRank(sq, 4, 0, 4, 0.0011, 0)).toBe(3);
      expect(chooseRank(sq, 4, 0, 4, 0.0111, 0)).toBe(2);
      expect(chooseRank(sq, 4, 0.001, 4, 0.0015, 0)).toBe(4); // the residual uses the budget up
      expect(chooseRank(sq, 4, 0, 4, 0, 0.005)).toBe(3); // negligible entries always go
    });
  });

  describe('when the arguments are bad', () => {
    it('throws a RangeError naming the argument', () => {
      expect(() => truncatedSvd(0, 3, new Float64Array(6))).toThrow(/m must be/);
      expect(() => truncatedSvd(2, 2, new Float64Array(4))).toThrow(/a has 4 doubles/);
      expect(() => truncatedSvd(1, 1, new Float64Array([NaN, 0]))).toThrow(/finite/);
      expect(() => truncatedSvd(1, 1, new Float64Array([1, 0]), { maxWeight: 1 })).toThrow(/maxWeight/);
      expect(() => truncatedSvd(1, 1, new Float64Array([1, 0]), { maxRank: 0 })).toThrow(/maxRank/);
    });
  });
});
