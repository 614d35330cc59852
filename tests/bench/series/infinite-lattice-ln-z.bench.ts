/**
 * Benchmark of the thermodynamic-limit ln Z series (workers/src/series: infiniteLatticeLnZ, the
 * linked-cluster sum at the central cell of a large torus): the highest order reached within
 * BUDGET_SECONDS, per lattice and model. Orders are tried upwards, each from scratch (no cache
 * shared between orders); the first order that takes longer than the budget ends the scan and
 * the last one inside it is reported as `orderIn10s`.
 * Models: transverse-field Ising (J = 1, hx = 0.5) and classical Ising (hx = 0) on the square
 * lattice; transverse-field Ising on the chain and triangular lattice.
 * Each series feeds a checksum; a non-finite checksum fails the run.
 *
 * Run: npx tsx tests/bench/series/infinite-lattice-ln-z.bench.ts
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { infiniteLatticeLnZ } from '../../../workers/src/series/index.js';
import { type BenchRecord, peakRssMb, printRecords } from '../bench-record.js';

/** Wall-time budget per order, seconds. */
const BUDGET_SECONDS = 10;

const cases: Array<{ name: string; spec: SweepSpec; start: number; max: number }> = [
  { name: 'square-tfim', spec: specOf('square', 0.5), start: 4, max: 12 },
  { name: 'square-classical', spec: specOf('square', 0), start: 6, max: 14 },
  { name: 'chain-tfim', spec: specOf('chain', 1), start: 8, max: 18 },
  { name: 'triangular-tfim', spec: specOf('triangular', 0.5), start: 4, max: 10 },
];

function specOf(kind: 'square' | 'chain' | 'triangular', hx: number): SweepSpec {
  const lattice = kind === 'chain'
    ? { kind, length: 40, boundary: 'periodic' }
    : { kind, size: [30, 30], boundary: ['periodic', 'periodic'] };
  return { lattice, h0: { model: 'ising', J: 1, hx, hz: 0 }, h1: { model: 'ising', J: 1, hx, hz: 0 } } as unknown as SweepSpec;
}

/** Scans orders upwards for each case (see file header). */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const c of cases) {
    let reached = 0;
    let reachedMs = 0;
    for (let n = c.start; n <= c.max; n++) {
      const t0 = performance.now();
      const s = infiniteLatticeLnZ(c.spec, n, n);
      const ms = performance.now() - t0;
      const checksum = s.reduce((a, v) => a + v, 0);
      if (!Number.isFinite(checksum)) throw new Error(`non-finite series for ${c.name} at order ${n}`);
      records.push({ label: `infiniteLatticeLnZ:${c.name}:size=${n}`, medianMs: ms, extra: { order: n, lastCoefficient: s[n] } });
      if (ms > BUDGET_SECONDS * 1000) break;
      reached = n;
      reachedMs = ms;
    }
    records.push({ label: `infiniteLatticeLnZ:${c.name}-order-in-${BUDGET_SECONDS}s:size=0`, medianMs: reachedMs, extra: { orderIn10s: reached } });
  }
  records.push({ label: 'process:peak-rss:size=0', medianMs: 0, extra: { peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
