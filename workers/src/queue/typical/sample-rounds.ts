/**
 * The typical engine's sample rounds, replayed from stored samples, and their split into
 * blocks (one queue job each).
 *
 * The engine (engines/typical/typical-engine.ts) runs a branch in rounds: samples [0, pilot),
 * then, while the jackknife error of the worst series is above the statistical target,
 * [t_j, t_{j+1}) with t_{j+1} = nextSampleCount(t_j, error on [0, t_j), target, cap). Each
 * decision is a function of the samples [0, t_j) alone (sample k's vector depends only on the
 * seed and k), so any process can replay the schedule from the store: round j is complete
 * when every sample below t_j is stored, and its decision is then the engine's own. No round
 * state is stored; a retried or duplicated job replays to the same targets.
 */
import { nextSampleCount } from '../../engines/typical/index.js';
import type { SampleRange, TypicalSampleRecord, TypicalSamples } from '../../engines/typical/index.js';

/** A block aims at this much work (plan estimate), seconds: partial results come this often. */
export const TARGET_BLOCK_SECONDS = 5;
/** A round is split into at least this many blocks (when it has as many samples), so 2+ workers share it. */
export const MIN_BLOCKS_PER_ROUND = 4;
/** A round is split into at most this many blocks (bounds the jobs per round). */
export const MAX_BLOCKS_PER_ROUND = 64;
/** A round of less estimated work than this stays one block (a job costs ~50 ms of its own), seconds. */
export const MIN_SPLIT_SECONDS = 0.5;

/** Where a branch's rounds stand, from what is stored. */
export interface RoundReplay {
  /** Targets of the rounds opened so far, t_1 = pilot < t_2 < … */
  readonly targets: readonly number[];
  /** True when the last round is complete and the engine would stop there. */
  readonly final: boolean;
  /** Every stored sample below the last target, records sorted by (β index, sample). */
  readonly samples: TypicalSamples;
  /** Distinct samples in `samples`. */
  readonly stored: number;
}

/** What {@link replayRounds} needs. */
export interface ReplayInput {
  readonly pilot: number;
  readonly cap: number;
  /** Statistical target σ* = (1 − TRUNCATION_SHARE)·tolerance. */
  readonly statTarget: number;
  /** Spec hash and record shape of the samples (for the TypicalSamples it builds). */
  readonly specHash: string;
  readonly times: number;
  readonly primitives: number;
  /** The stored records of each sample in [from, to), null where the sample is not stored. */
  load(from: number, to: number): Promise<Array<TypicalSampleRecord[] | null>>;
  /** The largest jackknife σ over the branch's β and series for a complete set of samples. */
  worstError(samples: TypicalSamples): number;
}

/** Replays the rounds (see file header). */
export async function replayRounds(input: ReplayInput): Promise<RoundReplay> {
  const { pilot, cap, statTarget } = input;
  const targets = [pilot];
  const records: TypicalSampleRecord[] = [];
  let stored = 0;
  let from = 0;
  const pack = (): TypicalSamples => ({
    specHash: input.specHash, primitives: input.primitives, times: input.times,
    records: [...records].sort((a, b) => a.betaIndex - b.betaIndex || a.sample - b.sample),
  });
  for (;;) {
    const to = targets[targets.length - 1];
    let complete = true;
    for (const r of await input.load(from, to)) {
      if (r) {
        records.push(...r);
        stored++;
      } else {
        complete = false;
      }
    }
    if (!complete) return { targets, final: false, samples: pack(), stored };
    const samples = pack();
    const next = nextSampleCount(to, input.worstError(samples), statTarget, cap);
    if (next <= to) return { targets, final: true, samples, stored };
    targets.push(next);
    from = to;
  }
}

/**
 * Splits the round [from, to) into blocks of whole samples: about TARGET_BLOCK_SECONDS of
 * estimated work each, but at least MIN_BLOCKS_PER_ROUND and at most MAX_BLOCKS_PER_ROUND
 * blocks (as far as the sample count allows); a round below MIN_SPLIT_SECONDS in all is one
 * block. Deterministic: the same round always gives the same blocks (their job ids dedupe).
 * @throws RangeError when the range is empty or the estimate is not positive.
 */
export function sampleBlocks(from: number, to: number, secondsPerSample: number): SampleRange[] {
  if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from < to)) throw new RangeError(`a round is a non-empty range of sample indices; got [${from}, ${to})`);
  if (!(secondsPerSample > 0)) throw new RangeError(`secondsPerSample must be positive; got ${secondsPerSample}`);
  const n = to - from;
  if (n * secondsPerSample < MIN_SPLIT_SECONDS) return [{ start: from, count: n }];
  const byTime = Math.floor(TARGET_BLOCK_SECONDS / secondsPerSample);
  const size = Math.max(1, Math.ceil(n / MAX_BLOCKS_PER_ROUND), Math.min(byTime, Math.ceil(n / MIN_BLOCKS_PER_ROUND)));
  const blocks: SampleRange[] = [];
  for (let start = from; start < to; start += size) blocks.push({ start, count: Math.min(size, to - start) });
  return blocks;
}

/** Rounds whose samples a set of `stored` samples reaches into: the least j with stored ≤ t_j (1-based). */
export function roundsReached(targets: readonly number[], stored: number): number {
  const j = targets.findIndex((t) => stored <= t);
  return j < 0 ? targets.length : j + 1;
}
