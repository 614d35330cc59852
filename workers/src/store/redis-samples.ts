/**
 * The Redis side of the sampled engines' raw samples (keys.ts: `samples`, `sample-counts`):
 * write-once per `${branchIndex}:${sample}` with a per-branch count (lua/sample-scripts.ts),
 * read back as binary.
 */
import type { Redis } from 'ioredis';
import type { StoreKeys } from './keys.js';
import { WRITE_SAMPLES } from './lua/sample-scripts.js';
import { checkSampleIndex, type StoredSample } from './sweep-record.js';

type WriteSamplesFn = (...args: (string | number | Buffer)[]) => Promise<number>;

/** Stores samples once each; the branch's stored count after the write, or null when the sweep is over. */
export async function writeSamplesRedis(redis: Redis, keys: StoreKeys, id: string, branchIndex: number, samples: StoredSample[]): Promise<number | null> {
  const r = redis as unknown as { bswWriteSamples?: WriteSamplesFn };
  if (typeof r.bswWriteSamples !== 'function') redis.defineCommand('bswWriteSamples', { lua: WRITE_SAMPLES });
  const args: (number | Buffer)[] = [];
  for (const s of samples) {
    checkSampleIndex(s.sample);
    args.push(s.sample, s.data);
  }
  const n = await (redis as unknown as { bswWriteSamples: WriteSamplesFn }).bswWriteSamples(
    3, keys.sweep(id), keys.samples(id), keys.sampleCounts(id), branchIndex, ...args,
  );
  return n < 0 ? null : Number(n);
}

/** The stored bytes of each requested sample of a branch (null where none is stored). */
export async function readSamplesRedis(redis: Redis, keys: StoreKeys, id: string, branchIndex: number, samples: number[]): Promise<Array<Buffer | null>> {
  if (samples.length === 0) return [];
  return redis.hmgetBuffer(keys.samples(id), ...samples.map((k) => `${branchIndex}:${k}`));
}
