import { describe, expect, it } from 'vitest';
import {
  axpyComplex, copyInto, dotc, norm2sq, scaleComplex, scaleReal,
} from '../../../workers/src/kernels/index.js';

describe('complex-vector helpers', () => {
  // All inputs below are small integers, so every result is exactly representable.
  it('norm2sq sums |x_k|² over all entries, including an odd tail', () => {
    expect(norm2sq(new Float64Array([3, 4, 1, -2, 2, 0]))).toBe(9 + 16 + 1 + 4 + 4);
    expect(norm2sq(new Float64Array(0))).toBe(0);
  });

  it('dotc conjugates the first argument', () => {
    const out = new Float64Array(2);
    // conj(1+2i)(3−i) + conj(−i)(2) = (1−2i)(3−i) + 2i = (3 − i − 6i − 2) + 2i = 1 − 5i
    dotc(new Float64Array([1, 2, 0, -1]), new Float64Array([3, -1, 2, 0]), out);
    expect(Array.from(out)).toEqual([1, -5]);
    expect(() => dotc(new Float64Array(2), new Float64Array(4), out)).toThrow(RangeError);
  });

  it('axpyComplex adds (re + i·im)·x, with a real fast path', () => {
    const y = new Float64Array([1, 1, 0, 0]);
    axpyComplex(y, 0, 1, new Float64Array([1, 0, 0, 2])); // i·1 = i, i·2i = −2
    expect(Array.from(y)).toEqual([1, 2, -2, 0]);
    axpyComplex(y, 2, 0, new Float64Array([1, 1, 1, 1]));
    expect(Array.from(y)).toEqual([3, 4, 0, 2]);
    expect(() => axpyComplex(y, 1, 0, new Float64Array(2))).toThrow(RangeError);
  });

  it('scaleReal, scaleComplex and copyInto write into the caller buffer', () => {
    const x = new Float64Array([1, -2, 3, 4]);
    scaleReal(x, -2);
    expect(Array.from(x)).toEqual([-2, 4, -6, -8]);
    scaleComplex(x, 0, 1); // times i
    expect(Array.from(x)).toEqual([-4, -2, 8, -6]);
    const d = new Float64Array(4);
    copyInto(d, x);
    expect(Array.from(d)).toEqual(Array.from(x));
    expect(() => copyInto(new Float64Array(2), x)).toThrow(RangeError);
  });
});
