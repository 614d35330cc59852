/**
 * Starts a BullMQ worker for branch jobs. Branches run in sandboxed child processes
 * (branch-sandbox.mjs), so the worker's own event loop stays free to renew job locks however
 * long a branch computes. Any number of workers on any number of machines may share one Redis.
 */
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { hostname } from 'node:os';
import { Job, Queue, Worker } from 'bullmq';
import { RedisJobStore, STORE_DEFAULTS, connectRedis } from '../store/index.js';
import { BranchJobData } from './branch-job.js';
import { BRANCH_QUEUE, queuePrefix } from './queue-names.js';
import { SANDBOX_ENV } from './sandbox-env.js';

/** Options of {@link startBranchWorker}. */
export interface BranchWorkerOptions {
  /** Redis URL, e.g. redis://127.0.0.1:6379. */
  redisUrl: string;
  /** Store key prefix. @defaultValue 'bsw:' */
  prefix?: string;
  /** Branches run at once (one sandbox child each); one per core is sensible. @defaultValue 1 */
  concurrency?: number;
  /** Job lock duration, ms; renewed at half this by the worker process. @defaultValue 30000 */
  lockDuration?: number;
  /** How often stalled jobs are looked for, ms. @defaultValue 30000 */
  stalledInterval?: number;
  /** Times a job may stall (its worker died) before it fails. @defaultValue 3 */
  maxStalledCount?: number;
  /** Identifies this worker in branch states. @defaultValue host-pid-random */
  workerId?: string;
  /** Sandboxed processor file. @defaultValue this folder's branch-sandbox.mjs */
  processorFile?: string;
  /** Cancel/hand-back poll interval inside the sandbox, ms. @defaultValue 200 */
  pollMs?: number;
  /** Retention of finished sweeps, seconds (the sandbox's store finalizes sweeps). @defaultValue 604800 */
  retentionSeconds?: number;
  /**
   * Start `concurrency` sandbox processes before taking jobs, so the first branch does not
   * wait for a process to start and load the engines (about a second). @defaultValue true
   */
  prewarm?: boolean;
}

export interface BranchWorkerHandle {
  readonly worker: Worker;
  readonly workerId: string;
  /**
   * Stops taking jobs and waits for the branches in hand; after `graceMs` asks them to hand
   * back (they return to the queue, with what they computed kept). @defaultValue graceMs 30000
   */
  close(graceMs?: number): Promise<void>;
}

const DEFAULT_PROCESSOR = fileURLToPath(new URL('./branch-sandbox.mjs', import.meta.url));

/** The slice of BullMQ's (private) child pool that prewarming uses. */
interface ChildPoolLike {
  retain(processFile: string): Promise<unknown>;
  release(child: unknown): void;
}

/** Forks and initialises `n` sandbox processes and parks them in the worker's free pool. */
async function prewarmSandboxes(worker: Worker, processorFile: string, n: number): Promise<void> {
  const pool = (worker as unknown as { childPool?: ChildPoolLike }).childPool;
  if (!pool || typeof pool.retain !== 'function') return;
  const children = await Promise.all(Array.from({ length: n }, () => pool.retain(processorFile)));
  for (const child of children) pool.release(child);
}

export async function startBranchWorker(options: BranchWorkerOptions): Promise<BranchWorkerHandle> {
  const {
    redisUrl, prefix = STORE_DEFAULTS.prefix, concurrency = 1, lockDuration = 30_000, stalledInterval = 30_000,
    maxStalledCount = 3, pollMs = 200, processorFile = DEFAULT_PROCESSOR, retentionSeconds, prewarm = true,
  } = options;
  const workerId = options.workerId ?? `${hostname()}-${process.pid}-${randomBytes(3).toString('hex')}`;
  const connection = connectRedis(redisUrl, { maxRetriesPerRequest: null }, `worker ${workerId}`);
  const store = new RedisJobStore(connection, { prefix, retentionSeconds });
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    [SANDBOX_ENV.redisUrl]: redisUrl,
    [SANDBOX_ENV.prefix]: prefix,
    [SANDBOX_ENV.workerId]: workerId,
    [SANDBOX_ENV.pollMs]: String(pollMs),
    ...(retentionSeconds !== undefined ? { [SANDBOX_ENV.retentionSeconds]: String(retentionSeconds) } : {}),
  };
  const worker = new Worker(BRANCH_QUEUE, processorFile, {
    connection,
    prefix: queuePrefix(prefix),
    concurrency,
    lockDuration,
    stalledInterval,
    maxStalledCount,
    autorun: false,
    workerForkOptions: { env, stdio: 'inherit' },
  });
  const queue = new Queue(BRANCH_QUEUE, { connection, prefix: queuePrefix(prefix) });

  const failSweepOf = async (job: Job | undefined, message: string) => {
    const data = BranchJobData.safeParse(job?.data);
    if (data.success) await store.failSweep(data.data.sweepId, `branch ${data.data.branchIndex}: ${message}`);
  };
  // A sandbox that died (crash, OOM) cannot report its own last failure: do it here.
  worker.on('failed', (job, err) => {
    if (job && job.finishedOn && job.attemptsMade >= (job.opts.attempts ?? 1)) void failSweepOf(job, err.message).catch(() => undefined);
  });
  // A job that stalled more often than allowed fails without a 'failed' event on any worker.
  worker.on('stalled', (jobId) => {
    void (async () => {
      const job = await Job.fromId(queue, jobId);
      if (job && (await job.getState()) === 'failed') await failSweepOf(job, job.failedReason || 'stalled too often');
    })().catch(() => undefined);
  });
  let lastError = 0;
  worker.on('error', (err) => {
    if (Date.now() - lastError < 5000) return;
    lastError = Date.now();
    process.stderr.write(`betasweep worker ${workerId}: ${err.message}\n`);
  });
  await worker.waitUntilReady();
  if (prewarm) await prewarmSandboxes(worker, processorFile, concurrency);
  worker.run().catch((err: Error) => { process.stderr.write(`betasweep worker ${workerId}: ${err.message}\n`); });

  let closing: Promise<void> | undefined;
  return {
    worker,
    workerId,
    close(graceMs = 30_000) {
      closing ??= (async () => {
        const done = worker.close();
        const timer = setTimeout(() => { void store.setHandback(workerId, true, 600).catch(() => undefined); }, graceMs);
        try {
          await done;
        } finally {
          clearTimeout(timer);
          await store.setHandback(workerId, false).catch(() => undefined);
          await queue.close();
          connection.disconnect();
        }
      })();
      return closing;
    },
  };
}
