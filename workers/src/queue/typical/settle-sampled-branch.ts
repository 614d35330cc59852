/**
 * What a sampled branch's job does after storing its samples (and what the branch's opening job
 * does alone): replay the rounds from the store, write the estimate from every stored sample
 * (version = samples merged, so an older estimate never replaces a newer one and SSE readers
 * see each point sharpen), then either queue the open round's missing blocks, or — when the
 * engine would stop — finish the branch and, if it was the last, assemble the result from the
 * samples. Every step is idempotent: a retried, duplicated or late job replays to the same
 * state and writes nothing that regresses it.
 */
import type { BranchInfo } from '../../store/index.js';
import type { BranchEnqueuer } from '../branch-job.js';
import { finalizeSweep } from '../finalize-sweep.js';
import { roundsReached } from './sample-rounds.js';
import { SampledBranch, type SampledEngine } from './sampled-branch.js';
import { versionedRecords } from './sampled-estimates.js';
import { sampledFinalRecords } from './sampled-final-records.js';

/** Records per store write. */
const WRITE_BATCH = 256;

/** Inputs of {@link settleSampledBranch}. */
export interface SettleInput {
  readonly branch: SampledBranch;
  readonly engine: SampledEngine;
  /** This job's branch state (attempt, worker, start time), reported with the samples. */
  readonly info: BranchInfo;
  readonly enqueue: BranchEnqueuer;
}

/** What settling did; `written` is null when the sweep is no longer queued or running. */
export interface SettleOutcome {
  readonly written: number | null;
  readonly final: boolean;
  readonly finalized: boolean;
}

/** Settles the branch (see file header). */
export async function settleSampledBranch(input: SettleInput): Promise<SettleOutcome> {
  const { branch, engine, info, enqueue } = input;
  const { store, sweepId, branchIndex } = branch;
  const replay = await branch.replay();
  const est = branch.estimates(replay, roundsReached(replay.targets, replay.stored));
  let written = 0;
  if (est) {
    const records = versionedRecords(est, replay.stored);
    for (let i = 0; i < records.length; i += WRITE_BATCH) {
      const n = await store.writeRecords(sweepId, branchIndex, records.slice(i, i + WRITE_BATCH));
      if (n === null) return { written: null, final: replay.final, finalized: false };
      written += n;
    }
  }
  const target = replay.targets[replay.targets.length - 1];
  const samples = { stored: replay.stored, target, final: replay.final };
  if (!replay.final) {
    const betaIndices = [...branch.betaIndices];
    await enqueue(branch.pendingBlocks(replay).map((range) => ({ sweepId, branchIndex, betaIndices, samples: range })));
    await store.branchProgress(sweepId, branchIndex, { ...info, state: 'running', samples });
    return { written, final: false, finalized: false };
  }
  const { allDone } = await store.branchFinished(sweepId, branchIndex, {
    ...info, state: 'done', finishedAt: new Date().toISOString(), error: null, samples,
  });
  const finalized = allDone && (await finalizeSweep(store, sweepId, {}, sampledFinalRecords(store, engine))) === 'succeeded';
  return { written, final: true, finalized };
}
