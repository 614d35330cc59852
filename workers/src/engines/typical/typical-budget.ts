/**
 * typicalBudget — how the typical engine sets its propagator tolerances, and how a
 * propagator's bound becomes an error on the pooled estimators.
 *
 * The statistical error (the jackknife's, ~10^−2…10^−4 in practice) dominates, so the
 * truncation is simply made negligible: the state error allowed is TRUNCATION_SHARE of what
 * the exact engine would allow for the same tolerance (its error-budget.ts derivation):
 *   δ_total = share · tolerance / (4·max(W, 1)),  W = largest Σ|w| of a series (quadratic ×2),
 * split evenly between imaginary and real time. Chebyshev costs grow only logarithmically in
 * 1/δ, so the share costs a few matrix applications per step.
 *
 * Imaginary time and κ. propagateImaginaryTime bounds the relative error of one vector by
 * κ·Σε_j with κ = ‖r‖/‖e^{−Δ(H0−E0)}r‖. For one random-phase vector κ² = 1/Σ_n e^{−2Δ(E_n−E0)}|⟨n|r⟩|²
 * is random (its mean over phases is ≤ 2^N / g, g the ground degeneracy); the estimators pool
 * the samples, Σ_r⟨ψ_r|O|ψ_r⟩ / Σ_r⟨ψ_r|ψ_r⟩, and by Cauchy–Schwarz the pooled relative error
 * is ≤ ε·√(R·e^{−2Δ(E0−lo)} / Σ_r‖ψ_r‖²) — whose typical value is the exact engine's
 * κ = 2^{N/2} (for the exact trace Σ_r → R·Tr/2^N). We therefore use κ = 2^{N/2} as an
 * ESTIMATE (not a bound: a sample set whose ground-state overlaps are far below 1/2^N would
 * exceed it — a rare event that also spoils the jackknife). It multiplies a tolerance share
 * that is already small: a κ ten times larger would still keep the series truncation below
 * tolerance/10.
 *
 * Rounding: ROUNDING_PER_MATVEC relative error per operator application (an estimate, as in
 * the exact engine).
 */
import type { ObservableLayout } from '../../observables/expand-observables.js';

/** Fraction of the exact engine's state-error budget the typical engine allows its propagators. */
export const TRUNCATION_SHARE = 0.01;

/** Rounding allowance per operator application, relative to ‖ψ‖ (a few ulps; an estimate). */
export const ROUNDING_PER_MATVEC = 4 * Number.EPSILON;

/** Propagator tolerances of the typical engine. */
export interface TypicalBudget {
  /** Largest series weight sum W (≥ 1). */
  readonly weight: number;
  /** Relative state error allowed in imaginary time (after dividing by κ: the propagator's tolerance). */
  readonly imaginaryTolerance: number;
  /** Relative state error allowed for all real-time calls of one quench together. */
  readonly realTolerance: number;
  /** κ estimate 2^{N/2} (see file header). */
  readonly kappa: number;
}

/** Largest Σ|w| (quadratic terms counted twice) over the series of a layout, at least 1. */
export function seriesWeight(layout: ObservableLayout): number {
  let weight = 1;
  for (const s of layout.series) {
    let w = 0;
    for (const [, c] of s.linear) w += Math.abs(c);
    for (const [, , c] of s.quadratic) w += 2 * Math.abs(c);
    weight = Math.max(weight, w);
  }
  return weight;
}

/**
 * The budget for a layout at `tolerance` on N sites, with the thermal state's target lowered
 * so the truncation part of every thermodynamic error stays ≤ share·tolerance/2 (formulas of
 * thermoTruncation: 2aδ for E, 5β²a²δ for C, (2 + 2βa)δ for S, 2δ/β for F).
 */
export function typicalBudget(
  layout: ObservableLayout, tolerance: number, sites: number, h0NormBound: number, betas: readonly number[],
): TypicalBudget {
  const weight = seriesWeight(layout);
  const share = TRUNCATION_SHARE * tolerance;
  const total = share / (4 * weight);
  let imaginary = total / 2;
  const a = h0NormBound;
  const half = share / 2;
  for (const beta of betas) {
    imaginary = Math.min(imaginary, half / 2);
    if (a > 0) imaginary = Math.min(imaginary, half / (2 * a));
    if (beta > 0) {
      if (a > 0) imaginary = Math.min(imaginary, half / (5 * beta * beta * a * a));
      imaginary = Math.min(imaginary, half / (2 + 2 * beta * a), (half * beta) / 2);
    }
  }
  const kappa = 2 ** (sites / 2);
  return { weight, imaginaryTolerance: imaginary / kappa, realTolerance: total / 2, kappa };
}

/** Truncation parts of the thermodynamic errors for a thermal-state error δ (thermo-at-beta.ts of the exact engine). */
export function thermoTruncation(delta: number, beta: number, a: number): {
  lnZ: number; energy: number; heatCapacity: number; freeEnergy: number | null; entropy: number;
} {
  const lnZ = delta < 1 ? -2 * Math.log1p(-delta) : Number.MAX_VALUE;
  const energy = 2 * a * delta;
  return {
    lnZ,
    energy,
    heatCapacity: beta * beta * 5 * a * a * delta,
    freeEnergy: beta === 0 ? null : lnZ / beta,
    entropy: lnZ + beta * energy,
  };
}
