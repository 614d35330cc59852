/**
 * Benchmark of the spectral path (workers/src/engines/spectral, workers/src/linalg/hermitian-*):
 * 1. hermitianEigen, complex and real fast path, n = 64 … 512 (median of 3 after a warm-up);
 *    flop counts 16·n³ (complex) and 6·n³ (real) as in its header; the residual of the result
 *    is checked, so nothing is optimised away and a broken build fails the run.
 * 2. Side by side on one N = 10 quench (periodic XXZ ring, Δ 0.5 → 2, hz 0.1 in H0, 2 β,
 *    21 times up to t = 5; Z per site, connected nearest ZZ, E:h1): spectral with magnetisation
 *    blocks, spectral on the whole space, and the exact engine (Chebyshev on the 4^N doubled
 *    state). One timed run each (these take seconds to minutes); max |Δ| against exact;
 *    peak RSS of the process so far. Tolerance 5e-8: at d = 1024 the spectral a-priori error
 *    bound (plan-spectral.ts) is ≈ 1.9e-8, so the default 1e-8 is refused without blocks.
 * 3. Spectral on an N = 10 transverse-field Ising quench (no magnetisation symmetry: one real
 *    1024 × 1024 block).
 * Inputs are built from a seeded RNG (1) or fixed specs (2, 3) outside the timed regions.
 *
 * Run: npx tsx tests/bench/spectral/spectral.bench.ts
 */
import { performance } from 'node:perf_hooks';
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { Engine } from '../../../workers/src/engines/engine.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { SpectralEngine } from '../../../workers/src/engines/spectral/index.js';
import { createHermitianEigenWorkspace, hermitianEigen } from '../../../workers/src/linalg/hermitian-eigen.js';
import type { SweepPoint } from '../../../shared-types/src/index.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom, timeIt } from '../bench-record.js';

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

interface Run { points: SweepPoint[]; ms: number; extra: Record<string, unknown> }

async function runEngine(engine: Engine, s: SweepSpec): Promise<Run> {
  const points: SweepPoint[] = [];
  let extra: Record<string, unknown> = {};
  const plan = engine.plan(s);
  if (!plan.feasible) throw new Error(`${engine.name} refused: ${plan.refusal?.message}`);
  const t0 = performance.now();
  for (const branch of plan.branches) {
    await engine.runBranch(s, branch, {
      thermo: () => undefined,
      point: (p) => points.push(p),
      diagnostics: (d) => { extra = d.extra; },
    });
  }
  return { points, ms: performance.now() - t0, extra: { ...extra, planSeconds: plan.seconds } };
}

function maxDiff(a: SweepPoint[], b: SweepPoint[]): number {
  let m = 0;
  for (const p of a) {
    const q = b.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex)!;
    p.values.forEach((v, k) => { m = Math.max(m, Math.abs(v - q.values[k])); });
  }
  return m;
}

/** Eigen kernels at several sizes, then the N = 10 engines side by side. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const n of EIGEN_SIZES) {
    records.push(eigen(n, false));
    records.push(eigen(n, true));
  }
  const xxz = SweepSpecSchema.parse({
    lattice: { kind: 'chain', length: 10, boundary: 'periodic' },
    h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 }, h1: { model: 'xxz', J: 1, delta: 2 },
    betas: [0.5, 2], times: { start: 0, stop: 5, count: 21 },
    observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'pair', paulis: 'ZZ', connected: true }, { kind: 'energy', of: 'h1' }],
    // The whole-space spectral plan's a-priori bound at d = 1024 is ≈ 1.9e-8 (> the default 1e-8).
    tolerance: 5e-8,
  });
  const blocks = await runEngine(new SpectralEngine(), xxz);
  const whole = await runEngine(new SpectralEngine({ symmetry: 'none' }), xxz);
  const exact = await runEngine(new ExactEngine(), xxz);
  const pick = (x: Record<string, unknown>, keys: string[]) => Object.fromEntries(keys.filter((k) => k in x).map((k) => [k, x[k] as number | string]));
  const keys = ['largestBlock', 'jointBlocks', 'decomposeSeconds', 'quenchBasisSeconds', 'h1BackwardError', 'planSeconds', 'matvecs'];
  records.push({ label: 'engine:spectral-magnetisation:size=10', medianMs: blocks.ms, extra: { ...pick(blocks.extra, keys), maxDiffVsExact: maxDiff(blocks.points, exact.points), peakRssMb: peakRssMb() } });
  records.push({ label: 'engine:spectral-whole-space:size=10', medianMs: whole.ms, extra: { ...pick(whole.extra, keys), maxDiffVsExact: maxDiff(whole.points, exact.points), peakRssMb: peakRssMb() } });
  records.push({ label: 'engine:exact:size=10', medianMs: exact.ms, extra: { ...pick(exact.extra, keys), speedupOfSpectralBlocks: exact.ms / blocks.ms, peakRssMb: peakRssMb() } });
  const ising = SweepSpecSchema.parse({
    lattice: { kind: 'chain', length: 10, boundary: 'periodic' },
    h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
    betas: [0.5, 2], times: { start: 0, stop: 5, count: 21 },
    observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'energy', of: 'h1' }],
  });
  const tfim = await runEngine(new SpectralEngine(), ising);
  records.push({ label: 'engine:spectral-ising:size=10', medianMs: tfim.ms, extra: { ...pick(tfim.extra, keys), peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e) => { console.error(e); process.exitCode = 1; });
}
