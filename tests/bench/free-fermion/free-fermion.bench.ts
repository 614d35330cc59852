/**
 * Benchmark of the free-fermion engine (workers/src/engines/free-fermion) and the dense kernels it
 * stands on (workers/src/linalg).
 *
 * Kernels (inputs from a seeded RNG outside the timed region; each result feeds a checksum and a
 * non-finite checksum fails the run):
 *   gemm:nn:size=N              C = A·B, N × N, GF/s = 2N³/time
 *   skewSchur:tridiagonal:L=…   the open transverse-field chain's Majorana matrix (bidiagonal SVD only)
 *   skewSchur:ring:L=…          the periodic chain's matrix (Householder reduction + SVD + applying Q)
 *   pfaffian:dense:size=n       Parlett–Reid on a random skew matrix, GF/s = n³/3 / time
 * Engine runs (one repetition each; the wall time includes planning-free setup, both Schur forms,
 * thermodynamics and every time point):
 *   engine:open-quench:L=1000   H0 = −ΣZZ − 0.5ΣX → H1 = −ΣZZ − 1.5ΣX, β = 1, t ∈ {0, 1, 2},
 *                               X:avg, ZZ:nearest, E:h0, E:h1 — the L = 1000 figure
 *   engine:ring-quench:L=400    the same on a ring (two parity sectors, Householder path)
 * Extra figures: Schur seconds, per-time-point seconds, peak RSS, ⟨H1⟩ drift and the gap between
 * E:h0 at t = 0 and the thermal E (two routes to the same number: a rounding yardstick).
 *
 * Run: npx tsx tests/bench/free-fermion/free-fermion.bench.ts   (or npm run bench free-fermion)
 */
import { performance } from 'node:perf_hooks';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { gemm } from '../../../workers/src/linalg/gemm.js';
import { pfaffian } from '../../../workers/src/linalg/pfaffian.js';
import { skewSchur } from '../../../workers/src/linalg/skew-schur.js';
import { parseSweepSpec } from '../../../workers/src/sweep/parse-sweep-spec.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom, timeIt } from '../bench-record.js';

function checksum(values: ArrayLike<number>, label: string): number {
  let s = 0;
  for (let i = 0; i < values.length; i += Math.max(1, Math.floor(values.length / 1024))) s += values[i];
  if (!Number.isFinite(s)) throw new Error(`${label}: non-finite checksum`);
  return s;
}

function gemmRecord(n: number): BenchRecord {
  const rand = seededRandom(n);
  const a = Float64Array.from({ length: n * n }, () => rand() - 0.5);
  const b = Float64Array.from({ length: n * n }, () => rand() - 0.5);
  const c = new Float64Array(n * n);
  const ms = median(timeIt(() => gemm({ m: n, n, k: n, a, b, c }), 3));
  return { label: `gemm:nn:size=${n}`, medianMs: ms, extra: { GFs: (2 * n ** 3) / (ms * 1e6), checksum: checksum(c, 'gemm') } };
}

/** Majorana matrix (strict lower triangle) of −JΣZZ − hΣX on L sites, open or periodic (even sector). */
function chainMatrix(L: number, h: number, ring: boolean): Float64Array {
  const n = 2 * L;
  const a = new Float64Array(n * n);
  for (let j = 0; j < L; j++) {
    a[(2 * j + 1) * n + 2 * j] = 2 * h; // A_{2j,2j+1} = −2h
    if (j + 1 < L) a[(2 * j + 2) * n + 2 * j + 1] = 2; // A_{2j+1,2j+2} = −2J
  }
  if (ring) a[(n - 1) * n] = -2; // boundary bond A_{2L−1,0} = 2J on the even sector
  return a;
}

function schurRecord(L: number, ring: boolean, reps: number): BenchRecord {
  const a = chainMatrix(L, 0.5, ring);
  let sweeps = 0;
  let sum = 0;
  const ms = median(timeIt(() => {
    const s = skewSchur(2 * L, a.slice());
    sweeps = s.sweeps;
    sum = checksum(s.eps, 'skewSchur');
  }, reps));
  return { label: `skewSchur:${ring ? 'ring' : 'tridiagonal'}:L=${L}`, medianMs: ms, extra: { n: 2 * L, sweeps, checksum: sum } };
}

function pfaffianRecord(n: number): BenchRecord {
  const rand = seededRandom(7 * n);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) a[i * n + j] = rand() - 0.5;
  const work = new Float64Array(n * n);
  let logAbs = 0;
  const ms = median(timeIt(() => { logAbs = pfaffian(n, a, n, work).logAbs; }, 3));
  if (!Number.isFinite(logAbs)) throw new Error('pfaffian: non-finite result');
  return { label: `pfaffian:dense:size=${n}`, medianMs: ms, extra: { GFs: n ** 3 / 3 / (ms * 1e6), logAbs } };
}

async function engineRecord(label: string, input: SweepSpecInput): Promise<BenchRecord> {
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`${label}: spec rejected ${JSON.stringify(parsed.issues)}`);
  const spec = parsed.spec;
  const engine = new FreeFermionEngine();
  const plan = engine.plan(spec);
  if (!plan.feasible) throw new Error(`${label}: plan refused ${JSON.stringify(plan.refusal)}`);
  const labels = engine.series(spec).map((s) => s.label);
  const points: number[][] = [];
  const stamps: number[] = [];
  let thermoEnergy = NaN;
  let diag: Record<string, unknown> = {};
  let h1Drift = NaN;
  const t0 = performance.now();
  await engine.runBranch(spec, [0], {
    thermo: (r) => { thermoEnergy = r.energy; stamps.push(performance.now()); },
    point: (p) => { points[p.timeIndex] = p.values; stamps.push(performance.now()); },
    diagnostics: (d) => { diag = d.extra; h1Drift = d.h1Drift; },
  });
  const ms = performance.now() - t0;
  const e0 = points[0][labels.indexOf('E:h0')];
  const perPoint = stamps.length > 2 ? (stamps[stamps.length - 1] - stamps[1]) / (stamps.length - 2) : NaN;
  checksum(points.flat(), label);
  return {
    label, medianMs: ms,
    extra: {
      planSeconds: plan.seconds, planMiB: plan.memoryBytes / 2 ** 20,
      schurSeconds: diag.decompositionSeconds as number, secondsPerTimePoint: perPoint / 1000,
      peakRssMiB: peakRssMb(), h1Drift, e0MinusThermalE: Math.abs(e0 - thermoEnergy),
      xAvgAtLastTime: points[points.length - 1][labels.indexOf('X:avg')],
    },
  };
}

const quench = (L: number, boundary: 'open' | 'periodic'): SweepSpecInput => ({
  lattice: { kind: 'chain', length: L, boundary },
  h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [1], times: { values: [0, 1, 2] },
  observables: [
    { kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' },
    { kind: 'energy', of: 'h0' }, { kind: 'energy', of: 'h1' },
  ],
  tolerance: 1e-8,
});

export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const n of [500, 1000]) records.push(gemmRecord(n));
  for (const L of [250, 500]) records.push(schurRecord(L, false, 3));
  records.push(schurRecord(1000, false, 1));
  for (const L of [250, 500]) records.push(schurRecord(L, true, 1));
  for (const n of [200, 400]) records.push(pfaffianRecord(n));
  records.push(await engineRecord('engine:open-quench:L=1000', quench(1000, 'open')));
  records.push(await engineRecord('engine:ring-quench:L=400', quench(400, 'periodic')));
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
