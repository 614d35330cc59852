/**
 * Thermal series in β from moments (thermal-moments.ts).
 *
 * With m_n = Tr(H^n)/2^N and o_n = Tr(O H^n)/2^N:
 *   Z/2^N      = Σ_n m_n (−β)^n/n!
 *   ln(Z/2^N)  = Σ_n κ_n (−β)^n/n!       (κ_n: cumulants of the spectral distribution)
 *   ⟨O⟩_β      = [Σ_n o_n (−β)^n/n!] / [Z/2^N]
 * (common practice; e.g. the high-temperature expansion in Oitmaa, Hamer & Zheng, "Series
 * Expansion Methods for Strongly Interacting Lattice Models", CUP 2006, ch. 2). Derived
 * quantities: E = −∂_β ln Z, C = β² ∂²_β ln Z.
 * The returned `magnitude` series bound the rounding: cumulants come from moments that grow like
 * N^{n/2}, so on large clusters the cancellation loses digits (power-series.ts).
 * Cost: O(order²).
 */
import { seriesDivide, seriesLog, type TrackedSeries } from './power-series.js';

function zSeries(m: ArrayLike<number>): Float64Array {
  const z = new Float64Array(m.length);
  let f = 1;
  for (let n = 0; n < m.length; n++) {
    if (n > 0) f *= -1 / n;
    z[n] = m[n] * f;
  }
  return z;
}

/**
 * Coefficients of ln(Z/2^N) in powers of β from m_0..m_order (m_0 must be 1).
 * @throws RangeError if m_0 ≠ 1.
 */
export function lnZSeries(moments: ArrayLike<number>): TrackedSeries {
  return seriesLog(zSeries(moments));
}

/** Coefficients of ⟨O⟩_β in powers of β from o_n and m_n (n = 0..order). */
export function expectationSeries(mixed: ArrayLike<number>, moments: ArrayLike<number>): TrackedSeries {
  return seriesDivide(zSeries(mixed), zSeries(moments));
}
