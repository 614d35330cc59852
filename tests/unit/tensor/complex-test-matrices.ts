/**
 * Test support (not a test): seeded complex row-major matrices, matrices with a prescribed
 * spectrum, products and residual norms for the tensor kernels' invariants.
 */
import { seededRandom } from '../../bench/bench-record.js';

/** A seeded m×n complex row-major matrix with entries uniform in the unit square around 0. */
export function randomComplex(m: number, n: number, seed: number): Float64Array {
  const rand = seededRandom(seed);
  const a = new Float64Array(2 * m * n);
  for (let k = 0; k < a.length; k++) a[k] = rand() - 0.5;
  return a;
}

/** m×k with orthonormal columns (classical Gram–Schmidt applied twice to random columns). */
export function randomIsometry(m: number, k: number, seed: number): Float64Array {
  const a = randomComplex(m, k, seed);
  for (let j = 0; j < k; j++) {
    for (let pass = 0; pass < 2; pass++) {
      for (let p = 0; p < j; p++) {
        let gr = 0;
        let gi = 0;
        for (let i = 0; i < m; i++) {
          const xr = a[2 * (i * k + p)];
          const xi = a[2 * (i * k + p) + 1];
          const yr = a[2 * (i * k + j)];
          const yi = a[2 * (i * k + j) + 1];
          gr += xr * yr + xi * yi;
          gi += xr * yi - xi * yr;
        }
        for (let i = 0; i < m; i++) {
          const xr = a[2 * (i * k + p)];
          const xi = a[2 * (i * k + p) + 1];
          a[2 * (i * k + j)] -= gr * xr - gi * xi;
          a[2 * (i * k + j) + 1] -= gr * xi + gi * xr;
        }
      }
    }
    let nrm = 0;
    for (let i = 0; i < m; i++) nrm += a[2 * (i * k + j)] ** 2 + a[2 * (i * k + j) + 1] ** 2;
    nrm = Math.sqrt(nrm);
    for (let i = 0; i < m; i++) {
      a[2 * (i * k + j)] /= nrm;
      a[2 * (i * k + j) + 1] /= nrm;
    }
  }
  return a;
}

/** A = P·diag(sigma)·Qᴴ (m×n) with random isometries P (m×r), Q (n×r), r = sigma.length. */
export function withSpectrum(m: number, n: number, sigma: readonly number[], seed: number): Float64Array {
  const r = sigma.length;
  const p = randomIsometry(m, r, seed);
  const q = randomIsometry(n, r, seed + 7919);
  const a = new Float64Array(2 * m * n);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let re = 0;
      let im = 0;
      for (let l = 0; l < r; l++) {
        const pr = p[2 * (i * r + l)] * sigma[l];
        const pi = p[2 * (i * r + l) + 1] * sigma[l];
        const qr = q[2 * (j * r + l)];
        const qi = -q[2 * (j * r + l) + 1];
        re += pr * qr - pi * qi;
        im += pr * qi + pi * qr;
      }
      a[2 * (i * n + j)] = re;
      a[2 * (i * n + j) + 1] = im;
    }
  }
  return a;
}

/** Frobenius norm of a complex buffer's first `len` complex entries. */
export function frob(a: Float64Array, len = a.length / 2): number {
  let s = 0;
  for (let k = 0; k < 2 * len; k++) s += a[k] * a[k];
  return Math.sqrt(s);
}

/** ‖A − U·diag(s)·Vh‖_F for compact row-major U (m×k), Vh (k×n). */
export function reconstructionError(
  m: number, n: number, a: Float64Array, u: Float64Array, s: Float64Array, vh: Float64Array,
): number {
  const k = s.length;
  let e = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let re = a[2 * (i * n + j)];
      let im = a[2 * (i * n + j) + 1];
      for (let l = 0; l < k; l++) {
        const ur = u[2 * (i * k + l)] * s[l];
        const ui = u[2 * (i * k + l) + 1] * s[l];
        const vr = vh[2 * (l * n + j)];
        const vi = vh[2 * (l * n + j) + 1];
        re -= ur * vr - ui * vi;
        im -= ur * vi + ui * vr;
      }
      e += re * re + im * im;
    }
  }
  return Math.sqrt(e);
}

/** max |(XᴴX − I)_{pq}| for X m×k row-major (orthonormal columns: rows=false) or k×n (rows: true). */
export function orthonormalityDefect(x: Float64Array, outer: number, inner: number, rows: boolean): number {
  // rows = true: the k = outer rows (length inner) should be orthonormal.
  // rows = false: the k = inner columns (length outer) should be orthonormal.
  const k = rows ? outer : inner;
  const len = rows ? inner : outer;
  const at = (v: number, i: number): [number, number] => {
    const o = rows ? 2 * (v * inner + i) : 2 * (i * inner + v);
    return [x[o], x[o + 1]];
  };
  let worst = 0;
  for (let p = 0; p < k; p++) {
    for (let q = p; q < k; q++) {
      let re = 0;
      let im = 0;
      for (let i = 0; i < len; i++) {
        const [xr, xi] = at(p, i);
        const [yr, yi] = at(q, i);
        re += xr * yr + xi * yi;
        im += xr * yi - xi * yr;
      }
      worst = Math.max(worst, Math.hypot(re - (p === q ? 1 : 0), im));
    }
  }
  return worst;
}
