/**
 * propagateImaginaryTime — ψ ← e^{−Δ·Op}ψ / ‖e^{−Δ·Op}ψ‖ in place, returning ln of the norm growth.
 *
 * Formula: with [lo, hi] ⊇ spectrum, c = (lo+hi)/2, a = (hi−lo)/2, X = (Op − c)/a,
 *   e^{−Δ·Op} = e^{−Δ·lo} · e^{−Δ(Op − lo)} = e^{−Δ·lo} · e^{−τ(X + 1)},  τ = Δ·a,
 * and e^{−τ(X+1)} (spectrum in [e^{−2τ}, 1]) is summed as a Chebyshev series with coefficients
 * 2(−1)^k e^{−τ}I_k(τ) (chebyshevExpSeries 'imaginary'). Δ is split into n equal sub-steps with
 * τ_j ≤ maxStepTau; after each sub-step ψ is renormalised and ln‖ψ‖ − Δ_j·lo is accumulated.
 *
 * Error bound (derived here; truncation only). Let E_j = e^{−Δ_j(Op−lo)} and P_j its polynomial,
 * ‖P_j − E_j‖ ≤ ε_j. The error of the product obeys e_n = Σ_j (Π_{i>j} E_i)(P_j − E_j)φ_{j−1},
 * and with E0 = min spectrum, ‖Π_{i>j} E_i‖·‖Π_{i<j} E_i ψ‖ ≤ e^{−(Δ−Δ_j)(E0−lo)}‖ψ‖, while
 * ‖Π E_i ψ‖ = e^{−Δ(E0−lo)}·‖e^{−Δ(Op−E0)}ψ‖. Hence, to first order in the ε_j,
 *   ‖ψ_out − ψ_exact‖ / ‖ψ_exact‖ ≤ κ · Σ_j ε_j·e^{Δ_j(E0−lo)} ≤ κ · Σ_j ε_j·e^{2τ_j} = κ · errorBound,
 *   κ = ‖ψ_in‖ / ‖e^{−Δ(Op−E0)}ψ_in‖ ≥ 1   (the step's own conditioning on ψ_in).
 * Chained calls compose: the sums add and κ is that of the whole chain. For the thermofield
 * double started at |I⟩ (Op = H ⊗ 1), κ² = 2^N / Σ_n e^{−2Δ(E_n−E0)} ≤ 2^N, i.e. κ ≤ 2^{N/2}.
 * With an upper bound g ≥ E0 on the lowest eigenvalue (options.groundBound, e.g. a Rayleigh
 * quotient or a Lanczos Ritz value; default hi), the factor e^{Δ_j(E0−lo)} is bounded by
 * A_j = e^{Δ_j(g−lo)} instead of e^{2τ_j} (the case g = hi), and errorBound = Σ_j ε_j·A_j.
 * The requested tolerance is split as ε_j = tolerance/(n·A_j), so errorBound ≤ tolerance.
 * Sub-steps keep Δ_j(g − lo) ≤ 2·maxStepTau: that caps A_j, which also multiplies the (unbounded
 * here) rounding error. With g = hi this is τ_j ≤ maxStepTau; when lo lies just below E0 (a
 * tight interval, g − lo ≪ 2a) one long step of order ≈ √(2τ·ln(1/ε)) replaces many short ones.
 *
 * Memory: ψ + the 2 work vectors. Cost: Σ K_j Op applications + one norm per sub-step.
 */
import { chebyshevExpSeries } from './chebyshev-exp-series.js';
import { chebyshevSum } from './chebyshev-sum.js';
import { checkPropagationArgs } from './check-propagation-args.js';
import type { AffineApply, ImaginaryPropagationReport, SpectralInterval } from './types.js';

/** Default largest scaled half-width τ = Δ_j·a of one sub-step (e^{2τ} ≈ 55). */
export const MAX_IMAGINARY_TIME_TAU = 2;

