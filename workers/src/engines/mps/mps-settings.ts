/**
 * mpsSettings — the numerical settings of one mps run: the spec's optional `mps` object with
 * the missing fields derived from the tolerance, and the a-priori error estimates the plan
 * reports.
 *
 * Trotter (a-priori, heuristic): the error of a local observable after evolving for a total
 * time T (β_max/2 of imaginary time plus t_max of real time) is estimated as
 *   ε_T ≈ TROTTER_CONSTANT[p]·Λ^{p+1}·dt^p·T,
 * Λ the largest bond norm Σ|w| of H0 and H1 (bond-model.ts), p the order. Calibration: the
 * measured ratio ε/(Λ^{p+1}·dt^p·T) was 2e-4–2e-2 over the Ising, XXZ and XXZ+DM chains of the
 * tests (largest: XXZ, Δ = 1.5, order 4); the constants 0.05 leave a margin of 2.5 over it.
 * The run replaces this by a measured estimate (step doubling on the first interval).
 * Default dt: the largest dt with ε_T ≤ tolerance/2, clamped to [DT_MIN, DT_MAX]/max(Λ, 1).
 * Default truncation: tolerance²/(16·G) per update, G the expected number of two-site updates,
 * clamped to [1e−16, 1e−8]: with the run's estimate 2·√(Σ discarded weights) this keeps the
 * truncation part at ≤ tolerance/2 while the bond cap is not reached.
 * Default bond cap: DEFAULT_MAX_BOND.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { updatesFor, type TrotterOrder } from './trotter-schedule.js';

/** Default bond cap χ. */
export const DEFAULT_MAX_BOND = 128;
/** Default Trotter order. */
export const DEFAULT_ORDER: TrotterOrder = 4;
/** Bounds of the derived dt (divided by max(Λ, 1)). */
export const DT_MIN = 1e-3;
export const DT_MAX = 0.1;
/** ε_T ≈ C_p·Λ^{p+1}·dt^p·T (see the file header). */
export const TROTTER_CONSTANT: Record<TrotterOrder, number> = { 2: 0.05, 4: 0.05 };
/** Bounds of the derived per-update truncation weight. */
export const TRUNCATION_MIN = 1e-16;
export const TRUNCATION_MAX = 1e-8;

/** Resolved settings of one run. */
export interface MpsRunSettings {
  readonly maxBond: number;
  /** Relative discarded weight allowed per two-site update. */
  readonly truncation: number;
  readonly order: TrotterOrder;
  readonly dt: number;
  /** Which fields were derived rather than given. */
  readonly derived: readonly string[];
  /** A-priori Trotter estimate ε_T for the longest evolution of the sweep. */
  readonly trotterEstimate: number;
  /** Expected two-site updates of the longest branch. */
  readonly updates: number;
}

/** Inputs that depend on the built Hamiltonians. */
export interface SettingsContext {
  /** Λ: the largest bond norm of H0 and H1. */
  readonly localNorm: number;
  /** Two-site updates per application of each Trotter layer, of H0 and of H1 (bond-model.ts layerCosts). */
  readonly layerCosts: readonly (readonly number[])[];
  /** β_max/2 (imaginary) and t_max (real). */
  readonly imaginaryTime: number;
  readonly realTime: number;
  /** Number of grid intervals with a positive length (each adds at least one step). */
  readonly intervals: number;
}

/** The a-priori Trotter estimate for a total evolution time T (see the file header). */
export function trotterEstimate(order: TrotterOrder, localNorm: number, dt: number, time: number): number {
  return TROTTER_CONSTANT[order] * localNorm ** (order + 1) * dt ** order * time;
}

/** Resolves the settings (see the file header). */
export function mpsSettings(spec: SweepSpec, ctx: SettingsContext): MpsRunSettings {
  const given = spec.mps ?? {};
  const derived: string[] = [];
  const order = given.trotterOrder ?? DEFAULT_ORDER;
  if (given.trotterOrder === undefined) derived.push('trotterOrder');
  const maxBond = given.maxBond ?? DEFAULT_MAX_BOND;
  if (given.maxBond === undefined) derived.push('maxBond');
  const total = ctx.imaginaryTime + ctx.realTime;
  const lam = Math.max(ctx.localNorm, 1e-300);
  let dt = given.dt ?? 0;
  if (given.dt === undefined) {
    derived.push('dt');
    const scale = Math.max(ctx.localNorm, 1);
    const ideal = total > 0 && ctx.localNorm > 0
      ? (spec.tolerance / (2 * TROTTER_CONSTANT[order] * lam ** (order + 1) * total)) ** (1 / order)
      : DT_MAX;
    dt = Math.min(DT_MAX / scale, Math.max(DT_MIN / scale, ideal));
  }
  const steps = Math.ceil(total / dt) + ctx.intervals;
  let updates = 0;
  for (const costs of ctx.layerCosts) updates = Math.max(updates, updatesFor(order, steps, costs));
  let truncation = given.truncation ?? 0;
  if (given.truncation === undefined) {
    derived.push('truncation');
    truncation = Math.min(TRUNCATION_MAX, Math.max(TRUNCATION_MIN, spec.tolerance ** 2 / (16 * Math.max(updates, 1))));
  }
  return {
    maxBond, truncation, order, dt, derived,
    trotterEstimate: trotterEstimate(order, ctx.localNorm, dt, total),
    updates,
  };
}
