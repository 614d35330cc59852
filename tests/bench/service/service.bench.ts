/**
 * Service benchmarks on loopback, against a private redis-server (AOF on):
 * - service:status-poll: 100 concurrent clients polling one sweep's status for 10 s
 *   (autocannon) — p50/p90/p99 latency and requests/s (target p99 < 25 ms); once against the
 *   one-process API and once against `serve --processes 2` (service:status-poll-2-processes);
 * - service:first-point: submit → first point on the event stream, 6-site chain, warm worker
 *   (target < 500 ms);
 * - service:store-write: points/s through the idempotent point-write script (batches of 256);
 * - service:sweep-points: points/s of a whole sweep through API, queue, sandbox and store.
 * The API and the worker run as `betasweep serve` / `betasweep work` child processes, so the
 * load generator does not share their event loop.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { Redis } from 'ioredis';
import type { Result as AutocannonResult } from 'autocannon';
import { median, printRecords, type BenchRecord } from '../bench-record.js';
import { startPrivateRedis, freePort } from '../../support/private-redis.js';
import { RedisJobStore, TokenStore, type BranchRecord } from '../../../workers/src/store/index.js';
import { parseSseChunk } from '../../../services/cli/src/client/index.js';
import { newSweepFor } from '../../service/support/harness-core.js';

const CLI = fileURLToPath(new URL('../../../services/cli/bin/betasweep.mjs', import.meta.url));
const PREFIX = 'bswbench:';

function startCli(args: string[], readyPattern: RegExp): Promise<ChildProcess> {
  const child = spawn(process.execPath, [CLI, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => { out += d; if (readyPattern.test(out)) resolve(child); });
    child.stderr!.on('data', (d: Buffer) => { out += d; });
    child.once('exit', (code) => reject(new Error(`${args[0]} exited ${code}: ${out}`)));
  });
}

/**
 * autocannon (100 connections, 10 s) in its own process, so the load generator's latencies do
 * not include pauses of this process (its heap holds the earlier scenarios).
 */
function autocannonProcess(url: string, authorization: string): Promise<AutocannonResult> {
  const bin = fileURLToPath(new URL('../../../node_modules/autocannon/autocannon.js', import.meta.url));
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [bin, '-c', '100', '-d', '10', '-j', '-H', `authorization=${authorization}`, url], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout!.on('data', (d: Buffer) => { out += d; });
    child.stderr!.on('data', (d: Buffer) => { err += d; });
    child.once('exit', (code) => {
      try {
        resolve(JSON.parse(out) as AutocannonResult);
      } catch {
        reject(new Error(`autocannon exited ${code}: ${err.slice(-500)}`));
      }
    });
  });
}

const spec6 = (beta: number, count = 20) => ({
  label: `bench-${beta}`,
  lattice: { kind: 'chain', length: 6 },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [beta],
  times: { stop: 2, count },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  engine: 'exact',
});

