/**
 * Error model of the spectral engine: what a measured Pauli expectation can be off by, from the
 * backward errors of the two decompositions (decompose-blocks.ts) and rounding.
 *
 * Let η0, δ0 (η1, δ1) be the backward error and orthogonality loss of H0 (H1). Then:
 * - Thermal state. The computed pairs are exact for H0 + E0, ‖E0‖ ≤ η0, and a Gibbs state moves
 *   by ‖ρ(H + E) − ρ(H)‖₁ ≤ 2β‖E‖ (Duhamel's formula: both the e^{−βH} factor and the
 *   normalisation contribute β‖E‖). Using W instead of its unitary polar factor adds ≤ 2δ0 in
 *   trace norm, doubled by the normalisation: 4δ0.
 * - Propagator. U = V e^{−iΛt} Vᴴ differs from e^{−i(H1+E1)t} by ≤ 2δ1 and that from e^{−iH1t}
 *   by ≤ η1·t; an observable of norm 1 in Tr(ρU†OU) feels 2‖ΔU‖: 2η1·t + 4δ1.
 * - Phases. cos/sin of the rounded products E_m·t carry ≈ ε·|E_m t|: 2ε·max|E|·t.
 * - Rounding in the products and sums of the formula: ROUNDING_PER_STATE·ε·d for the largest
 *   block d (a random-walk estimate of the dot products' rounding, not a worst-case bound;
 *   the worst case grows like d²·ε).
 * Sum, for a Pauli string (‖P‖ = 1), capped at 2 (any value in [−1, 1] is within 2):
 *   e(β, t) = 2βη0 + 4δ0 + 2η1·t + 4δ1 + 2ε·max|E1|·t + ROUNDING_PER_STATE·ε·d.
 * The reported propagatorErrorBound is η1·t_max + 2δ1 (the unitary's 2-norm error).
 */

/** Rounding allowance per state of the largest block, in units of ε (an estimate; see header). */
export const ROUNDING_PER_STATE = 8;

/** Per-decomposition figures the error model needs. */
export interface DecompositionFigures {
  /** η: backward error. */
  readonly backwardError: number;
  /** δ: orthogonality loss ‖WᴴW − I‖_F. */
  readonly orthogonality: number;
}

/** Error of one Pauli expectation at (β, t) (see the file header). */
export function pauliError(
  beta: number, t: number, h0: DecompositionFigures, h1: DecompositionFigures,
  largestBlock: number, maxAbsEnergy1: number,
): number {
  const eps = Number.EPSILON;
  const e = 2 * beta * h0.backwardError + 4 * h0.orthogonality
    + 2 * h1.backwardError * t + 4 * h1.orthogonality
    + 2 * eps * maxAbsEnergy1 * t + ROUNDING_PER_STATE * eps * largestBlock;
  return Math.min(e, 2);
}

/** The unitary's error bound over times up to tMax: η1·tMax + 2δ1. */
export function propagatorError(tMax: number, h1: DecompositionFigures): number {
  return h1.backwardError * tMax + 2 * h1.orthogonality;
}
