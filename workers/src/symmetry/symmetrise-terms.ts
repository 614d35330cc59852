/**
 * symmetriseTerms — the group average Ō = (1/|G|)·Σ_{g∈G} g·O·g† of a Pauli sum
 * (g·P(x, z)·g† = P(g·x, g·z), site-permutation.ts).
 *
 * Why it is exact for the spectral quench: ρ = e^{−βH0}/Z and U = e^{−iH1t} commute with every
 * g ∈ G (both Hamiltonians are G-invariant), so ρ(t) = UρU† does too, and
 *   Tr(ρ(t)·g·O·g†) = Tr(g†·ρ(t)·g·O) = Tr(ρ(t)·O)   for every g,
 * hence ⟨O⟩(t) = ⟨Ō⟩(t) for ANY observable — a single-site ⟨X_i⟩ equals the translation (and
 * reflection) average of ⟨X_j⟩, a pair ⟨A_i B_j⟩ the average over the images of the pair. Ō
 * commutes with G and is block-diagonal in the sectors (block-matrix.ts needs that). Its
 * weight Σ|w̄| is at most Σ|w|, so the error bound does not grow.
 * An operator that is already invariant is returned unchanged (merged).
 * Each averaged weight is a sum of equal addends w/|G|, so equal images of different strings
 * (Z_0 and Z_1 on a ring) produce bit-identical operators, which measurement-plan.ts merges.
 * Cost: O(|G|·T·N).
 */
import { pauliKey } from '../physics/pauli-algebra.js';
import type { PauliTermMask } from '../physics/types.js';
import { invariantUnder, termTable } from './invariant-under.js';
import { permuteMask } from './site-permutation.js';
import type { SpatialGroup } from './spatial-group.js';

/** Ō as a merged list of terms (see the file header). */
export function symmetriseTerms(group: SpatialGroup, terms: readonly PauliTermMask[]): PauliTermMask[] {
  const table = termTable(terms);
  if (group.elements.every((g) => invariantUnder(table, g))) {
    return [...table.values()].map((t) => ({ x: t.x, z: t.z, weight: t.weight }));
  }
  const order = group.elements.length;
  const out = new Map<bigint, { x: number; z: number; weight: number }>();
  for (const g of group.elements) {
    for (const t of table.values()) {
      const p = { x: permuteMask(g, t.x), z: permuteMask(g, t.z) };
      const key = pauliKey(p);
      const e = out.get(key);
      if (e === undefined) out.set(key, { ...p, weight: t.weight / order });
      else e.weight += t.weight / order;
    }
  }
  return [...out.values()].filter((t) => t.weight !== 0);
}
