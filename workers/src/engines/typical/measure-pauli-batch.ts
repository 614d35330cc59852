/**
 * measurePauliBatch — ⟨ψ|P_k|ψ⟩ for many Hermitian Pauli strings P_k on one 2^N vector.
 *
 * Flip groups (strings sharing x ≠ 0). P|s⟩ = i^{popcount(x&z)}·(−1)^{popcount(s&z)}·|s⊕x⟩
 * (DESIGN.md §2) gives ⟨ψ|P|ψ⟩ = i^q·Σ_s (−1)^{popcount(s&z)}·conj(ψ[s⊕x])·ψ[s], q = popcount(x&z).
 * P is Hermitian, so the terms at s and s⊕x are complex conjugates of each other and
 *   ⟨ψ|P|ψ⟩ = 2·Re(i^q·Σ_{s: s&b = 0} (−1)^{popcount(s&z)}·conj(ψ[s⊕x])·ψ[s]),  b = lowest bit of x:
 * half the entries, one read of each amplitude, the products shared by all strings of the group.
 *
 * Diagonal strings (x = 0): ⟨Z_z⟩ = Σ_s (−1)^{popcount(s&z)}·|ψ_s|². With many of them (more
 * than WHT_MIN_STRINGS_PER_SITE·N) the Walsh–Hadamard transform of the probabilities gives
 * every Σ_s (−1)^{s·z}|ψ_s|² at once in N passes over 2^N reals (the fast transform:
 * Fino & Algazi, IEEE Trans. Comput. C-25, 1142 (1976); common practice); otherwise one pass
 * with a parity per string and entry.
 *
 * Cost per flip group of m strings: 2^{N−1}·(8 + m·(parity + 4)) operations, one read of ψ.
 * Diagonal: min(m passes with parities, N real passes + 1). Results are exact up to rounding;
 * the imaginary parts vanish identically (Hermitian strings), so none are returned.
 * Caveat: not normalised (divide by ‖ψ‖²).
 */
import { parity, popcount } from '../../kernels/index.js';
import type { PauliString } from '../../physics/types.js';

/** Diagonal strings per site above which the Walsh–Hadamard transform is used. */
export const WHT_MIN_STRINGS_PER_SITE = 0.5;

/** Strings sharing one flip mask. */
export interface PauliBatchGroup {
  /** The shared flip mask. */
  readonly x: number;
  /** z masks of the group's strings. */
  readonly zMasks: Int32Array;
  /** popcount(x & z) mod 4 per string: the phase i^q. */
  readonly phases: Uint8Array;
  /** Index of each string in the batch's input order. */
  readonly indices: Int32Array;
}

/** A list of Pauli strings grouped by flip mask. */
export interface PauliBatch {
  /** Vector length 2^N. */
  readonly dim: number;
  /** Number of strings. */
  readonly count: number;
  /** Groups in ascending x; the diagonal group (x = 0), if any, first. */
  readonly groups: readonly PauliBatchGroup[];
}

/**
 * Groups `strings` by flip mask for {@link measurePauliBatch}.
 * @throws RangeError when dim is not a power of two or a mask is not an integer in [0, dim).
 */
export function pauliBatch(strings: readonly PauliString[], dim: number): PauliBatch {
  if (!Number.isInteger(dim) || dim < 1 || (dim & (dim - 1)) !== 0) throw new RangeError(`dim must be a power of two; got ${dim}`);
  const byX = new Map<number, number[]>();
  strings.forEach((p, k) => {
    for (const [name, v] of [['x', p.x], ['z', p.z]] as const) {
      if (!Number.isInteger(v) || v < 0 || v >= dim) throw new RangeError(`strings[${k}].${name} must be a mask below ${dim}; got ${v}`);
    }
    const list = byX.get(p.x);
    if (list === undefined) byX.set(p.x, [k]); else list.push(k);
  });
  const groups = [...byX.keys()].sort((a, b) => a - b).map((x): PauliBatchGroup => {
    const idx = byX.get(x)!;
    return {
      x,
      zMasks: Int32Array.from(idx, (k) => strings[k].z),
      phases: Uint8Array.from(idx, (k) => popcount(x & strings[k].z) & 3),
      indices: Int32Array.from(idx),
    };
  });
  return { dim, count: strings.length, groups };
}

/**
 * out[k] ← ⟨ψ|P_k|ψ⟩ (real, not normalised) for every string of the batch. `scratch` (≥ dim
 * doubles, overwritten) serves the Walsh–Hadamard path; without it one is allocated when needed.
 * @throws RangeError when `state` is shorter than 2·dim, `out` shorter than `count` or `scratch` shorter than dim.
 */
