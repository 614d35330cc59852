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
 *    each β in its own child process (mps-quench-run.ts: a branch, its own peak RSS), against
 *    the free-fermion engine (Lieb–Schultz–Mattis 1961; Pfeuty 1970): wall time, peak RSS, the
 *    largest deviation of ⟨X_i⟩, ⟨Z_iZ_{i+1}⟩ at each time, the last time with deviation
 *    ≤ 1e-5, bond dimensions, the engine's estimates and the checkpoint size.
 * Environment overrides: BENCH_MPS_BETAS="1", BENCH_MPS_TMAX=1; BENCH_MPS_BUDGET_S=600 aborts
 * each β after that much wall time and reports how far it got (default: none);
 * BENCH_MPS_SKIP_SVD=1 skips part 1; BENCH_MPS_PROGRESS=1 prints the wall time at every grid
 * point to stderr.
 * Inputs from a seeded RNG outside the timed loop; results are checked for NaN.
 *
 * Run: npx tsx tests/bench/mps/mps.bench.ts
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createSvdWorkspace, truncatedSvdUnchecked } from '../../../workers/src/tensor/index.js';
import type { SvdReport } from '../../../workers/src/tensor/index.js';
import { type BenchRecord, median, printRecords, seededRandom } from '../bench-record.js';

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

/** One β of the quench in a child process (its own peak RSS); see mps-quench-run.ts. */
function quenchRecord(beta: number, tmax: number, budget: number): BenchRecord {
  const script = fileURLToPath(new URL('./mps-quench-run.ts', import.meta.url));
  const r = spawnSync(process.execPath, ['--import', 'tsx', script, String(beta), String(tmax), String(budget)], {
    encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'], maxBuffer: 16 * 2 ** 20,
  });
  const line = r.stdout.split('\n').find((l) => l.startsWith('@@quench '));
  if (r.status !== 0 || !line) throw new Error(`mps-quench-run β = ${beta} failed (exit ${r.status})`);
  return JSON.parse(line.slice('@@quench '.length)) as BenchRecord;
}

function quenchRecords(): BenchRecord[] {
  const betas = (process.env.BENCH_MPS_BETAS ?? '0.5,1,2').split(',').map(Number);
  const tmax = Number(process.env.BENCH_MPS_TMAX ?? 5);
  const budget = Number(process.env.BENCH_MPS_BUDGET_S ?? 0);
  const out: BenchRecord[] = [];
  for (const beta of betas) {
    out.push(quenchRecord(beta, tmax, budget));
    printRecords(out.slice(-1));
  }
  return out;
}

/** The SVD and the L = 64 quench benchmarks (see the file header). */
export async function run(): Promise<BenchRecord[]> {
  const svd = process.env.BENCH_MPS_SKIP_SVD ? [] : svdRecords();
  printRecords(svd);
  return [...svd, ...quenchRecords()];
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
