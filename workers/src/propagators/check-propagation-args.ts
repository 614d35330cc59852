/**
 * Argument checks shared by the propagators (the thin checked layer over chebyshevSum).
 */
import type { SpectralInterval } from './types.js';

/** Throws RangeError/TypeError naming the bad argument. */
export function checkPropagationArgs(
  interval: SpectralInterval,
  amount: number,
  amountName: string,
  psi: Float64Array,
  work: readonly Float64Array[],
  tolerance: number,
): void {
  const { lo, hi } = interval;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo > hi) {
    throw new RangeError(`interval must be finite with lo ≤ hi; got [${lo}, ${hi}]`);
  }
  if (!Number.isFinite(amount)) throw new RangeError(`${amountName} must be finite; got ${amount}`);
  if (!(psi instanceof Float64Array) || psi.length % 2 !== 0) {
    throw new TypeError('psi must be a Float64Array of complex interleaved (re, im) entries');
  }
  if (work.length < 2) throw new RangeError(`work must hold 2 scratch vectors; got ${work.length}`);
  for (let j = 0; j < 2; j++) {
    if (work[j].length !== psi.length) {
      throw new RangeError(`work[${j}] must have psi's length ${psi.length}; got ${work[j].length}`);
    }
    if (work[j] === psi) throw new RangeError(`work[${j}] must not be psi`);
  }
  if (work[0] === work[1]) throw new RangeError('work[0] and work[1] must be different buffers');
  if (!(tolerance > 0) || !Number.isFinite(tolerance)) {
    throw new RangeError(`tolerance must be a positive finite number; got ${tolerance}`);
  }
}
