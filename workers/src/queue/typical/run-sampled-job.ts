/**
 * One job of a sampled branch (`typical`): the branch's opening job (no `samples` in its data)
 * only settles, which queues the first round's blocks; a block job computes the samples of its
 * block that are not stored yet — one at a time, each stored as soon as it is computed, keyed by
 * its index, so a retried or duplicated block never counts a sample twice and a killed one
 * loses at most the sample in hand — and then settles (settle-sampled-branch.ts).
 * Without an enqueuer (in-process use) the queued blocks run here, one after another.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import type { BranchInfo, JobStore } from '../../store/index.js';
import type { BranchEnqueuer, BranchJobData, BranchJobResult } from '../branch-job.js';
import { branchJobId } from '../queue-names.js';
import { watchBranch } from '../branch-watch.js';
import { BranchJobInvalidError } from '../errors/branch-job-invalid-error.js';
import { encodeSample } from './sample-codec.js';
import { SampledBranch, type SampledEngine } from './sampled-branch.js';
import { settleSampledBranch } from './settle-sampled-branch.js';

/** Inputs of {@link runSampledJob} (runStoredBranch has checked the sweep, the plan and the engine). */
export interface SampledJobOptions {
  readonly store: JobStore;
  readonly data: BranchJobData;
  readonly spec: SweepSpec;
  readonly engine: SampledEngine;
  readonly attempt: number;
  readonly workerId: string;
  readonly pollMs: number;
  readonly signal?: AbortSignal;
  /** Where new sample blocks go. @defaultValue run them in this process after this job */
  readonly enqueue?: BranchEnqueuer;
}

const now = () => new Date().toISOString();

/** Runs the job (see file header); the same contract as runStoredBranch. */
export async function runSampledJob(options: SampledJobOptions): Promise<BranchJobResult> {
  if (options.enqueue) return runOne(options, options.enqueue);
  const pending: BranchJobData[] = [];
  const ids = new Set<string>();
  const enqueue: BranchEnqueuer = async (jobs) => {
    for (const j of jobs) {
      const id = branchJobId(j.sweepId, j.branchIndex, j.samples);
      if (!ids.has(id)) { ids.add(id); pending.push(j); }
    }
  };
  let result = await runOne(options, enqueue);
  while (pending.length > 0 && result.outcome === 'done') {
    const next = await runOne({ ...options, data: pending.shift()!, attempt: 1 }, enqueue);
    result = { ...next, pointsWritten: result.pointsWritten + next.pointsWritten, finalized: result.finalized || next.finalized };
  }
  return result;
}

async function runOne(options: SampledJobOptions, enqueue: BranchEnqueuer): Promise<BranchJobResult> {
  const { store, data, spec, engine, attempt, workerId, pollMs, signal } = options;
  const { sweepId, branchIndex, betaIndices, samples: range } = data;
  const skipped: BranchJobResult = { outcome: 'skipped', pointsWritten: 0, resumedFrom: {}, finalized: false };
  const branch = new SampledBranch(store, sweepId, branchIndex, spec, engine, betaIndices);
  if (range && range.start + range.count > branch.cap) {
    throw new BranchJobInvalidError(`sample block [${range.start}, ${range.start + range.count}) of branch ${branchIndex} of ${sweepId} passes the cap of ${branch.cap} samples`);
  }
  const prior = await store.getBranch(sweepId, branchIndex);
  const info: BranchInfo = {
    state: 'running', attempts: attempt, worker: workerId, startedAt: now(), finishedAt: null, error: null,
    ...(prior?.samples ? { samples: prior.samples } : {}),
  };
  // A late duplicate of a finished branch's block (a retry whose first run stored everything)
  // leaves the branch's 'done' state alone.
  const started = prior?.state === 'done'
    ? ['queued', 'running'].includes((await store.getStatus(sweepId)) ?? '')
    : await store.branchStarted(sweepId, branchIndex, info);
  if (!started) return skipped;
  // The sweep left queued/running under this job: cancelled, or finished by another job's
  // settle (a block that ends with the last one); only a cancel changes the branch's state.
  const stopped = async (): Promise<BranchJobResult> => {
    if ((await store.getStatus(sweepId)) !== 'cancelled') return skipped;
    await store.branchUpdated(sweepId, branchIndex, { ...info, state: 'cancelled', finishedAt: now() });
    return { outcome: 'cancelled', pointsWritten: 0, resumedFrom: {}, finalized: false };
  };

  const watch = watchBranch(store, sweepId, workerId, pollMs, signal);
  try {
    let computed = 0;
    let alreadyStored = 0;
    if (range) {
      const indices = Array.from({ length: range.count }, (_, i) => range.start + i);
      const stored = await store.readSamples(sweepId, branchIndex, indices);
      let runner: ReturnType<SampledEngine['sampleRunner']> | undefined;
      for (const [i, k] of indices.entries()) {
        if (stored[i]) { alreadyStored++; continue; }
        watch.signal.throwIfAborted();
        runner ??= engine.sampleRunner(spec, betaIndices);
        const one = await runner.run({ start: k, count: 1 }, { signal: watch.signal });
        const count = await store.writeSamples(sweepId, branchIndex, [{ sample: k, data: encodeSample(one.records, branch.shape) }]);
        if (count === null) return await stopped();
        computed++;
      }
    }
    if (watch.reason() === 'cancelled') return await stopped();
    const settled = await settleSampledBranch({ branch, engine, info, enqueue });
    if (settled.written === null) return await stopped();
    return { outcome: 'done', pointsWritten: settled.written, resumedFrom: {}, finalized: settled.finalized, samples: { computed, alreadyStored } };
  } catch (err) {
    const why = watch.reason();
    if (why === 'cancelled') return await stopped();
    // Hand-back or orphan: the samples stored so far stay (each is final); the job goes back.
    if (why) throw watch.signal.reason;
    throw err;
  } finally {
    watch.dispose();
  }
}
