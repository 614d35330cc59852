/**
 * Benchmarks of the mps engine (workers/src/engines/mps) and its SVD (workers/src/tensor).
 *
 * 1. truncated-svd: QR-preconditioned one-sided Jacobi on n×n complex matrices, n = 64, 128,
 *    256: a random matrix (full rank, nothing truncated) and a TEBD-like graded spectrum
 *    σ_j = e^{−j/8} truncated to rank n/4 with weight ≤ 1e-12 (LQ rank cap 1.5·n/4, as the
 *    engine does). GFLOP/s counts the algorithm's own flops from what it did (r = LQ rank,
 *    S = sweeps, k = kept): 8mnr + 8mr² + S·21r³ + 8k(m + n)r (truncated-svd.ts header).
 * 2. mps:ising-quench:L=64: H0 Ising J = 1, hx = 1.2 → H1 hx = 1.0, β ∈ {0.5, 1, 2},
 *    t = 0, 0.5, …, 5, χ ≤ 64, discarded weight ≤ 1e-12 per update, fourth order, dt = 0.05,
 *    one β per run (a branch); against the free-fermion engine (Lieb–Schultz–Mattis 1961;
 *    Pfeuty 1970): wall time, peak RSS, the largest deviation of ⟨X_i⟩, ⟨Z_iZ_{i+1}⟩ at each
 *    time, the last time with deviation ≤ 1e-5, bond dimensions and the engine's estimates.
 * Environment overrides for a quick run: BENCH_MPS_BETAS="1", BENCH_MPS_TMAX=1; BENCH_MPS_SKIP_SVD=1
 * skips part 1; BENCH_MPS_PROGRESS=1 prints the wall time at every grid point to stderr.
 * Inputs from a seeded RNG outside the timed loop; results are checked for NaN.
 *
 * Run: npx tsx tests/bench/mps/mps.bench.ts
 */
import { SweepSpec } from '../../../shared-types/src/index.js';
import type { SweepPoint } from '../../../shared-types/src/index.js';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { MpsEngine } from '../../../workers/src/engines/mps/index.js';
import { createSvdWorkspace, truncatedSvdUnchecked } from '../../../workers/src/tensor/index.js';
import type { SvdReport } from '../../../workers/src/tensor/index.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom } from '../bench-record.js';

function randomMatrix(n: number, seed: number): Float64Array {
  const rand = seededRandom(seed);
  const a = new Float64Array(2 * n * n);
  for (let k = 0; k < a.length; k++) a[k] = rand() - 0.5;
  return a;
}

/** A = diag-free product P·Σ·Q with P, Q the Q factors of random matrices (via the SVD itself). */
function gradedMatrix(n: number, seed: number, ws: ReturnType<typeof createSvdWorkspace>): Float64Array {
  const rep: SvdReport = { rank: 0, totalWeight: 0, discardedWeight: 0, lqRank: 0, sweeps: 0 };
  const factor = (s: number) => {
    const u = new Float64Array(2 * n * n);
    const sv = new Float64Array(n);
    const vh = new Float64Array(2 * n * n);
    truncatedSvdUnchecked(n, n, randomMatrix(n, s), n, n, 0, ws, u, sv, vh, rep);
    return u;
  };
  const p = factor(seed);
  const q = factor(seed + 1);
  const a = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let l = 0; l < n; l++) {
      const w = Math.exp(-l / 8);
      const pr = p[2 * (i * n + l)] * w;
      const pi = p[2 * (i * n + l) + 1] * w;
      for (let j = 0; j < n; j++) {
        const qr = q[2 * (l * n + j)];
        const qi = q[2 * (l * n + j) + 1];
        a[2 * (i * n + j)] += pr * qr - pi * qi;
        a[2 * (i * n + j) + 1] += pr * qi + pi * qr;
      }
    }
  }
  return a;
}

