/**
 * Benchmark of the typical engine (workers/src/engines/typical): wall time, peak RSS against
 * the plan's memory, and the state throughput of the Pauli applications against the machine's
 * triad bandwidth (tests/bench/triad.ts).
 *
 * Scenarios (BETASWEEP_BENCH_TYPICAL = comma list to pick; default all, in this order):
 *  - square4x4: 4 × 4 periodic TFIM quench hx 1.5 → 2.5, 4 β, 100 times, 16 samples per β
 *    (issue 5's figure). The 4 one-β branches run in 2 child processes at once ("2 workers"),
 *    and the per-branch times are reported too.
 *  - chain20: open TFIM chain L = 20 quench hx 0.5 → 1.5, β ∈ {0.5, 1}, t = 0 … 1 (5 times),
 *    16 samples, compared with the free-fermion solution (Lieb, Schultz & Mattis 1961; the
 *    reference of tests/support/reference/free-fermion-ising.ts): max |z| and RMS z.
 *  - chain24: open TFIM chain L = 24, β = 0.5, t ∈ {0, 0.25}, 2 samples: per-sample time and RSS.
 * Throughput: stateGBs counts 2 × 16 B × 2^N per H application over the whole sweep's wall time
 * (everything included: axpys, measurements); kernelGBs times one H1 application alone with the
 * pass-model byte count (one pass per flip group), and kernelRatio = kernelGBs / triad.
 * Peak RSS (VmHWM) is read before the triad arrays are allocated.
 * Each scenario uses its results (errors must be finite) so nothing is optimised away.
 *
 * Run: npx tsx tests/bench/typical/typical.bench.ts    (or npm run bench typical)
 */
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { SweepSpec, SweepSpecInput } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { Collected } from '../../unit/exact/collect.js';
import { TypicalEngine, typicalSetup } from '../../../workers/src/engines/typical/index.js';
import { applyOperatorAffine } from '../../../workers/src/kernels/index.js';
import { openTfimQuench } from '../../support/reference/free-fermion-ising.js';
import {
  median, peakRssMb, printRecords, seededRandom, timeIt, type BenchRecord,
} from '../bench-record.js';
import { triadBandwidth } from '../triad.js';

