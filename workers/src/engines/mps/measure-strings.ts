/**
 * measureStrings — thermal/quench expectations ⟨ψ|P ⊗ 1|ψ⟩ of Pauli strings P on the physical
 * spins, from the purified MPS (normalised, mixed canonical).
 *
 * For a string with factors on sites s_1 < … < s_k the centre is put at s_1; then everything
 * left of s_1 is left-orthonormal and everything right of s_k right-orthonormal, so
 *   ⟨P⟩ = Tr E_{s_k},  E_{s_1} = B_{s_1}ᴴ-contracted with A_{s_1},
 *   E_j[β, β'] = Σ_{α,α',p} conj(A_j[α,p,β])·E_{j−1}[α,α']·(O_j A_j)[α',p,β'],
 * O_j the factor on site j (or 1). The centre sweeps once from site 0 to the right, and at each
 * site the strings that start there are evaluated: one sweep of L − 1 centre moves plus
 * Σ_P (s_k − s_1 + 1) transfers of ≈ 16·χ³·(8 + 8) flops each. Standard MPS contraction
 * (Verstraete, García-Ripoll & Cirac 2004). The imaginary parts (rounding for Hermitian P) are
 * reported.
 */
import { complexGemmUnchecked } from '../../tensor/complex-gemm.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import { LOCAL_DIM, pauliMatrix } from './local-operators.js';
import { moveCenterRight, moveCenterTo } from './move-center.js';
import type { MoveWorkspace } from './move-center.js';
import type { PurifiedMps } from './purified-mps.js';

/** A Pauli string by its factors, ascending by site (non-empty). */
export interface FactorString {
  readonly factors: readonly PauliFactor[];
}

/** B = (O ⊗ 1)·A for a 2×2 physical operator O (or a copy of A when O is null). */
export function applyPhysical(op: Float64Array | null, a: Float64Array, chiL: number, chiR: number, out: Float64Array): void {
  if (op === null) {
    out.set(a.subarray(0, 2 * chiL * LOCAL_DIM * chiR));
    return;
  }
  for (let al = 0; al < chiL; al++) {
    for (let p = 0; p < LOCAL_DIM; p++) {
      const s = p & 1;
      const aux = p & 2;
      const o = 2 * (al * LOCAL_DIM + p) * chiR;
      const i0 = 2 * (al * LOCAL_DIM + aux) * chiR; // s' = 0
      const i1 = 2 * (al * LOCAL_DIM + aux + 1) * chiR; // s' = 1
      const r0 = op[2 * (s * 2)];
      const m0 = op[2 * (s * 2) + 1];
      const r1 = op[2 * (s * 2 + 1)];
      const m1 = op[2 * (s * 2 + 1) + 1];
      for (let be = 0; be < 2 * chiR; be += 2) {
        const xr = a[i0 + be];
        const xi = a[i0 + be + 1];
        const yr = a[i1 + be];
        const yi = a[i1 + be + 1];
        out[o + be] = r0 * xr - m0 * xi + r1 * yr - m1 * yi;
        out[o + be + 1] = r0 * xi + m0 * xr + r1 * yi + m1 * yr;
      }
    }
  }
}

/** Scratch of the contractions (grown on demand). */
export interface MeasureWorkspace {
  b: Float64Array;
  t: Float64Array;
  env: Float64Array;
  next: Float64Array;
}

/** An empty workspace. */
export function createMeasureWorkspace(): MeasureWorkspace {
  return { b: new Float64Array(0), t: new Float64Array(0), env: new Float64Array(0), next: new Float64Array(0) };
}

function ensure(buf: Float64Array, len: number): Float64Array {
  return buf.length >= len ? buf : new Float64Array(len);
}

/**
 * ⟨P⟩ for a string whose first factor sits at the centre; writes [Re, Im] into `out`.
 * @throws RangeError if the first factor is not at the centre.
 */
export function stringAtCenter(mps: PurifiedMps, str: FactorString, ws: MeasureWorkspace, out: Float64Array): void {
  const f = str.factors;
  const first = f[0].site;
  if (first !== mps.center) throw new RangeError(`stringAtCenter: the string starts at ${first}, the centre is at ${mps.center}`);
  const last = f[f.length - 1].site;
  let k = 0;
  let chiPrev = 0;
  for (let j = first; j <= last; j++) {
    const chiL = mps.dims[j];
    const chiR = mps.dims[j + 1];
    const a = mps.tensors[j];
    let op: Float64Array | null = null;
    if (k < f.length && f[k].site === j) op = pauliMatrix(f[k++].letter);
    const len = 2 * chiL * LOCAL_DIM * chiR;
    ws.b = ensure(ws.b, len);
    applyPhysical(op, a, chiL, chiR, ws.b);
    let t: Float64Array;
    if (j === first) t = ws.b;
    else {
      ws.t = ensure(ws.t, len);
      complexGemmUnchecked('N', chiL, LOCAL_DIM * chiR, chiPrev, ws.env, chiPrev, ws.b, LOCAL_DIM * chiR, ws.t, LOCAL_DIM * chiR, false);
      t = ws.t;
    }
    ws.next = ensure(ws.next, 2 * chiR * chiR);
    complexGemmUnchecked('C', chiR, chiR, LOCAL_DIM * chiL, a, chiR, t, chiR, ws.next, chiR, false);
    const sw = ws.env;
    ws.env = ws.next;
    ws.next = sw;
    chiPrev = chiR;
  }
  let re = 0;
  let im = 0;
  for (let x = 0; x < chiPrev; x++) {
    re += ws.env[2 * (x * chiPrev + x)];
    im += ws.env[2 * (x * chiPrev + x) + 1];
  }
  out[0] = re;
  out[1] = im;
}

/**
 * Re⟨P⟩ of every string into `values` (same order); returns the largest |Im⟨P⟩|. Strings are
 * bucketed by their first site; the centre is moved to site 0 and swept right (it ends at the
 * last site that starts a string).
 */
export function measureStrings(
  mps: PurifiedMps, strings: readonly FactorString[], values: Float64Array,
  move: MoveWorkspace, ws: MeasureWorkspace, buckets?: readonly number[][],
): number {
  const byFirst = buckets ?? bucketByFirstSite(strings, mps.sites);
  let lastStart = -1;
  for (let s = 0; s < mps.sites; s++) if (byFirst[s].length > 0) lastStart = s;
  if (lastStart < 0) return 0;
  const pair = new Float64Array(2);
  let maxImag = 0;
  let firstStart = 0;
  while (byFirst[firstStart].length === 0) firstStart++;
  moveCenterTo(mps, firstStart, move);
  for (let s = firstStart; s <= lastStart; s++) {
    if (s > mps.center) moveCenterRight(mps, move);
    for (const k of byFirst[s]) {
      stringAtCenter(mps, strings[k], ws, pair);
      values[k] = pair[0];
      maxImag = Math.max(maxImag, Math.abs(pair[1]));
    }
  }
  return maxImag;
}

/** Indices of the strings grouped by first site (strings must be non-empty, factors ascending). */
export function bucketByFirstSite(strings: readonly FactorString[], sites: number): number[][] {
  const out: number[][] = Array.from({ length: sites }, () => []);
  strings.forEach((p, k) => {
    if (p.factors.length === 0) throw new RangeError(`bucketByFirstSite: string ${k} is the identity`);
    out[p.factors[0].site].push(k);
  });
  return out;
}
