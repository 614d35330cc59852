/**
 * Invariance of a Pauli sum under a site permutation, decided from its terms: with
 * π·P(x, z)·π† = P(π·x, π·z) (site-permutation.ts), π·H·π† = H holds exactly when the merged
 * term table maps onto itself — every string's image is a string of H with the same weight.
 * Weights are compared exactly (as conservesMagnetisation does): a symmetry broken only at the
 * level of rounding in user-given weights counts as broken, which costs speed, never accuracy.
 * No model names are consulted: one site with a different field, a missing boundary bond or a
 * chiral X_iY_j − Y_iX_j term (which reverses sign under a reflection) break the symmetry
 * because their images are not terms of H with the same weight.
 * Cost: O(T·N) for T terms.
 */
import { pauliKey } from '../physics/pauli-algebra.js';
import type { PauliTermMask } from '../physics/types.js';
import type { SitePermutation } from './site-permutation.js';
import { permuteMask } from './site-permutation.js';

/** Merged weights by string key (duplicates summed, exact zeros dropped). */
export type TermTable = ReadonlyMap<bigint, { readonly x: number; readonly z: number; readonly weight: number }>;

/** The merged term table of a list of weighted strings. */
export function termTable(terms: readonly PauliTermMask[]): TermTable {
  const m = new Map<bigint, { x: number; z: number; weight: number }>();
  for (const t of terms) {
    const key = pauliKey(t);
    const e = m.get(key);
    if (e === undefined) m.set(key, { x: t.x, z: t.z, weight: t.weight });
    else e.weight += t.weight;
  }
  for (const [k, e] of m) if (e.weight === 0) m.delete(k);
  return m;
}

/** True when π·H·π† = H exactly for the operator with this term table. */
export function invariantUnder(table: TermTable, perm: SitePermutation): boolean {
  for (const t of table.values()) {
    const image = table.get(pauliKey({ x: permuteMask(perm, t.x), z: permuteMask(perm, t.z) }));
    if (image === undefined || image.weight !== t.weight) return false;
  }
  return true;
}
