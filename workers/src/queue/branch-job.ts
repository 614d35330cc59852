/** The payload of a branch job, parsed at the processor boundary. */
import { z } from 'zod';
import { SWEEP_ID_PATTERN } from '../store/index.js';

export const BranchJobData = z.object({
  sweepId: z.string().regex(SWEEP_ID_PATTERN),
  branchIndex: z.number().int().min(0),
  /** β indices of this branch, ascending (a copy of plan.branches[branchIndex]). */
  betaIndices: z.array(z.number().int().min(0)).min(1),
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
});
export type BranchJobResult = z.infer<typeof BranchJobResult>;
