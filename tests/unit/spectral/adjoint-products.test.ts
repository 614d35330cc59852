/**
 * The dense product kernels of the spectral engine: complexAdjointProduct (C = Aᴴ·B, full or
 * packed upper) and realTransposeProduct (C = Aᵀ·B with stride/offset output) against plain
 * triple loops, on odd and even sizes (the 2×2 tiles have edge cases), and the packed-planes
 * split. Tolerance 1e-14·k: both sides sum the same k products in different orders, so they
 * differ by at most ~k·ε·Σ|a||b| with entries in [−0.5, 0.5].
 */
import { describe, expect, it } from 'vitest';
import { complexAdjointProduct } from '../../../workers/src/linalg/complex-adjoint-product.js';
import { realTransposeProduct } from '../../../workers/src/engines/spectral/real-transpose-product.js';
import { packedLength, splitPacked } from '../../../workers/src/engines/spectral/packed-planes.js';
import { seededRandom } from '../../bench/bench-record.js';

const random = (len: number, seed: number) => {
  const r = seededRandom(seed);
  return Float64Array.from({ length: len }, () => r() - 0.5);
};

/** Naive conj(A)ᵀ·B entry. */
function entry(k: number, a: Float64Array, b: Float64Array, i: number, j: number): [number, number] {
  let sr = 0, si = 0;
  for (let r = 0; r < k; r++) {
    const xr = a[2 * (r + i * k)], xi = a[2 * (r + i * k) + 1];
    const yr = b[2 * (r + j * k)], yi = b[2 * (r + j * k) + 1];
    sr += xr * yr + xi * yi;
    si += xr * yi - xi * yr;
  }
  return [sr, si];
}

describe('complexAdjointProduct', () => {
  for (const [k, m, n] of [[1, 1, 1], [5, 3, 4], [7, 6, 5], [9, 8, 8], [4, 1, 7]]) {
    it(`computes every entry of Aᴴ·B for k = ${k}, m = ${m}, n = ${n}`, () => {
      const a = random(2 * k * m, k * 100 + m);
      const b = random(2 * k * n, k * 100 + n + 50);
      const c = new Float64Array(2 * m * n).fill(NaN);
      complexAdjointProduct(k, m, n, a, b, c, 'full');
      for (let j = 0; j < n; j++) for (let i = 0; i < m; i++) {
        const [sr, si] = entry(k, a, b, i, j);
        expect(Math.abs(c[2 * (i + j * m)] - sr)).toBeLessThanOrEqual(1e-14 * k);
        expect(Math.abs(c[2 * (i + j * m) + 1] - si)).toBeLessThanOrEqual(1e-14 * k);
      }
    });
  }

  for (const n of [1, 2, 5, 8]) {
    it(`fills exactly the packed upper triangle of Aᴴ·B at n = ${n}, touching nothing beyond it`, () => {
      const k = 6;
      const a = random(2 * k * n, 7 + n);
      const b = random(2 * k * n, 70 + n);
      const c = new Float64Array(n * (n + 1) + 4).fill(NaN);
      complexAdjointProduct(k, n, n, a, b, c, 'upper-packed');
      for (let j = 0; j < n; j++) for (let i = 0; i <= j; i++) {
        const [sr, si] = entry(k, a, b, i, j);
        const p = j * (j + 1) + 2 * i;
        expect(Math.abs(c[p] - sr)).toBeLessThanOrEqual(1e-14 * k);
        expect(Math.abs(c[p + 1] - si)).toBeLessThanOrEqual(1e-14 * k);
      }
      for (let p = n * (n + 1); p < c.length; p++) expect(c[p]).toBeNaN();
    });
  }

  it('throws a RangeError naming the argument for bad sizes, short buffers and aliasing', () => {
    const a = random(2 * 6, 1);
    expect(() => complexAdjointProduct(-1, 1, 1, a, a, new Float64Array(2))).toThrow(/k must be/);
    expect(() => complexAdjointProduct(3, 2, 3, a, a, new Float64Array(12), 'upper-packed')).toThrow(/m = n/);
    expect(() => complexAdjointProduct(4, 2, 2, a, a, new Float64Array(8))).toThrow(/a must hold/);
    expect(() => complexAdjointProduct(3, 2, 2, a, a, new Float64Array(7))).toThrow(/c must hold/);
    expect(() => complexAdjointProduct(1, 1, 1, a, a, a)).toThrow(/same array/);
    expect(() => realTransposeProduct(2, 2, 2, a, a, new Float64Array(8), 'full', 2, 2)).toThrow(/offset < stride/);
    expect(() => realTransposeProduct(2, 2, 2, a, a, new Float64Array(7), 'full', 2, 1)).toThrow(/c must hold/);
  });

  it('gives a Hermitian Gram matrix with a real, positive diagonal when A = B', () => {
    const k = 5, n = 4;
    const a = random(2 * k * n, 3);
    const c = new Float64Array(n * (n + 1));
    complexAdjointProduct(k, n, n, a, a, c, 'upper-packed');
    for (let j = 0; j < n; j++) {
      expect(c[j * (j + 1) + 2 * j + 1]).toBe(0); // x·y − y·x in the same order cancels exactly
      expect(c[j * (j + 1) + 2 * j]).toBeGreaterThan(0);
    }
  });
});

describe('realTransposeProduct', () => {
  it('writes Aᵀ·B into the real or imaginary part of an interleaved packed result, leaving the other part alone', () => {
    const k = 7, n = 5;
    const a = random(k * n, 11);
    const b = random(k * n, 12);
    const c = new Float64Array(n * (n + 1)).fill(-99);
    realTransposeProduct(k, n, n, a, b, c, 'upper-packed', 2, 1);
    for (let j = 0; j < n; j++) for (let i = 0; i <= j; i++) {
      let s = 0;
      for (let r = 0; r < k; r++) s += a[r + i * k] * b[r + j * k];
      const p = j * (j + 1) + 2 * i;
      expect(Math.abs(c[p + 1] - s)).toBeLessThanOrEqual(1e-14 * k);
      expect(c[p]).toBe(-99);
    }
  });

  it('computes the full product with unit stride for odd shapes', () => {
    const k = 3, m = 5, n = 3;
    const a = random(k * m, 1);
    const b = random(k * n, 2);
    const c = new Float64Array(m * n);
    realTransposeProduct(k, m, n, a, b, c);
    for (let j = 0; j < n; j++) for (let i = 0; i < m; i++) {
      let s = 0;
      for (let r = 0; r < k; r++) s += a[r + i * k] * b[r + j * k];
      expect(Math.abs(c[i + j * m] - s)).toBeLessThanOrEqual(1e-14 * k);
    }
  });
});

describe('splitPacked', () => {
  it('splits interleaved packed entries into planes and drops exactly-zero planes', () => {
    const d = 3;
    expect(packedLength(d)).toBe(6);
    const realOnly = splitPacked(d, Float64Array.from([1, 0, 2, 0, 3, 0, 4, 0, 5, 0, 6, 0]));
    expect(Array.from(realOnly.re!)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(realOnly.im).toBeNull();
    const imagOnly = splitPacked(d, Float64Array.from([0, 1, 0, 0, 0, 0, 0, 0, 0, -2, 0, 0]));
    expect(imagOnly.re).toBeNull();
    expect(Array.from(imagOnly.im!)).toEqual([1, 0, 0, 0, -2, 0]);
  });
});
