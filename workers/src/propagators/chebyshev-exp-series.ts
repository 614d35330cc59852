/**
 * chebyshevExpSeries — truncated Chebyshev expansions of the two exponentials the propagators
 * need, on x ∈ [−1, 1], with a bound on the sup-norm truncation error.
 *
 *   real time:       e^{−iτx} = Σ_k c_k T_k(x),  c_0 = J_0(τ),  c_k = 2·(−i)^k·J_k(τ)
 *   imaginary time:  e^{−τ(x+1)} = Σ_k c_k T_k(x),  c_0 = e^{−τ}I_0(τ),  c_k = 2·(−1)^k·e^{−τ}I_k(τ)
 *
 * Sources: the Jacobi–Anger expansion e^{iz cos θ} = J_0(z) + 2Σ i^k J_k(z) cos kθ
 * (Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 9.1.44–45) and
 * e^{z cos θ} = I_0(z) + 2Σ I_k(z) cos kθ (A&S 9.6.34), with x = cos θ, T_k(cos θ) = cos kθ and
 * T_k(−x) = (−1)^k T_k(x). The imaginary-time series is shifted by +1 so that it approximates a
 * function with values in [e^{−2τ}, 1] and Σ|c_k| = 1 exactly (A&S 9.6.37): no overflow, benign
 * rounding. Chebyshev propagation itself: Tal-Ezer & Kosloff, J. Chem. Phys. 81, 3967 (1984).
 *
 * Truncation bound: since |T_k(x)| ≤ 1 on [−1, 1], sup|f − Σ_{k≤K} c_k T_k| ≤ Σ_{k>K} |c_k|.
 * The tail is evaluated as Σ_{K<k≤Kmax} |c_k| (computed values) + a rigorous remainder beyond
 * Kmax from
 *   |J_k(τ)| ≤ (τ/2)^k / k!                                 (A&S 9.1.62)
 *   e^{−τ}I_k(τ) ≤ (τ/2)^k / k! · e^{τ²/(4(k+1)) − τ}       (from the series A&S 9.6.10 with
 *                                                           (m+k)! ≥ k!·(k+1)^m)
 * both summed as geometric series with ratio (τ/2)/(K+2) < 1. Kmax is the first index whose
 * remainder is below REMAINDER_FRACTION·tolerance. The bound covers truncation only; rounding
 * in the recurrence (≈ order·ulp·Σ|c_k|) is not included.
 *
 * Cost: O(Kmax) (Kmax ≈ eτ/2 + a few tens). Results are memoised (MEMO_SIZE entries): an even
 * time grid asks for the same τ at every step.
 */
import { besselJSequence } from './bessel-j-sequence.js';
import { scaledBesselISequence } from './scaled-bessel-i-sequence.js';

/** Which exponential: e^{−iτx} ('real') or e^{−τ(x+1)} ('imaginary'). */
export type ExpSeriesKind = 'real' | 'imaginary';

/** A truncated Chebyshev series on [−1, 1]. Shared (memoised): do not mutate. */
export interface ChebyshevSeries {
  readonly kind: ExpSeriesKind;
  /** Scaled half-width τ ≥ 0. */
  readonly tau: number;
  /** Highest degree kept, K (K + 1 coefficients). */
  readonly order: number;
  /** c_0..c_K complex interleaved (re, im), length 2·(K + 1). Imaginary parts are 0 for 'imaginary'. */
  readonly coefficients: Float64Array;
  /** Bound on sup_{x∈[−1,1]} |f(x) − Σ_{k≤K} c_k T_k(x)| (truncation only). */
  readonly tailBound: number;
}

/** The rigorous remainder beyond Kmax is pushed below this fraction of the tolerance. */
const REMAINDER_FRACTION = 1e-3;
/** Memoised series (most recent last). */
const MEMO_SIZE = 16;
const memo = new Map<string, ChebyshevSeries>();

/**
 * Rigorous bound on Σ_{k>K} |c_k| from the closed-form majorants (see file header), or
 * +Infinity when the geometric ratio (τ/2)/(K+2) is not yet below 1.
 */
export function seriesRemainderBound(kind: ExpSeriesKind, tau: number, order: number): number {
  const h = tau / 2;
  const r = h / (order + 2);
  if (r >= 1) return Infinity;
  if (tau === 0) return 0;
  let lnFact = 0;
  for (let j = 2; j <= order + 1; j++) lnFact += Math.log(j);
  let lnTerm = (order + 1) * Math.log(h) - lnFact;
  if (kind === 'imaginary') lnTerm += (tau * tau) / (4 * (order + 2)) - tau;
  return (2 * Math.exp(lnTerm)) / (1 - r);
}

/**
 * The truncated Chebyshev series of e^{−iτx} or e^{−τ(x+1)} with the smallest order whose
 * tail bound is ≤ tolerance.
 *
 * @param kind - 'real' or 'imaginary' (see file header).
 * @param tau - scaled half-width τ, finite and ≥ 0.
 * @param tolerance - bound asked of the sup-norm truncation error, > 0.
 * @throws RangeError on a negative or non-finite τ, or a tolerance that is not positive.
 */
export function chebyshevExpSeries(kind: ExpSeriesKind, tau: number, tolerance: number): ChebyshevSeries {
  if (!Number.isFinite(tau) || tau < 0) throw new RangeError(`tau must be a finite number ≥ 0; got ${tau}`);
  if (!(tolerance > 0) || !Number.isFinite(tolerance)) throw new RangeError(`tolerance must be a positive finite number; got ${tolerance}`);
  const key = `${kind}|${tau}|${tolerance}`;
  const hit = memo.get(key);
  if (hit !== undefined) {
    memo.delete(key);
    memo.set(key, hit);
    return hit;
  }
  const series = buildSeries(kind, tau, tolerance);
  memo.set(key, series);
  if (memo.size > MEMO_SIZE) memo.delete(memo.keys().next().value as string);
  return series;
}

function buildSeries(kind: ExpSeriesKind, tau: number, tolerance: number): ChebyshevSeries {
  // Kmax: first order whose rigorous remainder is far below the tolerance.
  let kMax = Math.ceil(tau / 2);
  let remainder = seriesRemainderBound(kind, tau, kMax);
  const target = REMAINDER_FRACTION * tolerance;
  while (remainder > target && remainder > 0) {
    kMax += 1;
    remainder = seriesRemainderBound(kind, tau, kMax);
  }
  const values = kind === 'real' ? besselJSequence(tau, kMax) : scaledBesselISequence(tau, kMax);
  // Smallest K with Σ_{K<k≤Kmax} |c_k| + remainder ≤ tolerance (scan down from Kmax).
  let tail = remainder;
  let order = kMax;
  while (order > 0) {
    const next = tail + 2 * Math.abs(values[order]);
    if (next > tolerance) break;
    tail = next;
    order -= 1;
  }
  const coefficients = new Float64Array(2 * (order + 1));
  for (let k = 0; k <= order; k++) {
    const m = (k === 0 ? 1 : 2) * values[k];
    if (kind === 'imaginary') {
      coefficients[2 * k] = (k & 1) === 0 ? m : -m;
    } else {
      // (−i)^k: 1, −i, −1, i.
      switch (k & 3) {
        case 0: coefficients[2 * k] = m; break;
        case 1: coefficients[2 * k + 1] = -m; break;
        case 2: coefficients[2 * k] = -m; break;
        default: coefficients[2 * k + 1] = m; break;
      }
    }
  }
  return { kind, tau, order, coefficients, tailBound: tail };
}
