/**
 * gemm against a plain triple loop (common practice): all supported operand forms, odd sizes
 * that exercise the blocked kernels' remainders, α/β scaling, leading dimensions, edge sizes.
 */
import { describe, expect, it } from 'vitest';
import { gemm } from '../../../workers/src/linalg/gemm.js';
import { maxAbsDiff, naiveProduct, randomMatrix, transposed } from './random-matrices.js';

/** Sums of ≤ 300 products of numbers ≤ 1 in size: rounding ≤ 300·2⁻⁵³·300 ≈ 1e−11; 1e−12 is ample in practice. */
const TOL = 1e-12;

describe('gemm', () => {
  for (const [m, k, n] of [[1, 1, 1], [3, 5, 2], [7, 9, 13], [65, 130, 257], [258, 67, 300]]) {
    it(`matches the triple loop for op(A)·op(B) in all supported forms at m=${m}, k=${k}, n=${n}`, () => {
      const a = randomMatrix(m, k, m * 1000 + k);
      const b = randomMatrix(k, n, k * 1000 + n);
      const ref = naiveProduct(a, b, m, k, n);
      const c = new Float64Array(m * n);
      gemm({ m, n, k, a, b, c });
      expect(maxAbsDiff(c, ref)).toBeLessThan(TOL);
      gemm({ m, n, k, transA: true, a: transposed(a, m, k), b, c });
      expect(maxAbsDiff(c, ref)).toBeLessThan(TOL);
      gemm({ m, n, k, transB: true, a, b: transposed(b, k, n), c });
      expect(maxAbsDiff(c, ref)).toBeLessThan(TOL);
    });
  }

  it('applies α and β, and ignores NaN in C when β = 0', () => {
    const a = randomMatrix(4, 3, 1);
    const b = randomMatrix(3, 5, 2);
    const ref = naiveProduct(a, b, 4, 3, 5);
    const c0 = randomMatrix(4, 5, 3);
    const c = c0.slice();
    gemm({ m: 4, n: 5, k: 3, alpha: -2, a, b, beta: 0.5, c });
    expect(maxAbsDiff(c, ref.map((v, i) => -2 * v + 0.5 * c0[i]))).toBeLessThan(TOL);
    const nan = new Float64Array(20).fill(Number.NaN);
    gemm({ m: 4, n: 5, k: 3, a, b, c: nan });
    expect(maxAbsDiff(nan, ref)).toBeLessThan(TOL);
  });

  it('honours leading dimensions larger than the column count', () => {
    const a = randomMatrix(3, 6, 4); // a 3 × 4 matrix inside rows of 6
    const b = randomMatrix(4, 7, 5); // a 4 × 5 matrix inside rows of 7
    const c = new Float64Array(3 * 8).fill(9); // 3 × 5 inside rows of 8; padding must stay 9
    gemm({ m: 3, n: 5, k: 4, a, lda: 6, b, ldb: 7, c, ldc: 8 });
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 5; j++) {
        let s = 0;
        for (let p = 0; p < 4; p++) s += a[i * 6 + p] * b[p * 7 + j];
        expect(Math.abs(c[i * 8 + j] - s)).toBeLessThan(TOL);
      }
      for (let j = 5; j < 8; j++) expect(c[i * 8 + j]).toBe(9);
    }
  });

  it('returns β·C when k is 0 and does nothing when m or n is 0', () => {
    const c = Float64Array.from([1, 2, 3, 4]);
    gemm({ m: 2, n: 2, k: 0, a: new Float64Array(0), b: new Float64Array(0), beta: 3, c });
    expect(Array.from(c)).toEqual([3, 6, 9, 12]);
    expect(() => gemm({ m: 0, n: 3, k: 2, a: new Float64Array(0), b: new Float64Array(6), c: new Float64Array(0) })).not.toThrow();
  });

  it('rejects bad sizes, short arrays and the unsupported Aᵀ·Bᵀ form', () => {
    const x = new Float64Array(4);
    expect(() => gemm({ m: -1, n: 2, k: 2, a: x, b: x, c: x })).toThrow(RangeError);
    expect(() => gemm({ m: 2, n: 2, k: 2, a: new Float64Array(3), b: x, c: x })).toThrow(/A has 3 entries/);
    expect(() => gemm({ m: 2, n: 2, k: 2, a: x, b: x, c: x, ldc: 1 })).toThrow(/leading dimension of C/);
    expect(() => gemm({ m: 2, n: 2, k: 2, transA: true, transB: true, a: x, b: x, c: x })).toThrow(/not supported/);
  });
});
