/**
 * A branch whose computation blocks its process far longer than the job lock lasts is not
 * taken for stalled and run twice: the branch computes in a sandbox process while the
 * worker process keeps renewing the lock.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { SPIN_PROCESSOR, bearer, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

const DIR = mkdtempSync(join(tmpdir(), 'bsw-long-'));
const LOG = join(DIR, 'runs.log');
const LOCK_MS = 1000;
const BLOCK_MS = 4000;

describe('long branches', () => {
  const prefix = uniquePrefix('long');
  let api: Api;
  let token: string;
  let worker: BranchWorkerHandle;
  const stalled: string[] = [];

  beforeAll(async () => {
    process.env.BETASWEEP_FIXTURE_BLOCK_MS = String(BLOCK_MS);
    process.env.BETASWEEP_FIXTURE_LOG = LOG;
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    worker = await startBranchWorker({
      redisUrl: testRedisUrl(), prefix, processorFile: SPIN_PROCESSOR, concurrency: 1,
      lockDuration: LOCK_MS, stalledInterval: 500, maxStalledCount: 1,
    });
    worker.worker.on('stalled', (jobId) => stalled.push(jobId));
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
    delete process.env.BETASWEEP_FIXTURE_BLOCK_MS;
    delete process.env.BETASWEEP_FIXTURE_LOG;
    rmSync(DIR, { recursive: true, force: true });
  });

  describe('when a branch blocks its process for four lock durations', () => {
    it('should run it once, never mark it stalled, and complete the sweep', async () => {
      const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: smallSpec({ label: 'long-one', betas: [0.5], times: { stop: 1, count: 4 } }) });
      const id = res.json().id;
      const t0 = Date.now();
      const done = await waitFor(async () => {
        const s = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();
        return ['succeeded', 'failed'].includes(s.status) ? s : null;
      }, 'the long sweep', 60_000, 100);
      expect(Date.now() - t0).toBeGreaterThanOrEqual(BLOCK_MS);
      expect(done.status).toBe('succeeded');
      expect(stalled).toEqual([]);
      expect(done.branches[0].attempts).toBe(1);
      // The sweep succeeds inside the processor, a moment before BullMQ marks the job completed.
      const job = await waitFor(async () => {
        const j = await api.ctx.queue.queue.getJob(`${id}.0`);
        // Fetch again once completed: a job read while still active carries no return value.
        return j && (await j.getState()) === 'completed' ? api.ctx.queue.queue.getJob(`${id}.0`) : null;
      }, 'the job to complete', 30_000);
      expect(job?.attemptsStarted).toBe(1);
      expect(job?.stalledCounter ?? 0).toBe(0);
      expect(job?.returnvalue).toMatchObject({ outcome: 'done', pointsWritten: 4, finalized: true });
      const runs = readFileSync(LOG, 'utf8').split('\n').filter((l) => l.startsWith('long-one '));
      expect(runs).toHaveLength(1);
    });
  });
});
