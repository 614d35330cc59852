/** Request and response schemas of the sweep routes (the OpenAPI document is generated from them). */
import { z } from 'zod';
import { SweepPlan, SweepResult, SweepSpec, SeriesInfo, SweepHeader } from '../../../../shared-types/src/index.js';
import { BranchProgress, SWEEP_ID_PATTERN, SweepCheckSummary, SweepStatus } from '../../../../workers/src/store/index.js';

// The shared schemas carry their own `.meta({ id })`; the OpenAPI document names them so.
/** The spec as submitted. */
export const SweepSpecBody = SweepSpec;
/** The result document. */
export const SweepResultBody = SweepResult;
export const SweepPlanBody = SweepPlan;
export const SweepHeaderBody = SweepHeader;

export const SweepIdParams = z.object({
  id: z.string().max(64).describe("A sweep id: 'sw_' and 16 characters a-z or 2-7"),
});

export const SubmitQuery = z.object({
  /** Run again even if this owner already has a sweep for the same canonical spec. */
  fresh: z.enum(['true', 'false', '1', '0']).optional().describe('Run again even if an identical sweep exists (default false)'),
});

export const SweepLinks = z.object({
  self: z.string(),
  result: z.string(),
  csv: z.string(),
  events: z.string(),
  cancel: z.string(),
});

export const SubmitReply = z.object({
  id: z.string().regex(SWEEP_ID_PATTERN),
  status: SweepStatus,
  /** True when an existing sweep for the same canonical spec was returned instead of a new one. */
  deduplicated: z.boolean(),
  specHash: z.string(),
  links: SweepLinks,
}).meta({ id: 'SubmitReply' });

export const SweepTimings = z.object({
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  /** Seconds from submission to the first branch starting (so far, if still queued). */
  queuedSeconds: z.number(),
  /** Seconds from the first branch starting to the end (so far, if still running); null before it starts. */
  runSeconds: z.number().nullable(),
});

/** One sweep's status: progress per branch, timings and the engine plan. */
export const SweepStatusBody = z.object({
  id: z.string(),
  status: SweepStatus,
  label: z.string(),
  specHash: z.string(),
  engine: z.string(),
  error: z.string().nullable(),
  pointsDone: z.number().int(),
  pointsTotal: z.number().int(),
  /** pointsDone / pointsTotal, 0..1. */
  progress: z.number(),
  branches: z.array(BranchProgress),
  timings: SweepTimings,
  plan: SweepPlanBody,
  /** Grids and series labels (what each point's values[k] means). */
  betas: z.array(z.number()),
  times: z.array(z.number()),
  series: z.array(SeriesInfo),
  spec: SweepSpecBody,
  links: SweepLinks,
  /**
   * Summary of the check against the series (GET …/check has the report); null until the
   * sweep has succeeded and its check is stored. `flagged`: a disagreement inside the window.
   */
  check: SweepCheckSummary.nullable(),
}).meta({ id: 'SweepStatusReport' });

export const SweepSummaryBody = z.object({
  id: z.string(),
  status: SweepStatus,
  label: z.string(),
  specHash: z.string(),
  engine: z.string(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  error: z.string().nullable(),
  pointsDone: z.number().int(),
  pointsTotal: z.number().int(),
  /** Summary of the check against the series; null until a succeeded sweep's check is stored. */
  check: SweepCheckSummary.nullable(),
}).meta({ id: 'SweepSummary' });

export const ListQuery = z.object({
  status: SweepStatus.optional(),
  cursor: z.string().max(512).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(20),
});

export const ListReply = z.object({
  items: z.array(SweepSummaryBody),
  /** Pass as `cursor` for the next page; null at the end. */
  nextCursor: z.string().nullable(),
}).meta({ id: 'SweepList' });

export const ResultQuery = z.object({
  format: z.enum(['json', 'csv']).default('json'),
});

export const CancelReply = z.object({
  id: z.string(),
  status: SweepStatus,
  /** False when the sweep was already cancelled. */
  changed: z.boolean(),
}).meta({ id: 'CancelReply' });

export const EventsQuery = z.object({
  /** Resume after this stream id (same as the Last-Event-ID header, which wins). */
  after: z.string().max(64).optional(),
  /** A short-lived stream token (for clients that cannot send headers, e.g. EventSource). */
  streamToken: z.string().max(128).optional(),
});

export const EventsHeaders = z.object({
  'last-event-id': z.string().max(64).optional(),
});

export const StreamTokenReply = z.object({
  streamToken: z.string(),
  expiresAt: z.string(),
  /** The events URL with the token filled in. */
  url: z.string(),
}).meta({ id: 'StreamToken' });

export const PlanReply = z.object({
  specHash: z.string(),
  feasible: z.boolean(),
  plan: SweepPlanBody,
  header: SweepHeaderBody,
  /** Quench points the sweep will produce (betas × times). */
  points: z.number().int(),
  /** The canonical spec (defaults applied, betas sorted and de-duplicated). */
  spec: SweepSpecBody,
}).meta({ id: 'PlanReply' });
