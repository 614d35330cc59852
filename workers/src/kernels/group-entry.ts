/**
 * Table-free access to a compiled flip group: entry s = ⟨s⊕x|H|s⟩ = Σ_k c_k·(−1)^{popcount(s&z_k)}
 * from the group's `zMasks` and complex `coefficients` (see compile-operator.ts).
 * Used by the kernels when an operator was compiled with `{ tables: false }`.
 * Cost: one parity and one add per term of the group.
 */
import type { CompiledGroup } from './compile-operator.js';
import { parity } from './parity.js';

/** Real part of ⟨s⊕x|H|s⟩ for the group, from its compact terms. */
export function groupEntryRe(g: CompiledGroup, s: number): number {
  const zs = g.zMasks;
  const cs = g.coefficients;
  let v = 0;
  for (let k = 0; k < zs.length; k++) v += parity(s & zs[k]) === 0 ? cs[2 * k] : -cs[2 * k];
  return v;
}

/** Imaginary part of ⟨s⊕x|H|s⟩ for the group, from its compact terms. */
export function groupEntryIm(g: CompiledGroup, s: number): number {
  const zs = g.zMasks;
  const cs = g.coefficients;
  let v = 0;
  for (let k = 0; k < zs.length; k++) v += parity(s & zs[k]) === 0 ? cs[2 * k + 1] : -cs[2 * k + 1];
  return v;
}

/** True when the group carries a full table (compiled with tables), false for the compact form. */
export function hasTable(g: CompiledGroup): boolean {
  return g.table.length > 0;
}