function svdRecords(): BenchRecord[] {
  const out: BenchRecord[] = [];
  for (const n of [64, 128, 256]) {
    const ws = createSvdWorkspace(n, n);
    for (const variant of ['random', 'graded'] as const) {
      const input = variant === 'random' ? randomMatrix(n, 100 + n) : gradedMatrix(n, 200 + n, ws);
      const maxRank = variant === 'random' ? n : n / 4;
      const maxWeight = variant === 'random' ? 0 : 1e-12;
      const cap = variant === 'random' ? Infinity : Math.ceil(1.5 * maxRank);
      const u = new Float64Array(2 * n * n);
      const s = new Float64Array(n);
      const vh = new Float64Array(2 * n * n);
      const rep: SvdReport = { rank: 0, totalWeight: 0, discardedWeight: 0, lqRank: 0, sweeps: 0 };
      const reps = n === 256 ? 3 : 5;
      const times: number[] = [];
      for (let k = 0; k <= reps; k++) {
        const a = input.slice();
        const t0 = performance.now();
        truncatedSvdUnchecked(n, n, a, n, maxRank, maxWeight, ws, u, s, vh, rep, cap);
        if (k > 0) times.push(performance.now() - t0);
      }
      if (!Number.isFinite(s[0])) throw new Error('NaN singular value');
      const r = rep.lqRank;
      const flops = 8 * n * n * r + 8 * n * r * r + rep.sweeps * 21 * r ** 3 + 8 * rep.rank * 2 * n * r;
      const ms = median(times);
      out.push({
        label: `truncated-svd:${variant}:size=${n}`,
        medianMs: ms,
        extra: { gflops: flops / (ms * 1e6), lqRank: r, sweeps: rep.sweeps, kept: rep.rank, sigma0: s[0] },
      });
    }
  }
  return out;
}

async function collectPoints(engine: { runBranch: MpsEngine['runBranch'] }, s: SweepSpec): Promise<{ points: SweepPoint[]; extra: Record<string, unknown> }> {
  const points: SweepPoint[] = [];
  let extra: Record<string, unknown> = {};
  const t0 = performance.now();
  await engine.runBranch(s, [0], {
    thermo: () => {},
    point: (p) => {
      points.push(p);
      if (process.env.BENCH_MPS_PROGRESS) console.error(`  t index ${p.timeIndex} after ${((performance.now() - t0) / 1000).toFixed(0)} s`);
    },
    diagnostics: (d) => { extra = d.extra; },
  });
  return { points, extra };
}

async function quenchRecords(): Promise<BenchRecord[]> {
  const betas = (process.env.BENCH_MPS_BETAS ?? '0.5,1,2').split(',').map(Number);
  const tmax = Number(process.env.BENCH_MPS_TMAX ?? 5);
  const out: BenchRecord[] = [];
  for (const beta of betas) {
    const s = SweepSpec.parse({
      lattice: { kind: 'chain', length: 64 },
      h0: { model: 'ising', J: 1, hx: 1.2 },
      h1: { model: 'ising', J: 1, hx: 1.0 },
      betas: [beta],
      times: { start: 0, stop: tmax, count: Math.round(tmax / 0.5) + 1 },
      observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', perPair: true }],
      tolerance: 1e-5,
      mps: { maxBond: 64, truncation: 1e-12, trotterOrder: 4, dt: 0.05 },
    });
    const reference = await collectPoints(new FreeFermionEngine(), s);
    const t0 = performance.now();
    const run = await collectPoints(new MpsEngine(), s);
    const ms = performance.now() - t0;
    const dev: number[] = [];
    const bar: number[] = [];
    for (const p of run.points) {
      const q = reference.points.find((x) => x.timeIndex === p.timeIndex)!;
      let d = 0;
      let e = 0;
      p.values.forEach((v, k) => {
        if (!Number.isFinite(v)) throw new Error('NaN in the mps values');
        d = Math.max(d, Math.abs(v - q.values[k]));
        e = Math.max(e, p.errors[k]);
      });
      dev.push(d);
      bar.push(e);
    }
    let lastGood = -1;
    for (let k = 0; k < dev.length && dev[k] <= 1e-5; k++) lastGood = k;
    const step = tmax / (dev.length - 1);
    out.push({
      label: `mps:ising-quench:beta=${beta}:size=64`,
      medianMs: ms,
      extra: {
        peakRssMb: peakRssMb(),
        tWithin1e5: lastGood < 0 ? -1 : lastGood * step,
        maxDeviation: Math.max(...dev),
        deviationByTime: dev.map((x) => x.toExponential(1)).join(','),
        errorBarByTime: bar.map((x) => x.toExponential(1)).join(','),
        bondByTime: String(run.extra.bondByTime),
        discardedWeightSum: Number(run.extra.discardedWeightSum),
        trotterErrorEstimate: Number(run.extra.trotterErrorEstimate),
        updates: Number(run.extra.imaginaryUpdates) + Number(run.extra.realUpdates),
      },
    });
    printRecords(out.slice(-1));
  }
  return out;
}

/** The SVD and the L = 64 quench benchmarks (see the file header). */
export async function run(): Promise<BenchRecord[]> {
  const svd = process.env.BENCH_MPS_SKIP_SVD ? [] : svdRecords();
  printRecords(svd);
  return [...svd, ...(await quenchRecords())];
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
