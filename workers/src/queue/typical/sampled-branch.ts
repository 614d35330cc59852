/**
 * One branch of a stored sweep run by a sampled engine (`typical`): its fixed schedule
 * (pilot, cap, statistical target), its stored samples, the replayed rounds (sample-rounds.ts)
 * and estimates from whatever is stored. Pure reads; the job runner writes.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import type { Engine } from '../../engines/engine.js';
import {
  ASSUMED_FLOPS_PER_SECOND, betaOrder, TRUNCATION_SHARE, typicalPlanDetails,
} from '../../engines/typical/index.js';
import type {
  SampleRange, TypicalLayout, TypicalSampleRecord, TypicalSampling, TypicalSamples,
} from '../../engines/typical/index.js';
import type { JobStore } from '../../store/index.js';
import { decodeSample } from './sample-codec.js';
import { replayRounds, sampleBlocks, type RoundReplay } from './sample-rounds.js';
import { estimateBranch, worstStatError, type BranchEstimates } from './sampled-estimates.js';

/** An engine whose branches fan out as sample blocks (the typical engine). */
export interface SampledEngine extends Engine {
  /** Pilot round size and sample cap for a spec. */
  sampling(spec: SweepSpec): TypicalSampling;
  /** Runs sample ranges through a branch's β indices, returning the raw per-sample sums. */
  sampleRunner(spec: SweepSpec, betaIndices: readonly number[]): {
    run(range: SampleRange, options?: { signal?: AbortSignal }): Promise<TypicalSamples>;
  };
}

/** True for engines whose branches the service runs as sample blocks. */
export function isSampledEngine(engine: Engine): engine is SampledEngine {
  const e = engine as Partial<SampledEngine>;
  return typeof e.sampling === 'function' && typeof e.sampleRunner === 'function';
}

/** A sampled branch of one stored sweep (see file header). */
export class SampledBranch {
  readonly layout: TypicalLayout;
  /** The branch's β indices, ascending in β (the engine's order). */
  readonly order: readonly number[];
  readonly pilot: number;
  readonly cap: number;
  readonly statTarget: number;
  /** Plan estimate of one sample through all the branch's β, seconds (sizes the blocks). */
  readonly secondsPerSample: number;

  /** @throws RangeError when the spec cannot be set up or the β indices are not on its grid. */
  constructor(
    readonly store: JobStore, readonly sweepId: string, readonly branchIndex: number,
    readonly spec: SweepSpec, engine: SampledEngine, readonly betaIndices: readonly number[],
  ) {
    const details = typicalPlanDetails(spec);
    this.layout = details.layout;
    this.order = betaOrder(this.layout.betas, betaIndices);
    ({ pilot: this.pilot, cap: this.cap } = engine.sampling(spec));
    this.statTarget = (1 - TRUNCATION_SHARE) * spec.tolerance;
    const flops = this.order.reduce((a, b) => a + details.sampleFlops[b], 0);
    this.secondsPerSample = Math.max(1e-6, flops / ASSUMED_FLOPS_PER_SECOND);
  }

  /** Shape of every stored record: grid times × primitives. */
  get shape(): { times: number; primitives: number } {
    return { times: this.layout.times.length, primitives: this.layout.layout.primitives.length };
  }

  /** The decoded records of each sample in [from, to), null where none is stored. */
  async load(from: number, to: number): Promise<Array<TypicalSampleRecord[] | null>> {
    const indices = Array.from({ length: Math.max(0, to - from) }, (_, i) => from + i);
    const raw = await this.store.readSamples(this.sweepId, this.branchIndex, indices);
    const shape = this.shape;
    return raw.map((bytes, i) => {
      if (!bytes) return null;
      const records = decodeSample(bytes, shape);
      if (records[0].sample !== indices[i] || records.length !== this.order.length) {
        throw new RangeError(`stored sample ${this.branchIndex}:${indices[i]} holds sample ${records[0].sample} at ${records.length} β; expected ${this.order.length}`);
      }
      return records;
    });
  }

  /** Where the rounds stand (sample-rounds.ts). */
  replay(): Promise<RoundReplay> {
    return replayRounds({
      pilot: this.pilot, cap: this.cap, statTarget: this.statTarget,
      specHash: this.layout.specHash, ...this.shape,
      load: (from, to) => this.load(from, to),
      worstError: (samples) => worstStatError(this.layout, samples, this.order, this.spec.tolerance),
    });
  }

  /** Estimates from every stored sample of the replay, or null below 2 samples (no jackknife). */
  estimates(replay: RoundReplay, rounds: number): BranchEstimates | null {
    if (replay.stored < 2) return null;
    return estimateBranch(this.layout, replay.samples, this.order, this.spec.tolerance, { cap: this.cap, pilot: this.pilot, rounds });
  }

  /** The blocks of the open (last) round that still miss samples; none once final. */
  pendingBlocks(replay: RoundReplay): SampleRange[] {
    if (replay.final) return [];
    const { targets } = replay;
    const to = targets[targets.length - 1];
    const from = targets.length > 1 ? targets[targets.length - 2] : 0;
    const have = new Set(replay.samples.records.map((r) => r.sample));
    return sampleBlocks(from, to, this.secondsPerSample)
      .filter((b) => Array.from({ length: b.count }, (_, i) => b.start + i).some((k) => !have.has(k)));
  }
}
