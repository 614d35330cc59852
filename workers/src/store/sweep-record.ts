/**
 * The stored shape of a sweep and its branches. These zod schemas are the only source of the
 * record types; the API reuses them for its status responses.
 */
import { z } from 'zod';
import { SweepHeader, SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';

/** Life cycle of a sweep. `succeeded`, `failed` and `cancelled` are terminal. */
export const SweepStatus = z.enum(['queued', 'running', 'succeeded', 'failed', 'cancelled']).meta({ id: 'SweepStatus' });
export type SweepStatus = z.infer<typeof SweepStatus>;

/** The terminal statuses (no further change, retention clock running). */
export const TERMINAL_STATUSES: readonly SweepStatus[] = ['succeeded', 'failed', 'cancelled'];

/** True for `succeeded`, `failed` and `cancelled`. */
export function isTerminal(status: SweepStatus): boolean {
  return TERMINAL_STATUSES.includes(status);
}

/** Life cycle of one branch (a list of β indices run by one queue job). */
export const BranchState = z.enum(['queued', 'running', 'retrying', 'done', 'failed', 'cancelled']).meta({ id: 'BranchState' });
export type BranchState = z.infer<typeof BranchState>;

/** What the store keeps per branch (JSON in the branches hash). */
export const BranchInfo = z.object({
  state: BranchState,
  /** Attempts started so far (1 on the first run). */
  attempts: z.number().int().min(0),
  /** Worker that ran the latest attempt. */
  worker: z.string().nullable(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  /** Message of the latest failure, if any. */
  error: z.string().nullable(),
  /**
   * Sampled engines (`typical`) only: random samples stored for this branch and the current
   * round's target (`stored` reaches `target` when the round is complete; `final` once no further
   * round follows). Absent for deterministic engines.
   */
  samples: z.object({
    stored: z.number().int().min(0),
    target: z.number().int().min(0),
    final: z.boolean(),
  }).optional(),
});
export type BranchInfo = z.infer<typeof BranchInfo>;

/** A branch as reported: its β indices, state and how many of its points are stored. */
export const BranchProgress = BranchInfo.extend({
  index: z.number().int().min(0),
  betaIndices: z.array(z.number().int().min(0)),
  pointsDone: z.number().int().min(0),
  pointsTotal: z.number().int().min(0),
}).meta({ id: 'BranchProgress' });
export type BranchProgress = z.infer<typeof BranchProgress>;

/** Overall verdict of a sweep's check report against its series (see queue/sweep-check.ts). */
export const CheckSummaryVerdict = z.enum(['agree', 'disagree', 'no-window', 'error']).meta({ id: 'CheckSummaryVerdict' });
export type CheckSummaryVerdict = z.infer<typeof CheckSummaryVerdict>;

/**
 * The check summary kept on the sweep record once the check report is stored:
 * 'disagree' when some value disagrees inside the series window (then `flagged`), 'no-window'
 * when every value lies outside it, 'error' when the check could not be computed (`note` says why).
 */
export const SweepCheckSummary = z.object({
  verdict: CheckSummaryVerdict,
  /** True when some value disagrees with its series inside the series window. */
  flagged: z.boolean(),
  /** Entries of the report by verdict. */
  counts: z.object({
    agree: z.number().int().min(0),
    disagree: z.number().int().min(0),
    outsideWindow: z.number().int().min(0),
  }),
  /** Why the check failed or was cut short (null otherwise). */
  note: z.string().nullable(),
}).meta({ id: 'SweepCheckSummary' });
export type SweepCheckSummary = z.infer<typeof SweepCheckSummary>;

/** A sweep as stored and reported. */
export const SweepRecord = z.object({
  id: z.string(),
  owner: z.string(),
  status: SweepStatus,
  label: z.string(),
  specHash: z.string(),
  engine: z.string(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  /** Why the sweep failed (null otherwise). */
  error: z.string().nullable(),
  spec: SweepSpec,
  plan: SweepPlan,
  header: SweepHeader,
  branches: z.array(BranchProgress),
  pointsDone: z.number().int().min(0),
  pointsTotal: z.number().int().min(0),
  /** Summary of the check report against the series; null until it is stored (after success). */
  check: SweepCheckSummary.nullable(),
});
export type SweepRecord = z.infer<typeof SweepRecord>;

/** What a caller supplies to create a sweep (the store adds id, status and times). */
export interface NewSweep {
  owner: string;
  spec: SweepSpec;
  specHash: string;
  plan: SweepPlan;
  header: SweepHeader;
  /** Create a new sweep even if this owner already has one for the same canonical spec. @defaultValue false */
  fresh?: boolean;
  /** Refuse when the owner already has this many queued or running sweeps; 0 = no cap. @defaultValue 0 */
  maxActive?: number;
}

/** Outcome of {@link JobStore.createSweep}. */
export type CreateSweepOutcome =
  | { kind: 'created'; id: string }
  | { kind: 'existing'; id: string }
  | { kind: 'capped'; active: number };

/**
 * One record a running branch produces. `version` 0 (the default) is write-once: the first
 * write of a key wins. A version > 0 (sampled engines: the number of samples merged) replaces a
 * stored record of a lower version and is ignored otherwise; it never replaces a version-0 record.
 */
export type BranchRecord =
  | { kind: 'thermo'; betaIndex: number; json: string; version?: number }
  | { kind: 'point'; betaIndex: number; timeIndex: number; json: string; version?: number }
  | { kind: 'diagnostics'; betaIndex: number; json: string; version?: number };

/** Checks a record version (absent = 0). @throws RangeError unless a non-negative integer below 2^53. */
export function checkRecordVersion(version: number | undefined): void {
  if (version !== undefined && !(Number.isSafeInteger(version) && version >= 0)) {
    throw new RangeError(`record version must be a non-negative integer; got ${version}`);
  }
}

/** Checks a sample index (a generator stream number). @throws RangeError unless an integer in [0, 2^32). */
export function checkSampleIndex(sample: number): void {
  if (!Number.isInteger(sample) || sample < 0 || sample >= 2 ** 32) throw new RangeError(`sample index must be an integer in [0, 2^32); got ${sample}`);
}

/** One stored random sample of a branch (an opaque encoding; queue/typical/sample-codec.ts). */
export interface StoredSample {
  /** Sample index k. */
  sample: number;
  data: Buffer;
}

/** A page of the owner's sweeps, newest first. */
export interface SweepPage {
  items: SweepRecord[];
  /** Pass back to get the next page; null at the end. */
  nextCursor: string | null;
}

/** Everything stored for a sweep's final assembly. */
export interface StoredRecords {
  points: string[];
  thermo: string[];
  diagnostics: string[];
}
