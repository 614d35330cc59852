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

/** A runner that keeps its setup, budget and buffers across calls (the engine's adaptive rounds). */
export class TypicalSampleRunner {
  readonly setup: TypicalSetup;
  readonly order: readonly number[];
  readonly #budget: TypicalBudget;
  readonly #buffers: SampleBuffers;
  readonly #blocks: readonly QuenchBlock[];
  readonly #blockTolerance: number;

  /** @throws RangeError on a bad β index or an impossible spec. */
  constructor(spec: SweepSpec, betaIndices: readonly number[], setup?: TypicalSetup) {
    this.setup = setup ?? typicalSetup(spec);
    this.order = betaOrder(this.setup.betas, betaIndices);
    this.#budget = typicalBudget(this.setup.layout, spec.tolerance, this.setup.sites, this.setup.h0NormBound,
      this.order.map((b) => this.setup.betas[b]));
    const { h1Op, times, tables } = this.setup;
    this.#blockTolerance = this.#budget.realTolerance / quenchCalls(times);
    const groups = h1Op.groups.length;
    const terms = groups === 0 ? 0 : h1Op.groups.reduce((a, g) => a + g.zMasks.length, 0) / groups;
    this.#blocks = quenchBlocks(times, (this.setup.h1Interval.hi - this.setup.h1Interval.lo) / 2,
      applyPasses(h1Op.diagonal !== null, groups, terms, tables), this.#blockTolerance, maxBlockTimes(this.setup.dim));
    const widest = this.#blocks.reduce((a, b) => Math.max(a, b.count), 1);
    this.#buffers = allocateSampleBuffers(this.setup.dim, this.order.length > 1, widest);
  }

  /** The quench blocks every sample uses (for diagnostics and benchmarks). */
  get blocks(): readonly QuenchBlock[] {
    return this.#blocks;
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
      const recs = await runSample({
        setup: this.setup, budget: this.#budget, order: this.order, sample: k, buffers: this.#buffers,
        blocks: this.#blocks, blockTolerance: this.#blockTolerance, signal: options.signal,
      });
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
