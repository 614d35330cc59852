/**
 * Plan-time estimate of how much one random-phase sample scatters — used only to plan the
 * number of samples and to refuse; the run measures the scatter itself (jackknife) and
 * reports what it measured.
 *
 * Per-sample scatter. For ρ = e^{−βH0}/Z and Õ = O − ⟨O⟩, the ratio estimator's one-sample
 * variance is (delta method; Var⟨r|B|r⟩ = (Tr B² − Σ_s B_ss²)/4^N for random phases)
 *   σ₁² ≤ Tr(B²)/(Z/2^N)²·4^{−N} = Tr(ρÕρÕ) = Σ_mn p_m p_n |Õ_mn|²,   B = e^{−βH0/2}Õe^{−βH0/2},
 * the canonical-typicality scaling (Sugiura & Shimizu, PRL 108, 240401 (2012); PRL 111, 010401
 * (2013)): ≈ ‖O‖²_HS·2^{−N} at β = 0 and small again as T → 0, where every sample projects onto
 * the ground state. A unitary quench leaves ‖O(t)‖_HS unchanged; ‖O‖²_HS = Σ w² over O's
 * non-identity strings (orthonormal under Tr(·)/2^N). Products ⟨A⟩⟨B⟩ of connected correlators
 * add 2|w| per product to the scale (|⟨A⟩|, |⟨B⟩| ≤ 1).
 *
 * The model (our estimate, not a bound). Each site becomes an independent two-level system
 * ρ_i ∝ e^{−βhσ}, with h = √(μ₂/N), μ₂ = Σ w² of H0, which reproduces the exact
 * high-temperature expansion −ln Tr ρ² = S₂ = N ln 2 − β²μ₂ + O(β⁴). For an observable that
 * flips the site (the larger case), Tr(ρ_iõρ_iõ) = Tr(ρ_i²)·sech(2βh), so
 *   σ₁² ≈ ‖O‖²_HS · e^{−S₂(β)} · sech(2βh),   S₂ ≈ N·s₂(βh),  s₂(x) = ln 2 + 2 ln cosh x − ln cosh 2x.
 * Exact for free spins in a field. A degenerate ground state keeps σ₁ finite as T → 0, which
 * the model misses; the estimate is floored at its β = 0 value. On an 8-site transverse-field chain (J = 1, hx = 0.7,
 * β = 0 … 2) it lay within a factor 2 above the measured scatter of ⟨H1⟩ and ⟨X⟩.
 */
import type { ObservableLayout } from '../../observables/expand-observables.js';

/** ln cosh x without overflow. */
function lnCosh(x: number): number {
  const a = Math.abs(x);
  return a + Math.log1p(Math.exp(-2 * a)) - Math.LN2;
}

/** s₂(x) = ln 2 + 2 ln cosh x − ln cosh 2x: Rényi-2 entropy of a two-level system e^{−x σ}/Z. */
export function twoLevelRenyi2(x: number): number {
  return Math.max(0, Math.LN2 + 2 * lnCosh(x) - lnCosh(2 * x));
}

/** Estimated S₂(β) of H0's thermal state on N sites with μ₂ = Σ w² (see file header). */
export function renyi2Estimate(beta: number, sites: number, secondMoment: number): number {
  if (sites === 0) return 0;
  const h = Math.sqrt(secondMoment / sites);
  return sites * twoLevelRenyi2(beta * h);
}

/**
 * ‖O‖_HS-based scale of one series: √(Σ w² linear) + 2Σ|w| quadratic. With `diagonalExact`
 * (the thermal state and the measured operators are all diagonal in the basis: H0 has no
 * flip terms and either every time is 0 or H1 has none either), diagonal strings are estimated
 * exactly by random phases (|r_s|² = 2^{−N}) and are left out.
 */
export function seriesScale(series: ObservableLayout['series'][number], primitives: ObservableLayout['primitives'], diagonalExact = false): number {
  const counts = (p: number) => !diagonalExact || primitives[p].x !== 0;
  let s2 = 0;
  for (const [p, w] of series.linear) if (counts(p)) s2 += w * w;
  let q = 0;
  for (const [a, b, w] of series.quadratic) if (counts(a) || counts(b)) q += 2 * Math.abs(w);
  return Math.sqrt(s2) + q;
}

/** Estimated one-sample standard deviation of the worst series at β (see file header and {@link seriesScale}). */
export function sampleSpreadEstimate(
  layout: ObservableLayout, beta: number, sites: number, secondMoment: number, diagonalExact = false,
): number {
  let scale = 0;
  for (const s of layout.series) scale = Math.max(scale, seriesScale(s, layout.primitives, diagonalExact));
  if (sites === 0 || scale === 0) return 0;
  const x = beta * Math.sqrt(secondMoment / sites);
  const atBeta = Math.exp(-(renyi2Estimate(beta, sites, secondMoment) + lnCosh(2 * x)) / 2);
  // Floor: the infinite-temperature value, so a degenerate ground state (ignored by the model,
  // where the scatter stays finite as T → 0) never plans fewer samples than β = 0 would.
  return scale * Math.max(atBeta, 2 ** (-sites / 2));
}
