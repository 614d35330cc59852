/**
 * Turns every error (ours, fastify's, the validators', the rate limiter's) into a catalog
 * error and one response shape: { statusCode, code, message, issues? }.
 */
import type { FastifyError, FastifyReply, FastifyRequest } from 'fastify';
import { hasZodFastifySchemaValidationErrors, isResponseSerializationError } from 'fastify-type-provider-zod';
import { BetasweepApiError, apiError, type ErrorIssue } from './errors.js';

const PART_NAMES: Record<string, string> = { body: 'body', querystring: 'query string', params: 'path parameters', headers: 'headers' };

/** "a.b[2]" from ["a", "b", 2]. */
export function formatPath(path: (string | number)[]): string {
  return path.reduce<string>((s, p) => (typeof p === 'number' ? `${s}[${p}]` : s ? `${s}.${p}` : p), '');
}

function validationIssues(err: { validation: Array<{ instancePath?: string; message?: string; params?: unknown; keyword?: string }> }): ErrorIssue[] {
  return err.validation.map((v) => {
    const params = v.params as { issue?: { path?: PropertyKey[]; code?: string; message?: string } } | undefined;
    const path = (params?.issue?.path ?? (v.instancePath ?? '').split('/').filter(Boolean))
      .map((p) => (typeof p === 'number' ? p : String(p)));
    const where = formatPath(path);
    const message = params?.issue?.message ?? v.message ?? 'invalid';
    return { code: params?.issue?.code ?? v.keyword ?? 'invalid', path, message: where ? `${where}: ${message}` : message };
  });
}

/** The catalog error for any thrown value. */
export function toApiError(err: unknown, request: FastifyRequest): BetasweepApiError {
  if (err instanceof BetasweepApiError) return err;
  const e = err as FastifyError & { validationContext?: string };
  if (hasZodFastifySchemaValidationErrors(err)) {
    const issues = validationIssues(err);
    const part = PART_NAMES[e.validationContext ?? ''] ?? 'request';
    return new BetasweepApiError('BSW_ERR_BAD_REQUEST', [part, issues.map((i) => i.message).join('; ')], { issues });
  }
  if (isResponseSerializationError(err)) return apiError('BSW_ERR_INTERNAL', request.id);
  // ioredis gave up (Redis down or restarting): tell the client to come back shortly.
  if (e.name === 'MaxRetriesPerRequestError' || /Connection is closed|ECONNREFUSED|Stream isn't writeable|ETIMEDOUT/.test(e.message ?? '')) {
    return new BetasweepApiError('BSW_ERR_NOT_READY', ['Redis does not answer'], { retryAfter: 2 });
  }
  switch (e.code) {
    case 'FST_ERR_CTP_BODY_TOO_LARGE':
      return apiError('BSW_ERR_BODY_TOO_LARGE', request.routeOptions.bodyLimit ?? 0);
    case 'FST_ERR_CTP_INVALID_MEDIA_TYPE':
      return apiError('BSW_ERR_UNSUPPORTED_MEDIA_TYPE', String(request.headers['content-type'] ?? '(none)').slice(0, 100));
    case 'FST_ERR_CTP_EMPTY_JSON_BODY':
      return apiError('BSW_ERR_BAD_JSON', 'the body is empty');
    case 'FST_ERR_CTP_INVALID_JSON_BODY':
      return apiError('BSW_ERR_BAD_JSON', e.message);
    case 'FST_ERR_CTP_INVALID_CONTENT_LENGTH':
      return apiError('BSW_ERR_BAD_REQUEST', 'headers', 'Content-Length does not match the body');
    default:
      break;
  }
  // secure-json-parse errors (bad JSON, __proto__ or constructor.prototype keys) carry 400.
  if (e.statusCode === 400 && (e instanceof SyntaxError || /JSON|prototype|__proto__|constructor/i.test(e.message ?? ''))) {
    return apiError('BSW_ERR_BAD_JSON', e.message);
  }
  if (typeof e.statusCode === 'number' && e.statusCode >= 400 && e.statusCode < 500) {
    return apiError('BSW_ERR_BAD_REQUEST', 'request', e.message);
  }
  return apiError('BSW_ERR_INTERNAL', request.id);
}

export function errorHandler(err: unknown, request: FastifyRequest, reply: FastifyReply): void {
  const apiErr = toApiError(err, request);
  if (apiErr.statusCode >= 500) request.log.error({ err }, 'request failed');
  if (apiErr.retryAfter !== undefined) reply.header('retry-after', String(apiErr.retryAfter));
  void reply.status(apiErr.statusCode).send({
    statusCode: apiErr.statusCode,
    code: apiErr.code,
    message: apiErr.message,
    ...(apiErr.issues ? { issues: apiErr.issues } : {}),
  });
}
