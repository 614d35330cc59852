/**
 * axpyPairMulti against the plain complex arithmetic it fuses, on every path: accumulate or
 * overwrite, one order or two, general complex coefficients and the (real, imaginary) pattern
 * of real-time Chebyshev coefficients, and vectors longer than one chunk with a ragged end.
 */
import { describe, expect, it } from 'vitest';
import { axpyPairMulti, PAIR_CHUNK } from '../../../workers/src/kernels/index.js';
import { seededRandom } from './dense-reference.js';

function reference(y: Float64Array, a: [number, number], b: [number, number], x0: Float64Array, x1: Float64Array | null, overwrite: boolean): Float64Array {
  const out = overwrite ? new Float64Array(y.length) : y.slice();
  for (let i = 0; i < y.length; i += 2) {
    out[i] += a[0] * x0[i] - a[1] * x0[i + 1];
    out[i + 1] += a[0] * x0[i + 1] + a[1] * x0[i];
    if (x1 !== null) {
      out[i] += b[0] * x1[i] - b[1] * x1[i + 1];
      out[i + 1] += b[0] * x1[i + 1] + b[1] * x1[i];
    }
  }
  return out;
}

describe('axpyPairMulti', () => {
  it('equals y + a·x0 + b·x1 (or a·x0 + b·x1) for every output, on every path, across chunk boundaries', () => {
    const rand = seededRandom(3);
    const len = 2 * PAIR_CHUNK + 6; // two full chunks and a ragged end
    const vec = () => Float64Array.from({ length: len }, () => rand() - 0.5);
    const x0 = vec(), x1 = vec();
    for (const overwrite of [false, true]) {
      for (const second of [true, false]) {
        for (const pattern of [false, true]) {
          const outs = [vec(), vec(), vec()];
          const before = outs.map((o) => o.slice());
          const coef = new Float64Array(12);
          for (let j = 0; j < 3; j++) {
            coef[4 * j] = rand() - 0.5;
            coef[4 * j + 1] = pattern ? 0 : rand() - 0.5;
            coef[4 * j + 2] = pattern ? 0 : rand() - 0.5;
            coef[4 * j + 3] = rand() - 0.5;
          }
          // Only the first two outputs are active; the third must stay untouched.
          axpyPairMulti(outs, 2, coef, x0, second ? x1 : null, overwrite);
          for (let j = 0; j < 2; j++) {
            const want = reference(before[j], [coef[4 * j], coef[4 * j + 1]], [coef[4 * j + 2], coef[4 * j + 3]], x0, second ? x1 : null, overwrite);
            // Sums of 3 products of O(1) numbers: rounding ≤ 4 ulp ≈ 1e-15.
            for (let i = 0; i < len; i++) expect(Math.abs(outs[j][i] - want[i]), `j=${j} i=${i}`).toBeLessThan(1e-15);
          }
          expect(outs[2]).toEqual(before[2]);
        }
      }
    }
  });
});
