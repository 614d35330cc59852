/**
 * complexGemm ('N' and 'C') against a plain triple loop, with accumulation and leading
 * dimensions larger than the column count. Tolerance 1e-14 absolute (entries O(1), k ≤ 9).
 */
import { describe, expect, it } from 'vitest';
import { complexGemm } from '../../../workers/src/tensor/complex-gemm.js';
import { randomComplex } from './complex-test-matrices.js';

function naive(trans: 'N' | 'C', m: number, n: number, k: number, a: Float64Array, lda: number, b: Float64Array, ldb: number): Float64Array {
  const c = new Float64Array(2 * m * n);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) {
    let re = 0;
    let im = 0;
    for (let l = 0; l < k; l++) {
      const o = trans === 'N' ? 2 * (i * lda + l) : 2 * (l * lda + i);
      const ar = a[o];
      const ai = trans === 'N' ? a[o + 1] : -a[o + 1];
      re += ar * b[2 * (l * ldb + j)] - ai * b[2 * (l * ldb + j) + 1];
      im += ar * b[2 * (l * ldb + j) + 1] + ai * b[2 * (l * ldb + j)];
    }
    c[2 * (i * n + j)] = re;
    c[2 * (i * n + j) + 1] = im;
  }
  return c;
}

describe('complexGemm', () => {
  for (const trans of ['N', 'C'] as const) {
    it(`computes op(A)·B for op = '${trans}', with padded leading dimensions and accumulation`, () => {
      const [m, n, k] = [5, 7, 9];
      const lda = (trans === 'N' ? k : m) + 2;
      const a = randomComplex(trans === 'N' ? m : k, lda, 1);
      const b = randomComplex(k, n + 1, 2);
      const c = new Float64Array(2 * m * n).fill(3);
      complexGemm(trans, m, n, k, a, lda, b, n + 1, c, n, false);
      const ref = naive(trans, m, n, k, a, lda, b, n + 1);
      ref.forEach((x, q) => expect(Math.abs(c[q] - x)).toBeLessThan(1e-14));
      complexGemm(trans, m, n, k, a, lda, b, n + 1, c, n, true);
      ref.forEach((x, q) => expect(Math.abs(c[q] - 2 * x)).toBeLessThan(1e-14));
    });
  }

  it('does nothing for k = 0 except clearing C, and rejects bad sizes', () => {
    const c = new Float64Array(4).fill(1);
    complexGemm('N', 1, 2, 0, new Float64Array(2), 1, new Float64Array(4), 2, c, 2);
    expect([...c]).toEqual([0, 0, 0, 0]);
    expect(() => complexGemm('N', -1, 2, 2, new Float64Array(8), 2, new Float64Array(8), 2, c, 2)).toThrow(/m must be/);
    expect(() => complexGemm('N', 2, 2, 2, new Float64Array(2), 2, new Float64Array(8), 2, new Float64Array(8), 2)).toThrow(/a has 2 doubles/);
  });
});
