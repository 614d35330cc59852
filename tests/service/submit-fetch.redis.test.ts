/**
 * Submit → complete → fetch over the real stack (API, Redis, BullMQ worker with sandboxed
 * branches) gives the same numbers as the local run, as JSON and as CSV; the event stream
 * carries every point once and resumes after Last-Event-ID.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult } from '../../shared-types/src/index.js';
import type { Api } from '../../services/api/src/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { resultToCsv } from '../../workers/src/sweep/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { bearer, localResult, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

describe('sweep service', () => {
  const prefix = uniquePrefix('submit');
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;

  beforeAll(async () => {
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, concurrency: 1 });
  });

  afterAll(async () => {
    await worker?.close(1000);
    await api?.close();
  });

  const submit = async (spec: unknown, query = '') =>
    api.app.inject({ method: 'POST', url: `/v1/sweeps${query}`, headers: bearer(token), payload: spec as object });
  const statusOf = async (id: string) => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();
  const untilDone = (id: string) => waitFor(async () => {
    const s = await statusOf(id);
    return ['succeeded', 'failed', 'cancelled'].includes(s.status) ? s : null;
  }, `sweep ${id} to finish`);

  describe('when a deterministic sweep is submitted and a worker runs it', () => {
    const spec = smallSpec({ label: 'same-as-local' });
    let id: string;
    let remote: SweepResult;
    let local: SweepResult;

    beforeAll(async () => {
      const res = await submit(spec);
      expect(res.statusCode).toBe(201);
      id = res.json().id;
      const done = await untilDone(id);
      expect(done.status).toBe('succeeded');
      const r = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) });
      expect(r.statusCode).toBe(200);
      remote = r.json();
      local = await localResult(spec);
    });

    it('should return the same numbers as the local run', () => {
      expect(remote.series.map((s) => s.label)).toEqual(local.series.map((s) => s.label));
      // Same engine, same canonical spec, same arithmetic: bit-for-bit equal.
      expect(remote.series).toEqual(local.series);
      expect(remote.thermo).toEqual(local.thermo);
      expect(remote.betas).toEqual(local.betas);
      expect(remote.times).toEqual(local.times);
      expect(remote.specHash).toBe(local.specHash);
      expect(remote.spec).toEqual(local.spec);
      expect(remote.diagnostics.map((d) => d.h1Drift)).toEqual(local.diagnostics.map((d) => d.h1Drift));
    });

    it('should give the same CSV as the local run, by both CSV routes', async () => {
      const a = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result?format=csv`, headers: bearer(token) });
      const b = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result.csv`, headers: bearer(token) });
      expect(a.headers['content-type']).toMatch(/^text\/csv/);
      expect(a.body).toBe(resultToCsv(local));
      expect(b.body).toBe(a.body);
      expect(a.body.split('\n')[0]).toBe('beta,time,series,value,error');
    });

    it('should report per-branch progress, timings and the plan once done', async () => {
      const s = await statusOf(id);
      expect(s.branches).toHaveLength(local.plan.branches.length);
      for (const b of s.branches) {
        expect(b.state).toBe('done');
        expect(b.pointsDone).toBe(b.pointsTotal);
        expect(b.attempts).toBe(1);
      }
      expect(s.pointsDone).toBe(10);
      expect(s.progress).toBe(1);
      expect(s.plan.engine).toBe('exact');
      expect(s.timings.runSeconds).toBeGreaterThan(0);
      expect(Date.parse(s.timings.finishedAt)).toBeGreaterThanOrEqual(Date.parse(s.timings.startedAt));
    });

    it('should stream every point exactly once and end the stream', async () => {
      const res = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) });
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toMatch(/^text\/event-stream/);
      const { events } = parseSseChunk(res.body);
      const points = events.filter((e) => e.type === 'point').map((e) => JSON.parse(e.data));
      const keys = points.map((p) => `${p.betaIndex}:${p.timeIndex}`);
      expect(new Set(keys).size).toBe(10);
      expect(keys).toHaveLength(10);
      expect(events.filter((e) => e.type === 'thermo')).toHaveLength(2);
      expect(events.filter((e) => e.type === 'diagnostics')).toHaveLength(2);
      expect(events.map((e) => e.type)).toContain('branch');
      const statuses = events.filter((e) => e.type === 'status').map((e) => JSON.parse(e.data).status);
      expect(statuses).toEqual(['queued', 'running', 'succeeded']);
      expect(events.at(-1)?.type).toBe('end');
      // Event ids are the stream ids, strictly increasing.
      const ids = events.filter((e) => e.id).map((e) => e.id!);
      const sorted = [...ids].sort((x, y) => {
        const [a1, a2] = x.split('-').map(Number);
        const [b1, b2] = y.split('-').map(Number);
        return a1 - b1 || a2 - b2;
      });
      expect(ids).toEqual(sorted);
      // Every streamed value equals the result document's.
      for (const p of points) {
        remote.series.forEach((s, k) => expect(p.values[k]).toBe(s.values[p.betaIndex][p.timeIndex]));
      }
    });

    it('should resume after Last-Event-ID with only the later events', async () => {
      const all = parseSseChunk((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) })).body).events;
      const withIds = all.filter((e) => e.id);
      const cut = withIds[5];
      const rest = parseSseChunk((await api.app.inject({
        method: 'GET', url: `/v1/sweeps/${id}/events`, headers: { ...bearer(token), 'last-event-id': cut.id! },
      })).body).events;
      expect(rest.filter((e) => e.id).map((e) => e.id)).toEqual(withIds.slice(6).map((e) => e.id));
      const byQuery = parseSseChunk((await api.app.inject({
        method: 'GET', url: `/v1/sweeps/${id}/events?after=${cut.id}`, headers: bearer(token),
      })).body).events;
      expect(byQuery.filter((e) => e.id).map((e) => e.id)).toEqual(withIds.slice(6).map((e) => e.id));
    });

    it('should list the sweep for its owner', async () => {
      const list = (await api.app.inject({ method: 'GET', url: '/v1/sweeps?status=succeeded', headers: bearer(token) })).json();
      expect(list.items.map((s: { id: string }) => s.id)).toContain(id);
      const none = (await api.app.inject({ method: 'GET', url: '/v1/sweeps?status=running', headers: bearer(token) })).json();
      expect(none.items.map((s: { id: string }) => s.id)).not.toContain(id);
    });
  });

  describe('when the same canonical spec is submitted twice', () => {
    it('should return the existing sweep, unless fresh=true', async () => {
      const h0 = { model: 'ising' as const, J: 1, hx: 0.7 };
      const first = await submit(smallSpec({ label: 'dedupe', h0, betas: [1, 0.5] }));
      expect(first.statusCode).toBe(201);
      // Same physics, betas in another order, another label: the same canonical spec.
      const again = await submit(smallSpec({ label: 'dedupe again', h0, betas: [0.5, 1, 1] }));
      expect(again.statusCode).toBe(200);
      expect(again.json()).toMatchObject({ id: first.json().id, deduplicated: true });
      const fresh = await submit(smallSpec({ label: 'dedupe', h0 }), '?fresh=true');
      expect(fresh.statusCode).toBe(201);
      expect(fresh.json().id).not.toBe(first.json().id);
      expect(fresh.json().deduplicated).toBe(false);
      await untilDone(first.json().id);
      await untilDone(fresh.json().id);
    });
  });

  describe('when a result is asked for before the sweep succeeded', () => {
    it('should answer 409 naming the status', async () => {
      const res = await submit(smallSpec({ label: 'early', times: { stop: 3, count: 60 }, betas: [0.25] }), '?fresh=true');
      const id = res.json().id;
      const early = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) });
      if (early.statusCode !== 200) {
        expect(early.statusCode).toBe(409);
        expect(early.json().code).toBe('BSW_ERR_RESULT_NOT_READY');
      }
      await untilDone(id);
    });
  });

  describe('when the service is asked about itself', () => {
    it('should list the engines with the schema and service limits', async () => {
      const res = (await api.app.inject({ method: 'GET', url: '/v1/engines', headers: bearer(token) })).json();
      expect(res.engines.map((e: { name: string }) => e.name)).toContain('exact');
      expect(res.limits.maxSites).toBe(4096);
      expect(res.service).toMatchObject({ maxBodyBytes: 2 * 1024 * 1024, maxActiveSweepsPerOwner: 20 });
    });

    it('should expose queue depth, branches running, points written and request latency as metrics', async () => {
      const text = (await api.app.inject({ method: 'GET', url: '/metrics' })).body;
      const value = (re: RegExp) => Number(re.exec(text)?.[1]);
      expect(value(/^betasweep_points_written_total (\d+)$/m)).toBe(await api.ctx.store.pointsWritten());
      expect(value(/^betasweep_points_written_total (\d+)$/m)).toBeGreaterThanOrEqual(10);
      expect(text).toMatch(/^betasweep_queue_branches\{state="waiting"\} \d+$/m);
      expect(text).toMatch(/^betasweep_branches_running \d+$/m);
      expect(value(/^betasweep_http_requests_total\{method="GET",route="\/v1\/sweeps\/:id",status="200"\} (\d+)$/m)).toBeGreaterThan(0);
      expect(text).toMatch(/^betasweep_http_request_duration_seconds_bucket\{method="GET",route="\/v1\/sweeps\/:id",le="\+Inf"\} \d+$/m);
    });
  });
});