export function measurePauliBatch(batch: PauliBatch, state: Float64Array, out: Float64Array, scratch?: Float64Array): void {
  const dim = batch.dim;
  if (state.length < 2 * dim) throw new RangeError(`state must hold at least ${2 * dim} doubles; got ${state.length}`);
  if (out.length < batch.count) throw new RangeError(`out must hold ${batch.count} values; got ${out.length}`);
  if (scratch !== undefined && scratch.length < dim) throw new RangeError(`scratch must hold at least ${dim} doubles; got ${scratch.length}`);
  let maxGroup = 0;
  for (const g of batch.groups) maxGroup = Math.max(maxGroup, g.zMasks.length);
  const accRe = new Float64Array(maxGroup);
  const accIm = new Float64Array(maxGroup);
  const sites = Math.round(Math.log2(dim));
  for (const g of batch.groups) {
    const m = g.zMasks.length;
    accRe.fill(0, 0, m);
    accIm.fill(0, 0, m);
    if (g.x === 0) {
      if (m > 1 && m > WHT_MIN_STRINGS_PER_SITE * sites) {
        const p = scratch ?? new Float64Array(dim);
        for (let s = 0; s < dim; s++) p[s] = state[2 * s] * state[2 * s] + state[2 * s + 1] * state[2 * s + 1];
        walshHadamard(p, dim);
        for (let k = 0; k < m; k++) out[g.indices[k]] = p[g.zMasks[k]];
      } else {
        diagonalPass(g.zMasks, state, dim, accRe);
        for (let k = 0; k < m; k++) out[g.indices[k]] = accRe[k];
      }
      continue;
    }
    flipPass(g.x, g.zMasks, state, dim, accRe, accIm);
    for (let k = 0; k < m; k++) {
      const sr = accRe[k], si = accIm[k];
      // 2·Re(i^q·(sr + i·si)).
      let v: number;
      switch (g.phases[k]) {
        case 0: v = sr; break;
        case 1: v = -si; break;
        case 2: v = -sr; break;
        default: v = si; break;
      }
      out[g.indices[k]] = 2 * v;
    }
  }
}

/** In place p[z] ← Σ_s (−1)^{popcount(s&z)}·p[s] (unnormalised fast Walsh–Hadamard transform). */
function walshHadamard(p: Float64Array, dim: number): void {
  for (let h = 1; h < dim; h *= 2) {
    for (let i = 0; i < dim; i += 2 * h) {
      for (let j = i, end = i + h; j < end; j++) {
        const a = p[j], b = p[j + h];
        p[j] = a + b;
        p[j + h] = a - b;
      }
    }
  }
}

/** acc[k] += Σ_s (−1)^{popcount(s&z_k)}·|ψ_s|². */
function diagonalPass(zs: Int32Array, state: Float64Array, dim: number, acc: Float64Array): void {
  const m = zs.length;
  if (m === 1) {
    const z = zs[0];
    let a = 0;
    for (let s = 0; s < dim; s++) {
      const re = state[2 * s], im = state[2 * s + 1];
      const p = re * re + im * im;
      a += parity(s & z) === 0 ? p : -p;
    }
    acc[0] += a;
    return;
  }
  for (let s = 0; s < dim; s++) {
    const re = state[2 * s], im = state[2 * s + 1];
    const p = re * re + im * im;
    for (let k = 0; k < m; k++) acc[k] += parity(s & zs[k]) === 0 ? p : -p;
  }
}

/** acc[k] += Σ_{s: s&b = 0} (−1)^{popcount(s&z_k)}·conj(ψ[s⊕x])·ψ[s], b the lowest set bit of x. */
function flipPass(x: number, zs: Int32Array, state: Float64Array, dim: number, accRe: Float64Array, accIm: Float64Array): void {
  const m = zs.length;
  const b = x & -x;
  if (m === 1 && zs[0] === 0) {
    // A pure flip string (z = 0, phase 1): only the real part is used, and there is no sign.
    let s0 = 0, s1 = 0;
    for (let hi = 0; hi < dim; hi += 2 * b) {
      for (let s = hi, end = hi + b; s < end; s++) {
        const q = 2 * (s ^ x), k = 2 * s;
        s0 += state[q] * state[k];
        s1 += state[q + 1] * state[k + 1];
      }
    }
    accRe[0] += s0 + s1;
    return;
  }
  if (m === 1) {
    const z = zs[0];
    let sr = 0, si = 0;
    for (let hi = 0; hi < dim; hi += 2 * b) {
      for (let s = hi, end = hi + b; s < end; s++) {
        const q = 2 * (s ^ x), k = 2 * s;
        const ar = state[q], ai = state[q + 1];
        const br = state[k], bi = state[k + 1];
        if (parity(s & z) === 0) {
          sr += ar * br + ai * bi;
          si += ar * bi - ai * br;
        } else {
          sr -= ar * br + ai * bi;
          si -= ar * bi - ai * br;
        }
      }
    }
    accRe[0] += sr;
    accIm[0] += si;
    return;
  }
  for (let hi = 0; hi < dim; hi += 2 * b) {
    for (let s = hi, end = hi + b; s < end; s++) {
      const q = 2 * (s ^ x), k = 2 * s;
      const ar = state[q], ai = state[q + 1];
      const br = state[k], bi = state[k + 1];
      const pr = ar * br + ai * bi;
      const pi = ar * bi - ai * br;
      for (let j = 0; j < m; j++) {
        if (parity(s & zs[j]) === 0) { accRe[j] += pr; accIm[j] += pi; } else { accRe[j] -= pr; accIm[j] -= pi; }
      }
    }
  }
}
