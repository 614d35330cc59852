/** The body of every error response. */
import { z } from 'zod';

export const ErrorIssueBody = z.object({
  /** Stable code of this issue (spec issue codes, or the validation keyword). */
  code: z.string(),
  /** Path to the offending value, e.g. ["betas", 2]. */
  path: z.array(z.union([z.string(), z.number()])),
  message: z.string(),
}).meta({ id: 'ErrorIssue' });

export const ErrorBody = z.object({
  statusCode: z.number().int(),
  /** A code of the error catalog, e.g. BSW_ERR_SWEEP_NOT_FOUND. */
  code: z.string(),
  message: z.string(),
  /** Each problem found, when the request had several. */
  issues: z.array(ErrorIssueBody).optional(),
}).meta({ id: 'Error' });
export type ErrorBody = z.infer<typeof ErrorBody>;

/** Error responses a route may give, keyed by status (for route schemas and the OpenAPI document). */
export function errorResponses<S extends number>(...statuses: S[]): Record<S, typeof ErrorBody> {
  return Object.fromEntries(statuses.map((s) => [s, ErrorBody])) as Record<S, typeof ErrorBody>;
}
