/**
 * primitiveForms — how each measured Pauli string is evaluated on the Gaussian components.
 *
 * A string Q = i^k·c_{m_1}⋯c_{m_s} (jordan-wigner.ts):
 * - s odd: Q changes the fermion parity P. Every Hamiltonian this engine accepts commutes with
 *   P, so the thermal state and its evolution do too (ρ = PρP), and ⟨Q⟩ = Tr(ρQ) =
 *   Tr(PρP·Q) = Tr(ρ·PQP) = −⟨Q⟩: the value is exactly 0 at every time (e.g. ⟨Z_i⟩, ⟨Y_i⟩,
 *   ⟨X_iZ_j⟩; also true on a finite ring in the ordered phase — there is no spontaneous
 *   symmetry breaking in a finite system).
 * - s even: Wick's theorem, ⟨Q⟩ = i^{k−s/2}·Pf(Γ[m, m]) on each Gaussian component.
 *   With parity sectors (a ring), on sector p also Q = p·(QP), whose monomial has 2L − s
 *   Majoranas: the shorter of the two is used (e.g. the boundary bond Z_{L−1}Z_0 costs a 2 × 2
 *   Pfaffian, not a (2L−2) × (2L−2) one).
 */
import { monomialIndices, pauliToMajorana, pfaffianSign, timesParity } from './jordan-wigner.js';
import type { FactorPrimitive } from './free-fermion-layout.js';

/** Evaluation form of one primitive. */
export interface PrimitiveForm {
  /** True when the value is exactly 0 (parity-odd string). */
  readonly zero: boolean;
  /** The Majorana indices of the Pfaffian, ascending (empty for a constant). */
  readonly indices: Int32Array;
  /**
   * Sign per sector: ⟨Q⟩_component = sign[sector]·Pf(Γ_component[indices, indices]).
   * One entry without sectors; two ([p = +1, p = −1]) with sectors.
   */
  readonly signs: readonly number[];
}

/** Forms of all primitives on `sites` sites, with (`sectors` = 2) or without (1) parity sectors. */
export function primitiveForms(prims: readonly FactorPrimitive[], sites: number, sectors: 1 | 2): PrimitiveForm[] {
  return prims.map((p) => {
    const q = pauliToMajorana(p.factors);
    if (q.count % 2 === 1) return { zero: true, indices: new Int32Array(0), signs: sectors === 1 ? [0] : [0, 0] };
    if (sectors === 1 || q.count <= sites) {
      const s = pfaffianSign(q);
      return { zero: false, indices: monomialIndices(q), signs: sectors === 1 ? [s] : [s, s] };
    }
    const r = timesParity(q, sites);
    const s = pfaffianSign(r);
    return { zero: false, indices: monomialIndices(r), signs: [s, -s] };
  });
}

/**
 * The Majorana count a primitive will cost without building it (same rule as
 * {@link primitiveForms}; 0 for parity-odd strings).
 */
export function primitiveCost(prim: FactorPrimitive, sites: number, sectors: 1 | 2): number {
  const q = pauliToMajorana(prim.factors);
  if (q.count % 2 === 1) return 0;
  return sectors === 1 ? q.count : Math.min(q.count, 2 * sites - q.count);
}
