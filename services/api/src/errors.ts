/**
 * The one error catalog of the API. Every error response carries one of these codes; the
 * code, once published, keeps its meaning and is never reused. Messages are templates with
 * `%s` slots and may be reworded. Every code is listed in services/api/README.md (a test
 * checks both).
 */

/** One catalog entry. */
export interface ErrorDefinition {
  readonly code: string;
  readonly statusCode: number;
  /** Message template; each `%s` takes one argument, in order. */
  readonly message: string;
}

const def = <C extends string>(code: C, statusCode: number, message: string) => ({ code, statusCode, message }) as const;

export const ERRORS = {
  /** No Authorization header, or not of the form `Bearer <token>`. */
  BSW_ERR_UNAUTHORIZED: def('BSW_ERR_UNAUTHORIZED', 401, 'a bearer token is required: send the header "Authorization: Bearer <token>"'),
  /** The token is unknown or revoked. */
  BSW_ERR_TOKEN_REJECTED: def('BSW_ERR_TOKEN_REJECTED', 401, 'the bearer token is unknown or has been revoked'),
  /** The stream token (for EventSource clients) is unknown, expired or for another sweep. */
  BSW_ERR_STREAM_TOKEN_REJECTED: def('BSW_ERR_STREAM_TOKEN_REJECTED', 401, 'the stream token is unknown, expired or not for this sweep'),
  /** No such sweep for this owner (another owner's sweep is reported the same way). */
  BSW_ERR_SWEEP_NOT_FOUND: def('BSW_ERR_SWEEP_NOT_FOUND', 404, "no sweep '%s' for this token"),
  /** No route matches the method and path. */
  BSW_ERR_ROUTE_NOT_FOUND: def('BSW_ERR_ROUTE_NOT_FOUND', 404, 'no route %s %s'),
  /** The path parameter is not a sweep id. */
  BSW_ERR_BAD_SWEEP_ID: def('BSW_ERR_BAD_SWEEP_ID', 400, "'%s' is not a sweep id: expected 'sw_' and 16 characters a-z or 2-7"),
  /** The submitted spec fails validation; `issues` names each field path and limit. */
  BSW_ERR_SPEC_INVALID: def('BSW_ERR_SPEC_INVALID', 400, 'the sweep spec is invalid: %s'),
  /** The spec is valid but the engine refuses it (too large for its reach, …). */
  BSW_ERR_SPEC_REFUSED: def('BSW_ERR_SPEC_REFUSED', 422, 'no engine can run this spec: %s'),
  /** A query string, path parameter or header fails validation; `issues` names each. */
  BSW_ERR_BAD_REQUEST: def('BSW_ERR_BAD_REQUEST', 400, 'invalid %s: %s'),
  /** The body is not valid JSON (or is empty, or tries prototype poisoning). */
  BSW_ERR_BAD_JSON: def('BSW_ERR_BAD_JSON', 400, 'the request body is not acceptable JSON: %s'),
  /** The body's Content-Type is not application/json. */
  BSW_ERR_UNSUPPORTED_MEDIA_TYPE: def('BSW_ERR_UNSUPPORTED_MEDIA_TYPE', 415, "unsupported content type '%s': send application/json"),
  /** The body is larger than the server's limit. */
  BSW_ERR_BODY_TOO_LARGE: def('BSW_ERR_BODY_TOO_LARGE', 413, 'the request body exceeds the limit of %s bytes'),
  /** Too many requests for this token in the window; see Retry-After. */
  BSW_ERR_RATE_LIMITED: def('BSW_ERR_RATE_LIMITED', 429, 'rate limit exceeded for this token: at most %s requests per %s; retry in %s'),
  /** The owner already has the maximum number of queued or running sweeps; see Retry-After. */
  BSW_ERR_TOO_MANY_ACTIVE: def('BSW_ERR_TOO_MANY_ACTIVE', 429, 'this owner already has %s queued or running sweeps (the cap is %s); wait for one to finish or cancel one'),
  /** The listing cursor is malformed (pass back the nextCursor of a previous page). */
  BSW_ERR_BAD_CURSOR: def('BSW_ERR_BAD_CURSOR', 400, "the cursor '%s' is malformed: pass back a previous page's nextCursor"),
  /** The result exists only once the sweep has succeeded. */
  BSW_ERR_RESULT_NOT_READY: def('BSW_ERR_RESULT_NOT_READY', 409, "sweep '%s' is %s: a result exists once it has succeeded"),
  /** Cancel of a sweep that already finished. */
  BSW_ERR_SWEEP_FINISHED: def('BSW_ERR_SWEEP_FINISHED', 409, "sweep '%s' already finished (%s) and cannot be cancelled"),
  /** The Last-Event-ID is not a stream id. */
  BSW_ERR_BAD_EVENT_ID: def('BSW_ERR_BAD_EVENT_ID', 400, "the event id '%s' is not a stream id (expected digits-digits)"),
  /** Redis or the queue is unreachable. */
  BSW_ERR_NOT_READY: def('BSW_ERR_NOT_READY', 503, 'the service is not ready: %s'),
  /** Anything unexpected (logged with the request id). */
  BSW_ERR_INTERNAL: def('BSW_ERR_INTERNAL', 500, 'internal error (request %s)'),
} as const;

export type ErrorCode = keyof typeof ERRORS;

/** One problem inside a request: a stable code, the path to the bad value, and a readable message. */
export interface ErrorIssue {
  code: string;
  path: (string | number)[];
  message: string;
}

/** The base class of every error the API answers with. */
export class BetasweepApiError extends Error {
  override readonly name = 'BetasweepApiError';
  readonly code: ErrorCode;
  readonly statusCode: number;
  readonly issues: ErrorIssue[] | undefined;
  /** Seconds to send in Retry-After (429/503). */
  readonly retryAfter: number | undefined;

  constructor(code: ErrorCode, args: Array<string | number>, extra: { issues?: ErrorIssue[]; retryAfter?: number } = {}) {
    const d = ERRORS[code];
    let i = 0;
    super(d.message.replace(/%s/g, () => String(args[i++] ?? '')));
    this.code = code;
    this.statusCode = d.statusCode;
    this.issues = extra.issues;
    this.retryAfter = extra.retryAfter;
  }
}

/** Builds a catalog error: `apiError('BSW_ERR_SWEEP_NOT_FOUND', id)`. */
export function apiError(code: ErrorCode, ...args: Array<string | number>): BetasweepApiError {
  return new BetasweepApiError(code, args);
}
