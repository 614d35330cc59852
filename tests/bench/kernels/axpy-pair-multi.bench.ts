/**
 * Benchmark of axpyPairMulti (workers/src/kernels/axpy-pair-multi.ts) against the plain loop it
 * replaced in propagateToTimes: two axpyComplex calls per output (orders k−1 and k) for B outputs.
 * Sizes: 2^14, 2^16, 2^18 complex amplitudes (the typical engine's 4 × 4 torus is 2^16), B = 20
 * outputs (the block size quenchBlocks picks there). Coefficients alternate real and imaginary,
 * as the real-time Chebyshev coefficients (−i)^k·J_k do. Inputs from a seeded RNG outside the
 * timed loop; a checksum of the outputs must be finite. Reported: median ms per call (two
 * orders for all outputs) and the ratio plain / fused.
 *
 * Run: npx tsx tests/bench/kernels/axpy-pair-multi.bench.ts
 */
import { axpyComplex, axpyPairMulti } from '../../../workers/src/kernels/index.js';
import { type BenchRecord, median, printRecords, seededRandom, timeIt } from '../bench-record.js';

const SIZES = [14, 16, 18];
const OUTPUTS = 20;
const REPS = 15;

function one(n: number): BenchRecord[] {
  const rand = seededRandom(n);
  const len = 2 * 2 ** n;
  const x0 = Float64Array.from({ length: len }, () => rand() - 0.5);
  const x1 = Float64Array.from({ length: len }, () => rand() - 0.5);
  const outs = Array.from({ length: OUTPUTS }, () => Float64Array.from({ length: len }, () => rand() - 0.5));
  const coef = new Float64Array(4 * OUTPUTS);
  for (let j = 0; j < OUTPUTS; j++) { coef[4 * j] = 1e-3 * (rand() - 0.5); coef[4 * j + 3] = 1e-3 * (rand() - 0.5); }
  const fused = median(timeIt(() => axpyPairMulti(outs, OUTPUTS, coef, x0, x1, false), REPS));
  const plain = median(timeIt(() => {
    for (let j = 0; j < OUTPUTS; j++) {
      axpyComplex(outs[j], coef[4 * j], coef[4 * j + 1], x0);
      axpyComplex(outs[j], coef[4 * j + 2], coef[4 * j + 3], x1);
    }
  }, REPS));
  let checksum = 0;
  for (const o of outs) for (let i = 0; i < len; i += 97) checksum += o[i];
  if (!Number.isFinite(checksum)) throw new Error('non-finite checksum');
  return [
    { label: `axpy-pair-multi:fused:size=${n}`, medianMs: fused, extra: { outputs: OUTPUTS, ratioPlainOverFused: plain / fused, checksum } },
    { label: `axpy-pair-multi:two-axpys:size=${n}`, medianMs: plain, extra: { outputs: OUTPUTS } },
  ];
}

/** Fused vs two plain axpys per output at N = 14, 16, 18. */
export async function run(): Promise<BenchRecord[]> {
  return SIZES.flatMap(one);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
