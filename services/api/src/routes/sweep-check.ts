/**
 * GET /v1/sweeps/:id/check — the check report of a succeeded sweep against the
 * high-temperature and short-time series of its spec (computed by the worker that finalised
 * the sweep). 409 BSW_ERR_RESULT_NOT_READY until it exists.
 */
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import type { ApiContext } from '../context.js';
import { apiError } from '../errors.js';
import { CheckReportBody } from '../schemas/check-bodies.js';
import { errorResponses } from '../schemas/error-body.js';
import { SweepIdParams } from '../schemas/sweep-bodies.js';
import { ownedSweep } from './sweeps.js';

/** What the 409 names while a succeeded sweep's check is still being computed. */
const CHECK_PENDING = 'succeeded, its check report is still being computed';

export function sweepCheckRoute(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.get('/:id/check', {
      schema: {
        summary: 'Check report: each value against the series of the same spec, with a verdict',
        description: 'Per β (and time) and quantity: series value ± truncation estimate, engine value ± error, ' +
          'verdict agree / disagree / outside-window. Exists once the sweep has succeeded and its check is computed (409 before).',
        tags: ['sweeps'],
        params: SweepIdParams,
        response: { 200: CheckReportBody, ...errorResponses(400, 401, 404, 409, 429) },
      },
    }, async (request, reply) => {
      const record = await ownedSweep(ctx, request, request.params.id);
      if (record.status !== 'succeeded') throw apiError('BSW_ERR_RESULT_NOT_READY', record.id, record.status);
      const json = await ctx.store.getCheckJson(record.id);
      if (json === null) throw apiError('BSW_ERR_RESULT_NOT_READY', record.id, record.check === null ? CHECK_PENDING : 'expired');
      // Stored JSON text, sent as it is (like the result document).
      return reply.header('content-type', 'application/json; charset=utf-8').send(json as never);
    });
  };
}
