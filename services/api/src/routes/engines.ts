/** GET /v1/engines — the engine catalogue with the schema limits and the service limits. */
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { LIMITS } from '../../../../shared-types/src/index.js';
import type { ApiContext } from '../context.js';
import { errorResponses } from '../schemas/error-body.js';
import { EngineCatalog } from '../schemas/service-bodies.js';

export function engineRoutes(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.get('', {
      schema: {
        summary: 'Engines and limits',
        tags: ['engines'],
        response: { 200: EngineCatalog, ...errorResponses(401, 429) },
      },
    }, async () => ({
      engines: ctx.planner.engines(),
      limits: { ...LIMITS },
      service: {
        maxBodyBytes: ctx.options.bodyLimit,
        maxActiveSweepsPerOwner: ctx.options.maxActivePerOwner,
        rateLimit: { max: ctx.options.rateLimitMax, windowMs: ctx.options.rateLimitWindowMs },
      },
    }));
  };
}
