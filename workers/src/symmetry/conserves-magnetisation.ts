/**
 * conservesMagnetisation — whether a Pauli sum commutes with the total magnetisation
 * M = Σ_i Z_i, decided by the Pauli-string algebra: the commutator [H, M] is expanded term by
 * term (physics/pauli-algebra.ts `commutator`, exact phases) and must vanish identically.
 *
 * No pattern matching: Z-only terms commute string by string; X_iX_j + Y_iY_j with equal
 * weights, or X_iY_j − Y_iX_j, commute only as sums (their commutator strings cancel); a lone
 * X_iX_j, X_i or unequal XX/YY weights do not. If [H, M] = 0 then H is block-diagonal in the
 * popcount sectors of the computational basis (Z_i|s⟩ = (1 − 2 s_i)|s⟩, DESIGN.md §2, so
 * M|s⟩ = (N − 2·popcount(s))|s⟩).
 *
 * Exactness: cancellation is tested with `tolerance` on |weight| of each commutator string,
 * default 0 (exact): a symmetry broken at the level of rounding in user-given weights is
 * treated as broken, which costs speed, never accuracy.
 * Cost: O(T·N) string products for T terms on N sites.
 */
import { addComplexTerm, commutator, createComplexSum, fromPauliSum } from '../physics/pauli-algebra.js';
import type { PauliSum } from '../physics/types.js';

/**
 * True when [H, Σ_i Z_i] = 0 (every commutator string's weight ≤ `tolerance` in modulus).
 * @throws RangeError if tolerance is negative or not finite.
 */
export function conservesMagnetisation(h: PauliSum, tolerance = 0): boolean {
  if (!(tolerance >= 0) || !Number.isFinite(tolerance)) throw new RangeError(`tolerance must be finite and ≥ 0; got ${tolerance}`);
  const m = createComplexSum(h.sites);
  for (let i = 0; i < h.sites; i++) addComplexTerm(m, { x: 0, z: 2 ** i }, 1, 0);
  const c = commutator(fromPauliSum(h), m);
  for (const t of c.terms.values()) if (Math.hypot(t.re, t.im) > tolerance) return false;
  return true;
}
