/**
 * Error ESTIMATES of the free-fermion engine (rounding only: the method has no truncation).
 * They are estimates, not rigorous bounds; their size was checked against the exact engine and
 * dense references in tests/unit/free-fermion (the deviations there stay below them).
 *
 * One covariance entry Γ_ab(t) = (F Γ'' Fᵀ)_ab, F = O1·E(t), Γ'' = W Γ'₀ Wᵀ, has two parts:
 *   systematic  δΓ_sys ≈ 2·(def₀ + def₁) + r₀·β/2 + r₁·t,
 *   random      δΓ_rnd ≈ ROUNDING_PER_SUM·√n·u,
 * def = orthogonality defect of O (a non-orthogonal O distorts Γ linearly), r = absolute Schur
 * residual max|AO − OΛ| (an error δε in a mode energy moves tanh(βε/2) by ≤ β·δε/2 and the
 * phase ε·t by t·δε); the random part is the typical rounding of the length-n sums of products
 * of unit-norm rows (√n·u; the worst case n·u is rarely approached — Higham, Accuracy and
 * Stability of Numerical Algorithms (2002), §3.1 and §2.8).
 * A Pfaffian of order s built from entries with errors δΓ (|entries| ≤ 1 for thermal states,
 * so every minor is ≤ 1 in size) changes by ≤ Σ over its s(s−1)/2 entries; the estimate uses s·δΓ
 * (random-sign accumulation) times max(1, |Pf|) — primitive-evaluator.ts.
 * A series Σ w_P⟨P⟩ adds the systematic parts linearly and the random parts in quadrature
 * (free-fermion-layout.ts): for an extensive energy on L = 1000 sites the linear sum of
 * worst cases would overstate the observed deviations (~1e−11) a hundredfold.
 *
 * Thermodynamics from the L mode energies, each off by ≲ r₀:
 *   δ ln Z ≈ L·(β r₀/2 + 4u),  δE ≈ L·r₀·(1 + β‖A‖/2) + 4L·u·‖A‖,  δC ≈ β²·L·r₀·‖A‖·(1 + β‖A‖/2).
 */

/** Unit roundoff of IEEE double precision, 2⁻⁵³. */
export const UNIT_ROUNDOFF = 2 ** -53;
/** Multiple of √n·u allowed for each length-n sum (products, rotations). */
export const ROUNDING_PER_SUM = 4;
/** A-priori multiple of √n·u for the orthogonality defect and the relative Schur residual (plan). */
export const PRIOR_DECOMPOSITION_FACTOR = 4;

/** Inputs of {@link entryError}. */
export interface EntryErrorInput {
  /** Matrix order 2L. */
  n: number;
  /** Orthogonality defects of O0 and O1. */
  defect0: number;
  defect1: number;
  /** Absolute Schur residuals of A0 and A1 (energy units). */
  residual0: number;
  residual1: number;
  beta: number;
  t: number;
}

/** Estimated absolute error of one covariance entry at (β, t): systematic and random parts. */
export interface EntryError {
  readonly systematic: number;
  readonly random: number;
}

/** Estimated absolute error of one covariance entry at (β, t). */
export function entryError(x: EntryErrorInput): EntryError {
  return {
    systematic: 2 * (x.defect0 + x.defect1) + x.residual0 * x.beta / 2 + x.residual1 * x.t,
    random: ROUNDING_PER_SUM * Math.sqrt(x.n) * UNIT_ROUNDOFF,
  };
}

/** The same estimate before any decomposition exists (the plan's accuracy), from ‖A0‖, ‖A1‖. */
export function priorEntryError(n: number, norm0: number, norm1: number, beta: number, t: number): EntryError {
  const nu = Math.sqrt(n) * UNIT_ROUNDOFF;
  return entryError({
    n, defect0: PRIOR_DECOMPOSITION_FACTOR * nu, defect1: PRIOR_DECOMPOSITION_FACTOR * nu,
    residual0: PRIOR_DECOMPOSITION_FACTOR * nu * Math.max(1, norm0),
    residual1: PRIOR_DECOMPOSITION_FACTOR * nu * Math.max(1, norm1), beta, t,
  });
}

/** Estimated absolute errors of ln Z, E and C at β (see the file header). */
export function thermoErrors(sites: number, residual0: number, norm0: number, beta: number): { lnZ: number; energy: number; heatCapacity: number } {
  const half = beta * norm0 / 2;
  return {
    lnZ: sites * (beta * residual0 / 2 + 4 * UNIT_ROUNDOFF),
    energy: sites * residual0 * (1 + half) + 4 * sites * UNIT_ROUNDOFF * Math.max(1, norm0),
    heatCapacity: beta * beta * sites * residual0 * Math.max(1, norm0) * (1 + half) + 4 * sites * UNIT_ROUNDOFF,
  };
}
