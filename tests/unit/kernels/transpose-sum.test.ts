import { describe, expect, it } from 'vitest';
import { scaleSum, transposeSum } from '../../../workers/src/kernels/index.js';
import { maxAbsDiff, randomSum, seededRandom, sumDense, transposeDense } from './dense-reference.js';

describe('transposeSum and scaleSum', () => {
  it('flips the sign once per Y factor: (Y0 Y1)ᵀ = +Y0 Y1, (X0 Y1)ᵀ = −X0 Y1, Zᵀ = Z', () => {
    const t = transposeSum({
      sites: 2,
      terms: [{ x: 3, z: 3, weight: 1 }, { x: 3, z: 2, weight: 1 }, { x: 0, z: 3, weight: 1 }, { x: 2, z: 2, weight: 0.5 }],
    });
    expect(t.terms.map((p) => p.weight)).toEqual([1, -1, 1, -0.5]);
  });

  it('gives the dense transpose for random sums with Y strings on N = 1..4', () => {
    const rand = seededRandom(51);
    for (let n = 1; n <= 4; n++) {
      const sum = randomSum(rand, n, 3 * n);
      const a = sumDense(transposeSum(sum));
      const b = transposeDense(sumDense(sum));
      // Exact ±1 sign changes of the same sums: only reordering rounding (≤ 1e-15).
      expect(maxAbsDiff(a.re, b.re)).toBeLessThan(1e-13);
      expect(maxAbsDiff(a.im, b.im)).toBeLessThan(1e-13);
    }
  });

  it('scales every weight and keeps the strings', () => {
    const s = scaleSum({ sites: 1, terms: [{ x: 1, z: 0, weight: 2 }, { x: 0, z: 1, weight: -1 }] }, -0.5);
    expect(s.terms).toEqual([{ x: 1, z: 0, weight: -1 }, { x: 0, z: 1, weight: 0.5 }]);
    expect(s.sites).toBe(1);
  });
});
