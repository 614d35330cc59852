/**
 * The purified (thermofield-double) state as a matrix-product state in the interleaved order
 * (i, ĩ): L sites of local dimension 4 (physical ⊗ auxiliary, p = s + 2·s̃; local-operators.ts),
 * after Verstraete, García-Ripoll & Cirac, PRL 93, 207204 (2004) and Feiguin & White, PRB 72,
 * 220401 (2005).
 *
 * Tensor i is A_i[α, p, β] with α < dims[i], β < dims[i+1], stored complex row-major at
 * 2·((α·4 + p)·dims[i+1] + β): read as a matrix it is (α, p) × β ("left grouping") or
 * α × (p, β) ("right grouping") without copying. dims[0] = dims[L] = 1.
 * Gauge: mixed canonical with orthogonality centre `center` — tensors left of it are
 * left-orthonormal (Σ_{α,p} conj(A[α,p,β])·A[α,p,β'] = δ), tensors right of it
 * right-orthonormal — and ‖ψ‖ = ‖A_center‖ = 1 (the engines keep the norm in a log).
 * Memory: 16·Σ_i 4·dims[i]·dims[i+1] bytes.
 */
import { LOCAL_DIM } from './local-operators.js';

/** A purified MPS (see the file header). */
export interface PurifiedMps {
  readonly sites: number;
  /** Bond dimensions, length sites + 1. */
  readonly dims: Int32Array;
  /** tensors[i] holds 2·dims[i]·4·dims[i+1] doubles. */
  readonly tensors: Float64Array[];
  /** Orthogonality centre. */
  center: number;
}

/**
 * The β = 0 state |I⟩ = ⊗_i (|0 0̃⟩ + |1 1̃⟩)/√2: bond dimension 1, every site right-orthonormal,
 * centre 0 (DESIGN.md §2).
 * @throws RangeError if sites is not a positive integer.
 */
export function identityPurification(sites: number): PurifiedMps {
  if (!Number.isInteger(sites) || sites < 1) throw new RangeError(`identityPurification: sites must be a positive integer; got ${sites}`);
  const dims = new Int32Array(sites + 1).fill(1);
  const tensors: Float64Array[] = [];
  for (let i = 0; i < sites; i++) {
    const a = new Float64Array(2 * LOCAL_DIM);
    a[0] = Math.SQRT1_2; // p = 0: s = 0, s̃ = 0
    a[6] = Math.SQRT1_2; // p = 3: s = 1, s̃ = 1
    tensors.push(a);
  }
  return { sites, dims, tensors, center: 0 };
}

/** A deep copy. */
export function cloneMps(mps: PurifiedMps): PurifiedMps {
  return { sites: mps.sites, dims: mps.dims.slice(), tensors: mps.tensors.map((t) => t.slice()), center: mps.center };
}

/** Largest bond dimension. */
export function maxBond(mps: PurifiedMps): number {
  let m = 0;
  for (const d of mps.dims) m = Math.max(m, d);
  return m;
}

/** Bytes held by the tensors. */
export function mpsBytes(mps: PurifiedMps): number {
  let s = 0;
  for (const t of mps.tensors) s += t.byteLength;
  return s;
}

/** Format tag of {@link serializeMps} (first double). */
export const MPS_FORMAT = 1;

/**
 * The state as one Float64Array: [MPS_FORMAT, sites, center, dims…, tensors…] (for checkpoints;
 * a Buffer view of it can be stored as is).
 */
export function serializeMps(mps: PurifiedMps): Float64Array {
  let len = 3 + mps.sites + 1;
  for (const t of mps.tensors) len += t.length;
  const out = new Float64Array(len);
  out[0] = MPS_FORMAT;
  out[1] = mps.sites;
  out[2] = mps.center;
  let o = 3;
  for (const d of mps.dims) out[o++] = d;
  for (const t of mps.tensors) {
    out.set(t, o);
    o += t.length;
  }
  return out;
}

/**
 * The inverse of {@link serializeMps}, reading from `offset`; returns the state and the offset
 * after it.
 * @throws RangeError if the data is not a serialised state of this format.
 */
export function deserializeMps(data: Float64Array, offset = 0): { mps: PurifiedMps; next: number } {
  if (data[offset] !== MPS_FORMAT) throw new RangeError(`deserializeMps: format tag ${data[offset]}, expected ${MPS_FORMAT}`);
  const sites = data[offset + 1];
  const center = data[offset + 2];
  if (!Number.isInteger(sites) || sites < 1 || !Number.isInteger(center) || center < 0 || center >= sites) {
    throw new RangeError(`deserializeMps: bad header (sites ${sites}, center ${center})`);
  }
  let o = offset + 3;
  const dims = new Int32Array(sites + 1);
  for (let i = 0; i <= sites; i++) dims[i] = data[o++];
  const tensors: Float64Array[] = [];
  for (let i = 0; i < sites; i++) {
    const len = 2 * dims[i] * LOCAL_DIM * dims[i + 1];
    if (o + len > data.length) throw new RangeError('deserializeMps: data ends inside a tensor');
    tensors.push(data.slice(o, o + len));
    o += len;
  }
  return { mps: { sites, dims, tensors, center }, next: o };
}
