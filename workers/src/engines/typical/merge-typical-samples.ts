/**
 * mergeTypicalSamples — the union of sample sets of one spec, as one set.
 *
 * Each record is keyed by (β index, sample index). Sample k's random vector is a function of
 * (spec.seed, k) only, so two records with the same key are the same computation (a retried
 * branch, a duplicated job): the first one is kept and the rest are dropped. The result is
 * sorted by (β index, sample), so estimates of a merged set are independent of how the samples
 * were split into branches and of the order the branches finished in.
 * Cost: O(n log n) in the number of records; records are shared, not copied.
 */
import type { TypicalSampleRecord, TypicalSamples } from './typical-samples.js';

/**
 * Merges sets of samples of the same spec (see file header).
 * @throws RangeError when the list is empty or the sets belong to different specs or layouts.
 */
export function mergeTypicalSamples(parts: readonly TypicalSamples[]): TypicalSamples {
  if (parts.length === 0) throw new RangeError('parts must hold at least one sample set');
  const first = parts[0];
  parts.forEach((p, k) => {
    if (p.specHash !== first.specHash) throw new RangeError(`parts[${k}] belongs to spec ${p.specHash}, parts[0] to ${first.specHash}`);
    if (p.primitives !== first.primitives || p.times !== first.times) {
      throw new RangeError(`parts[${k}] holds ${p.primitives} primitives × ${p.times} times; parts[0] holds ${first.primitives} × ${first.times}`);
    }
  });
  const seen = new Map<string, TypicalSampleRecord>();
  for (const p of parts) {
    for (const r of p.records) {
      const key = `${r.betaIndex}:${r.sample}`;
      if (!seen.has(key)) seen.set(key, r);
    }
  }
  const records = [...seen.values()].sort((a, b) => a.betaIndex - b.betaIndex || a.sample - b.sample);
  return { specHash: first.specHash, primitives: first.primitives, times: first.times, records };
}
