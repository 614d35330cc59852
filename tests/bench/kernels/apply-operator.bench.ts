/**
 * Benchmark of applyOperatorAffine (workers/src/kernels/apply-operator.ts) on single 2^N
 * vectors, tabulated groups vs the table-free compact form ({ tables: false }).
 *
 * H = −Σ Z_i Z_{i+1} − 0.7 Σ X_i + Σ (X_i X_{i+1} + Y_i Y_{i+1})/2 on an open chain, N = 14, 18, 20.
 * Byte count (pass model): one diagonal pass (read in, diagonal, out; write out: 40 B per
 * entry) plus per flip group one pass reading in, table (tabulated only) and out and writing
 * out (64 B per entry tabulated, 48 B compact). effGBs = bytes / time.
 * Inputs from a seeded RNG outside the timed loop; a checksum of the result fails on NaN.
 *
 * Run: npx tsx tests/bench/kernels/apply-operator.bench.ts
 */
import { applyOperatorAffine, compileOperator } from '../../../workers/src/kernels/index.js';
import type { PauliSum, PauliTermMask } from '../../../workers/src/physics/types.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom, timeIt } from '../bench-record.js';

const SIZES = [14, 18, 20];

function chain(n: number): PauliSum {
  const terms: PauliTermMask[] = [];
  for (let i = 0; i < n; i++) terms.push({ x: 1 << i, z: 0, weight: -0.7 });
  for (let i = 0; i + 1 < n; i++) {
    const m = (1 << i) | (1 << (i + 1));
    terms.push({ x: 0, z: m, weight: -1 }, { x: m, z: 0, weight: 0.5 }, { x: m, z: m, weight: 0.5 });
  }
  return { sites: n, terms };
}

function one(n: number, tables: boolean): BenchRecord {
  const dim = 1 << n;
  const op = compileOperator(chain(n), { tables });
  const rand = seededRandom(2000 + n);
  const input = new Float64Array(2 * dim);
  const out = new Float64Array(2 * dim);
  for (let k = 0; k < input.length; k++) { input[k] = rand() - 0.5; out[k] = rand() - 0.5; }
  const times = timeIt(() => applyOperatorAffine(op, 1, input, out, 1 / (2 * op.normBound), 0.25, 0.5), 7);
  let checksum = 0;
  for (let k = 0; k < out.length; k++) checksum += out[k];
  if (!Number.isFinite(checksum)) throw new Error('non-finite checksum');
  const ms = median(times);
  const bytes = dim * (40 + op.groups.length * (tables ? 64 : 48));
  return {
    label: `apply-operator:${tables ? 'tabulated' : 'compact'}:size=${n}`,
    medianMs: ms,
    extra: { groups: op.groups.length, effGBs: bytes / (ms * 1e6), checksum },
  };
}

/** Tabulated vs compact applyOperatorAffine at N = 14, 18, 20. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const n of SIZES) {
    records.push(one(n, true));
    records.push(one(n, false));
  }
  records.push({ label: 'process:peak-rss:size=0', medianMs: 0, extra: { peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
