/**
 * Builds the sandboxed processor function: parse job.data, run the branch against the Redis
 * store, report the outcome. Runs inside the BullMQ sandbox child, whose event loop may be
 * busy for minutes while the parent keeps renewing the job lock.
 *
 * The child also watches its parent: after a `kill -9` of the worker it would live on as an
 * orphan, so when the IPC channel drops (or its parent pid changes) it exits at once. Point
 * writes are idempotent, so even a process that writes late duplicates nothing.
 */
import { WaitingError, type SandboxedJob } from 'bullmq';
import { RedisJobStore, connectRedis, type BranchInfo } from '../store/index.js';
import { BranchJobData, type BranchJobResult } from './branch-job.js';
import { BranchAbortedError } from './errors/branch-aborted-error.js';
import { BranchJobInvalidError } from './errors/branch-job-invalid-error.js';
import { defaultEngineResolver, runStoredBranch, type EngineResolver } from './run-stored-branch.js';
import { readSandboxEnv, type SandboxConfig } from './sandbox-env.js';
import { SweepQueue } from './sweep-queue.js';

/** Options of {@link createBranchProcessor}. */
export interface BranchProcessorOptions {
  /** Picks the engine (fixtures pass their own). @defaultValue the sweep runner's choice */
  resolveEngine?: EngineResolver;
  /** Configuration. @defaultValue read from the environment */
  config?: SandboxConfig;
}

/** How often the child checks that its parent is alive, ms. */
const PARENT_CHECK_MS = 500;

export function createBranchProcessor(options: BranchProcessorOptions = {}) {
  const { resolveEngine = defaultEngineResolver } = options;
  let config: SandboxConfig | undefined = options.config;
  let store: RedisJobStore | undefined;
  let queue: SweepQueue | undefined;
  const running = new Set<AbortController>();

  // Exit at once: a result sent to a dead parent fails, and BullMQ's child wrapper then loops
  // on its own uncaught-exception handler. Nothing is lost — the points already written
  // stay, and the retry recomputes the rest from the stored counts.
  const orphaned = () => {
    for (const c of running) c.abort('orphaned');
    process.exit(0);
  };
  const initialParent = process.ppid;
  if (process.send) {
    process.once('disconnect', orphaned);
    setInterval(() => { if (process.ppid !== initialParent) orphaned(); }, PARENT_CHECK_MS).unref();
  }

  const getStore = () => {
    config ??= readSandboxEnv();
    // One connection per child; null retries keep writes waiting through a Redis restart.
    store ??= new RedisJobStore(connectRedis(config.redisUrl, { maxRetriesPerRequest: null }, `sandbox ${process.pid}`), {
      prefix: config.prefix, retentionSeconds: config.retentionSeconds,
    });
    return { store, config };
  };

  return async function processBranch(job: SandboxedJob, token?: string, signal?: AbortSignal): Promise<BranchJobResult> {
    const parsed = BranchJobData.safeParse(job.data);
    if (!parsed.success) {
      throw new BranchJobInvalidError(`job ${job.id}: invalid branch payload: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
    }
    const data = parsed.data;
    const { store, config } = getStore();
    const attempt = Math.max(1, (job.attemptsStarted ?? job.attemptsMade + 1));
    const maxAttempts = job.opts.attempts ?? 1;
    const controller = new AbortController();
    const forward = () => controller.abort(signal?.reason);
    signal?.addEventListener('abort', forward, { once: true });
    running.add(controller);
    try {
      // Sample blocks of sampled engines go to the same queue, with this job's attempts.
      const enqueue = async (jobs: BranchJobData[]) => {
        queue ??= new SweepQueue(store.redis, { prefix: config.prefix, attempts: maxAttempts });
        await queue.addBranches(jobs);
      };
      return await runStoredBranch({
        store, data, attempt, workerId: config.workerId, resolveEngine, signal: controller.signal, pollMs: config.pollMs, enqueue,
      });
    } catch (err) {
      if (err instanceof BranchAbortedError && err.reason === 'handback' && token) {
        // Back to the waiting list without spending an attempt; another worker takes it.
        await job.moveToWait(token);
        throw new WaitingError();
      }
      if (err instanceof BranchAbortedError && err.reason === 'orphaned') throw err;
      const message = err instanceof Error ? err.message : String(err);
      const final = err instanceof BranchJobInvalidError || attempt >= maxAttempts;
      const info: BranchInfo = {
        state: final ? 'failed' : 'retrying', attempts: attempt, worker: config.workerId,
        // finishedAt: when this attempt ended (a retry starts no earlier than the back-off after it).
        startedAt: null, finishedAt: new Date().toISOString(), error: message,
      };
      await store.branchUpdated(data.sweepId, data.branchIndex, info).catch(() => undefined);
      if (final) await store.failSweep(data.sweepId, `branch ${data.branchIndex}: ${message}`).catch(() => undefined);
      throw err;
    } finally {
      running.delete(controller);
      signal?.removeEventListener('abort', forward);
    }
  };
}
