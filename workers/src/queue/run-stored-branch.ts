/**
 * Runs one branch of a stored sweep against a JobStore: the core of the queue processor,
 * free of BullMQ so it also runs in-process. It resumes after the points already stored,
 * streams new records to the store, polls for cancel and hand-back, and assembles the result
 * when it finishes the last branch. A sampled engine's branch (`typical`) runs instead as
 * sample-block jobs whose estimate sharpens as they finish (queue/typical/run-sampled-job.ts).
 */
import { SweepSpec } from '../../../shared-types/src/index.js';
import type { BranchCheckpoints, Engine } from '../engines/engine.js';
import type { BranchInfo, JobStore } from '../store/index.js';
import type { BranchEnqueuer, BranchJobData, BranchJobResult } from './branch-job.js';
import { BranchJobInvalidError } from './errors/branch-job-invalid-error.js';
import { finalizeSweep } from './finalize-sweep.js';
import { StoreSink } from './store-sink.js';
import { watchBranch } from './branch-watch.js';
import { isSampledEngine, runSampledJob } from './typical/index.js';

/** Picks the engine for a spec; throws (or returns a refusal) for an impossible one. */
export type EngineResolver = (spec: SweepSpec) => Promise<{ engine: Engine; feasible: boolean; reason: string }>;

/** Options of {@link runStoredBranch}. */
export interface RunStoredBranchOptions {
  store: JobStore;
  data: BranchJobData;
  /** Which attempt this is (1 on the first run). @defaultValue 1 */
  attempt?: number;
  /** Names the worker in the branch state and selects its hand-back flag. @defaultValue 'local' */
  workerId?: string;
  /** Picks the engine. @defaultValue the sweep runner's `selectEngine` */
  resolveEngine?: EngineResolver;
  /** External stop (BullMQ's cancel signal, an orphaned sandbox). Its reason may be a BranchAbortedError reason. */
  signal?: AbortSignal;
  /** Interval between cancel/hand-back polls, ms. @defaultValue 200 */
  pollMs?: number;
  /** Sink batching window, ms. @defaultValue 20 */
  flushMs?: number;
  /**
   * Least wall time between two periodic engine checkpoints, seconds (engines that resume save
   * their state through the store: engines/branch-checkpoints.ts). @defaultValue 60
   */
  checkpointSeconds?: number;
  /**
   * Where a sampled engine's branch (`typical`) queues its sample blocks (queue/typical/).
   * @defaultValue none: the blocks run in this call, one after another
   */
  enqueue?: BranchEnqueuer;
}

/** The sweep runner's engine choice, loaded on first use (it pulls in every engine). */
export const defaultEngineResolver: EngineResolver = async (spec) => {
  const { selectEngine } = await import('../sweep/index.js');
  const { engine, plan } = selectEngine(spec);
  return { engine, feasible: plan.feasible, reason: plan.refusal?.message ?? plan.reason };
};

const now = () => new Date().toISOString();

/** Default least interval between periodic engine checkpoints, seconds. */
export const DEFAULT_CHECKPOINT_SECONDS = 60;

/**
 * The checkpoint hook of one branch: load/save through the store. A save first drains the
 * sink, so the stored points always reach at least as far as the checkpoint; a save the store
 * refuses (the sweep ended) is ignored.
 */
function storeCheckpoints(store: JobStore, sweepId: string, branchIndex: number, sink: StoreSink, intervalSeconds: number): BranchCheckpoints {
  return {
    intervalSeconds,
    load: () => store.loadCheckpoint(sweepId, branchIndex),
    save: async (data) => {
      await sink.drain();
      await store.saveCheckpoint(sweepId, branchIndex, data);
    },
  };
}

/**
 * Runs the branch. Resolves with the outcome (done, cancelled, skipped); rejects with a
 * BranchAbortedError('handback') when the worker hands the branch back, with a
 * BranchJobInvalidError for an invalid stored spec (never retry), or with any other error
 * (retry).
 */
