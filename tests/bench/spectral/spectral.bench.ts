/**
 * Benchmark of the spectral path (workers/src/engines/spectral, workers/src/symmetry,
 * workers/src/linalg/hermitian-*):
 * 1. hermitianEigen, complex and real fast path, n = 64 … 512 (median of 3 after a warm-up);
 *    flop counts 16·n³ (complex) and 6·n³ (real) as in its header; the residual of the result
 *    is checked, so nothing is optimised away and a broken build fails the run.
 * 2. Side by side on one N = 10 quench (periodic XXZ ring, spectral-scenario.ts): spectral with
 *    all symmetries (magnetisation, translations, inversion), with translations, with
 *    magnetisation only, on the whole space, and the exact engine (Chebyshev on the 4^N
 *    doubled state); max |Δ| of every point against exact. The N = 10 transverse-field Ising
 *    ring (no magnetisation) with all symmetries and without.
 * 3. The largest rings the spectral engine now runs: XXZ N = 14 and 16 with all symmetries.
 * Every engine scenario runs once in its own child process (these take seconds to minutes),
 * so its peak RSS (VmHWM) is its own; the 1-minute load average before and after is recorded
 * (the machine is shared: wall times scale with it).
 *
 * Run: npx tsx tests/bench/spectral/spectral.bench.ts   (or npm run bench -- spectral)
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { createHermitianEigenWorkspace, hermitianEigen } from '../../../workers/src/linalg/hermitian-eigen.js';
import type { SweepPoint } from '../../../shared-types/src/index.js';
import { type BenchRecord, median, printRecords, seededRandom, timeIt } from '../bench-record.js';
import type { ScenarioResult } from './spectral-scenario.js';

const EIGEN_SIZES = [64, 128, 256, 512];

function eigen(n: number, real: boolean): BenchRecord {
  const r = seededRandom(3000 + n + (real ? 1 : 0));
  const a = new Float64Array(2 * n * n);
  for (let c = 0; c < n; c++) {
    for (let i = c; i < n; i++) {
      const re = r() - 0.5;
      const im = real || i === c ? 0 : r() - 0.5;
      a[2 * (i + c * n)] = re; a[2 * (i + c * n) + 1] = im;
      a[2 * (c + i * n)] = re; a[2 * (c + i * n) + 1] = -im;
    }
  }
  const w = new Float64Array(n);
  const v = new Float64Array(2 * n * n);
  const ws = createHermitianEigenWorkspace(n);
  const times = timeIt(() => hermitianEigen(n, a, w, v, {}, ws), 3);
  // Residual of the last eigenpair (uses the result; fails on NaN).
  let res = 0;
  const k = n - 1;
  for (let i = 0; i < n; i++) {
    let yr = -w[k] * v[2 * (i + k * n)], yi = -w[k] * v[2 * (i + k * n) + 1];
    for (let j = 0; j < n; j++) {
      const ar = a[2 * (i + j * n)], ai = a[2 * (i + j * n) + 1], vr = v[2 * (j + k * n)], vi = v[2 * (j + k * n) + 1];
      yr += ar * vr - ai * vi; yi += ar * vi + ai * vr;
    }
    res += yr * yr + yi * yi;
  }
  res = Math.sqrt(res);
  if (!(res < 1e-10)) throw new Error(`hermitianEigen residual ${res} at n = ${n}`);
  const ms = median(times);
  const flops = (real ? 6 : 16) * n ** 3;
  return { label: `hermitian-eigen:${real ? 'real' : 'complex'}:size=${n}`, medianMs: ms, extra: { gflops: flops / (ms * 1e6), residual: res } };
}

/** Runs one scenario in a child process (see spectral-scenario.ts). */
function scenario(engine: string, model: 'xxz' | 'ising', n: number): ScenarioResult {
  const file = join(import.meta.dirname, 'spectral-scenario.ts');
  const r = spawnSync(process.execPath, ['--import', 'tsx', file, engine, model, String(n)], { encoding: 'utf8', maxBuffer: 256 * 2 ** 20 });
  const line = r.stdout.split('\n').find((l) => l.startsWith('@@scenario '));
  if (r.status !== 0 || !line) throw new Error(`scenario ${engine} ${model}-${n} failed: ${r.stderr.trim().split('\n').slice(-3).join(' | ')}`);
  return JSON.parse(line.slice('@@scenario '.length)) as ScenarioResult;
}

function maxDiff(a: SweepPoint[], b: SweepPoint[]): number {
  let m = 0;
  for (const p of a) {
    const q = b.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex)!;
    p.values.forEach((v, k) => { m = Math.max(m, Math.abs(v - q.values[k])); });
  }
  return m;
}

const KEYS = ['symmetry', 'jointBlocks', 'largestBlock', 'basisSeconds', 'decomposeSeconds', 'quenchBasisSeconds', 'h1BackwardError', 'matvecs'];

function record(engine: string, model: string, n: number, r: ScenarioResult, extra: Record<string, number | string> = {}): BenchRecord {
  const picked = Object.fromEntries(KEYS.filter((k) => k in r.extra).map((k) => [k, r.extra[k] as number | string]));
  return {
    label: `engine:${engine}${model === 'xxz' ? '' : `-${model}`}:size=${n}`,
    medianMs: r.ms,
    extra: { ...picked, planSeconds: r.planSeconds, peakRssMb: r.peakRssMb, load1Before: r.loadBefore, load1After: r.loadAfter, ...extra },
  };
}

/** Eigen kernels at several sizes, then the engine scenarios side by side. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const n of EIGEN_SIZES) {
    records.push(eigen(n, false));
    records.push(eigen(n, true));
  }
  const exact = scenario('exact', 'xxz', 10);
  for (const engine of ['spectral-all', 'spectral-translations', 'spectral-magnetisation', 'spectral-none']) {
    const r = scenario(engine, 'xxz', 10);
    records.push(record(engine, 'xxz', 10, r, { maxDiffVsExact: maxDiff(r.points, exact.points), speedupVsExact: exact.ms / r.ms }));
  }
  records.push(record('exact', 'xxz', 10, exact));
  const isingAll = scenario('spectral-all', 'ising', 10);
  const isingNone = scenario('spectral-none', 'ising', 10);
  records.push(record('spectral-all', 'ising', 10, isingAll, { maxDiffVsWholeSpace: maxDiff(isingAll.points, isingNone.points) }));
  records.push(record('spectral-none', 'ising', 10, isingNone));
  for (const n of [14, 16]) records.push(record('spectral-all', 'xxz', n, scenario('spectral-all', 'xxz', n)));
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e) => { console.error(e); process.exitCode = 1; });
}
