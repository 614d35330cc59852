/**
 * Helpers of the service tests: a unique key prefix per test file on the shared private
 * Redis, an in-process API, tokens, worker processes, small specs, polling.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Redis } from 'ioredis';
import { inject } from 'vitest';
import { createApi, type Api, type CreateApiOptions } from '../../../services/api/src/index.js';
import { TokenStore } from '../../../workers/src/store/index.js';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';
import type { SweepResult, SweepSpecInput } from '../../../shared-types/src/index.js';

export const REPO_ROOT = fileURLToPath(new URL('../../../', import.meta.url));
export const CLI = fileURLToPath(new URL('../../../services/cli/bin/betasweep.mjs', import.meta.url));
export const SPIN_PROCESSOR = fileURLToPath(new URL('../fixtures/spin-sandbox.mjs', import.meta.url));

/** The private test Redis (started by the integration project's global setup). */
export function testRedisUrl(): string {
  return inject('redisUrl');
}

/** A key prefix no other test file uses. */
export function uniquePrefix(tag: string): string {
  return `bswt-${tag}-${randomBytes(3).toString('hex')}:`;
}

/** An API on the test Redis, with inject() for requests. */
export async function startTestApi(options: Partial<CreateApiOptions> & { prefix: string; redisUrl?: string }): Promise<Api> {
  // Tests poll status every few ms; only the rate-limit tests set a real limit. Several tests
  // store sweeps without queueing them on purpose: the outbox reconciler runs only where a
  // test turns it on (submit-outbox.redis.test.ts).
  const api = await createApi({ redisUrl: options.redisUrl ?? testRedisUrl(), rateLimitMax: 1_000_000, reconcileEveryMs: 0, ...options });
  await api.app.ready();
  return api;
}

/** Creates a token directly in the store; returns its secret. */
export async function makeToken(redisUrl: string, prefix: string, name: string, owner?: string): Promise<string> {
  const redis = new Redis(redisUrl);
  try {
    return (await new TokenStore(redis, { prefix }).create(name, owner)).secret;
  } finally {
    redis.disconnect();
  }
}

export const bearer = (secret: string) => ({ authorization: `Bearer ${secret}` });

/** A small deterministic spec: an open 4-site Ising chain, a field quench, two βs, five times. */
export function smallSpec(overrides: Partial<SweepSpecInput> = {}): SweepSpecInput {
  return {
    label: 'small',
    lattice: { kind: 'chain', length: 4 },
    h0: { model: 'ising', J: 1, hx: 0.5 },
    h1: { model: 'ising', J: 1, hx: 1.5 },
    betas: [0.5, 1],
    times: { stop: 2, count: 5 },
    observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
    engine: 'exact',
    ...overrides,
  };
}

/** The local (no Redis) result of a spec, as `betasweep run` computes it. */
export async function localResult(input: SweepSpecInput): Promise<SweepResult> {
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`spec invalid: ${JSON.stringify(parsed.issues)}`);
  return runSweep(parsed.spec);
}

/** Polls until `fn` returns a truthy value. */
export async function waitFor<T>(fn: () => Promise<T | undefined | null | false>, what: string, timeoutMs = 30_000, intervalMs = 50): Promise<T> {
  const start = Date.now();
  let last: unknown;
  for (;;) {
    try {
      const v = await fn();
      if (v) return v;
    } catch (err) {
      last = err;
    }
    if (Date.now() - start > timeoutMs) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}${last ? ` (last error: ${String(last)})` : ''}`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}

/** A `betasweep work` process. */
export interface WorkerProcess {
  child: ChildProcess;
  output(): string;
  /** Resolves once the worker printed its ready line. */
  ready: Promise<void>;
  exited: Promise<number | null>;
}

export function spawnWorker(options: { redisUrl: string; prefix: string; args?: string[]; env?: NodeJS.ProcessEnv }): WorkerProcess {
  const child = spawn(process.execPath, [CLI, 'work', '--redis', options.redisUrl, '--prefix', options.prefix, ...(options.args ?? [])], {
    cwd: REPO_ROOT,
    env: { ...process.env, ...options.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => { out += d.toString(); });
  child.stderr!.on('data', (d: Buffer) => { out += d.toString(); });
  const ready = new Promise<void>((resolve, reject) => {
    const check = () => { if (/ready \(concurrency/.test(out)) resolve(); };
    child.stdout!.on('data', check);
    child.once('exit', (code) => reject(new Error(`worker exited (${code}) before ready:\n${out}`)));
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return { child, output: () => out, ready, exited };
}

/** Is a process id alive? (A zombie — exited, not yet reaped by a parent that never waits — counts as gone.) */
export function alive(pid: number): boolean {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3) !== 'Z';
  } catch {
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  }
}


export { newSweepFor } from './harness-core.js';
