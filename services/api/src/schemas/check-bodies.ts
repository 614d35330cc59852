/**
 * The check report document of GET /v1/sweeps/{id}/check (workers/src/series/check-report.ts,
 * stored by workers/src/queue/sweep-check.ts). Non-finite numbers (an infinite series
 * estimate outside its window, a missing engine error) are sent as null, as JSON has no Infinity.
 */
import { z } from 'zod';

/** A number, or null where the value is infinite or undefined. */
const Value = z.number().nullable();

export const CheckEntryBody = z.object({
  betaIndex: z.number().int().min(0),
  beta: z.number(),
  /** null for thermodynamics. */
  timeIndex: z.number().int().min(0).nullable(),
  time: z.number().nullable(),
  /** "thermo:<field>" or a series label of the sweep. */
  quantity: z.string(),
  seriesValue: Value,
  /** Truncation estimate of the series value. */
  seriesError: Value,
  engineValue: Value,
  engineError: Value,
  verdict: z.enum(['agree', 'disagree', 'outside-window']),
}).meta({ id: 'CheckEntry' });

export const CheckReportBody = z.object({
  format: z.literal('betasweep.check/1'),
  specHash: z.string(),
  engine: z.object({ name: z.string(), version: z.string() }),
  /** The series compared against; null when the check failed (see `error`). */
  series: z.object({
    kind: z.enum(['finite-cluster', 'infinite-lattice']),
    method: z.enum(['whole-cluster', 'linked-cluster']),
    thermoOrder: z.number().int().min(0),
    quenchOrder: z.number().int().min(0),
    seconds: z.number(),
  }).nullable(),
  entries: z.array(CheckEntryBody),
  summary: z.object({
    agree: z.number().int().min(0),
    disagree: z.number().int().min(0),
    outsideWindow: z.number().int().min(0),
  }),
  /** True when some value disagrees with its series inside the series window. */
  flagged: z.boolean(),
  /** Why the check could not be computed (budget exceeded, series failure); null otherwise. */
  error: z.string().nullable(),
}).meta({ id: 'CheckReport' });
