/**
 * Builds the fastify app: zod validation and serialization, the OpenAPI document, one error
 * shape, request metrics, and the versioned routes under /v1 behind bearer tokens and a
 * per-token rate limit (counters in Redis, so every API process shares them).
 */
import Fastify, { type FastifyInstance } from 'fastify';
import swagger from '@fastify/swagger';
import {
  jsonSchemaTransform, jsonSchemaTransformObject, serializerCompiler, validatorCompiler, type ZodTypeProvider,
} from 'fastify-type-provider-zod';
import { installGate } from './gatekeeper.js';
import type { ApiContext } from './context.js';
import { errorHandler } from './error-handler.js';
import { apiError } from './errors.js';
import { engineRoutes } from './routes/engines.js';
import { planRoutes } from './routes/plan.js';
import { serviceRoutes } from './routes/service.js';
import { sweepsRoutes } from './routes/sweeps.js';
import { dashboardPlugin } from './plugins/dashboard.js';

/** The API version reported in the OpenAPI document. */
export const API_VERSION = '1.0.0';

/** Hooks for tools and tests. */
export interface BuildAppHooks {
  /** Called for every route as it is registered (the OpenAPI test lists them this way). */
  onRoute?: (route: { method: string | string[]; url: string; hidden: boolean }) => void;
}

export async function buildApp(ctx: ApiContext, hooks: BuildAppHooks = {}): Promise<FastifyInstance> {
  const app = Fastify({
    logger: ctx.options.logger,
    bodyLimit: ctx.options.bodyLimit,
    onProtoPoisoning: 'error',
    onConstructorPoisoning: 'error',
    return503OnClosing: true,
    routerOptions: { maxParamLength: 200 },
  }).withTypeProvider<ZodTypeProvider>();
  if (hooks.onRoute) {
    const report = hooks.onRoute;
    app.addHook('onRoute', (r) => report({ method: r.method, url: r.url, hidden: Boolean((r.schema as { hide?: boolean } | undefined)?.hide) }));
  }
  app.setValidatorCompiler(validatorCompiler);
  app.setSerializerCompiler(serializerCompiler);
  app.setErrorHandler(errorHandler);
  app.setNotFoundHandler((request, reply) => {
    errorHandler(apiError('BSW_ERR_ROUTE_NOT_FOUND', request.method, request.url.split('?')[0].slice(0, 200)), request, reply);
  });
  app.decorateRequest('caller', null);
  app.decorateRequest('prefetchedSweep', null);
  // JSON only: a text body is never a spec.
  app.removeContentTypeParser('text/plain');

  app.addHook('onResponse', async (request, reply) => {
    ctx.metrics.observe(request.method, request.routeOptions.url ?? 'unmatched', reply.statusCode, reply.elapsedTime / 1000);
  });

  await app.register(swagger, {
    openapi: {
      openapi: '3.0.3',
      info: {
        title: 'betasweep',
        version: API_VERSION,
        description: 'Finite-temperature quench sweeps of spin-1/2 lattices (thermofield double): submit sweeps, follow their points live, fetch results.',
      },
      components: { securitySchemes: { bearer: { type: 'http', scheme: 'bearer', description: 'A token from `betasweep token create`' } } },
      security: [{ bearer: [] }],
      tags: [
        { name: 'sweeps', description: 'Submit, follow, fetch and cancel sweeps' },
        { name: 'plan', description: 'Dry runs' },
        { name: 'engines', description: 'What the service can compute' },
        { name: 'service', description: 'Health, readiness, metrics' },
      ],
    },
    transform: jsonSchemaTransform,
    transformObject: jsonSchemaTransformObject,
  });

  await app.register(serviceRoutes(ctx));
  await app.register(dashboardPlugin());

  await app.register(async (v1) => {
    // Bearer token and per-token rate limit in one Redis script call, with the status poll's
    // sweep read in the same call (gatekeeper.ts).
    installGate(v1, ctx.redis, { keys: ctx.store.keys, store: ctx.store, max: ctx.options.rateLimitMax, windowMs: ctx.options.rateLimitWindowMs });
    await v1.register(sweepsRoutes(ctx), { prefix: '/sweeps' });
    await v1.register(planRoutes(ctx), { prefix: '/plan' });
    await v1.register(engineRoutes(ctx), { prefix: '/engines' });
  }, { prefix: '/v1' });

  return app;
}
