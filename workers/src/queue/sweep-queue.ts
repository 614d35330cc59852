/**
 * The producer side of the branch queue: enqueue a sweep's branches, drop the ones still
 * waiting when a sweep is cancelled, and report queue depth.
 */
import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import type { SweepPlan } from '../../../shared-types/src/index.js';
import { STORE_DEFAULTS } from '../store/index.js';
import type { BranchJobData } from './branch-job.js';
import { BRANCH_QUEUE, branchJobId, queuePrefix } from './queue-names.js';

/** Options of a {@link SweepQueue}. */
export interface SweepQueueOptions {
  /** Store key prefix; the queue's own prefix derives from it. @defaultValue 'bsw:' */
  prefix?: string;
  /** Attempts per branch (first run included). @defaultValue 5 */
  attempts?: number;
  /** First retry delay, ms; doubles per attempt. @defaultValue 1000 */
  backoffMs?: number;
}

/** Branch queue counts (what /metrics reports). */
export interface QueueDepth {
  waiting: number;
  active: number;
  delayed: number;
  failed: number;
  completed: number;
}

export class SweepQueue {
  readonly queue: Queue;
  private readonly attempts: number;
  private readonly backoffMs: number;

  /** Uses `connection` (shared, not owned). */
  constructor(connection: Redis, options: SweepQueueOptions = {}) {
    const { prefix = STORE_DEFAULTS.prefix, attempts = 5, backoffMs = 1000 } = options;
    this.attempts = attempts;
    this.backoffMs = backoffMs;
    this.queue = new Queue(BRANCH_QUEUE, { connection, prefix: queuePrefix(prefix) });
  }

  /** Adds one job per branch; re-adding an existing branch is a no-op (job id dedupe). */
  async enqueue(sweepId: string, plan: SweepPlan): Promise<void> {
    await this.addBranches(plan.branches.map((betaIndices, branchIndex) => ({ sweepId, branchIndex, betaIndices })));
  }

  /**
   * Adds branch jobs as given (sampled engines add their sample blocks this way, from the
   * sandbox that completes a round); a job whose id exists is not added again.
   */
  async addBranches(jobs: BranchJobData[]): Promise<void> {
    if (jobs.length === 0) return;
    await this.queue.addBulk(jobs.map((data) => ({
      name: 'branch',
      data,
      opts: {
        jobId: branchJobId(data.sweepId, data.branchIndex, data.samples),
        attempts: this.attempts,
        backoff: { type: 'exponential', delay: this.backoffMs },
        removeOnComplete: { age: 3600, count: 10_000 },
        removeOnFail: { age: 7 * 24 * 3600 },
      },
    })));
  }

  /** Removes the sweep's branch jobs that are not running (waiting, delayed). Running ones stop by polling the store. */
  async dropWaiting(sweepId: string, branchCount: number): Promise<number> {
    let removed = 0;
    for (let i = 0; i < branchCount; i++) {
      try {
        removed += await this.queue.remove(branchJobId(sweepId, i));
      } catch {
        /* locked (active): it will see the cancelled status */
      }
    }
    return removed;
  }

  async depth(): Promise<QueueDepth> {
    const c = await this.queue.getJobCounts('waiting', 'active', 'delayed', 'failed', 'completed', 'prioritized');
    return { waiting: (c.waiting ?? 0) + (c.prioritized ?? 0), active: c.active ?? 0, delayed: c.delayed ?? 0, failed: c.failed ?? 0, completed: c.completed ?? 0 };
  }

  async close(): Promise<void> {
    await this.queue.close();
  }
}
