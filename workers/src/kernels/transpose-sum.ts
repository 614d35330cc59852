/**
 * transposeSum — the transpose Hᵀ of a real-weighted Pauli sum, as another Pauli sum.
 *
 * Formula: Xᵀ = X, Zᵀ = Z, Yᵀ = −Y, hence (w·P)ᵀ = w·(−1)^{popcount(x&z)}·P: every Y in a
 * string flips the sign once. Used for the auxiliary half of the quench generator
 * K = H1⊗1 − 1⊗H1ᵀ (DESIGN.md §2). Cost O(T).
 */
import type { PauliSum } from '../physics/types.js';
import { popcount } from './parity.js';

/** Hᵀ: same strings, each weight times (−1)^{number of Y factors}. Returns a new sum. */
export function transposeSum(sum: PauliSum): PauliSum {
  return {
    sites: sum.sites,
    terms: sum.terms.map((t) => ({
      x: t.x,
      z: t.z,
      weight: (popcount(t.x & t.z) & 1) === 0 ? t.weight : -t.weight,
    })),
  };
}
