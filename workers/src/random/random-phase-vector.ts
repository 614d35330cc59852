/**
 * fillRandomPhaseVector — |r⟩ = 2^{−N/2}·Σ_s e^{iφ_s}|s⟩ with independent uniform phases φ_s
 * (for any length D: D^{−1/2}·Σ_s e^{iφ_s}|s⟩; the Lanczos start vector uses that).
 *
 * Property used by the typical engine (Sugiura & Shimizu, PRL 108, 240401 (2012); the phase choice is
 * common practice): the phases give E[r_s·conj(r_s')] = δ_ss'/2^N, hence E⟨r|A|r⟩ = Tr(A)/2^N
 * for every operator A, and ‖r‖ = 1 exactly (no norm fluctuation). The variance of ⟨r|A|r⟩ is
 * (Tr(A†A) − Σ_s |A_ss|²)/4^N: diagonal operators are estimated exactly (zero variance).
 *
 * Determinism: φ_s = 2π·u_s with u_s the s-th 32-bit output of Xoshiro128.forStream(seed, stream),
 * s = 0, 1, … in order; nothing else enters. Sample k of a sweep uses stream k.
 * Cost: one generator step, one cos and one sin per entry; writes 16·2^N bytes.
 */
import { Xoshiro128 } from './xoshiro128.js';

/**
 * Overwrites `out` (2·dim doubles, complex interleaved) with the random-phase vector of
 * (seed, stream), normalised to 1.
 * @throws RangeError when dim is not a positive integer, `out` is too short, or seed/stream are not integers in [0, 2^32).
 */
export function fillRandomPhaseVector(out: Float64Array, dim: number, seed: number, stream: number): void {
  if (!Number.isInteger(dim) || dim < 1) throw new RangeError(`dim must be a positive integer; got ${dim}`);
  if (out.length < 2 * dim) throw new RangeError(`out must hold at least ${2 * dim} doubles; got ${out.length}`);
  const rng = Xoshiro128.forStream(seed, stream);
  const amp = 1 / Math.sqrt(dim);
  const step = (2 * Math.PI) / 2 ** 32;
  for (let s = 0; s < dim; s++) {
    const phi = rng.nextUint32() * step;
    out[2 * s] = amp * Math.cos(phi);
    out[2 * s + 1] = amp * Math.sin(phi);
  }
}