const SQUARE: SweepSpecInput = {
  lattice: { kind: 'square', size: [4, 4], boundary: ['periodic', 'periodic'] },
  h0: { model: 'ising', J: 1, hx: 1.5 }, h1: { model: 'ising', J: 1, hx: 2.5 },
  betas: [0.25, 0.5, 1, 2], times: { start: 0, stop: 2, count: 100 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 0.05, seed: 1,
};
const CHAIN20: SweepSpecInput = {
  lattice: { kind: 'chain', length: 20, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1], times: { start: 0, stop: 1, count: 5 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 0.05, seed: 1,
};
const CHAIN24: SweepSpecInput = {
  lattice: { kind: 'chain', length: 24, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5], times: { values: [0, 0.25] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  tolerance: 0.05, seed: 1,
};

/** Runs β branches with a fixed sample count (pilot = cap = samples). */
async function runBranches(s: SweepSpec, branches: number[][], samples: number): Promise<{ out: Collected; branchSeconds: number[] }> {
  const engine = new TypicalEngine({ maxSamples: samples, pilotSamples: samples });
  const out: Collected = { thermo: [], points: [], diagnostics: [] };
  const branchSeconds: number[] = [];
  for (const b of branches) {
    const t0 = performance.now();
    await engine.runBranch(s, b, {
      thermo: (r) => out.thermo.push(r), point: (p) => out.points.push(p), diagnostics: (d) => out.diagnostics.push(d),
    });
    branchSeconds.push((performance.now() - t0) / 1000);
  }
  for (const p of out.points) if (!p.errors.every(Number.isFinite)) throw new Error('non-finite error in a point');
  return { out, branchSeconds };
}

/** Sweep-level figures: matvecs, wall time per matvec, and the minimal-traffic state GB/s. */
function throughput(n: number, matvecs: number, seconds: number) {
  const stateGBs = (matvecs * 2 * 16 * 2 ** n) / (seconds * 1e9);
  return { matvecs, msPerMatvec: (seconds * 1000) / matvecs, stateGBs };
}

/**
 * One application of the scenario's H1 as the engine compiles it (tables up to 18 sites), timed
 * alone: pass-model bytes (diagonal pass 40 B per entry; per flip group 64 B tabulated, 48 B
 * computed on the fly — as in tests/bench/kernels/apply-operator.bench.ts) over the median time.
 */
function kernelGBs(s: SweepSpec): { applyMs: number; kernelGBs: number } {
  const setup = typicalSetup(s);
  const dim = setup.dim;
  const rand = seededRandom(77);
  const input = new Float64Array(2 * dim).map(() => rand() - 0.5);
  const out = new Float64Array(2 * dim);
  const ms = median(timeIt(() => applyOperatorAffine(setup.h1Op, 1, input, out, 0.01, 0.5, 0), 3));
  if (!Number.isFinite(out[7])) throw new Error('non-finite apply result');
  const bytes = dim * ((setup.h1Op.diagonal ? 40 : 0) + setup.h1Op.groups.length * (setup.tables ? 64 : 48));
  return { applyMs: ms, kernelGBs: bytes / (ms * 1e6) };
}

const matvecsOf = (out: Collected) => out.diagnostics.reduce((a, d) => a + Number(d.extra.matvecs ?? 0), 0);

/** Child-process entry: run the given β branches of the 4 × 4 scenario, print JSON. */
async function worker(branches: number[][]): Promise<void> {
  const s = SweepSpecSchema.parse(SQUARE);
  const { out, branchSeconds } = await runBranches(s, branches, 16);
  process.stdout.write(`@@worker ${JSON.stringify({ branchSeconds, matvecs: matvecsOf(out), peakRssMb: peakRssMb() })}\n`);
}

function spawnWorker(branches: number[][]): Promise<{ branchSeconds: number[]; matvecs: number; peakRssMb: number }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--worker', JSON.stringify(branches)], { stdio: ['ignore', 'pipe', 'inherit'] });
    let text = '';
    child.stdout.on('data', (d: Buffer) => { text += d.toString(); });
    child.on('error', reject);
    child.on('close', (code) => {
      const line = text.split('\n').find((l) => l.startsWith('@@worker '));
      if (code !== 0 || !line) reject(new Error(`worker exited with ${code}`));
      else resolve(JSON.parse(line.slice('@@worker '.length)));
    });
  });
}

async function square4x4(): Promise<BenchRecord> {
  const s = SweepSpecSchema.parse(SQUARE);
  const plan = new TypicalEngine().plan(s);
  const t0 = performance.now();
  // Two workers: β indices {0, 3} and {1, 2} (balanced: imaginary time grows with β).
  const [a, b] = await Promise.all([spawnWorker([[0], [3]]), spawnWorker([[1], [2]])]);
  const wall = (performance.now() - t0) / 1000;
  const busy = [...a.branchSeconds, ...b.branchSeconds].reduce((x, y) => x + y, 0);
  return {
    label: 'sweep:typical-square4x4-2workers:size=16',
    medianMs: wall * 1000,
    extra: {
      betas: 4, times: 100, samplesPerBeta: 16,
      branchSeconds: [a.branchSeconds[0], b.branchSeconds[0], b.branchSeconds[1], a.branchSeconds[1]].map((x) => x.toFixed(1)).join('/'),
      oneCoreSeconds: busy, target60s: wall <= 60 ? 'met' : 'not met',
      ...throughput(16, a.matvecs + b.matvecs, busy), ...kernelGBs(s),
      peakRssMb: Math.max(a.peakRssMb, b.peakRssMb), planMb: plan.memoryBytes / 2 ** 20, planSeconds: plan.seconds,
    },
  };
}

