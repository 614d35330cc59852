/**
 * errorBudget — how the exact engine splits spec.tolerance between its propagators.
 *
 * Observable error from a state error: if the doubled state has relative 2-norm error δ
 * (‖ψ − ψ*‖ ≤ δ‖ψ*‖), the normalised pure states are at angle θ with sin θ ≤ δ, their
 * projectors differ by 2 sin θ in trace norm (Nielsen & Chuang, Quantum Computation and
 * Quantum Information (2000), §9.2.1), so |Δ⟨O⟩| ≤ 2δ·‖O − c‖ for any real c; for a Pauli
 * string |Δ⟨P⟩| ≤ 2δ. A series c + Σw⟨P⟩ + Σw⟨A⟩⟨B⟩ then errs by at most 2δ·W with
 * W = Σ|w_linear| + 2Σ|w_quadratic| (first order; evaluateSeries adds the δ² terms).
 *
 * Budget: δ_total = tolerance / (4·max(W, 1)) (so series errors ≤ tolerance/2, leaving half for
 * rounding and second-order terms), split evenly: δ_imag = δ_real = δ_total/2.
 * - Imaginary time: δ_imag ≤ κ·Σ(call bounds), κ = 2^{N/2} (propagateImaginaryTime header), so
 *   a call advancing β/2 by Δ gets tolerance (δ_imag/κ)·Δ/(β_max/2).
 * - Real time: errors of unitary steps add, so each of the n Chebyshev calls of one quench gets
 *   δ_real/n.
 * - Thermodynamics: the thermal state's δ is further lowered (imaginaryTarget) so that the
 *   truncation part of every ThermoRecord error (thermo-at-beta.ts) stays ≤ tolerance/2:
 *   2δ (ln Z), 2aδ (E), 5β²a²δ (C), (2 + 2βa)δ (S), 2δ/β (F), a = Σ|w| of H0. Imaginary time
 *   costs only logarithmically more for this. The rounding allowance is added on top and can
 *   exceed the tolerance for C at large β·a; the reported errors then say so.
 */
import type { ObservableLayout } from '../../observables/expand-observables.js';

/** Per-propagator tolerances derived from spec.tolerance. */
export interface ErrorBudget {
  /** Largest series weight sum W (≥ 1). */
  readonly weight: number;
  /** δ_total: state error allowed (relative 2-norm). */
  readonly stateError: number;
  /** Part of it for imaginary time (before the factor κ). */
  readonly imaginary: number;
  /** Part of it for all real-time calls of one quench. */
  readonly real: number;
  /** κ = 2^{N/2}: conditioning of imaginary-time evolution started at |I⟩. */
  readonly kappa: number;
}

/** The budget for a layout, a tolerance and N sites (see file header). */
export function errorBudget(layout: ObservableLayout, tolerance: number, sites: number): ErrorBudget {
  let weight = 1;
  for (const s of layout.series) {
    let w = 0;
    for (const [, c] of s.linear) w += Math.abs(c);
    for (const [, , c] of s.quadratic) w += 2 * Math.abs(c);
    weight = Math.max(weight, w);
  }
  const stateError = tolerance / (4 * weight);
  return { weight, stateError, imaginary: stateError / 2, real: stateError / 2, kappa: 2 ** (sites / 2) };
}

/** State error δ at β that keeps every thermodynamic error ≤ tolerance/2 (see file header). */
export function thermoStateError(tolerance: number, beta: number, a: number): number {
  const half = tolerance / 2;
  let d = half / 2;
  d = Math.min(d, half / (2 * a));
  d = Math.min(d, half / (5 * beta * beta * a * a));
  d = Math.min(d, half / (2 + 2 * beta * a));
  if (beta > 0) d = Math.min(d, (half * beta) / 2);
  return d;
}

/** Thermal-state error target of a branch (before κ): the series budget, lowered for thermodynamics. */
export function imaginaryTarget(budget: ErrorBudget, tolerance: number, a: number, betas: readonly number[]): number {
  let d = budget.imaginary;
  for (const beta of betas) d = Math.min(d, thermoStateError(tolerance, beta, a));
  return d;
}

/** Number of Chebyshev calls of a quench over an ascending grid starting from t = 0. */
export function quenchCalls(times: readonly number[]): number {
  let calls = 0;
  let prev = 0;
  for (const t of times) {
    if (t > prev) calls += 1;
    prev = t;
  }
  return Math.max(calls, 1);
}

/**
 * Rounding allowance per operator application, relative to ‖ψ‖ (an estimate, not a bound:
 * a few ulps per Chebyshev term; the propagators' bounds cover truncation only).
 */
export const ROUNDING_PER_MATVEC = 4 * Number.EPSILON;
