/**
 * A `typical` sweep through the real queue: two `betasweep work` processes share its sample
 * blocks; while it runs, the status report shows each branch's samples and the event stream
 * re-sends every point with more samples and smaller error bars; one worker is killed with
 * SIGKILL mid-run and its block is retried by the other without counting a sample twice; the
 * final result equals the local run bit for bit (same samples [0, R), same summation order —
 * see typical-fanout.test.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { BranchJobResult } from '../../workers/src/queue/index.js';
import {
  bearer, localResult, makeToken, smallSpec, spawnWorker, startTestApi, testRedisUrl, uniquePrefix, waitFor, type WorkerProcess,
} from './support/harness.js';

/** 13-site chain, 2 β × 40 times; tolerance 0.01 takes 2–3 rounds of ~0.2 s samples (one per block). */
const SPEC = smallSpec({
  label: 'typical-queue', lattice: { kind: 'chain', length: 13 }, engine: 'typical', tolerance: 0.01, seed: 3,
  h0: { model: 'ising', J: 1, hx: 0.7 }, betas: [0.5, 1.5], times: { stop: 2, count: 40 },
});

describe('typical sweep on two workers', () => {
  const prefix = uniquePrefix('typical');
  let api: Api;
  let token: string;
  const procs: WorkerProcess[] = [];

  beforeAll(async () => {
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    for (const id of ['t1', 't2']) {
      procs.push(spawnWorker({ redisUrl: testRedisUrl(), prefix, args: ['--id', id, '--lock-ms', '2000', '--stalled-ms', '1000', '--concurrency', '1'] }));
    }
    await Promise.all(procs.map((p) => p.ready));
  });

  afterAll(async () => {
    for (const p of procs) if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill('SIGTERM');
    await Promise.all(procs.map((p) => Promise.race([p.exited, new Promise((r) => setTimeout(r, 5000))])));
    await api?.close();
  });

  describe('when its sample blocks run on both workers and one worker is killed mid-run', () => {
    it('should sharpen the points while running and end with the local result, no sample counted twice', async () => {
      const id = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: SPEC })).json().id as string;
      const status = async () => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();
      const queue = api.ctx.queue.queue;
      const jobsOf = async () => (await queue.getJobs(['active', 'waiting', 'delayed', 'completed', 'failed', 'prioritized']))
        .filter((j) => j?.data?.sweepId === id);

      // Mid-run: both workers busy with blocks, more waiting, a partial estimate on record.
      const mid = await waitFor(async () => {
        const s = await status();
        const busy = await queue.getActiveCount();
        const waiting = (await jobsOf()).filter((j) => j.finishedOn === undefined && j.processedOn === undefined).length;
        return s.status === 'running' && busy === 2 && waiting >= 2 && s.branches.some((b: { samples?: { stored: number } }) => (b.samples?.stored ?? 0) >= 2) ? s : null;
      }, 'both workers on sample blocks', 60_000, 20);
      // (Both active jobs are this sweep's: the queue is private to the test's prefix.)
      for (const b of mid.branches) if (b.samples) expect(b.samples.final).toBe(false);

      const [victim] = procs;
      victim.child.kill('SIGKILL');
      await victim.exited;

      const done = await waitFor(async () => { const s = await status(); return ['succeeded', 'failed'].includes(s.status) ? s : null; }, 'the sweep', 120_000, 100);
      expect(done.status, done.error).toBe('succeeded');
      const result = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) })).json();
      const local = await localResult(SPEC);
      expect(result.series).toEqual(local.series);
      expect(result.thermo).toEqual(local.thermo);
      expect(result.diagnostics).toEqual(local.diagnostics);
      const used = local.diagnostics.map((d) => Number(d.extra.samples));
      expect(done.branches.map((b: { samples: unknown }) => b.samples)).toEqual(used.map((n) => ({ stored: n, target: n, final: true })));

      // The block the victim held ran again on the survivor, computing only what was missing.
      const jobs = await waitFor(async () => {
        const all = await jobsOf();
        return all.every((j) => j.finishedOn) ? all : null;
      }, 'every job to finish', 30_000);
      const blocks = jobs.filter((j) => j.data.samples);
      expect(new Set(blocks.map((j) => j.data.branchIndex))).toEqual(new Set([0, 1]));
      const retried = blocks.filter((j) => (j.attemptsStarted ?? 0) >= 2);
      expect(retried.length).toBeGreaterThanOrEqual(1);
      for (const j of retried) {
        const out = BranchJobResult.parse(j.returnvalue);
        expect(out.samples!.computed + out.samples!.alreadyStored).toBe(j.data.samples.count);
      }

      // The stream, before the final status: every point re-sent with more samples each time,
      // ending with the final values. Which partial sets are merged depends on timing; the
      // pilot's (samples [0, 4), fixed by the seed) always is, and its error bars are wider.
      const events = parseSseChunk((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) })).body).events;
      const succeededAt = events.findIndex((e) => e.type === 'status' && JSON.parse(e.data).status === 'succeeded');
      const points = events.slice(0, succeededAt).filter((e) => e.type === 'point').map((e) => JSON.parse(e.data));
      const rms = (ps: Array<{ errors: number[] }>) => Math.sqrt(ps.flatMap((p) => p.errors).reduce((a, e) => a + e * e, 0) / (2 * ps.length));
      for (const [b, n] of used.entries()) {
        for (const t of [0, 20, 39]) {
          const versions = points.filter((p) => p.betaIndex === b && p.timeIndex === t);
          const counts = versions.map((p) => p.samples as number);
          expect(counts.length).toBeGreaterThanOrEqual(2);
          expect(counts).toEqual([...new Set(counts)].sort((x, y) => x - y));
          expect(counts[counts.length - 1]).toBe(n);
          expect(versions[versions.length - 1].values).toEqual(local.series.map((s) => s.values[b][t]));
        }
        const pilot = points.filter((p) => p.betaIndex === b && p.samples === 4);
        const final = points.filter((p) => p.betaIndex === b && p.samples === n);
        expect(pilot).toHaveLength(40);
        expect(final).toHaveLength(40);
        expect(rms(pilot)).toBeGreaterThan(rms(final));
      }
    });
  });
});
