/**
 * The wire shape of the series cross-check (GET /v1/sweeps/{id}/check; built by
 * workers/src/series/check-report.ts): per β (and time) and per quantity, the series value ±
 * its truncation estimate, the engine's value ± its error, and a verdict. Only the fields the
 * figures read are required; anything else passes through. Parsed with zod so a page or a
 * CLI that meets another shape says "cross-check not available" instead of drawing nonsense.
 */
import { z } from 'zod';

/** Verdicts: inside the series' trust window the values agree or disagree; outside, the series cannot judge. */
export const CheckVerdictBody = z.enum(['agree', 'disagree', 'outside-window']);

/** One compared value. */
export const CheckEntryBody = z.object({
  betaIndex: z.number().int().min(0),
  beta: z.number(),
  /** null for thermodynamics. */
  timeIndex: z.number().int().min(0).nullable(),
  time: z.number().nullable(),
  /** "thermo:<field>" (totals, not per site) or a series label. */
  quantity: z.string(),
  seriesValue: z.number().nullable(),
  seriesError: z.number().nullable(),
  engineValue: z.number().nullable().optional(),
  engineError: z.number().nullable().optional(),
  verdict: CheckVerdictBody,
}).loose();

/** The cross-check report of one sweep. */
export const CheckReportBody = z.object({
  format: z.string().optional(),
  entries: z.array(CheckEntryBody),
  summary: z.object({ agree: z.number(), disagree: z.number(), outsideWindow: z.number() }),
  flagged: z.boolean(),
  /** The series used; null when the check could not be computed (see `error`). */
  series: z.object({
    kind: z.string().optional(),
    method: z.string().optional(),
    thermoOrder: z.number().optional(),
    quenchOrder: z.number().optional(),
  }).loose().nullable().optional(),
  /** Why there is no check (e.g. no series fits the time budget); null or absent when there is one. */
  error: z.string().nullable().optional(),
}).loose();

export type CheckEntryBody = z.infer<typeof CheckEntryBody>;
export type CheckReportBody = z.infer<typeof CheckReportBody>;

/** The note shown in place of the overlay when no report is at hand. */
export const CHECK_UNAVAILABLE = 'cross-check not available';

/**
 * The report to draw, or the note to show instead: a parsed body that carries an `error` (the
 * service stores one when the check could not be computed) is no overlay.
 */
export function usableCheck(raw: unknown, from: string): { check: CheckReportBody; note: '' } | { check: null; note: string } {
  const parsed = CheckReportBody.safeParse(raw);
  if (!parsed.success) return { check: null, note: `${CHECK_UNAVAILABLE}: ${from} sent an unexpected shape` };
  if (parsed.data.error) return { check: null, note: `${CHECK_UNAVAILABLE}: ${parsed.data.error}` };
  return { check: parsed.data, note: '' };
}