export async function runStoredBranch(options: RunStoredBranchOptions): Promise<BranchJobResult> {
  const {
    store, data, attempt = 1, workerId = 'local', resolveEngine = defaultEngineResolver, signal,
    pollMs = 200, flushMs = 20, checkpointSeconds = DEFAULT_CHECKPOINT_SECONDS,
  } = options;
  const { sweepId, branchIndex, betaIndices } = data;
  const skipped: BranchJobResult = { outcome: 'skipped', pointsWritten: 0, resumedFrom: {}, finalized: false };

  const record = await store.getSweep(sweepId);
  if (!record || record.status === 'succeeded' || record.status === 'failed' || record.status === 'cancelled') return skipped;
  const spec = SweepSpec.safeParse(record.spec);
  if (!spec.success) throw new BranchJobInvalidError(`stored spec of ${sweepId} is invalid: ${spec.error.issues[0]?.message ?? 'unknown'}`);
  const planned = record.plan.branches[branchIndex];
  if (!planned || planned.join(',') !== betaIndices.join(',')) {
    throw new BranchJobInvalidError(`branch ${branchIndex} of ${sweepId} does not match the plan (β indices ${betaIndices.join(',')})`);
  }
  const { engine, feasible, reason } = await resolveEngine(spec.data);
  if (!feasible) throw new BranchJobInvalidError(`engine refused the spec: ${reason}`);
  if (isSampledEngine(engine)) {
    return runSampledJob({ store, data, spec: spec.data, engine, attempt, workerId, pollMs, signal, enqueue: options.enqueue });
  }
  if (data.samples) throw new BranchJobInvalidError(`branch ${branchIndex} of ${sweepId}: the ${engine.name} engine does not run sample blocks`);

  const info: BranchInfo = { state: 'running', attempts: attempt, worker: workerId, startedAt: now(), finishedAt: null, error: null };
  if (!(await store.branchStarted(sweepId, branchIndex, info))) return skipped;

  const timeCount = record.header.times.length;
  const resumeFrom = await store.storedPointCounts(sweepId, betaIndices, timeCount);

  const watch = watchBranch(store, sweepId, workerId, pollMs, signal);
  const { stop } = watch;
  const sink = new StoreSink(store, sweepId, branchIndex, { flushMs, onRejected: () => stop('cancelled') });

  try {
    try {
      const checkpoints = storeCheckpoints(store, sweepId, branchIndex, sink, checkpointSeconds);
      await engine.runBranch(spec.data, betaIndices, sink, { signal: watch.signal, resumeFrom, checkpoints });
      await sink.drain();
    } catch (err) {
      const why = watch.reason();
      if (why !== null) {
        if (why === 'cancelled') {
          sink.discard();
          await store.branchUpdated(sweepId, branchIndex, { ...info, state: 'cancelled', finishedAt: now() });
          return { outcome: 'cancelled', pointsWritten: sink.written, resumedFrom: resumeFrom, finalized: false };
        }
        // Hand-back or orphan: keep what is computed (writes are idempotent), then give the branch up.
        await sink.drain().catch(() => undefined);
        if (why === 'handback') await store.branchUpdated(sweepId, branchIndex, { ...info, state: 'queued', error: null });
        throw watch.signal.reason;
      }
      // An ordinary failure: keep what was computed before it, so the retry resumes later.
      await sink.drain().catch(() => undefined);
      throw err;
    }
    if (watch.reason() === 'cancelled') {
      return { outcome: 'cancelled', pointsWritten: sink.written, resumedFrom: resumeFrom, finalized: false };
    }
    const { allDone } = await store.branchFinished(sweepId, branchIndex, { ...info, state: 'done', finishedAt: now() });
    const finalized = allDone ? (await finalizeSweep(store, sweepId)) === 'succeeded' : false;
    return { outcome: 'done', pointsWritten: sink.written, resumedFrom: resumeFrom, finalized };
  } finally {
    watch.dispose();
  }
}
