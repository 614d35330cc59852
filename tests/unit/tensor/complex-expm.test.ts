/**
 * complexExpm against mathjs's expm (a general-purpose reference library, DESIGN.md §7) on
 * random complex matrices, and invariants: exp(0) = I, exp(−iτH) unitary for Hermitian H,
 * exp(A)·exp(−A) = I. Tolerance 1e-13 relative (scaling and squaring with degree 18 Taylor:
 * truncation < 1e-22, rounding (s + 18)·n·ε).
 */
import { describe, expect, it } from 'vitest';
import { complex, expm, matrix, type Complex, type Matrix } from 'mathjs';
import { complexExpm } from '../../../workers/src/tensor/complex-expm.js';
import { randomComplex } from './complex-test-matrices.js';

function viaMathjs(n: number, a: Float64Array): Float64Array {
  const rows = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => complex(a[2 * (i * n + j)], a[2 * (i * n + j) + 1])));
  const e = (expm(matrix(rows)) as Matrix).toArray() as Complex[][];
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    out[2 * (i * n + j)] = e[i][j].re;
    out[2 * (i * n + j) + 1] = e[i][j].im;
  }
  return out;
}

function maxAbsDiff(a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (let k = 0; k < a.length; k++) d = Math.max(d, Math.abs(a[k] - b[k]));
  return d;
}

describe('complexExpm', () => {
  for (const [n, scale] of [[2, 0.3], [4, 1], [4, 6], [16, 0.8]] as const) {
    it(`matches mathjs expm on a random ${n}×${n} complex matrix of scale ${scale}`, () => {
      const a = randomComplex(n, n, 17 * n);
      for (let k = 0; k < a.length; k++) a[k] *= scale;
      const out = new Float64Array(2 * n * n);
      complexExpm(n, a, out);
      const ref = viaMathjs(n, a);
      const size = Math.max(...ref.map(Math.abs));
      expect(maxAbsDiff(out, ref) / size).toBeLessThan(1e-13);
    });
  }

  it('gives the identity for the zero matrix and a unitary for −iτH with H Hermitian', () => {
    const n = 4;
    const out = new Float64Array(32);
    complexExpm(n, new Float64Array(32), out);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      expect(out[2 * (i * n + j)]).toBe(i === j ? 1 : 0);
      expect(out[2 * (i * n + j) + 1]).toBe(0);
    }
    const h = randomComplex(n, n, 5);
    const a = new Float64Array(32);
    // A = −iτ(H + Hᴴ)/2, τ = 2.3
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const re = (h[2 * (i * n + j)] + h[2 * (j * n + i)]) / 2;
      const im = (h[2 * (i * n + j) + 1] - h[2 * (j * n + i) + 1]) / 2;
      a[2 * (i * n + j)] = 2.3 * im;
      a[2 * (i * n + j) + 1] = -2.3 * re;
    }
    complexExpm(n, a, out);
    for (let p = 0; p < n; p++) for (let q = 0; q < n; q++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        const xr = out[2 * (k * n + p)];
        const xi = out[2 * (k * n + p) + 1];
        const yr = out[2 * (k * n + q)];
        const yi = out[2 * (k * n + q) + 1];
        re += xr * yr + xi * yi;
        im += xr * yi - xi * yr;
      }
      expect(Math.abs(re - (p === q ? 1 : 0))).toBeLessThan(1e-13);
      expect(Math.abs(im)).toBeLessThan(1e-13);
    }
  });

  it('throws a RangeError for a non-finite entry or a short buffer', () => {
    expect(() => complexExpm(1, new Float64Array([NaN, 0]), new Float64Array(2))).toThrow(RangeError);
    expect(() => complexExpm(2, new Float64Array(4), new Float64Array(8))).toThrow(/a has 4 doubles/);
    expect(() => complexExpm(0, new Float64Array(0), new Float64Array(0))).toThrow(/n must be/);
  });
});
