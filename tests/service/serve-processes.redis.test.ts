/**
 * `betasweep serve --processes N`: N API processes share one port (node:cluster), answer the
 * same sweeps (state in Redis), a process that dies is replaced, SIGTERM stops them all with
 * exit code 0, and a start-up failure (the port taken) stops the lot with exit code 1.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from '../support/private-redis.js';
import { CLI, REPO_ROOT, alive, bearer, makeToken, smallSpec, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

function serve(args: string[]): { child: ChildProcess; output: () => string; exited: Promise<number | null> } {
  const child = spawn(process.execPath, [CLI, 'serve', ...args], { cwd: REPO_ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => { out += d; });
  child.stderr!.on('data', (d: Buffer) => { out += d; });
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return { child, output: () => out, exited };
}

/** Pids of the API processes forked by `pid` (its children running the CLI; a first start also leaves esbuild's service child from the dashboard build). */
function childPids(pid: number): number[] {
  let pids: number[];
  try {
    pids = execFileSync('pgrep', ['-P', String(pid)], { encoding: 'utf8' }).split('\n').filter(Boolean).map(Number);
  } catch {
    return [];
  }
  return pids.filter((p) => {
    try {
      return readFileSync(`/proc/${p}/cmdline`, 'utf8').includes('betasweep.mjs');
    } catch {
      return false;
    }
  });
}

describe('serve --processes', () => {
  const prefix = uniquePrefix('procs');
  const started: ChildProcess[] = [];
  afterAll(() => { for (const c of started) if (c.exitCode === null) c.kill('SIGKILL'); });

  describe('when two processes share the port', () => {
    it('should run two processes that answer the sweeps, replace one that dies, and stop all on SIGTERM with exit code 0', async () => {
      const port = await freePort();
      const s = serve(['--redis', testRedisUrl(), '--prefix', prefix, '--port', String(port), '--processes', '2']);
      started.push(s.child);
      await waitFor(async () => /listening on .*\(2 processes\)/.test(s.output()), 'the listening line', 60_000);
      const pids = childPids(s.child.pid!);
      expect(pids).toHaveLength(2);
      const token = await makeToken(testRedisUrl(), prefix, 'procs-user');
      const base = `http://127.0.0.1:${port}`;
      const submitted = await fetch(`${base}/v1/sweeps`, { method: 'POST', headers: { ...bearer(token), 'content-type': 'application/json' }, body: JSON.stringify(smallSpec()) });
      expect(submitted.status).toBe(201);
      const { id } = (await submitted.json()) as { id: string };
      // Fresh connections are handed out round-robin; whichever process answers sees the sweep.
      for (let i = 0; i < 6; i++) {
        const res = await fetch(`${base}/v1/sweeps/${id}`, { headers: { ...bearer(token), connection: 'close' } });
        expect(res.status).toBe(200);
        expect(((await res.json()) as { id: string }).id).toBe(id);
      }
      process.kill(pids[0], 'SIGKILL');
      const replaced = await waitFor(async () => {
        const now = childPids(s.child.pid!);
        return now.length === 2 && !now.includes(pids[0]) ? now : null;
      }, 'a replacement process', 30_000);
      expect(replaced).toContain(pids[1]);
      expect(s.output()).toMatch(/API process \d+ exited \(SIGKILL\); starting another/);
      await waitFor(async () => (await fetch(`${base}/healthz`, { headers: { connection: 'close' } }).then((r) => r.ok, () => false)), 'the API after the replacement', 30_000);
      s.child.kill('SIGTERM');
      expect(await s.exited).toBe(0);
      for (const p of replaced) expect(alive(p)).toBe(false);
    });
  });

  describe('when the port is taken', () => {
    it.each(['1', '2'])('should stop every process and exit with code 1, naming the failure (--processes %s)', async (processes) => {
      const blocker = createServer();
      const port = await new Promise<number>((resolve) => blocker.listen(0, '127.0.0.1', () => resolve((blocker.address() as { port: number }).port)));
      try {
        const s = serve(['--redis', testRedisUrl(), '--prefix', prefix, '--port', String(port), '--processes', processes]);
        started.push(s.child);
        expect(await s.exited).toBe(1);
        expect(s.output()).toMatch(/EADDRINUSE/);
        if (processes === '2') expect(s.output()).toMatch(/before all processes were listening; stopping/);
        expect(s.output()).not.toMatch(/reconcile failed/);
      } finally {
        blocker.close();
      }
    }, 60_000);
  });
});
