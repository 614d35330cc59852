/**
 * Test helper: dense complex matrices of Pauli strings built from explicit 2×2 matrices by
 * Kronecker products, with site i = bit i of the basis index (DESIGN.md §2).
 */
import type { PauliString } from '../../../workers/src/physics/types.js';

/** A dense complex matrix, row-major, separate real and imaginary parts. */
export interface Dense {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

const I2: Dense = { n: 2, re: Float64Array.of(1, 0, 0, 1), im: Float64Array.of(0, 0, 0, 0) };
/** σx = [[0,1],[1,0]]. */
export const SX: Dense = { n: 2, re: Float64Array.of(0, 1, 1, 0), im: Float64Array.of(0, 0, 0, 0) };
/** σy = [[0,−i],[i,0]]. */
export const SY: Dense = { n: 2, re: Float64Array.of(0, 0, 0, 0), im: Float64Array.of(0, -1, 1, 0) };
/** σz = [[1,0],[0,−1]]. */
export const SZ: Dense = { n: 2, re: Float64Array.of(1, 0, 0, -1), im: Float64Array.of(0, 0, 0, 0) };

export function zeros(n: number): Dense {
  return { n, re: new Float64Array(n * n), im: new Float64Array(n * n) };
}

/** a ⊗ b where b acts on the low bits (the basis index is ia·nb + ib). */
export function kron(a: Dense, b: Dense): Dense {
  const n = a.n * b.n;
  const out = zeros(n);
  for (let ar = 0; ar < a.n; ar++) for (let ac = 0; ac < a.n; ac++) {
    const xr = a.re[ar * a.n + ac]; const xi = a.im[ar * a.n + ac];
    for (let br = 0; br < b.n; br++) for (let bc = 0; bc < b.n; bc++) {
      const yr = b.re[br * b.n + bc]; const yi = b.im[br * b.n + bc];
      const k = (ar * b.n + br) * n + (ac * b.n + bc);
      out.re[k] = xr * yr - xi * yi;
      out.im[k] = xr * yi + xi * yr;
    }
  }
  return out;
}

export function matmul(a: Dense, b: Dense): Dense {
  const n = a.n;
  const out = zeros(n);
  for (let r = 0; r < n; r++) for (let k = 0; k < n; k++) {
    const xr = a.re[r * n + k]; const xi = a.im[r * n + k];
    if (xr === 0 && xi === 0) continue;
    for (let c = 0; c < n; c++) {
      const yr = b.re[k * n + c]; const yi = b.im[k * n + c];
      out.re[r * n + c] += xr * yr - xi * yi;
      out.im[r * n + c] += xr * yi + xi * yr;
    }
  }
  return out;
}

/** a + (cr + i·ci)·b */
export function axpy(a: Dense, b: Dense, cr: number, ci = 0): Dense {
  const out = zeros(a.n);
  for (let k = 0; k < a.n * a.n; k++) {
    out.re[k] = a.re[k] + cr * b.re[k] - ci * b.im[k];
    out.im[k] = a.im[k] + cr * b.im[k] + ci * b.re[k];
  }
  return out;
}

export function transpose(a: Dense): Dense {
  const out = zeros(a.n);
  for (let r = 0; r < a.n; r++) for (let c = 0; c < a.n; c++) {
    out.re[c * a.n + r] = a.re[r * a.n + c];
    out.im[c * a.n + r] = a.im[r * a.n + c];
  }
  return out;
}

export function maxAbsDiff(a: Dense, b: Dense): number {
  let m = 0;
  for (let k = 0; k < a.n * a.n; k++) m = Math.max(m, Math.hypot(a.re[k] - b.re[k], a.im[k] - b.im[k]));
  return m;
}

/** Dense matrix of a Pauli string on `sites` sites: site sites−1 is the leftmost Kronecker factor. */
export function densePauli(p: PauliString, sites: number): Dense {
  let m: Dense = { n: 1, re: Float64Array.of(1), im: Float64Array.of(0) };
  for (let s = sites - 1; s >= 0; s--) {
    const hx = (p.x >> s) & 1; const hz = (p.z >> s) & 1;
    const f = hx && hz ? SY : hx ? SX : hz ? SZ : I2;
    m = kron(m, f);
  }
  return m;
}

/** Dense matrix of Σ (re + i·im)·P. */
export function denseSum(terms: Iterable<PauliString & { re: number; im: number }>, sites: number): Dense {
  let m = zeros(1 << sites);
  for (const t of terms) m = axpy(m, densePauli(t, sites), t.re, t.im);
  return m;
}
