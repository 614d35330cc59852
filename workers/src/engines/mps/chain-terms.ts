/**
 * chainTerms — a Hamiltonian spec as merged, weighted Pauli strings with explicit site factors,
 * on lattices of any size (the two-mask PauliSum of physics/build-hamiltonian.ts stops at 30
 * sites). Same presets and merging rule as buildHamiltonian (DESIGN.md §2):
 *   ising: H = −J Σ⟨ij⟩ Z_i Z_j − hx Σ_i X_i − hz Σ_i Z_i
 *   xxz:   H = J Σ⟨ij⟩ (X_i X_j + Y_i Y_j + Δ Z_i Z_j) − hz Σ_i Z_i
 *   pauli-sum: the listed words ("" is a constant).
 * Repeated strings merge in first-appearance order; a merged weight is dropped when it is 0 or
 * cancels below CANCEL_RTOL of the magnitudes merged into it.
 * The terms are those of physics/site-terms.ts (shared with the free-fermion engine).
 */
import type { Hamiltonian } from '../../../../shared-types/src/index.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import { siteTerms } from '../../physics/site-terms.js';
import type { LatticeGraph } from '../../physics/types.js';

/** One weighted Pauli string, factors ascending by site (empty: a constant). */
export interface ChainTerm {
  readonly weight: number;
  readonly factors: readonly PauliFactor[];
}

/** Canonical word of sorted factors, e.g. "X0 Z3". */
export { factorsWord as wordOf } from '../../physics/site-terms.js';

/**
 * The merged terms of `h` on `graph` (see the file header).
 * @throws RangeError if a pauli-sum word names a site outside the lattice or repeats a site;
 *   TypeError if a word is malformed.
 */
export function chainTerms(h: Hamiltonian, graph: LatticeGraph): ChainTerm[] {
  return siteTerms(h, graph).map(({ weight, factors }) => ({ weight, factors }));
}
