/**
 * Branch workers on one Redis: two workers run two sweeps at once with progress visible
 * while they run; cancel stops running branches within 2 s; a worker that shuts down hands
 * its branch back and another finishes it without duplicating a point.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { SPIN_PROCESSOR, bearer, localResult, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

const DIR = mkdtempSync(join(tmpdir(), 'bsw-workers-'));
const LOG = join(DIR, 'runs.log');

describe('branch workers', () => {
  const prefix = uniquePrefix('workers');
  let api: Api;
  let token: string;
  const workers: BranchWorkerHandle[] = [];

  beforeAll(async () => {
    process.env.BETASWEEP_FIXTURE_SPIN_MS = '60';
    process.env.BETASWEEP_FIXTURE_LOG = LOG;
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    for (const id of ['wA', 'wB']) {
      workers.push(await startBranchWorker({ redisUrl: testRedisUrl(), prefix, workerId: id, processorFile: SPIN_PROCESSOR, concurrency: 1 }));
    }
  });

  afterAll(async () => {
    await Promise.all(workers.map((w) => w.close(500)));
    await api?.close();
    delete process.env.BETASWEEP_FIXTURE_SPIN_MS;
    delete process.env.BETASWEEP_FIXTURE_LOG;
    rmSync(DIR, { recursive: true, force: true });
  });

  const submit = async (spec: unknown) => {
    const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps?fresh=true', headers: bearer(token), payload: spec as object });
    expect(res.statusCode, res.body).toBe(201);
    return res.json().id as string;
  };
  const status = async (id: string) => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();
  const finished = (id: string) => waitFor(async () => {
    const s = await status(id);
    return ['succeeded', 'failed', 'cancelled'].includes(s.status) ? s : null;
  }, `${id} to finish`, 60_000);

  describe('when two workers share one Redis and two sweeps are submitted', () => {
    it('should run both at once, with branch progress visible while they run', async () => {
      // One β each: one branch per sweep, 24 points of ~60 ms each.
      const specA = smallSpec({ label: 'two-a', betas: [0.5], times: { stop: 2, count: 24 } });
      const specB = smallSpec({ label: 'two-b', betas: [1], times: { stop: 2, count: 24 } });
      const [a, b] = [await submit(specA), await submit(specB)];
      const seen = await waitFor(async () => {
        const [sa, sb] = [await status(a), await status(b)];
        const mid = (s: { status: string; pointsDone: number; pointsTotal: number }) => s.status === 'running' && s.pointsDone > 0 && s.pointsDone < s.pointsTotal;
        return mid(sa) && mid(sb) ? [sa, sb] : null;
      }, 'both sweeps to be mid-run', 30_000, 20);
      const runningOn = seen.map((s) => s.branches[0]);
      expect(runningOn.map((br) => br.state)).toEqual(['running', 'running']);
      expect(new Set(runningOn.map((br) => br.worker))).toEqual(new Set(['wA', 'wB']));
      for (const br of runningOn) expect(br.pointsDone).toBeGreaterThan(0);
      const [fa, fb] = [await finished(a), await finished(b)];
      expect([fa.status, fb.status]).toEqual(['succeeded', 'succeeded']);
      const ra = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${a}/result`, headers: bearer(token) })).json();
      expect(ra.series).toEqual((await localResult(specA)).series);
    });
  });

  describe('when a running sweep is cancelled', () => {
    it('should stop its running branches within 2 s and keep the points written so far', async () => {
      const id = await submit(smallSpec({ label: 'cancel-me', betas: [0.5, 1], times: { stop: 4, count: 200 } }));
      await waitFor(async () => (await status(id)).pointsDone >= 4, 'some points', 30_000, 20);
      const t0 = Date.now();
      const res = await api.app.inject({ method: 'POST', url: `/v1/sweeps/${id}/cancel`, headers: bearer(token) });
      expect(res.json()).toMatchObject({ status: 'cancelled', changed: true });
      const stopped = await waitFor(async () => {
        const s = await status(id);
        const active = await api.ctx.queue.queue.getJobs(['active']);
        const mine = active.filter((j) => j.data.sweepId === id);
        return s.branches.every((b: { state: string }) => b.state !== 'running') && mine.length === 0 ? s : null;
      }, 'the branches to stop', 5000, 20);
      const elapsed = Date.now() - t0;
      expect(elapsed).toBeLessThan(2000);
      expect(stopped.status).toBe('cancelled');
      expect(stopped.branches.some((b: { state: string }) => b.state === 'cancelled')).toBe(true);
      const after = stopped.pointsDone;
      expect(after).toBeLessThan(400);
      await new Promise((r) => setTimeout(r, 500));
      expect((await status(id)).pointsDone).toBe(after);
    });
  });

  describe('when a worker shuts down with a branch in hand', () => {
    it('should hand the branch back, and another worker should finish it with every point once', async () => {
      const spare = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, workerId: 'wSpare', processorFile: SPIN_PROCESSOR, concurrency: 1 });
      // Take the two shared workers out first, so the branch lands on the one we stop.
      await Promise.all(workers.splice(0).map((w) => w.close(500)));
      const spec = smallSpec({ label: 'hand-back', betas: [0.75], times: { stop: 3, count: 80 } });
      const id = await submit(spec);
      await waitFor(async () => (await status(id)).pointsDone >= 5, 'the branch to start', 30_000, 20);
      const t0 = Date.now();
      const closing = spare.close(300);
      await closing;
      expect(Date.now() - t0).toBeLessThan(5000);
      const mid = await status(id);
      expect(mid.status).toBe('running');
      expect(mid.pointsDone).toBeLessThan(80);
      const job = await api.ctx.queue.queue.getJob(`${id}.0`);
      expect(await job?.getState()).toBe('waiting');
      workers.push(await startBranchWorker({ redisUrl: testRedisUrl(), prefix, workerId: 'wNext', processorFile: SPIN_PROCESSOR, concurrency: 1 }));
      const done = await finished(id);
      expect(done.status).toBe('succeeded');
      expect(done.branches[0].worker).toBe('wNext');
      const events = parseSseChunk((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) })).body).events;
      const keys = events.filter((e) => e.type === 'point').map((e) => { const p = JSON.parse(e.data); return `${p.betaIndex}:${p.timeIndex}`; });
      expect(keys).toHaveLength(80);
      expect(new Set(keys).size).toBe(80);
      const result = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) })).json();
      expect(result.series).toEqual((await localResult(spec)).series);
      const runs = readFileSync(LOG, 'utf8').split('\n').filter((l) => l.startsWith('hand-back '));
      expect(runs).toHaveLength(2);
    });
  });
});
