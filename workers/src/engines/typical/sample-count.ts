/**
 * How many samples: the pilot, the minimum, the cap, and the next count after a measurement.
 *
 * The jackknife standard error falls as 1/√R, so with a measured statistical error σ(R) the
 * count that meets a target σ* is R·(σ/σ*)²; SAMPLE_SAFETY enlarges it because σ(R) is itself
 * measured with relative scatter ≈ 1/√(2(R − 1)) (a pilot of 4 samples can underestimate σ
 * by a third). Rounds repeat until the target is met or the cap is reached.
 */

/** Samples of the first round (enough for a first jackknife). */
export const PILOT_SAMPLES = 4;
/** Fewest samples any reported estimate rests on (its σ is then known to ≈ ±25 %). */
export const MIN_SAMPLES = 8;
/** Most samples per β the engine will run. */
export const MAX_TYPICAL_SAMPLES = 1024;
/** Over-provisioning factor on the extrapolated count. */
export const SAMPLE_SAFETY = 1.25;

/** Samples that bring a one-sample spread `spread` to a standard error ≤ `target` (≥ 1). */
export function samplesFor(spread: number, target: number): number {
  if (!(target > 0)) throw new RangeError(`target must be positive; got ${target}`);
  if (!(spread >= 0)) throw new RangeError(`spread must be ≥ 0; got ${spread}`);
  return Math.max(1, Math.ceil((spread / target) ** 2));
}

/**
 * The sample count after a round that measured statistical error `statError` with `current`
 * samples: `current` when the target is met with ≥ MIN_SAMPLES or the cap is reached, else the
 * extrapolated count × SAMPLE_SAFETY, at least MIN_SAMPLES and current + 1, at most `cap`.
 */
export function nextSampleCount(current: number, statError: number, target: number, cap: number): number {
  if (current >= cap) return current;
  if (statError <= target) return Math.min(cap, Math.max(current, MIN_SAMPLES));
  const ratio = Number.isFinite(statError) ? statError / target : Infinity;
  const want = Math.ceil(current * ratio * ratio * SAMPLE_SAFETY);
  return Math.min(cap, Math.max(want, MIN_SAMPLES, current + 1));
}
