/**
 * runTypicalSamples — the typical engine's unit of fan-out: a range of samples through a list
 * of β indices, returning the raw per-sample accumulators (typical-samples.ts) instead of
 * estimates. A sweep's samples can run as any number of such calls, on any machines; merged
 * with mergeTypicalSamples and estimated with estimateTypicalBeta they give the same numbers
 * as one call over all samples.
 *
 * Memory: 3 vectors of 16·2^N bytes (4 with several β) plus the widest quench block's outputs
 * (quench-blocks.ts: ≤ 32 vectors and ≤ 1 GiB), the compiled H0 and H1 (typical-setup.ts), and
 * the records: 8·times·primitives bytes per (sample, β). Cost: see plan-typical.ts.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { quenchBlocks, applyPasses, maxBlockTimes } from './quench-blocks.js';
import type { QuenchBlock } from './quench-blocks.js';
import { allocateSampleBuffers, quenchCalls, runSample } from './run-sample.js';
import type { SampleBuffers } from './run-sample.js';
import { typicalBudget } from './typical-budget.js';
import type { TypicalBudget } from './typical-budget.js';
import type { SampleRange, TypicalSampleRecord, TypicalSamples } from './typical-samples.js';
import { typicalSetup } from './typical-setup.js';
import type { TypicalSetup } from './typical-setup.js';
import { boundIntervals, IntervalMissError, narrowIntervals } from './typical-intervals.js';
import type { NarrowedIntervals } from './typical-intervals.js';

/** Options of {@link runTypicalSamples}. */
export interface TypicalSamplesOptions {
  /** Aborts between grid times (rejects with an AbortError). */
  readonly signal?: AbortSignal;
  /** Called after each finished sample with its records (e.g. to stream them out). */
  readonly onSample?: (records: readonly TypicalSampleRecord[]) => void;
  /** A setup already built for this spec (saves compiling H0 and H1 again). */
  readonly setup?: TypicalSetup;
}

/** Largest sample index + 1 (sample indices are generator stream numbers, < 2^32). */
export const MAX_SAMPLE_INDEX = 2 ** 32;

/** The β indices of a branch, checked, de-duplicated and sorted by β. */
export function betaOrder(betas: readonly number[], betaIndices: readonly number[]): number[] {
  for (const b of betaIndices) {
    if (!Number.isInteger(b) || b < 0 || b >= betas.length) {
      throw new RangeError(`betaIndices: ${b} is not an index of the β grid (0..${betas.length - 1})`);
    }
  }
  return [...new Set(betaIndices)].sort((p, q) => betas[p] - betas[q]);
}

/** Options of {@link TypicalSampleRunner}. */
export interface TypicalRunnerOptions {
  /**
   * Narrow the setup's Chebyshev intervals to Lanczos estimates (typical-intervals.ts); false
   * runs on the setup's intervals as given (a sample that reports an IntervalMissError still
   * falls back to the bounds when those intervals are narrower). @defaultValue true
   */
  readonly narrow?: boolean;
}

/**
 * A runner that keeps its setup, budget and buffers across calls (the engine's adaptive rounds).
 * It runs on narrowed intervals and redoes a sample on the rigorous bounds when the sample
 * reports an IntervalMissError (same buffers; blocks no wider than the narrowed schedule's).
 */
export class TypicalSampleRunner {
  /** The setup the samples run on (narrowed intervals unless options.narrow is false). */
  readonly setup: TypicalSetup;
  readonly order: readonly number[];
  /** The Lanczos reports, when the intervals were narrowed. */
  readonly intervals: NarrowedIntervals | null;
  readonly #budget: TypicalBudget;
  readonly #buffers: SampleBuffers;
  readonly #blocks: readonly QuenchBlock[];
  readonly #blockTolerance: number;
  #fallback: { setup: TypicalSetup; blocks: readonly QuenchBlock[] } | null = null;
  #fallbacks = 0;

