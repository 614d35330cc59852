/**
 * Truncated power-series arithmetic on coefficient arrays c[0..n] (c[k] multiplies x^k).
 *
 * Each operation also returns a `magnitude` series: the same recursion run on absolute values.
 * The rounding error of coefficient k is bounded by about ROUNDING_UNIT·(n+1)·magnitude[k]
 * (standard forward error analysis of sums of products; Higham, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed., SIAM 2002, §3.1). This is what shows when the cancellation of
 * large moments into small cumulants has eaten the digits.
 * - log:    L = ln a, a[0] = 1:  L_n = a_n − (1/n) Σ_{k=1}^{n−1} k L_k a_{n−k}
 * - divide: q = a/b, b[0] ≠ 0:   q_n = (a_n − Σ_{k=0}^{n−1} q_k b_{n−k}) / b_0
 * Cost: O(n²) flops each.
 */

/** Unit roundoff of IEEE double (2^−53). */
export const ROUNDING_UNIT = 2 ** -53;

/** A series with a magnitude series for rounding bounds. */
export interface TrackedSeries {
  readonly value: Float64Array;
  readonly magnitude: Float64Array;
}

/**
 * ln a(x) for a series with a[0] = 1 (checked to 1e−12).
 * @throws RangeError if a[0] is not 1.
 */
export function seriesLog(a: ArrayLike<number>, aMagnitude?: ArrayLike<number>): TrackedSeries {
  if (a.length === 0) return { value: new Float64Array(0), magnitude: new Float64Array(0) };
  if (Math.abs(a[0] - 1) > 1e-12) throw new RangeError(`seriesLog: a[0] must be 1; got ${a[0]}`);
  const n = a.length;
  const v = new Float64Array(n);
  const m = new Float64Array(n);
  for (let k = 1; k < n; k++) {
    let s = 0;
    let sm = 0;
    for (let j = 1; j < k; j++) {
      s += j * v[j] * a[k - j];
      sm += j * m[j] * Math.abs(a[k - j]);
    }
    v[k] = a[k] - s / k;
    m[k] = Math.abs(aMagnitude ? aMagnitude[k] : a[k]) + sm / k;
  }
  return { value: v, magnitude: m };
}

/**
 * a(x)/b(x) to the length of a.
 * @throws RangeError if b[0] = 0 or b is shorter than a.
 */
export function seriesDivide(a: ArrayLike<number>, b: ArrayLike<number>): TrackedSeries {
  const n = a.length;
  if (b.length < n) throw new RangeError(`seriesDivide: divisor has ${b.length} coefficients, needs ${n}`);
  if (n === 0) return { value: new Float64Array(0), magnitude: new Float64Array(0) };
  if (b[0] === 0) throw new RangeError('seriesDivide: divisor has b[0] = 0');
  const v = new Float64Array(n);
  const m = new Float64Array(n);
  const b0 = Math.abs(b[0]);
  for (let k = 0; k < n; k++) {
    let s = a[k];
    let sm = Math.abs(a[k]);
    for (let j = 0; j < k; j++) {
      s -= v[j] * b[k - j];
      sm += m[j] * Math.abs(b[k - j]);
    }
    v[k] = s / b[0];
    m[k] = sm / b0;
  }
  return { value: v, magnitude: m };
}

/** a(x)·b(x) truncated to `length` coefficients (default: the shorter length). */
export function seriesMultiply(a: ArrayLike<number>, b: ArrayLike<number>, length = Math.min(a.length, b.length)): Float64Array {
  const out = new Float64Array(length);
  for (let i = 0; i < Math.min(a.length, length); i++) {
    if (a[i] === 0) continue;
    for (let j = 0; j < b.length && i + j < length; j++) out[i + j] += a[i] * b[j];
  }
  return out;
}

/** Σ c[k] x^k (Horner). */
export function sumSeries(c: ArrayLike<number>, x: number): number {
  let s = 0;
  for (let k = c.length - 1; k >= 0; k--) s = s * x + c[k];
  return s;
}

/** Coefficients of d/dx Σ c[k] x^k (length n − 1, at least 0). */
export function seriesDerivative(c: ArrayLike<number>): Float64Array {
  const out = new Float64Array(Math.max(0, c.length - 1));
  for (let k = 1; k < c.length; k++) out[k - 1] = k * c[k];
  return out;
}
