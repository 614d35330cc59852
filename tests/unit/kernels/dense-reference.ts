/**
 * Dense complex matrices for checking the matrix-free kernels (test support, not a test).
 * Pauli strings are built as Kronecker products of the 2×2 matrices I, X, Y, Z with
 * site i = bit i of the basis index, i.e. P = σ_{N−1} ⊗ … ⊗ σ_0 in Kronecker order
 * (DESIGN.md §2). Independent of the kernels' bit-trick formula on purpose.
 */
import type { PauliSum } from '../../../workers/src/physics/types.js';

/** Row-major n×n complex matrix, split real and imaginary parts. */
export interface Dense {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

export function zeros(n: number): Dense {
  return { n, re: new Float64Array(n * n), im: new Float64Array(n * n) };
}

export function identity(n: number): Dense {
  const m = zeros(n);
  for (let i = 0; i < n; i++) m.re[i * n + i] = 1;
  return m;
}

function pauli2(letter: 'I' | 'X' | 'Y' | 'Z'): Dense {
  const m = zeros(2);
  if (letter === 'I') { m.re[0] = 1; m.re[3] = 1; }
  if (letter === 'X') { m.re[1] = 1; m.re[2] = 1; }
  if (letter === 'Y') { m.im[1] = -1; m.im[2] = 1; } // [[0, −i], [i, 0]]
  if (letter === 'Z') { m.re[0] = 1; m.re[3] = -1; }
  return m;
}

export function kron(a: Dense, b: Dense): Dense {
  const n = a.n * b.n;
  const m = zeros(n);
  for (let ia = 0; ia < a.n; ia++) for (let ja = 0; ja < a.n; ja++) {
    const ar = a.re[ia * a.n + ja], ai = a.im[ia * a.n + ja];
    if (ar === 0 && ai === 0) continue;
    for (let ib = 0; ib < b.n; ib++) for (let jb = 0; jb < b.n; jb++) {
      const br = b.re[ib * b.n + jb], bi = b.im[ib * b.n + jb];
      const k = (ia * b.n + ib) * n + (ja * b.n + jb);
      m.re[k] = ar * br - ai * bi;
      m.im[k] = ar * bi + ai * br;
    }
  }
  return m;
}

/** Dense matrix of the Pauli string (x, z) on `sites` sites. */
export function pauliDense(x: number, z: number, sites: number): Dense {
  let m = identity(1);
  for (let i = sites - 1; i >= 0; i--) {
    const xb = (x >> i) & 1, zb = (z >> i) & 1;
    const letter = xb && zb ? 'Y' : xb ? 'X' : zb ? 'Z' : 'I';
    m = kron(m, pauli2(letter));
  }
  return m;
}

export function addScaled(acc: Dense, m: Dense, w: number): void {
  for (let k = 0; k < acc.re.length; k++) { acc.re[k] += w * m.re[k]; acc.im[k] += w * m.im[k]; }
}

export function sumDense(sum: PauliSum): Dense {
  const m = zeros(2 ** sum.sites);
  for (const t of sum.terms) addScaled(m, pauliDense(t.x, t.z, sum.sites), t.weight);
  return m;
}

export function transposeDense(a: Dense): Dense {
  const m = zeros(a.n);
  for (let i = 0; i < a.n; i++) for (let j = 0; j < a.n; j++) {
    m.re[j * a.n + i] = a.re[i * a.n + j];
    m.im[j * a.n + i] = a.im[i * a.n + j];
  }
  return m;
}

/** out = A·v for interleaved complex vectors (nVectors contiguous vectors of length a.n). */
export function matVec(a: Dense, v: Float64Array, nVectors = 1): Float64Array {
  const n = a.n;
  const out = new Float64Array(2 * n * nVectors);
  for (let b = 0; b < nVectors; b++) {
    const o = 2 * n * b;
    for (let i = 0; i < n; i++) {
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) {
        const ar = a.re[i * n + j], ai = a.im[i * n + j];
        const vr = v[o + 2 * j], vi = v[o + 2 * j + 1];
        sr += ar * vr - ai * vi;
        si += ar * vi + ai * vr;
      }
      out[o + 2 * i] = sr;
      out[o + 2 * i + 1] = si;
    }
  }
  return out;
}

/** Largest |a_k − b_k| over two equally long arrays. */
export function maxAbsDiff(a: Float64Array, b: Float64Array): number {
  if (a.length !== b.length) throw new Error(`length mismatch ${a.length} vs ${b.length}`);
  let m = 0;
  for (let k = 0; k < a.length; k++) m = Math.max(m, Math.abs(a[k] - b[k]));
  return m;
}

/** Seeded uniform RNG on [0, 1) (mulberry32; common practice). */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Random interleaved complex vector with entries uniform in [−1, 1) per part. */
export function randomVector(rand: () => number, doubles: number): Float64Array {
  const v = new Float64Array(doubles);
  for (let k = 0; k < doubles; k++) v[k] = 2 * rand() - 1;
  return v;
}

/**
 * Random Pauli sum with X, Y, Z factors, an identity term and a duplicated string (so the
 * compile step has to combine terms).
 */
export function randomSum(rand: () => number, sites: number, nTerms: number): PauliSum {
  const dim = 2 ** sites;
  const terms: { x: number; z: number; weight: number }[] = [{ x: 0, z: 0, weight: 0.37 }];
  for (let k = 0; k < nTerms; k++) {
    terms.push({ x: Math.floor(rand() * dim), z: Math.floor(rand() * dim), weight: 2 * rand() - 1 });
  }
  terms.push({ ...terms[terms.length - 1], weight: 0.25 });
  // Make sure at least one Y string is present.
  terms.push({ x: 1, z: 1, weight: 0.6 });
  return { sites, terms };
}
