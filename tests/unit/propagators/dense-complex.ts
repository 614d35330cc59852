/**
 * Test support (not a test): small dense complex matrices for checking the propagators against
 * mathjs `expm` (mathjs is a general-purpose math library; its complex `expm` is used as an
 * independent small-matrix reference). Vectors are complex interleaved (re, im) like the engine's.
 */
import { create, all } from 'mathjs';
import { symmetricEigen } from '../../support/reference/jacobi-eigen.js';

const math = create(all);

/** Row-major n×n complex matrix as interleaved (re, im) pairs. */
export interface DenseC {
  n: number;
  data: Float64Array;
}

/** Deterministic uniform(−1, 1) generator (mulberry32; common practice). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) / 4294967296) * 2 - 1;
  };
}

/** A random Hermitian n×n matrix with entries of size ~1. */
export function randomHermitian(n: number, seed: number): DenseC {
  const r = rng(seed);
  const data = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    data[2 * (i * n + i)] = r();
    for (let j = i + 1; j < n; j++) {
      const re = r(), im = r();
      data[2 * (i * n + j)] = re; data[2 * (i * n + j) + 1] = im;
      data[2 * (j * n + i)] = re; data[2 * (j * n + i) + 1] = -im;
    }
  }
  return { n, data };
}

/** A random complex vector of n entries. */
export function randomVector(n: number, seed: number): Float64Array {
  const r = rng(seed);
  return Float64Array.from({ length: 2 * n }, () => r());
}

/** Σ_ij |H_ij| over rows → max row sum: an upper bound of the spectral radius (Gershgorin). */
export function rowSumBound(h: DenseC): number {
  let best = 0;
  for (let i = 0; i < h.n; i++) {
    let s = 0;
    for (let j = 0; j < h.n; j++) s += Math.hypot(h.data[2 * (i * h.n + j)], h.data[2 * (i * h.n + j) + 1]);
    best = Math.max(best, s);
  }
  return best;
}

/** The affine callback out ← α·H·in + β·in + γ·out for a dense H. */
export function denseApply(h: DenseC) {
  const n = h.n;
  return (input: Float64Array, out: Float64Array, alpha: number, beta: number, gamma: number): void => {
    for (let i = 0; i < n; i++) {
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) {
        const ar = h.data[2 * (i * n + j)], ai = h.data[2 * (i * n + j) + 1];
        const xr = input[2 * j], xi = input[2 * j + 1];
        sr += ar * xr - ai * xi;
        si += ar * xi + ai * xr;
      }
      const o0 = gamma === 0 ? 0 : gamma * out[2 * i];
      const o1 = gamma === 0 ? 0 : gamma * out[2 * i + 1];
      out[2 * i] = alpha * sr + beta * input[2 * i] + o0;
      out[2 * i + 1] = alpha * si + beta * input[2 * i + 1] + o1;
    }
  };
}

/** exp(z·H)·v via mathjs expm, z complex (zr + i·zi). */
export function expmTimes(h: DenseC, zr: number, zi: number, v: Float64Array): Float64Array {
  const n = h.n;
  const rows = [];
  for (let i = 0; i < n; i++) {
    const row = [];
    for (let j = 0; j < n; j++) {
      const ar = h.data[2 * (i * n + j)], ai = h.data[2 * (i * n + j) + 1];
      row.push(math.complex(zr * ar - zi * ai, zr * ai + zi * ar));
    }
    rows.push(row);
  }
  const e = (math.expm(math.matrix(rows)) as unknown as { toArray(): { re: number; im: number }[][] }).toArray();
  const out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    let sr = 0, si = 0;
    for (let j = 0; j < n; j++) {
      const { re, im } = e[i][j];
      sr += re * v[2 * j] - im * v[2 * j + 1];
      si += re * v[2 * j + 1] + im * v[2 * j];
    }
    out[2 * i] = sr; out[2 * i + 1] = si;
  }
  return out;
}

export function norm(v: Float64Array): number {
  let s = 0;
  for (let k = 0; k < v.length; k++) s += v[k] * v[k];
  return Math.sqrt(s);
}

export function distance(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let k = 0; k < a.length; k++) s += (a[k] - b[k]) ** 2;
  return Math.sqrt(s);
}

/**
 * Eigenvalues of a Hermitian H = A + iB, ascending: cyclic Jacobi (tests/support/reference/
 * jacobi-eigen.ts) on the real embedding [[A, −B], [B, A]], whose spectrum is H's twice over.
 */
export function hermitianEigenvalues(h: DenseC): number[] {
  const n = h.n;
  const rows = Array.from({ length: 2 * n }, (_, i) => Array.from({ length: 2 * n }, (_, j) => {
    const r = i % n, c = j % n;
    const re = h.data[2 * (r * n + c)], im = h.data[2 * (r * n + c) + 1];
    if ((i < n) === (j < n)) return re;
    return i < n ? -im : im;
  }));
  return symmetricEigen(rows).values.filter((_, k) => k % 2 === 0);
}