  /** @throws RangeError on a bad β index or an impossible spec. */
  constructor(spec: SweepSpec, betaIndices: readonly number[], setup?: TypicalSetup, options: TypicalRunnerOptions = {}) {
    const { narrow = true } = options;
    const base = setup ?? typicalSetup(spec);
    this.order = betaOrder(base.betas, betaIndices);
    this.#budget = typicalBudget(base.layout, spec.tolerance, base.sites, base.h0NormBound,
      this.order.map((b) => base.betas[b]));
    this.#blockTolerance = this.#budget.realTolerance / quenchCalls(base.times);
    const length = 2 * base.dim;
    const work: [Float64Array, Float64Array] = [new Float64Array(length), new Float64Array(length)];
    if (narrow && this.order.length > 0) {
      const narrowed = narrowIntervals(base, work[0], work[1]);
      this.setup = narrowed.setup;
      this.intervals = narrowed.reports;
    } else {
      this.setup = base;
      this.intervals = null;
    }
    this.#blocks = this.#schedule(this.setup, maxBlockTimes(base.dim));
    const widest = this.#blocks.reduce((a, b) => Math.max(a, b.count), 1);
    this.#buffers = allocateSampleBuffers(base.dim, this.order.length > 1, widest, work);
  }

  /** The quench blocks every sample uses (for diagnostics and benchmarks). */
  get blocks(): readonly QuenchBlock[] {
    return this.#blocks;
  }

  /** Samples this runner redid on the rigorous bounds after an IntervalMissError. */
  get fallbacks(): number {
    return this.#fallbacks;
  }

  #schedule(setup: TypicalSetup, maxBlock: number): QuenchBlock[] {
    const { h1Op, times, tables } = setup;
    const groups = h1Op.groups.length;
    const terms = groups === 0 ? 0 : h1Op.groups.reduce((a, g) => a + g.zMasks.length, 0) / groups;
    return quenchBlocks(times, (setup.h1Interval.hi - setup.h1Interval.lo) / 2,
      applyPasses(h1Op.diagonal !== null, groups, terms, tables), this.#blockTolerance, maxBlock);
  }

  async #sample(k: number, signal: AbortSignal | undefined): Promise<TypicalSampleRecord[]> {
    const common = { budget: this.#budget, order: this.order, sample: k, buffers: this.#buffers, blockTolerance: this.#blockTolerance, signal };
    try {
      return await runSample({ ...common, setup: this.setup, blocks: this.#blocks });
    } catch (e) {
      if (!(e instanceof IntervalMissError) || onBounds(this.setup)) throw e;
      this.#fallbacks += 1;
      if (this.#fallback === null) {
        const setup = boundIntervals(this.setup);
        this.#fallback = { setup, blocks: this.#schedule(setup, this.#buffers.block.length) };
      }
      return runSample({ ...common, ...this.#fallback });
    }
  }

  /** Runs samples [range.start, range.start + range.count); records sorted by (β index, sample). */
  async run(range: SampleRange, options: Pick<TypicalSamplesOptions, 'signal' | 'onSample'> = {}): Promise<TypicalSamples> {
    const { start, count } = range;
    if (!Number.isInteger(start) || start < 0) throw new RangeError(`sampleRange.start must be a non-negative integer; got ${start}`);
    if (!Number.isInteger(count) || count < 0 || start + count > MAX_SAMPLE_INDEX) {
      throw new RangeError(`sampleRange.count must be a non-negative integer with start + count ≤ 2^32; got ${count}`);
    }
    const records: TypicalSampleRecord[] = [];
    for (let k = start; k < start + count && this.order.length > 0; k++) {
      const recs = await this.#sample(k, options.signal);
      options.onSample?.(recs);
      records.push(...recs);
    }
    records.sort((a, b) => a.betaIndex - b.betaIndex || a.sample - b.sample);
    return {
      specHash: this.setup.specHash,
      primitives: this.setup.layout.primitives.length,
      times: this.setup.times.length,
      records,
    };
  }
}

/** Whether a setup already runs on its rigorous bounds (nothing to fall back to). */
function onBounds(s: TypicalSetup): boolean {
  const same = (a: { lo: number; hi: number }, b: { lo: number; hi: number }) => a.lo === b.lo && a.hi === b.hi;
  return same(s.h0Interval, s.h0Bound) && same(s.h1Interval, s.h1Bound) && s.h0Ground === s.h0Bound.hi;
}

/**
 * Runs samples `sampleRange` of the spec at `betaIndices` (each sample walks the β list in
 * ascending β, quenching at each) and returns their raw accumulators.
 * @throws RangeError on a bad β index, a bad range or a lattice beyond the engine's reach.
 */
export async function runTypicalSamples(
  spec: SweepSpec, betaIndices: readonly number[], sampleRange: SampleRange, options: TypicalSamplesOptions = {},
): Promise<TypicalSamples> {
  const runner = new TypicalSampleRunner(spec, betaIndices, options.setup);
  return runner.run(sampleRange, options);
}
