/**
 * A truncated double series f(t, β) = Σ_{k+m ≤ K} c_{k,m} t^k β^m (quench series: t is the
 * time after the quench, β the inverse temperature of the initial thermal state).
 * Storage: c_{k,m} at index k·(K+1) + m of a Float64Array of (K+1)², entries with k+m > K are 0.
 */

/** A truncated double series with its rounding-magnitude companion (see power-series.ts). */
export interface DoubleSeries {
  /** Total order K. */
  readonly order: number;
  /** c_{k,m} at index k·(K+1) + m. */
  readonly value: Float64Array;
  /** Magnitude companion for rounding bounds, same layout. */
  readonly magnitude: Float64Array;
}

/** An all-zero double series of total order K. */
export function emptyDoubleSeries(order: number): DoubleSeries {
  const n = (order + 1) * (order + 1);
  return { order, value: new Float64Array(n), magnitude: new Float64Array(n) };
}

/** The β-series multiplying t^k: c_{k,0..K−k}. */
export function thermalColumn(s: DoubleSeries, k: number): Float64Array {
  const K = s.order;
  if (!Number.isInteger(k) || k < 0 || k > K) throw new RangeError(`k must be an integer in 0..${K}; got ${String(k)}`);
  return s.value.slice(k * (K + 1), k * (K + 1) + (K - k) + 1);
}

/** Same as {@link thermalColumn} for the magnitude companion. */
export function thermalColumnMagnitude(s: DoubleSeries, k: number): Float64Array {
  const K = s.order;
  return s.magnitude.slice(k * (K + 1), k * (K + 1) + (K - k) + 1);
}

/**
 * Product of two double series of total order K given as flat arrays (index k·(K+1)+m),
 * truncated at total order K. Cost O(K⁴).
 */
export function multiplyFlatDouble(a: Float64Array, b: Float64Array, order: number): Float64Array {
  const K = order;
  const out = new Float64Array((K + 1) * (K + 1));
  for (let k1 = 0; k1 <= K; k1++) {
    for (let m1 = 0; m1 <= K - k1; m1++) {
      const x = a[k1 * (K + 1) + m1];
      if (x === 0) continue;
      for (let k2 = 0; k1 + k2 <= K; k2++) {
        for (let m2 = 0; k1 + k2 + m1 + m2 <= K; m2++) {
          out[(k1 + k2) * (K + 1) + m1 + m2] += x * b[k2 * (K + 1) + m2];
        }
      }
    }
  }
  return out;
}
