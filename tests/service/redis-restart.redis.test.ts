/**
 * Restart redis-server (kill -9, AOF) mid-sweep: submitted and finished sweeps, points and
 * results survive, the API and the workers reconnect, and the running sweep completes with
 * every point exactly once.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { startPrivateRedis, type PrivateRedis } from '../support/private-redis.js';
import { SPIN_PROCESSOR, bearer, localResult, makeToken, smallSpec, startTestApi, uniquePrefix, waitFor } from './support/harness.js';

describe('Redis restart', () => {
  const prefix = uniquePrefix('restart');
  let redis: PrivateRedis;
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;

  beforeAll(async () => {
    redis = await startPrivateRedis();
    process.env.BETASWEEP_FIXTURE_SPIN_MS = '40';
    api = await startTestApi({ prefix, redisUrl: redis.url });
    token = await makeToken(redis.url, prefix, 'lab');
    worker = await startBranchWorker({ redisUrl: redis.url, prefix, processorFile: SPIN_PROCESSOR, concurrency: 1, lockDuration: 5000, stalledInterval: 2000 });
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
    await redis?.stop();
    delete process.env.BETASWEEP_FIXTURE_SPIN_MS;
  });

  const get = async (url: string) => api.app.inject({ method: 'GET', url, headers: bearer(token) });
  const finished = (id: string) => waitFor(async () => {
    const s = (await get(`/v1/sweeps/${id}`)).json();
    return ['succeeded', 'failed', 'cancelled'].includes(s.status) ? s : null;
  }, `${id} to finish`, 60_000, 100);

  describe('when redis-server is killed and restarted mid-sweep', () => {
    it('should keep every sweep, point and result, and finish the running sweep', async () => {
      const doneSpec = smallSpec({ label: 'before', betas: [0.5], times: { stop: 1, count: 3 } });
      const doneId = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: doneSpec })).json().id;
      expect((await finished(doneId)).status).toBe('succeeded');
      const resultBefore = (await get(`/v1/sweeps/${doneId}/result`)).body;

      const spec = smallSpec({ label: 'across-restart', betas: [0.25, 0.75], times: { stop: 3, count: 40 } });
      const id = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: spec })).json().id;
      const queuedId = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: smallSpec({ label: 'queued', betas: [2] }) })).json().id;
      const before = await waitFor(async () => {
        const s = (await get(`/v1/sweeps/${id}`)).json();
        return s.pointsDone >= 6 ? s : null;
      }, 'points before the restart', 30_000, 20);

      await redis.restart();

      // Everything acknowledged before the kill is back.
      const after = (await get(`/v1/sweeps/${id}`)).json();
      expect(after.pointsDone).toBeGreaterThanOrEqual(before.pointsDone);
      expect((await get(`/v1/sweeps/${doneId}/result`)).body).toBe(resultBefore);
      expect((await get(`/v1/sweeps/${queuedId}`)).statusCode).toBe(200);
      expect((await api.app.inject({ method: 'GET', url: '/readyz' })).statusCode).toBe(200);

      const done = await finished(id);
      expect(done.status).toBe('succeeded');
      expect((await finished(queuedId)).status).toBe('succeeded');
      const events = parseSseChunk((await get(`/v1/sweeps/${id}/events`)).body).events;
      const keys = events.filter((e) => e.type === 'point').map((e) => { const p = JSON.parse(e.data); return `${p.betaIndex}:${p.timeIndex}`; });
      expect(keys).toHaveLength(80);
      expect(new Set(keys).size).toBe(80);
      const result = (await get(`/v1/sweeps/${id}/result`)).json();
      expect(result.series).toEqual((await localResult(spec)).series);
    });
  });
});
