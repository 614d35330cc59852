/** The payload of a branch job, parsed at the processor boundary. */
import { z } from 'zod';
import { SWEEP_ID_PATTERN } from '../store/index.js';

export const BranchJobData = z.object({
  sweepId: z.string().regex(SWEEP_ID_PATTERN),
  branchIndex: z.number().int().min(0),
  /** β indices of this branch, ascending (a copy of plan.branches[branchIndex]). */
  betaIndices: z.array(z.number().int().min(0)).min(1),
  /**
   * Sampled engines (`typical`): the block of sample indices [start, start + count) this job
   * runs. Absent on the branch's first job, which opens the sample rounds (queue/typical/).
   */
  samples: z.object({
    start: z.number().int().min(0).max(2 ** 32 - 1),
    count: z.number().int().min(1).max(2 ** 32),
  }).strict().optional(),
}).strict();
export type BranchJobData = z.infer<typeof BranchJobData>;

/** What a branch job returns (JSON; bulk numbers go through the store, never here). */
export const BranchJobResult = z.object({
  outcome: z.enum(['done', 'cancelled', 'skipped']),
  /** Points this attempt stored that were not stored before. */
  pointsWritten: z.number().int().min(0),
  /** Per β index, the time index this attempt resumed from. */
  resumedFrom: z.record(z.string(), z.number().int().min(0)),
  /** True when this attempt assembled and stored the final result. */
  finalized: z.boolean(),
  /** Sampled engines: samples this attempt computed, and those of its block found stored already. */
  samples: z.object({ computed: z.number().int().min(0), alreadyStored: z.number().int().min(0) }).optional(),
});
export type BranchJobResult = z.infer<typeof BranchJobResult>;

/**
 * Adds branch jobs to the queue (BullMQ: SweepQueue.addBranches; a job id that exists is not
 * added again). Sampled engines add their sample blocks through it.
 */
export type BranchEnqueuer = (jobs: BranchJobData[]) => Promise<void>;
