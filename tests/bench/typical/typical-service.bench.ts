/**
 * The typical engine through the service: issue 5's 4 × 4 periodic TFIM quench (hx 1.5 → 2.5,
 * 4 β, 100 times, 16 samples per β) submitted to `betasweep serve` and run by two
 * `betasweep work` processes (one sandbox each) on a private redis-server. Its sample blocks
 * fan out over both workers; the wall time runs from submit to the succeeded status.
 * Reported: wall time (target < 60 s), time to the first (partial) point and to the first
 * point at full sample count, point events streamed, block jobs and their busy seconds, and
 * the load average at start and end (the machine is shared).
 * The fixed count comes from a fixture processor (fixed-samples-processor.ts): the registry's
 * engine would choose its count from the tolerance.
 *
 * Run: npx tsx tests/bench/typical/typical-service.bench.ts   (or npm run bench typical-service)
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { printRecords, type BenchRecord } from '../bench-record.js';
import { freePort, startPrivateRedis } from '../../support/private-redis.js';
import { TokenStore } from '../../../workers/src/store/index.js';
import { BRANCH_QUEUE, queuePrefix } from '../../../workers/src/queue/index.js';
import { parseSseChunk } from '../../../services/cli/src/client/index.js';

const CLI = fileURLToPath(new URL('../../../services/cli/bin/betasweep.mjs', import.meta.url));
const PROCESSOR = fileURLToPath(new URL('./fixed-samples-sandbox.mjs', import.meta.url));
const PREFIX = 'bswbench-typical:';
const SAMPLES = 16;

const SQUARE = {
  label: 'bench-typical-4x4', engine: 'typical',
  lattice: { kind: 'square', size: [4, 4], boundary: ['periodic', 'periodic'] },
  h0: { model: 'ising', J: 1, hx: 1.5 }, h1: { model: 'ising', J: 1, hx: 2.5 },
  betas: [0.25, 0.5, 1, 2], times: { start: 0, stop: 2, count: 100 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 0.05, seed: 1,
};

function startCli(args: string[], readyPattern: RegExp, env: NodeJS.ProcessEnv = {}): Promise<ChildProcess> {
  const child = spawn(process.execPath, [CLI, ...args], { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, ...env } });
  let out = '';
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => { out += d; if (readyPattern.test(out)) resolve(child); });
    child.stderr!.on('data', (d: Buffer) => { out += d; });
    child.once('exit', (code) => reject(new Error(`${args[0]} exited ${code}: ${out}`)));
  });
}

const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');

export async function run(): Promise<BenchRecord[]> {
  const redis = await startPrivateRedis();
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const children: ChildProcess[] = [];
  const client = new Redis(redis.url);
  const queue = new Queue(BRANCH_QUEUE, { connection: client, prefix: queuePrefix(PREFIX) });
  try {
    const token = (await new TokenStore(client, { prefix: PREFIX }).create('bench')).secret;
    const auth = { authorization: `Bearer ${token}` };
    children.push(await startCli(['serve', '--redis', redis.url, '--prefix', PREFIX, '--port', String(port), '--rate-limit', '100000000', '--max-active', '0'], /listening/));
    const env = { BETASWEEP_BENCH_SAMPLES: String(SAMPLES) };
    for (const id of ['b1', 'b2']) {
      children.push(await startCli(['work', '--redis', redis.url, '--prefix', PREFIX, '--concurrency', '1', '--id', id, '--processor', PROCESSOR], /ready/, env));
    }
    const loadStart = load();
    const t0 = performance.now();
    const res = await fetch(`${base}/v1/sweeps`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(SQUARE) });
    const { id } = (await res.json()) as { id: string };
    const stream = await fetch(`${base}/v1/sweeps/${id}/events`, { headers: auth });
    const decoder = new TextDecoder();
    let buf = '';
    let firstPoint = NaN;
    let firstFull = NaN;
    let succeeded = NaN;
    let pointEvents = 0;
    let finalStatus = '';
    for await (const chunk of stream.body as unknown as AsyncIterable<Uint8Array>) {
      buf += decoder.decode(chunk, { stream: true });
      const { events, rest } = parseSseChunk(buf);
      buf = rest;
      for (const e of events) {
        if (e.type === 'point') {
          pointEvents++;
          const p = JSON.parse(e.data) as { samples?: number };
          if (Number.isNaN(firstPoint)) firstPoint = performance.now() - t0;
          if (Number.isNaN(firstFull) && p.samples === SAMPLES) firstFull = performance.now() - t0;
        } else if (e.type === 'status') {
          finalStatus = (JSON.parse(e.data) as { status: string }).status;
          if (finalStatus === 'succeeded') succeeded = performance.now() - t0;
        }
      }
      if (events.some((e) => e.type === 'end')) break;
    }
    if (finalStatus !== 'succeeded') throw new Error(`sweep ended ${finalStatus}`);
    const result = (await (await fetch(`${base}/v1/sweeps/${id}/result`, { headers: auth })).json()) as { diagnostics: Array<{ extra: Record<string, unknown> }>; series: Array<{ errors: number[][] }> };
    if (!result.series.every((s) => s.errors.flat().every(Number.isFinite))) throw new Error('non-finite error in the result');
    const jobs = (await queue.getJobs(['completed'])).filter((j) => j?.data?.sweepId === id && j.data.samples);
    const busy = jobs.map((j) => ((j.finishedOn ?? 0) - (j.processedOn ?? 0)) / 1000);
    return [{
      label: 'service:typical-square4x4-2workers:size=16',
      medianMs: succeeded,
      extra: {
        betas: 4, times: 100, samplesPerBeta: result.diagnostics.map((d) => d.extra.samples).join('/'),
        wallSeconds: (succeeded / 1000).toFixed(1), target60s: succeeded <= 60_000 ? 'met' : 'not met',
        firstPointSeconds: (firstPoint / 1000).toFixed(1), firstFullPointSeconds: (firstFull / 1000).toFixed(1), pointEvents,
        blockJobs: jobs.length, blockBusySeconds: busy.reduce((a, b) => a + b, 0).toFixed(1), longestBlockSeconds: Math.max(...busy).toFixed(1),
        loadStart, loadEnd: load(),
      },
    }];
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once('exit', r)))));
    await queue.close();
    client.disconnect();
    await redis.stop();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
