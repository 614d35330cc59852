/**
 * The check report over the real stack: the sandboxed branch that finalises a sweep stores
 * the check against the series, GET /v1/sweeps/{id}/check serves it (one entry per β and
 * quantity, each with a verdict), the status report carries its summary, and another owner
 * gets 404 for it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { CheckReportBody } from '../../services/api/src/schemas/check-bodies.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { bearer, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

interface Entry { betaIndex: number; beta: number; timeIndex: number | null; quantity: string; verdict: string }
interface Report { format: string; entries: Entry[]; summary: { agree: number; disagree: number; outsideWindow: number }; flagged: boolean; error: string | null }

describe('sweep check report', () => {
  const prefix = uniquePrefix('check');
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;
  let otherToken: string;

  beforeAll(async () => {
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    otherToken = await makeToken(testRedisUrl(), prefix, 'other-lab', 'other-owner');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix, concurrency: 1 });
  });

  afterAll(async () => {
    await worker?.close(1000);
    await api?.close();
  });

  const get = (url: string, secret = token) => api.app.inject({ method: 'GET', url, headers: bearer(secret) });

  describe('when a small sweep has succeeded', () => {
    // Small βs and short times keep part of the sweep inside the series window.
    const spec = smallSpec({ label: 'checked', betas: [0.05, 0.2], times: { stop: 0.4, count: 3 } });
    let id: string;
    let status: { status: string; check: { verdict: string; flagged: boolean; counts: Report['summary']; note: string | null } | null };

    beforeAll(async () => {
      const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: spec as object });
      expect(res.statusCode).toBe(201);
      id = res.json().id;
      // The check is stored right after the result: wait for its summary on the status.
      status = await waitFor(async () => {
        const s = (await get(`/v1/sweeps/${id}`)).json();
        if (s.status === 'failed' || s.status === 'cancelled') throw new Error(`sweep ${s.status}: ${s.error}`);
        return s.status === 'succeeded' && s.check ? s : null;
      }, `sweep ${id} to be checked`, 60_000);
    }, 90_000);

    it('should serve a report with an entry and a verdict for each β and quantity', async () => {
      const r = await get(`/v1/sweeps/${id}/check`);
      expect(r.statusCode).toBe(200);
      const report = r.json() as Report;
      expect(report.format).toBe('betasweep.check/1');
      // The body is the documented response schema (non-finite numbers arrive as null).
      expect(CheckReportBody.safeParse(report).success).toBe(true);
      expect(report.error).toBeNull();
      const thermo = ['thermo:lnZ', 'thermo:energy', 'thermo:heatCapacity', 'thermo:entropy'];
      const series = ['X:avg', 'ZZ:nearest'];
      for (const b of [0, 1]) {
        for (const q of thermo) expect(report.entries.filter((e) => e.betaIndex === b && e.quantity === q), `${q} at β index ${b}`).toHaveLength(1);
        for (const q of series) {
          const times = report.entries.filter((e) => e.betaIndex === b && e.quantity === q).map((e) => e.timeIndex);
          expect(times, `${q} at β index ${b}`).toEqual([0, 1, 2]);
        }
      }
      for (const e of report.entries) expect(['agree', 'disagree', 'outside-window']).toContain(e.verdict);
      // An exact engine inside the window agrees: ln Z at β = 0.05 has a series error ~1e-16.
      expect(report.entries.find((e) => e.betaIndex === 0 && e.quantity === 'thermo:lnZ')?.verdict).toBe('agree');
      expect(report.flagged).toBe(false);
    });

    it('should show the check summary on the status report, matching the report', async () => {
      const report = (await get(`/v1/sweeps/${id}/check`)).json() as Report;
      expect(status.check).toEqual({ verdict: 'agree', flagged: false, counts: report.summary, note: null });
      // The listing carries the same summary (the dashboard's list shows it).
      const listed = (await get('/v1/sweeps?status=succeeded')).json().items.find((s: { id: string }) => s.id === id);
      expect(listed.check).toEqual(status.check);
      expect(report.summary.agree + report.summary.disagree + report.summary.outsideWindow).toBe(report.entries.length);
    });

    it('should answer 404 to another owner', async () => {
      const r = await get(`/v1/sweeps/${id}/check`, otherToken);
      expect(r.statusCode).toBe(404);
      expect(r.json().code).toBe('BSW_ERR_SWEEP_NOT_FOUND');
    });
  });

  describe('when the sweep is unknown or has no report yet', () => {
    it('should answer 404 for an unknown id', async () => {
      const r = await get('/v1/sweeps/sw_aaaaaaaaaaaaaaaa/check');
      expect(r.statusCode).toBe(404);
      expect(r.json().code).toBe('BSW_ERR_SWEEP_NOT_FOUND');
    });

    /** A sweep stored for the 'lab' owner but never enqueued, so no worker touches it. */
    const storedSweep = async (label: string) => {
      const parsed = api.ctx.planner.parse(smallSpec({ label, betas: [0.3] }));
      if (!parsed.success) throw new Error('spec invalid');
      const { plan, header } = api.ctx.planner.plan(parsed.spec, parsed.hash);
      const out = await api.ctx.store.createSweep({ owner: 'lab', spec: parsed.spec, specHash: parsed.hash, plan, header, fresh: true });
      if (out.kind === 'capped') throw new Error('capped');
      return out.id;
    };

    it('should answer 409 BSW_ERR_RESULT_NOT_READY for a sweep that has not finished', async () => {
      const pendingId = await storedSweep('pending');
      const r = await get(`/v1/sweeps/${pendingId}/check`);
      expect(r.statusCode).toBe(409);
      expect(r.json().code).toBe('BSW_ERR_RESULT_NOT_READY');
      expect(r.json().message).toMatch(/is queued/);
      expect((await get(`/v1/sweeps/${pendingId}`)).json().check).toBeNull();
    });

    it('should answer 409 for a succeeded sweep whose check is not stored yet', async () => {
      const doneId = await storedSweep('unchecked');
      expect(await api.ctx.store.completeSweep(doneId, '{}')).toBe(true);
      const r = await get(`/v1/sweeps/${doneId}/check`);
      expect(r.statusCode).toBe(409);
      expect(r.json().message).toMatch(/check report is still being computed/);
    });
  });
});
