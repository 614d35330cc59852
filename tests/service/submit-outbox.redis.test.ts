/**
 * The submit outbox: a sweep stored by a submit that died before its branch jobs were added
 * (simulated by creating it through the store alone) is listed as unqueued; the reconciler
 * re-adds its branch jobs, and it completes with the same numbers as a local run. A normal
 * submit confirms its sweep at once; finished or cancelled sweeps are dropped from the list,
 * never re-run.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { reconcileUnqueued, startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { bearer, localResult, makeToken, newSweepFor, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

describe('submit outbox', () => {
  const prefix = uniquePrefix('outbox');
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;

  beforeAll(async () => {
    // The periodic pass runs every 300 ms here and leaves sweeps younger than 200 ms alone.
    api = await startTestApi({ prefix, reconcileEveryMs: 300, reconcileGraceMs: 200 });
    token = await makeToken(testRedisUrl(), prefix, 'lab', 'lab');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, concurrency: 1 });
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
  });

  const status = async (id: string) => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();

  describe('when a submit stored the sweep but never enqueued it', () => {
    it('should list it, then the periodic pass should queue it and it should finish like a local run', async () => {
      const spec = smallSpec({ label: 'orphaned-submit', betas: [0.5, 1] });
      const created = await api.ctx.store.createSweep(await newSweepFor(spec, 'lab'));
      expect(created.kind).toBe('created');
      const id = (created as { id: string }).id;
      expect(await api.ctx.store.unqueuedSweeps(0)).toContain(id);
      const done = await waitFor(async () => { const s = await status(id); return s.status === 'succeeded' || s.status === 'failed' ? s : null; }, 'the re-queued sweep', 30_000);
      expect(done.status).toBe('succeeded');
      expect(await api.ctx.store.unqueuedSweeps(0)).not.toContain(id);
      const result = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) })).json();
      expect(result.series).toEqual((await localResult(spec)).series);
    });
  });

  describe('when a submit goes through', () => {
    it('should confirm the sweep at once (never listed once the reply is sent)', async () => {
      const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps?fresh=true', headers: bearer(token), payload: smallSpec({ label: 'normal-submit', betas: [0.7] }) });
      expect(res.statusCode).toBe(201);
      expect(await api.ctx.store.unqueuedSweeps(0)).not.toContain(res.json().id);
    });
  });

  describe('when a listed sweep was cancelled before the pass', () => {
    it('should drop it from the list without queueing its branches', async () => {
      const created = await api.ctx.store.createSweep({ ...(await newSweepFor(smallSpec({ label: 'cancelled-before', betas: [0.9] }), 'lab')), fresh: true });
      const id = (created as { id: string }).id;
      expect(await api.ctx.store.cancelSweep(id)).toBe(true);
      const added: string[] = [];
      // A pass of its own with a recording queue (the periodic pass may also have taken it: both drop it).
      const report = await reconcileUnqueued(api.ctx.store, { enqueue: async (sid) => { added.push(sid); } }, { graceMs: 0 });
      expect(added).not.toContain(id);
      expect(report.enqueued).not.toContain(id);
      expect(await api.ctx.store.unqueuedSweeps(0)).not.toContain(id);
      expect(await api.ctx.queue.queue.getJob(`${id}.0`)).toBeUndefined();
    });
  });
});