export async function run(): Promise<BenchRecord[]> {
  const redis = await startPrivateRedis();
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const children: ChildProcess[] = [];
  const records: BenchRecord[] = [];
  const client = new Redis(redis.url);
  try {
    const token = (await new TokenStore(client, { prefix: PREFIX }).create('bench')).secret;
    const auth = { authorization: `Bearer ${token}` };
    children.push(await startCli(['serve', '--redis', redis.url, '--prefix', PREFIX, '--port', String(port), '--rate-limit', '100000000', '--max-active', '0'], /listening/));
    children.push(await startCli(['work', '--redis', redis.url, '--prefix', PREFIX, '--concurrency', '1'], /ready/));

    // Submit → first streamed point.
    const firsts: number[] = [];
    for (let i = 0; i < 7; i++) {
      const t0 = performance.now();
      const res = await fetch(`${base}/v1/sweeps?fresh=true`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(spec6(0.1 + i / 10)) });
      const { id } = (await res.json()) as { id: string };
      const stream = await fetch(`${base}/v1/sweeps/${id}/events`, { headers: auth });
      const decoder = new TextDecoder();
      let buf = '';
      let first = NaN;
      for await (const chunk of stream.body as unknown as AsyncIterable<Uint8Array>) {
        buf += decoder.decode(chunk, { stream: true });
        const { events, rest } = parseSseChunk(buf);
        buf = rest;
        if (Number.isNaN(first) && events.some((e) => e.type === 'point')) first = performance.now() - t0;
        if (events.some((e) => e.type === 'end')) break;
      }
      if (i > 0) firsts.push(first);
    }
    records.push({ label: 'service:first-point:size=6', medianMs: median(firsts), extra: { maxMs: Math.max(...firsts), runs: firsts.length, targetMs: 500 } });

    // Whole-sweep throughput (engine, sandbox, store, stream).
    {
      const t0 = performance.now();
      const res = await fetch(`${base}/v1/sweeps?fresh=true`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(spec6(0.5, 2000)) });
      const { id } = (await res.json()) as { id: string };
      let status = '';
      while (status !== 'succeeded') {
        await new Promise((r) => setTimeout(r, 50));
        status = ((await (await fetch(`${base}/v1/sweeps/${id}`, { headers: auth })).json()) as { status: string }).status;
      }
      const ms = performance.now() - t0;
      records.push({ label: 'service:sweep-points:size=6', medianMs: ms, extra: { points: 2000, pointsPerS: Math.round(2000 / (ms / 1000)) } });
    }

    // Status polling under load.
    const id = ((await (await fetch(`${base}/v1/sweeps?fresh=true`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(spec6(0.3)) })).json()) as { id: string }).id;
    await new Promise((r) => setTimeout(r, 1000));
    const poll = async (url: string, label: string, processes: number) => {
      const result = await autocannonProcess(url, auth.authorization);
      records.push({
        label,
        medianMs: result.latency.p50,
        extra: {
          p90Ms: result.latency.p90, p99Ms: result.latency.p99, reqPerS: Math.round(result.requests.average),
          non2xx: result.non2xx, errors: result.errors, processes, targetP99Ms: 25,
        },
      });
    };
    await poll(`${base}/v1/sweeps/${id}`, 'service:status-poll:connections=100', 1);
    // The same poll against `serve --processes 2` (a second API on the same Redis and prefix).
    const port2 = await freePort();
    children.push(await startCli(['serve', '--redis', redis.url, '--prefix', PREFIX, '--port', String(port2), '--rate-limit', '100000000', '--max-active', '0', '--processes', '2'], /listening/));
    await poll(`http://127.0.0.1:${port2}/v1/sweeps/${id}`, 'service:status-poll-2-processes:connections=100', 2);

    // Raw store writes.
    {
      const store = new RedisJobStore(client, { prefix: 'bswbench-store:' });
      const input = await newSweepFor({ ...spec6(1, 10_001), betas: [1, 2] } as never);
      const { id: sid } = (await store.createSweep(input)) as { id: string };
      const values = [0.123456789, -0.987654321];
      const batches: BranchRecord[][] = [];
      for (let b = 0; b < 2; b++) {
        for (let t0 = 0; t0 < 10_000; t0 += 256) {
          batches.push(Array.from({ length: Math.min(256, 10_000 - t0) }, (_, k) => ({
            kind: 'point' as const, betaIndex: b, timeIndex: t0 + k,
            json: JSON.stringify({ betaIndex: b, timeIndex: t0 + k, values, errors: [1e-9, 1e-9] }),
          })));
        }
      }
      const t0 = performance.now();
      let written = 0;
      for (const batch of batches) written += (await store.writeRecords(sid, 0, batch)) ?? 0;
      const ms = performance.now() - t0;
      records.push({ label: 'service:store-write:batch=256', medianMs: ms, extra: { points: written, pointsPerS: Math.round(written / (ms / 1000)) } });
    }
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once('exit', r)))));
    client.disconnect();
    await redis.stop();
  }
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
