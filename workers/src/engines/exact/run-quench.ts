/**
 * runQuench — real-time evolution of the doubled state under K = H1 ⊗ 1 + 1 ⊗ B (B = −H1ᵀ)
 * over an ascending time grid, measuring every primitive Pauli string at each grid time.
 *
 * Steps: from t = 0 to times[0], then between consecutive grid times, each span by
 * propagateRealTime (Chebyshev, split internally into τ ≤ MAX_REAL_TIME_TAU sub-steps) with
 * tolerance `stepTolerance`. Measurements at each time:
 *   ⟨P⟩ = Re⟨ψ|P ⊗ 1|ψ⟩/⟨ψ|ψ⟩ (pauliExpectation; the largest |Im| is reported as maxImag),
 *   ⟨H1⟩ = ⟨ψ|H1 ⊗ 1|ψ⟩/⟨ψ|ψ⟩ (one extra operator application, for the drift check).
 * Error of every primitive: 2δ(t) (error-budget.ts), δ(t) = δ₀ + (1 + δ₀)·(Σ call bounds +
 * rounding allowance) — unitary steps do not amplify earlier errors. Series through evaluateSeries.
 *
 * Memory: the state + 2 work vectors. The abort signal is checked, and the event loop is given
 * a turn, before every grid time.
 */
import { applyDoubledAffine, dotc, norm2sq, pauliExpectation } from '../../kernels/index.js';
import { evaluateSeries } from '../../observables/expand-observables.js';
import type { ObservableLayout } from '../../observables/expand-observables.js';
import { propagateRealTime } from '../../propagators/index.js';
import type { AffineApply } from '../../propagators/index.js';
import { abortError } from '../abort-error.js';
import type { DoubledOperators } from './doubled-operators.js';
import { ROUNDING_PER_MATVEC } from './error-budget.js';

/** Inputs of {@link runQuench}. */
export interface QuenchInput {
  readonly ops: DoubledOperators;
  readonly layout: ObservableLayout;
  /** Ascending grid times (≥ 0). */
  readonly times: readonly number[];
  /** The thermal doubled state, normalised; evolved in place. */
  readonly state: Float64Array;
  /** Two scratch vectors of the state's length. */
  readonly work: readonly [Float64Array, Float64Array];
  /** Tolerance of each propagateRealTime call. */
  readonly stepTolerance: number;
  /** Relative error bound δ₀ of the thermal state. */
  readonly initialError: number;
  /**
   * The caller guarantees Kψ = 0 exactly (β = 0 with the transposed auxiliary generator:
   * K|I⟩ ↔ H1 − H1 = 0): the state is not propagated, only measured. @defaultValue false
   */
  readonly stationary?: boolean;
  readonly signal?: AbortSignal;
  /** Receives each grid time's series values and errors (buffers reused: copy them). */
  onPoint(timeIndex: number, values: Float64Array, errors: Float64Array): void;
}

/** What a quench did and how healthy it was. */
export interface QuenchReport {
  matvecs: number;
  orderMax: number;
  /** Relative state error bound at the last time (δ(t_last)). */
  errorBound: number;
  /** max_t |‖ψ(t)‖ − 1|. */
  normDrift: number;
  /** max_t |⟨H1⟩(t) − ⟨H1⟩(0)| (⟨H1⟩(0) on the thermal state). */
  h1Drift: number;
  /** Largest |Im⟨P⟩| seen (should be rounding). */
  maxImag: number;
}

/** Runs the quench (see file header). Rejects with an AbortError when the signal fires. */
export async function runQuench(input: QuenchInput): Promise<QuenchReport> {
  const { ops, layout, times, state, work, stepTolerance, initialError, signal, stationary = false } = input;
  const apply: AffineApply = (i, o, al, be, ga) => applyDoubledAffine(ops.h1, ops.aux, i, o, al, be, ga);
  const np = layout.primitives.length;
  const ns = layout.series.length;
  const primValues = new Float64Array(np);
  const primErrors = new Float64Array(np);
  const values = new Float64Array(ns);
  const errors = new Float64Array(ns);
  const pair = new Float64Array(2);
  const dim = ops.dim;
  const report: QuenchReport = { matvecs: 0, orderMax: 0, errorBound: initialError, normDrift: 0, h1Drift: 0, maxImag: 0 };

  const energyH1 = (n2: number): number => {
    applyDoubledAffine(ops.h1, null, state, work[0], 1, 0, 0);
    dotc(state, work[0], pair);
    return pair[0] / n2;
  };
  const h1AtZero = energyH1(norm2sq(state));
  let realBound = 0;
  let prev = 0;
  for (let ti = 0; ti < times.length; ti++) {
    await new Promise<void>((resolve) => setImmediate(resolve));
    if (signal?.aborted) throw abortError(signal);
    const dt = times[ti] - prev;
    prev = times[ti];
    if (dt > 0 && !stationary) {
      const rep = propagateRealTime(apply, ops.quenchInterval, dt, state, work, { tolerance: stepTolerance });
      report.matvecs += rep.matvecs;
      report.orderMax = Math.max(report.orderMax, rep.order);
      realBound += rep.errorBound + ROUNDING_PER_MATVEC * rep.matvecs;
    }
    const n2 = norm2sq(state);
    report.normDrift = Math.max(report.normDrift, Math.abs(Math.sqrt(n2) - 1));
    report.h1Drift = Math.max(report.h1Drift, Math.abs(energyH1(n2) - h1AtZero));
    const delta = initialError + (1 + initialError) * realBound;
    report.errorBound = delta;
    const primError = Math.min(2 * delta, 2);
    for (let p = 0; p < np; p++) {
      pauliExpectation(layout.primitives[p], state, dim, dim, pair);
      primValues[p] = pair[0] / n2;
      primErrors[p] = primError;
      report.maxImag = Math.max(report.maxImag, Math.abs(pair[1] / n2));
    }
    evaluateSeries(layout, primValues, primErrors, values, errors);
    input.onPoint(ti, values, errors);
  }
  return report;
}
