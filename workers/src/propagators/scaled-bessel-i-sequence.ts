/**
 * scaledBesselISequence — e^{−x}·I_k(x), k = 0..kMax, for real x ≥ 0 (no overflow at large x).
 *
 * Method: Miller's backward recurrence for the modified Bessel functions (Abramowitz & Stegun,
 * Handbook of Mathematical Functions (1964), recurrence 9.6.26: I_{k−1}(x) = (2k/x)·I_k(x) +
 * I_{k+1}(x)), started from (f_{M+1}, f_M) = (0, 1) at M = millerStartIndex(x, kMax), and
 * normalised with the generating-function identity e^{x} = I_0(x) + 2·Σ_{k≥1} I_k(x)
 * (A&S 9.6.37 at θ = 0). Dividing by that sum yields e^{−x}·I_k(x) directly, so no e^{x}
 * is ever formed. All terms are positive: the normalisation has no cancellation.
 *
 * Cost: O(M) flops; allocates one Float64Array of length M + 2.
 */
import { millerStartIndex } from './bessel-j-sequence.js';

/** Rescale when a running value exceeds this. */
const RESCALE_LIMIT = 1e250;
/** Factor applied on rescaling. */
const RESCALE = 1e-250;

/**
 * Scaled modified Bessel functions e^{−x}·I_k(x), k = 0..kMax.
 *
 * @param x - argument, finite and ≥ 0.
 * @param kMax - highest order, integer ≥ 0.
 * @returns a new Float64Array of length kMax + 1.
 * @throws RangeError if x is negative or not finite, or kMax is not a non-negative integer.
 */
export function scaledBesselISequence(x: number, kMax: number): Float64Array {
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`x must be a finite number ≥ 0; got ${x}`);
  if (!Number.isInteger(kMax) || kMax < 0) throw new RangeError(`kMax must be a non-negative integer; got ${kMax}`);
  const out = new Float64Array(kMax + 1);
  if (x === 0) { out[0] = 1; return out; }
  const m = millerStartIndex(x, kMax);
  const f = new Float64Array(m + 2);
  f[m] = 1;
  for (let k = m; k >= 1; k--) {
    const v = (2 * k / x) * f[k] + f[k + 1];
    f[k - 1] = v;
    if (v > RESCALE_LIMIT) {
      for (let j = k - 1; j <= m; j++) f[j] *= RESCALE;
    }
  }
  let norm = f[0];
  for (let k = 1; k <= m; k++) norm += 2 * f[k];
  const inv = 1 / norm;
  for (let k = 0; k <= kMax; k++) out[k] = f[k] * inv;
  return out;
}
