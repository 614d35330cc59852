/**
 * Benchmark of applyDoubledAffine (workers/src/kernels/apply-doubled.ts) against a memory
 * bandwidth yardstick.
 *
 * 1. triad a[i] = b[i] + s·c[i] over three 2^24-double arrays (128 MiB each): bytes counted as
 *    2 reads + 1 write = 24 bytes per element (write-allocate traffic not counted, as is
 *    common practice for the triad figure).
 * 2. applyDoubledAffine(a = H, b = −Hᵀ) with α = 1/(2·normBound), β = 0.25, γ = 0.5 (γ ≠ 0 so
 *    `out` is read, as in a Chebyshev recurrence; |γ| < 1 keeps repeated calls bounded) for two chain Hamiltonians at N = 8, 9, 10 (4^N = 2^16,
 *    2^18, 2^20 complex amplitudes):
 *      ising-x:  −Σ Z_i Z_{i+1} − 0.7 Σ X_i − 0.1 Σ Z_i   (open chain; G = N flip groups per side)
 *      xx-yy:    Σ (X_i X_{i+1} + Y_i Y_{i+1} + 0.5 Z_i Z_{i+1})   (G = N − 1 flip groups per side)
 *    Byte count ("pass model"): the kernel makes 1 fused diagonal pass plus one pass per flip
 *    group of A and of B; each pass is counted as a full read of `in`, read of `out` and write
 *    of `out`, 48 bytes per complex amplitude. passes = 1 + G_A + G_B. effGBs = passes·48·4^N
 *    / time; ratio = effGBs / triad GB/s. minGBs is the compulsory traffic only (one pass).
 * Inputs come from a seeded RNG outside the timed loop; each result feeds a checksum and the
 * run fails on a non-finite checksum.
 *
 * Run: npx tsx tests/bench/kernels/apply-doubled.bench.ts
 */
import { applyDoubledAffine, compileOperator, scaleSum, transposeSum } from '../../../workers/src/kernels/index.js';
import type { PauliSum, PauliTermMask } from '../../../workers/src/physics/types.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom, timeIt } from '../bench-record.js';

const TRIAD_DOUBLES = 2 ** 24;
const TRIAD_REPS = 7;
const SIZES = [8, 9, 10];
const BYTES_PER_AMPLITUDE_PASS = 48;

function isingX(n: number): PauliSum {
  const terms: PauliTermMask[] = [];
  for (let i = 0; i + 1 < n; i++) terms.push({ x: 0, z: (1 << i) | (1 << (i + 1)), weight: -1 });
  for (let i = 0; i < n; i++) terms.push({ x: 1 << i, z: 0, weight: -0.7 });
  for (let i = 0; i < n; i++) terms.push({ x: 0, z: 1 << i, weight: -0.1 });
  return { sites: n, terms };
}

function xxYy(n: number): PauliSum {
  const terms: PauliTermMask[] = [];
  for (let i = 0; i + 1 < n; i++) {
    const m = (1 << i) | (1 << (i + 1));
    terms.push({ x: m, z: 0, weight: 1 }, { x: m, z: m, weight: 1 }, { x: 0, z: m, weight: 0.5 });
  }
  return { sites: n, terms };
}

function triad(): BenchRecord {
  const rand = seededRandom(7);
  const a = new Float64Array(TRIAD_DOUBLES);
  const b = new Float64Array(TRIAD_DOUBLES);
  const c = new Float64Array(TRIAD_DOUBLES);
  for (let i = 0; i < TRIAD_DOUBLES; i++) { b[i] = rand(); c[i] = rand(); }
  let s = 0.5;
  const times = timeIt(() => {
    for (let i = 0; i < TRIAD_DOUBLES; i++) a[i] = b[i] + s * c[i];
    s = -s;
  }, TRIAD_REPS);
  let checksum = 0;
  for (let i = 0; i < TRIAD_DOUBLES; i += 4096) checksum += a[i];
  if (!Number.isFinite(checksum)) throw new Error('triad produced a non-finite checksum');
  const ms = median(times);
  return {
    label: `triad:float64:size=${TRIAD_DOUBLES}`,
    medianMs: ms,
    extra: { GBs: (24 * TRIAD_DOUBLES) / (ms * 1e6), checksum },
  };
}

function doubled(variant: string, sum: PauliSum, triadGBs: number): BenchRecord {
  const n = sum.sites;
  const dim = 2 ** n;
  const amps = dim * dim;
  const a = compileOperator(sum);
  const b = compileOperator(scaleSum(transposeSum(sum), -1));
  const rand = seededRandom(1000 + n);
  const input = new Float64Array(2 * amps);
  const out = new Float64Array(2 * amps);
  for (let k = 0; k < input.length; k++) { input[k] = rand() - 0.5; out[k] = rand() - 0.5; }
  const reps = n >= 10 ? 9 : 15;
  // γ = 0.5: out converges instead of growing, and does not cycle back to its start value.
  const times = timeIt(() => applyDoubledAffine(a, b, input, out, 1 / (2 * a.normBound), 0.25, 0.5), reps);
  let checksum = 0;
  for (let k = 0; k < out.length; k += 64) checksum += out[k];
  if (!Number.isFinite(checksum)) throw new Error(`${variant} produced a non-finite checksum`);
  const ms = median(times);
  const passes = 1 + a.groups.length + b.groups.length;
  const effGBs = (passes * BYTES_PER_AMPLITUDE_PASS * amps) / (ms * 1e6);
  return {
    label: `apply-doubled:${variant}:size=${n}`,
    medianMs: ms,
    extra: {
      amplitudes: amps,
      passes,
      effGBs,
      ratio: effGBs / triadGBs,
      minGBs: (BYTES_PER_AMPLITUDE_PASS * amps) / (ms * 1e6),
      nsPerAmpPass: (ms * 1e6) / (amps * passes),
      checksum,
    },
  };
}

/** Run the triad yardstick and applyDoubledAffine at N = 8, 9, 10 for two Hamiltonians. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  const t = triad();
  records.push(t);
  const triadGBs = t.extra.GBs as number;
  for (const n of SIZES) {
    records.push(doubled('ising-x', isingX(n), triadGBs));
    records.push(doubled('xx-yy', xxYy(n), triadGBs));
  }
  records.push({ label: 'process:peak-rss:size=0', medianMs: 0, extra: { peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
