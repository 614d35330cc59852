/** Unauthenticated service routes: /healthz, /readyz, /metrics, /openapi.json. */
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import type { ApiContext } from '../context.js';
import { HealthReply, ReadyReply } from '../schemas/service-bodies.js';

export function serviceRoutes(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.get('/healthz', {
      schema: { summary: 'Liveness: the process answers', tags: ['service'], security: [], response: { 200: HealthReply } },
    }, async () => ({ status: 'ok' as const }));

    app.get('/readyz', {
      schema: { summary: 'Readiness: Redis and the queue answer', tags: ['service'], security: [], response: { 200: ReadyReply, 503: ReadyReply } },
    }, async (_request, reply) => {
      const within = <T>(p: Promise<T>) => Promise.race([p, new Promise<never>((_, rej) => setTimeout(() => rej(new Error('timeout')), 1000))]);
      const redis = await within(ctx.redis.ping()).then((p) => p === 'PONG', () => false);
      const queue = redis ? await within(ctx.queue.depth()).then(() => true, () => false) : false;
      const ok = redis && queue;
      return reply.status(ok ? 200 : 503).send({ status: ok ? 'ready' : 'not-ready', redis, queue });
    });

    app.get('/metrics', {
      schema: { summary: 'Prometheus metrics (text exposition format)', tags: ['service'], security: [], response: { 200: z.string() } },
    }, async (_request, reply) => {
      const gauges: Parameters<typeof ctx.metrics.render>[0] = [];
      try {
        const depth = await ctx.queue.depth();
        for (const [state, value] of Object.entries(depth)) {
          gauges.push({ name: 'betasweep_queue_branches', help: 'Branch jobs by queue state.', type: 'gauge', value, labels: { state } });
        }
        gauges.push({ name: 'betasweep_branches_running', help: 'Branches being computed now.', type: 'gauge', value: depth.active });
        gauges.push({ name: 'betasweep_points_written_total', help: 'Quench points written to the store (all sweeps).', type: 'counter', value: await ctx.store.pointsWritten() });
        gauges.push({ name: 'betasweep_redis_up', help: '1 when Redis answered this scrape.', type: 'gauge', value: 1 });
      } catch {
        gauges.push({ name: 'betasweep_redis_up', help: '1 when Redis answered this scrape.', type: 'gauge', value: 0 });
      }
      return reply.header('content-type', 'text/plain; version=0.0.4; charset=utf-8').send(ctx.metrics.render(gauges));
    });

    app.get('/openapi.json', {
      schema: { summary: 'This OpenAPI 3 document', tags: ['service'], security: [], hide: true },
    }, async () => app.swagger());
  };
}
