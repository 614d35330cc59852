/**
 * besselJSequence — J_0(x), J_1(x), …, J_kMax(x) for real x ≥ 0.
 *
 * Method: Miller's backward recurrence (Abramowitz & Stegun, Handbook of Mathematical
 * Functions (1964), 9.12 and the recurrence 9.1.27: J_{k−1}(x) = (2k/x)·J_k(x) − J_{k+1}(x)),
 * started from (f_{M+1}, f_M) = (0, 1) at an even index M well above max(kMax, x), then
 * normalised with the identity 1 = J_0(x) + 2·Σ_{k≥1} J_{2k}(x) (A&S 9.1.46). The backward
 * direction is stable for the minimal solution J_k, so every value comes out to a few ulps
 * relative to max|J| (and to good relative accuracy in the decaying tail k > x).
 *
 * Start index: M = max(kMax, x) + START_MARGIN + √(START_SQRT_FACTOR·max(kMax, x)), rounded up
 * to even (the usual heuristic for Miller's method; the tail beyond M is then far below one ulp).
 * Overflow: running values are rescaled by RESCALE whenever they exceed RESCALE_LIMIT
 * (everything already stored is rescaled too; values far below are flushed to 0, correctly).
 *
 * Cost: O(M) flops plus O(M) per rescale; allocates one Float64Array of length M + 2.
 */

/** Extra recurrence steps above max(kMax, x). */
const START_MARGIN = 30;
/** √(START_SQRT_FACTOR·n) more steps, covering the transition zone of width ~n^{1/3}. */
const START_SQRT_FACTOR = 40;
/** Rescale when a running value exceeds this. */
const RESCALE_LIMIT = 1e250;
/** Factor applied on rescaling. */
const RESCALE = 1e-250;

/** Start index of the backward recurrence for x and kMax (even). Exposed for the scaled-I twin. */
export function millerStartIndex(x: number, kMax: number): number {
  const n = Math.max(kMax, Math.ceil(x));
  const m = n + START_MARGIN + Math.ceil(Math.sqrt(START_SQRT_FACTOR * n));
  return m + (m & 1);
}

/**
 * Bessel functions of the first kind J_k(x), k = 0..kMax, by Miller's backward recurrence.
 *
 * @param x - argument, finite and ≥ 0.
 * @param kMax - highest order, integer ≥ 0.
 * @returns a new Float64Array of length kMax + 1 with J_k(x) at index k.
 * @throws RangeError if x is negative or not finite, or kMax is not a non-negative integer.
 */
export function besselJSequence(x: number, kMax: number): Float64Array {
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`x must be a finite number ≥ 0; got ${x}`);
  if (!Number.isInteger(kMax) || kMax < 0) throw new RangeError(`kMax must be a non-negative integer; got ${kMax}`);
  const out = new Float64Array(kMax + 1);
  if (x === 0) { out[0] = 1; return out; }
  const m = millerStartIndex(x, kMax);
  const f = new Float64Array(m + 2);
  f[m] = 1;
  for (let k = m; k >= 1; k--) {
    const v = (2 * k / x) * f[k] - f[k + 1];
    f[k - 1] = v;
    if (Math.abs(v) > RESCALE_LIMIT) {
      for (let j = k - 1; j <= m; j++) f[j] *= RESCALE;
    }
  }
  let norm = f[0];
  for (let k = 2; k <= m; k += 2) norm += 2 * f[k];
  const inv = 1 / norm;
  for (let k = 0; k <= kMax; k++) out[k] = f[k] * inv;
  return out;
}
