/**
 * `kill -9` of a worker process mid-branch: its orphaned sandbox notices and exits, the
 * branch is retried on the other worker and resumes after the stored points, and the final
 * result has every point exactly once (and equals the local run).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import {
  SPIN_PROCESSOR, alive, bearer, localResult, makeToken, smallSpec, spawnWorker, startTestApi, testRedisUrl, uniquePrefix, waitFor,
  type WorkerProcess,
} from './support/harness.js';

const DIR = mkdtempSync(join(tmpdir(), 'bsw-kill-'));
const LOG = join(DIR, 'runs.log');

describe('worker crash', () => {
  const prefix = uniquePrefix('kill');
  let api: Api;
  let token: string;
  const procs: WorkerProcess[] = [];

  beforeAll(async () => {
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    const env = { BETASWEEP_FIXTURE_SPIN_MS: '40', BETASWEEP_FIXTURE_LOG: LOG };
    for (const id of ['w1', 'w2']) {
      procs.push(spawnWorker({
        redisUrl: testRedisUrl(), prefix, env,
        args: ['--id', id, '--processor', SPIN_PROCESSOR, '--lock-ms', '2000', '--stalled-ms', '1000', '--concurrency', '1'],
      }));
    }
    await Promise.all(procs.map((p) => p.ready));
  });

  afterAll(async () => {
    for (const p of procs) if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill('SIGTERM');
    await Promise.all(procs.map((p) => Promise.race([p.exited, new Promise((r) => setTimeout(r, 5000))])));
    await api?.close();
    rmSync(DIR, { recursive: true, force: true });
  });

  describe('when the worker running a branch is killed with SIGKILL', () => {
    it('should retry the branch on the other worker and store every point exactly once', async () => {
      const spec = smallSpec({ label: 'crash-me', betas: [0.5], times: { stop: 3, count: 60 } });
      const id = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(token), payload: spec })).json().id;
      const status = async () => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: bearer(token) })).json();
      const mid = await waitFor(async () => { const s = await status(); return s.pointsDone >= 8 ? s : null; }, 'points from the first worker', 30_000, 20);
      const victimId = mid.branches[0].worker as string;
      const victim = procs[victimId === 'w1' ? 0 : 1];
      const survivor = procs[victimId === 'w1' ? 1 : 0];
      const sandboxPid = Number(readFileSync(LOG, 'utf8').trim().split('\n').find((l) => l.startsWith('crash-me '))!.split(' ')[2]);
      expect(alive(sandboxPid)).toBe(true);

      victim.child.kill('SIGKILL');
      await victim.exited;
      // The orphaned sandbox sees its parent gone and exits by itself.
      await waitFor(async () => !alive(sandboxPid), `orphaned sandbox ${sandboxPid} to exit`, 5000, 50).catch((e) => { console.log(victim.output()); throw e; });

      const done = await waitFor(async () => { const s = await status(); return s.status === 'succeeded' || s.status === 'failed' ? s : null; }, 'the retried sweep', 60_000, 100);
      expect(done.status).toBe('succeeded');
      expect(done.branches[0].worker).toBe(victimId === 'w1' ? 'w2' : 'w1');
      expect(done.branches[0].attempts).toBe(2);
      expect(survivor.child.exitCode).toBeNull();

      // The job completes after the sweep's status (the cross-check report runs in between);
      // fetch it again once completed, or its return value is the stale one of an active job.
      const job = await waitFor(async () => {
        const j = await api.ctx.queue.queue.getJob(`${id}.0`);
        return j && (await j.getState()) === 'completed' ? api.ctx.queue.queue.getJob(`${id}.0`) : null;
      }, 'the job to complete', 30_000);
      // The retry resumed after the points the first attempt had stored.
      expect(job.returnvalue.resumedFrom['0']).toBeGreaterThanOrEqual(8);
      expect(job.returnvalue.pointsWritten).toBe(60 - job.returnvalue.resumedFrom['0']);

      const events = parseSseChunk((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/events`, headers: bearer(token) })).body).events;
      const keys = events.filter((e) => e.type === 'point').map((e) => { const p = JSON.parse(e.data); return `${p.betaIndex}:${p.timeIndex}`; });
      expect(keys).toHaveLength(60);
      expect(new Set(keys).size).toBe(60);
      const result = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: bearer(token) })).json();
      expect(result.series).toEqual((await localResult(spec)).series);
      const runs = readFileSync(LOG, 'utf8').split('\n').filter((l) => l.startsWith('crash-me '));
      expect(runs).toHaveLength(2);
      expect(runs[0].split(' ')[2]).not.toBe(runs[1].split(' ')[2]);
    });
  });
});
