/**
 * Engine checkpoints through the branch runner, on the in-memory job store: a branch of an mps
 * sweep stopped after a few stored points resumes from its checkpoint on retry (no imaginary
 * time re-run) and the sweep's result equals the uninterrupted run; checkpoints are refused
 * once the sweep is over and deleted when it succeeds. The same on Redis:
 * checkpoints.redis.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { MemoryJobStore } from '../../workers/src/store/index.js';
import { checkResumeFromCheckpoint } from './support/checkpoint-resume.js';
import { newSweepFor, smallSpec } from './support/harness.js';

describe('branch checkpoints (memory store)', () => {
  describe('when a branch is stopped after some points and retried', () => {
    it('should resume from its quench checkpoint and give the uninterrupted result', async () => {
      await checkResumeFromCheckpoint(new MemoryJobStore());
    });
  });

  describe('when the sweep is over', () => {
    it('should refuse to store a checkpoint', async () => {
      const store = new MemoryJobStore();
      const { id } = await store.createSweep(await newSweepFor(smallSpec())) as { id: string };
      expect(await store.saveCheckpoint(id, 0, new Uint8Array([1, 2, 3]))).toBe(true);
      expect(Array.from((await store.loadCheckpoint(id, 0))!)).toEqual([1, 2, 3]);
      await store.cancelSweep(id);
      expect(await store.saveCheckpoint(id, 1, new Uint8Array([4]))).toBe(false);
      expect(await store.loadCheckpoint(id, 1)).toBeNull();
      expect(await store.saveCheckpoint('sw_aaaaaaaaaaaaaaaa', 0, new Uint8Array([4]))).toBe(false);
    });
  });
});