async function chain20(): Promise<BenchRecord> {
  const s = SweepSpecSchema.parse(CHAIN20);
  const plan = new TypicalEngine().plan(s);
  const t0 = performance.now();
  const { out } = await runBranches(s, [[0, 1]], 16);
  const seconds = (performance.now() - t0) / 1000;
  const times = [0, 0.25, 0.5, 0.75, 1];
  const zs: number[] = [];
  for (const b of [0, 1]) {
    const ref = openTfimQuench({ length: 20, J: 1, h0: 0.5, h1: 1.5, beta: s.betas[b], times });
    const t = out.thermo.find((r) => r.betaIndex === b)!;
    for (const key of ['lnZ', 'energy', 'heatCapacity'] as const) zs.push((t[key] - ref.thermo[key]) / t.errors[key]);
    for (const p of out.points.filter((q) => q.betaIndex === b)) {
      zs.push((p.values[0] - ref.x[p.timeIndex].reduce((x, v) => x + v, 0) / 20) / p.errors[0]);
      zs.push((p.values[1] - ref.zz[p.timeIndex].reduce((x, v) => x + v, 0) / 19) / p.errors[1]);
    }
  }
  return {
    label: 'sweep:typical-chain20-vs-free-fermion:size=20',
    medianMs: seconds * 1000,
    extra: {
      samples: 16, values: zs.length,
      maxAbsZ: Math.max(...zs.map(Math.abs)), rmsZ: Math.sqrt(zs.reduce((x, z) => x + z * z, 0) / zs.length),
      maxError: Math.max(...out.points.flatMap((p) => p.errors)),
      secondsPerSample: seconds / 16,
      peakRssMb: peakRssMb(),
      ...throughput(20, matvecsOf(out), seconds), ...kernelGBs(s), planMb: plan.memoryBytes / 2 ** 20, planSeconds: plan.seconds,
    },
  };
}

async function chain24(): Promise<BenchRecord> {
  const s = SweepSpecSchema.parse(CHAIN24);
  const plan = new TypicalEngine().plan(s);
  const t0 = performance.now();
  const { out } = await runBranches(s, [[0]], 2);
  const seconds = (performance.now() - t0) / 1000;
  return {
    label: 'sweep:typical-chain24:size=24',
    medianMs: seconds * 1000,
    extra: {
      samples: 2, secondsPerSample: seconds / 2,
      energy: out.thermo[0].energy, energyError: out.thermo[0].errors.energy,
      peakRssMb: peakRssMb(),
      ...throughput(24, matvecsOf(out), seconds), ...kernelGBs(s), planMb: plan.memoryBytes / 2 ** 20, planSeconds: plan.seconds,
      within24GiB: peakRssMb() < 24 * 1024 ? 'yes' : 'no',
    },
  };
}

/**
 * The scenarios picked by BETASWEEP_BENCH_TYPICAL (default all). The triad bandwidth is taken
 * from BETASWEEP_BENCH_TRIAD_GBS or measured after the scenarios (its 384 MB of arrays would
 * otherwise count in their peak RSS).
 */
export async function run(): Promise<BenchRecord[]> {
  const pick = (process.env.BETASWEEP_BENCH_TYPICAL ?? 'square4x4,chain20,chain24').split(',');
  const records: BenchRecord[] = [];
  if (pick.includes('square4x4')) records.push(await square4x4());
  if (pick.includes('chain20')) records.push(await chain20());
  if (pick.includes('chain24')) records.push(await chain24());
  const triad = Number(process.env.BETASWEEP_BENCH_TRIAD_GBS) || triadBandwidth();
  for (const r of records) {
    r.extra.triadGBs = triad;
    r.extra.kernelRatio = Number(r.extra.kernelGBs) / triad;
  }
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const w = process.argv.indexOf('--worker');
  const job = w >= 0 ? worker(JSON.parse(process.argv[w + 1]) as number[][]) : run().then(printRecords);
  job.catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
