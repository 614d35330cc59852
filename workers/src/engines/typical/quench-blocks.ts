/**
 * quenchBlocks — how the quench cuts an ascending time grid into blocks for propagateToTimes.
 *
 * A block of b grid times after the previous block's last time p costs about
 *   G·K_max + Σ_j (K_j + 1)     (in axpy-pass units; G = cost of one application of H1)
 * with K_j the Chebyshev order for the offset t_j − p. Small blocks pay a fixed order overhead
 * per step (K ≈ τ + ~10 even for τ ≈ 1), large blocks pay axpys growing like b²·dτ/2. Greedy:
 * from each block start, the size with the smallest cost per grid time wins, up to `maxBlock`
 * (the memory for output vectors) and a scaled span τ ≤ MAX_REAL_TIME_TAU (short Bessel
 * recurrences, as in propagateRealTime). For G ≈ 17 and dτ ≈ 1.5 this picks b ≈ 20 and costs
 * about a third of stepping from time to time. propagateToTimes adds two orders per output pass,
 * so the model counts axpys double; halving them made b ≈ 27 on a 4 × 4 torus and the sample
 * 10 % slower (27 outputs of 1 MiB no longer fit the 32 MiB L3), so the model is left as it is.
 * Cost: O(n·maxBlock) order look-ups for n grid times (a series is built once per distinct offset).
 */
import { MAX_REAL_TIME_TAU } from '../../propagators/index.js';
import { offsetSeries } from './propagate-to-times.js';

/** Most grid times per block. */
export const MAX_BLOCK_TIMES = 32;
/** Memory the block outputs of one sample may take. */
export const BLOCK_MEMORY_BYTES = 2 ** 30;

/** Block size limit for vectors of `dim` entries: MAX_BLOCK_TIMES, or what BLOCK_MEMORY_BYTES holds (≥ 1). */
export function maxBlockTimes(dim: number): number {
  return Math.max(1, Math.min(MAX_BLOCK_TIMES, Math.floor(BLOCK_MEMORY_BYTES / (16 * dim))));
}

/**
 * Cost of one application of a compiled Pauli sum in axpy-pass units: one pass for the
 * diagonal, ≈ 1.3 per tabulated flip group (reads a table too), 1 + terms/2 per group computed
 * on the fly (a parity per term). Measured ratios on this machine; only the block sizes depend on it.
 */
export function applyPasses(diagonal: boolean, groups: number, termsPerGroup: number, tables: boolean): number {
  return (diagonal ? 1 : 0) + groups * (tables ? 1.3 : 1 + termsPerGroup / 2);
}

/** One block: grid times [start, start + count), offsets from the time `from`. */
export interface QuenchBlock {
  readonly start: number;
  readonly count: number;
  /** The time the block starts from (0 or the previous block's last time). */
  readonly from: number;
  /** Largest Chebyshev order in the block (applications of H1). */
  readonly matvecs: number;
  /** Axpy passes of the block. */
  readonly axpys: number;
}

/**
 * Blocks covering every grid time (see file header).
 * @param times - ascending grid times ≥ 0.
 * @param halfWidth - half-width a of H1's spectral interval.
 * @param applyCost - cost of one application of H1 in axpy-pass units (G).
 * @param tolerance - truncation tolerance of each output.
 * @param maxBlock - most grid times per block (≥ 1).
 */
export function quenchBlocks(
  times: readonly number[], halfWidth: number, applyCost: number, tolerance: number, maxBlock: number,
): QuenchBlock[] {
  if (!Number.isInteger(maxBlock) || maxBlock < 1) throw new RangeError(`maxBlock must be an integer ≥ 1; got ${maxBlock}`);
  const blocks: QuenchBlock[] = [];
  const orderCache = new Map<number, number>();
  const orderOf = (s: number): number => {
    let k = orderCache.get(s);
    if (k === undefined) {
      k = halfWidth > 0 ? offsetSeries([s], halfWidth, tolerance)[0].order : 0;
      orderCache.set(s, k);
    }
    return k;
  };
  let from = 0;
  let start = 0;
  while (start < times.length) {
    const offsets: number[] = [];
    for (let j = start; j < times.length && j - start < maxBlock; j++) {
      const s = times[j] - from;
      if (j > start && s * halfWidth > MAX_REAL_TIME_TAU) break;
      offsets.push(s);
    }
    const orders = offsets.map(orderOf);
    let best = 1, bestCost = Infinity, bestMatvecs = 0, bestAxpys = 0;
    let kMax = 0, axpys = 0;
    for (let b = 1; b <= offsets.length; b++) {
      kMax = Math.max(kMax, orders[b - 1]);
      axpys += orders[b - 1] + 1;
      const cost = (applyCost * kMax + axpys) / b;
      if (cost < bestCost) { bestCost = cost; best = b; bestMatvecs = kMax; bestAxpys = axpys; }
    }
    blocks.push({ start, count: best, from, matvecs: bestMatvecs, axpys: bestAxpys });
    from = times[start + best - 1];
    start += best;
  }
  return blocks;
}