/** Options of {@link propagateImaginaryTime}. */
export interface ImaginaryTimeOptions {
  /** Bound asked of errorBound = Σ_j ε_j e^{2τ_j} (> 0); see the file header for its meaning. */
  tolerance: number;
  /** Largest τ per sub-step, as Δ_j·(groundBound − lo)/2. @defaultValue MAX_IMAGINARY_TIME_TAU */
  maxStepTau?: number;
  /** An upper bound on Op's lowest eigenvalue, in [lo, hi] (see the file header). @defaultValue interval.hi */
  groundBound?: number;
}

/**
 * In place ψ ← e^{−Δ·Op}ψ, returned normalised to 1. `work` holds 2 scratch vectors.
 * @returns lnNormGrowth = ln(‖e^{−Δ·Op}ψ_in‖/‖ψ_in‖), order, errorBound (see file header),
 *   matvecs, steps.
 * @throws RangeError/TypeError on a bad interval, a negative Δ, a zero ψ, a bad buffer or tolerance.
 */
export function propagateImaginaryTime(
  apply: AffineApply,
  interval: SpectralInterval,
  delta: number,
  psi: Float64Array,
  work: readonly Float64Array[],
  options: ImaginaryTimeOptions,
): ImaginaryPropagationReport {
  const { tolerance, maxStepTau = MAX_IMAGINARY_TIME_TAU, groundBound = interval.hi } = options;
  checkPropagationArgs(interval, delta, 'delta', psi, work, tolerance);
  if (delta < 0) throw new RangeError(`delta must be ≥ 0; got ${delta}`);
  if (!(maxStepTau > 0)) throw new RangeError(`maxStepTau must be positive; got ${maxStepTau}`);
  if (!(groundBound >= interval.lo && groundBound <= interval.hi)) {
    throw new RangeError(`groundBound must lie in the interval [${interval.lo}, ${interval.hi}]; got ${groundBound}`);
  }
  const report: ImaginaryPropagationReport = { order: 0, errorBound: 0, matvecs: 0, steps: 0, lnNormGrowth: 0 };
  const norm0 = normalise(psi);
  if (norm0 === 0) throw new RangeError('psi must not be the zero vector');
  if (delta === 0) return report;
  const { lo, hi } = interval;
  const centre = (lo + hi) / 2;
  const halfWidth = (hi - lo) / 2;
  if (halfWidth === 0) {
    report.lnNormGrowth = -delta * centre;
    report.steps = 1;
    return report;
  }
  const tauTotal = delta * halfWidth;
  // g = hi keeps the plain form (τ_j ≤ maxStepTau, A_j = e^{2τ_j}) bit for bit.
  const plain = groundBound === hi;
  const steps = Math.max(1, Math.ceil(plain ? tauTotal / maxStepTau : (delta * (groundBound - lo)) / (2 * maxStepTau)));
  const tau = tauTotal / steps;
  const amplification = Math.exp(plain ? 2 * tau : (delta / steps) * (groundBound - lo));
  const series = chebyshevExpSeries('imaginary', tau, tolerance / (steps * amplification));
  const stepDelta = delta / steps;
  for (let j = 0; j < steps; j++) {
    report.matvecs += chebyshevSum(apply, centre, halfWidth, series.coefficients, psi, work[0], work[1]);
    const norm = normalise(psi);
    if (norm === 0) throw new RangeError('imaginary-time step produced the zero vector (interval does not contain the spectrum?)');
    report.lnNormGrowth += Math.log(norm) - stepDelta * lo;
  }
  report.order = series.order;
  report.steps = steps;
  report.errorBound = steps * series.tailBound * amplification;
  return report;
}

/** ψ ← ψ/‖ψ‖; returns the old norm (0 leaves ψ untouched). */
function normalise(psi: Float64Array): number {
  let s0 = 0, s1 = 0;
  const n = psi.length;
  let k = 0;
  for (; k + 1 < n; k += 2) { s0 += psi[k] * psi[k]; s1 += psi[k + 1] * psi[k + 1]; }
  const norm = Math.sqrt(s0 + s1);
  if (norm > 0 && norm !== 1) {
    const inv = 1 / norm;
    for (let j = 0; j < n; j++) psi[j] *= inv;
  }
  return norm;
}
