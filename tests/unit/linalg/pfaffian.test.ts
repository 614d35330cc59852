/**
 * pfaffian checked against Cayley's identity Pf(A)² = det A (det by Gaussian elimination with
 * partial pivoting in the test; mathjs 15's det returned negative values for some 14 × 14 and larger
 * skew matrices here, impossible for det of an even skew matrix, so it is not used), closed forms (2 × 2, 4 × 4: Pf = a01·a23 − a02·a13 + a03·a12), block
 * structure, the sign rule under a row/column swap, and edge sizes.
 */
import { describe, expect, it } from 'vitest';
import { pfaffian, pfaffianInPlace } from '../../../workers/src/linalg/pfaffian.js';
import { determinant, randomSkew } from './random-matrices.js';

function pf(a: Float64Array, n: number): number {
  const r = pfaffian(n, a, n, new Float64Array(n * n));
  return r.sign * Math.exp(r.logAbs);
}

describe('pfaffian', () => {
  it('satisfies Pf(A)² = det A ≥ 0 for random matrices', () => {
    for (const n of [2, 4, 6, 10, 16, 30]) {
      const a = randomSkew(n, 100 + n);
      const det = determinant(a, n);
      expect(det).toBeGreaterThan(0);
      // Relative: both are backward stable eliminations; 1e−12 relative covers n ≤ 30.
      expect(Math.abs(pf(a, n) ** 2 - det)).toBeLessThan(1e-12 * Math.max(1, Math.abs(det)));
    }
  });

  it('reproduces the 2 × 2 and 4 × 4 closed forms including the sign', () => {
    expect(Math.abs(pf(Float64Array.from([0, 3, -3, 0]), 2) - 3)).toBeLessThan(1e-15);
    expect(Math.abs(pf(Float64Array.from([0, -3, 3, 0]), 2) + 3)).toBeLessThan(1e-15);
    const a = randomSkew(4, 7);
    const e = (i: number, j: number) => a[i * 4 + j];
    const want = e(0, 1) * e(2, 3) - e(0, 2) * e(1, 3) + e(0, 3) * e(1, 2);
    expect(Math.abs(pf(a, 4) - want)).toBeLessThan(1e-15);
  });

  it('changes sign when two rows and columns are swapped, and multiplies over blocks', () => {
    const n = 8;
    const a = randomSkew(n, 8);
    const swapped = new Float64Array(n * n);
    const perm = [0, 5, 2, 3, 4, 1, 6, 7];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) swapped[i * n + j] = a[perm[i] * n + perm[j]];
    expect(Math.abs(pf(swapped, n) + pf(a, n))).toBeLessThan(1e-13);
    const b = randomSkew(4, 9);
    const c = randomSkew(6, 10);
    const block = new Float64Array(100);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) block[i * 10 + j] = b[i * 4 + j];
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) block[(i + 4) * 10 + j + 4] = c[i * 6 + j];
    expect(Math.abs(pf(block, 10) - pf(b, 4) * pf(c, 6))).toBeLessThan(1e-14);
  });

  it('keeps large Pfaffians in log form without overflow', () => {
    // ⊕ of 300 blocks [[0, 10], [−10, 0]], scrambled by a permutation: Pf = ±10^300 … exactly 1e300·sign.
    const n = 600;
    const a = new Float64Array(n * n);
    for (let k = 0; k < n; k += 2) { a[(k + 1) * n + k] = -1e3; a[k * n + k + 1] = 1e3; }
    const r = pfaffian(n, a, n, new Float64Array(n * n));
    expect(r.sign).toBe(1);
    expect(Math.abs(r.logAbs - 300 * Math.log(1e3))).toBeLessThan(1e-9);
  });

  it('returns 1 for the empty matrix, 0 for odd order or a zero column, and reads only the lower triangle', () => {
    expect(pfaffian(0, new Float64Array(0), 0, new Float64Array(0))).toEqual({ sign: 1, logAbs: 0 });
    expect(pfaffianInPlace(3, new Float64Array(9)).sign).toBe(0);
    expect(pfaffian(4, new Float64Array(16), 4, new Float64Array(16)).sign).toBe(0);
    const a = randomSkew(6, 11);
    const junk = a.slice();
    for (let i = 0; i < 6; i++) for (let j = i; j < 6; j++) junk[i * 6 + j] = 99;
    expect(pf(junk, 6)).toBe(pf(a, 6));
  });

  it('rejects non-finite entries and short buffers', () => {
    const a = randomSkew(4, 12);
    a[3 * 4 + 1] = Number.POSITIVE_INFINITY;
    expect(() => pfaffian(4, a, 4, new Float64Array(16))).toThrow(/not finite/);
    expect(() => pfaffian(4, randomSkew(4, 1), 4, new Float64Array(15))).toThrow(RangeError);
  });
});
