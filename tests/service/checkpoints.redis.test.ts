/**
 * What only Redis does with engine checkpoints: binary values stored byte for byte under the
 * sweep's keys, a save refused once the sweep is over (so a late writer cannot re-create the
 * key), the sweep's retention TTL after the terminal transition, and the resume of a stopped
 * mps branch through the Redis store (support/checkpoint-resume.ts).
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RedisJobStore } from '../../workers/src/store/index.js';
import { checkResumeFromCheckpoint } from './support/checkpoint-resume.js';
import { newSweepFor, smallSpec, testRedisUrl, uniquePrefix } from './support/harness.js';

let redis: Redis;
let store: RedisJobStore;
beforeAll(() => {
  redis = new Redis(testRedisUrl());
  store = new RedisJobStore(redis, { prefix: uniquePrefix('ckpt'), retentionSeconds: 3600 });
});
afterAll(() => { redis?.disconnect(); });

describe('RedisJobStore checkpoints', () => {
  describe('when a checkpoint holds arbitrary bytes', () => {
    it('should store them byte for byte and refuse saves after the sweep ended, keeping the retention TTL', async () => {
      const { id } = await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string };
      const bytes = new Uint8Array(4099).map((_, i) => (i * 37) & 255);
      expect(await store.saveCheckpoint(id, 1, bytes.subarray(3))).toBe(true);
      expect(Array.from((await store.loadCheckpoint(id, 1))!)).toEqual(Array.from(bytes.subarray(3)));
      expect(await store.loadCheckpoint(id, 0)).toBeNull();
      expect(await redis.ttl(store.keys.checkpoints(id))).toBe(-1);
      expect(await store.failSweep(id, 'stop')).toBe(true);
      const ttl = await redis.ttl(store.keys.checkpoints(id));
      expect(ttl).toBeGreaterThan(3500);
      expect(ttl).toBeLessThanOrEqual(3600);
      expect(await store.saveCheckpoint(id, 0, new Uint8Array([1]))).toBe(false);
      expect(await store.loadCheckpoint(id, 0)).toBeNull();
    });
  });

  describe('when a branch of an mps sweep is stopped after some points and retried', () => {
    it('should resume from the stored checkpoint and delete the checkpoints when the sweep succeeds', async () => {
      const { id } = await checkResumeFromCheckpoint(store);
      expect(await redis.exists(store.keys.checkpoints(id))).toBe(0);
    });
  });
});
