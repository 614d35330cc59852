/**
 * Retries: a branch that fails with an ordinary error is retried after a back-off and
 * resumes without duplicating points; an invalid job fails at once (never retried) and the
 * sweep reports why.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { SPIN_PROCESSOR, bearer, localResult, makeToken, newSweepFor, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

const DIR = mkdtempSync(join(tmpdir(), 'bsw-retry-'));
const LOG = join(DIR, 'runs.log');
const BACKOFF_MS = 600;

describe('branch retries', () => {
  const prefix = uniquePrefix('retry');
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;

  beforeAll(async () => {
    Object.assign(process.env, { BETASWEEP_FIXTURE_FAIL_DIR: DIR, BETASWEEP_FIXTURE_FAIL_AT: '5', BETASWEEP_FIXTURE_LOG: LOG, BETASWEEP_FIXTURE_SPIN_MS: '5' });
    api = await startTestApi({ prefix, backoffMs: BACKOFF_MS, attempts: 3 });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, processorFile: SPIN_PROCESSOR });
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
    for (const k of ['BETASWEEP_FIXTURE_FAIL_DIR', 'BETASWEEP_FIXTURE_FAIL_AT', 'BETASWEEP_FIXTURE_LOG', 'BETASWEEP_FIXTURE_SPIN_MS']) delete process.env[k];
    rmSync(DIR, { recursive: true, force: true });
  });

  const status = async (id: string) => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();

  describe('when a branch fails with a transient error', () => {
    it('should show it retrying, retry after the back-off, and finish with every point once', async () => {
      const spec = smallSpec({ label: 'flaky', betas: [0.5], times: { stop: 2, count: 12 } });
      const id = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: spec })).json().id;
      const retrying = await waitFor(async () => { const s = await status(id); return s.branches[0].state === 'retrying' ? s : null; }, 'the retrying state', 30_000, 20);
      expect(retrying.branches[0].error).toMatch(/transient failure of 'flaky' after 5 points/);
      expect(retrying.status).toBe('running');
      const done = await waitFor(async () => { const s = await status(id); return s.status === 'succeeded' || s.status === 'failed' ? s : null; }, 'the sweep', 30_000, 50);
      expect(done.status).toBe('succeeded');
      expect(done.branches[0].attempts).toBe(2);
      const runs = readFileSync(LOG, 'utf8').split('\n').filter((l) => l.startsWith('flaky '));
      expect(runs).toHaveLength(2);
      const job = await waitFor(async () => {
        const j = await api.ctx.queue.queue.getJob(`${id}.0`);
        // Fetch again once completed: a job read while still active carries no return value.
        return j && (await j.getState()) === 'completed' ? api.ctx.queue.queue.getJob(`${id}.0`) : null;
      }, 'the job to complete', 30_000);
      expect(job.attemptsMade).toBe(2);
      // The second attempt started no earlier than the back-off after the first one failed.
      expect(job.processedOn! - Date.parse(retrying.branches[0].finishedAt)).toBeGreaterThanOrEqual(BACKOFF_MS - 20);
      expect(job.returnvalue.resumedFrom['0']).toBeGreaterThanOrEqual(1);
      const events = parseSseChunk((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) })).body).events;
      const keys = events.filter((e) => e.type === 'point').map((e) => { const p = JSON.parse(e.data); return `${p.betaIndex}:${p.timeIndex}`; });
      expect(keys).toHaveLength(12);
      expect(new Set(keys).size).toBe(12);
      const result = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) })).json();
      expect(result.series).toEqual((await localResult(spec)).series);
    });
  });

  describe('when a branch job does not match its sweep', () => {
    it('should fail at once without retrying, and fail the sweep with the reason', async () => {
      // A stored sweep whose own jobs are not queued, and a forged job whose β indices are not in its plan.
      const created = await api.ctx.store.createSweep(await newSweepFor(smallSpec({ label: 'forged', betas: [6] }), 'lab'));
      const other = (created as { id: string }).id;
      await api.ctx.queue.queue.add('branch', { sweepId: other, branchIndex: 0, betaIndices: [0, 3] }, { jobId: `${other}.forged`, attempts: 3 });
      const failed = await waitFor(async () => {
        const j = await api.ctx.queue.queue.getJob(`${other}.forged`);
        return j && (await j.getState()) === 'failed' ? j : null;
      }, 'the forged job to fail', 30_000);
      expect(failed.attemptsMade).toBe(1);
      expect(failed.failedReason).toMatch(/does not match the plan/);
      const s = await status(other);
      expect(s.status).toBe('failed');
      expect(s.error).toMatch(/branch 0: .*does not match the plan/);
    });

    it('should fail a job with a malformed payload at once', async () => {
      await api.ctx.queue.queue.add('branch', { sweepId: 'not-a-sweep', branchIndex: -1 }, { jobId: 'garbage-1', attempts: 3 });
      const failed = await waitFor(async () => {
        const j = await api.ctx.queue.queue.getJob('garbage-1');
        return j && (await j.getState()) === 'failed' ? j : null;
      }, 'the malformed job to fail', 30_000);
      expect(failed.attemptsMade).toBe(1);
      expect(failed.failedReason).toMatch(/invalid branch payload/);
    });
  });
});
