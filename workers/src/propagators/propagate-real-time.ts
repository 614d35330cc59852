/**
 * propagateRealTime — ψ ← e^{−i·t·Op}·ψ in place, by Chebyshev expansion with a truncation bound.
 *
 * Formula: with centre c = (lo+hi)/2 and half-width a = (hi−lo)/2 of an interval containing
 * the spectrum, e^{−itOp} = e^{−itc}·e^{−iτX}, X = (Op − c)/a, τ = t·a, and e^{−iτX} is summed
 * as Σ_{k≤K} c_k T_k(X) (chebyshevExpSeries 'real'; Tal-Ezer & Kosloff, J. Chem. Phys. 81,
 * 3967 (1984)). Spans with τ > maxStepTau are split into equal sub-steps (keeps the Bessel
 * recurrence short; the cost per unit τ is nearly independent of the split once τ ≫ 1).
 *
 * Error bound: each sub-step j is a polynomial P_j with ‖P_j − U_j‖ ≤ ε_j (its tail bound) for
 * the exact unitary U_j, so ‖P_n⋯P_1 − U_n⋯U_1‖ ≤ Π(1 + ε_j) − 1 = `errorBound`, i.e.
 * ‖ψ_out − e^{−itOp}ψ_in‖ ≤ errorBound·‖ψ_in‖. ε_j = tolerance / n. Rounding is not included.
 * Negative t runs −Op forward.
 *
 * Memory: ψ + the 2 work vectors (ψ is the accumulator). Cost: Σ K_j Op applications.
 */
import { chebyshevExpSeries } from './chebyshev-exp-series.js';
import { chebyshevSum, scaleComplexInPlace } from './chebyshev-sum.js';
import { checkPropagationArgs } from './check-propagation-args.js';
import type { AffineApply, PropagationReport, SpectralInterval } from './types.js';

/** Default largest scaled half-width τ = |t|·a of one sub-step. */
export const MAX_REAL_TIME_TAU = 250;

/** Options of {@link propagateRealTime}. */
export interface RealTimeOptions {
  /** Bound asked of the relative truncation error of the whole span (> 0). */
  tolerance: number;
  /** Largest τ per sub-step. @defaultValue MAX_REAL_TIME_TAU */
  maxStepTau?: number;
}

/**
 * In place ψ ← e^{−i·time·Op}ψ. `work` holds 2 scratch vectors of ψ's length.
 * @returns order (max K), errorBound (relative 2-norm, truncation only), matvecs, steps.
 * @throws RangeError/TypeError on a bad interval, time, buffer or tolerance.
 */
export function propagateRealTime(
  apply: AffineApply,
  interval: SpectralInterval,
  time: number,
  psi: Float64Array,
  work: readonly Float64Array[],
  options: RealTimeOptions,
): PropagationReport {
  const { tolerance, maxStepTau = MAX_REAL_TIME_TAU } = options;
  checkPropagationArgs(interval, time, 'time', psi, work, tolerance);
  if (!(maxStepTau > 0)) throw new RangeError(`maxStepTau must be positive; got ${maxStepTau}`);
  if (time < 0) {
    const flipped: AffineApply = (i, o, al, be, ga) => apply(i, o, -al, be, ga);
    return propagateRealTime(flipped, { lo: -interval.hi, hi: -interval.lo }, -time, psi, work, options);
  }
  const centre = (interval.lo + interval.hi) / 2;
  const halfWidth = (interval.hi - interval.lo) / 2;
  const report: PropagationReport = { order: 0, errorBound: 0, matvecs: 0, steps: 0 };
  if (time === 0) return report;
  if (halfWidth > 0) {
    const tauTotal = time * halfWidth;
    const steps = Math.max(1, Math.ceil(tauTotal / maxStepTau));
    const series = chebyshevExpSeries('real', tauTotal / steps, tolerance / steps);
    let growth = 1;
    for (let j = 0; j < steps; j++) {
      report.matvecs += chebyshevSum(apply, centre, halfWidth, series.coefficients, psi, work[0], work[1]);
      growth *= 1 + series.tailBound;
    }
    report.order = series.order;
    report.steps = steps;
    report.errorBound = growth - 1;
  } else {
    report.steps = 1;
  }
  // The centre's phase e^{−i·t·c}.
  scaleComplexInPlace(psi, Math.cos(time * centre), -Math.sin(time * centre));
  return report;
}
