/**
 * pauliExpectation — Σ_v ⟨v|P|v⟩ over a batch of contiguous 2^N vectors, for one Pauli string.
 *
 * Formula: P|s⟩ = i^{popcount(x&z)}·(−1)^{popcount(s&z)}·|s⊕x⟩ (DESIGN.md §2), so
 *   ⟨v|P|v⟩ = i^{popcount(x&z)} · Σ_s (−1)^{popcount(s&z)} · conj(v[s⊕x])·v[s].
 * On the doubled state (columns = contiguous physical vectors) with nVectors = dim this is
 * ⟨ψ|P⊗1|ψ⟩ = Tr(M†PM), not normalised. Source: direct from the Pauli action (common practice).
 *
 * Cost: 8 flops + one parity per complex entry, one read pass; no allocation.
 */
import type { PauliString } from '../physics/types.js';
import { parity, popcount } from './parity.js';

/**
 * out ← Σ_{v < nVectors} ⟨v|P|v⟩ (complex: out[0] = re, out[1] = im), summed, not normalised.
 * For Hermitian P the imaginary part is zero up to rounding.
 *
 * @param p - the Pauli string; masks must be < dim.
 * @param state - at least 2·dim·nVectors doubles, complex interleaved.
 * @param dim - entries per vector (2^N).
 * @param nVectors - number of contiguous vectors.
 * @param out - length ≥ 2, receives (re, im).
 * @throws RangeError on a mask ≥ dim, a non-power-of-two dim or a short buffer.
 */
export function pauliExpectation(
  p: PauliString,
  state: Float64Array,
  dim: number,
  nVectors: number,
  out: Float64Array,
): void {
  if (!Number.isInteger(dim) || dim < 1 || (dim & (dim - 1)) !== 0) {
    throw new RangeError(`dim must be a power of two; got ${dim}`);
  }
  const { x, z } = p;
  if (!Number.isInteger(x) || x < 0 || x >= dim) throw new RangeError(`p.x must be a mask below ${dim}; got ${x}`);
  if (!Number.isInteger(z) || z < 0 || z >= dim) throw new RangeError(`p.z must be a mask below ${dim}; got ${z}`);
  if (!Number.isInteger(nVectors) || nVectors < 0) throw new RangeError(`nVectors must be a non-negative integer; got ${nVectors}`);
  const need = 2 * dim * nVectors;
  if (state.length < need) throw new RangeError(`state must hold at least ${need} doubles; got ${state.length}`);
  if (out.length < 2) throw new RangeError(`out must hold 2 doubles; got ${out.length}`);

  let sr = 0;
  let si = 0;
  for (let v = 0; v < nVectors; v++) {
    const base = 2 * dim * v;
    for (let s = 0; s < dim; s++) {
      const k = base + 2 * s;
      const q = base + 2 * (s ^ x);
      const ar = state[q];
      const ai = state[q + 1];
      const br = state[k];
      const bi = state[k + 1];
      // conj(a)·b
      const pr = ar * br + ai * bi;
      const pi = ar * bi - ai * br;
      if (parity(s & z) === 0) { sr += pr; si += pi; } else { sr -= pr; si -= pi; }
    }
  }
  // Multiply by i^{popcount(x&z)}.
  switch (popcount(x & z) & 3) {
    case 0: out[0] = sr; out[1] = si; break;
    case 1: out[0] = -si; out[1] = sr; break;
    case 2: out[0] = -sr; out[1] = -si; break;
    default: out[0] = si; out[1] = -sr; break;
  }
}
