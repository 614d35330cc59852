/**
 * /v1/sweeps: submit, list, status, result (JSON and CSV), cancel, stream token.
 * The live event stream is in sweep-events.ts, the check report in sweep-check.ts.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { FastifyRequest } from 'fastify';
import { validatorCompiler, type FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import type { FastifySchemaCompiler } from 'fastify';
import type { SweepResult } from '../../../../shared-types/src/index.js';
import { SWEEP_ID_PATTERN, decodeCursor, isTerminal, type SweepRecord } from '../../../../workers/src/store/index.js';
import { callerOf } from '../gatekeeper.js';
import type { ApiContext } from '../context.js';
import { BetasweepApiError, apiError } from '../errors.js';
import { errorResponses } from '../schemas/error-body.js';
import {
  CancelReply, ListQuery, ListReply, ResultQuery, StreamTokenReply, SubmitQuery, SubmitReply, SweepIdParams,
  SweepResultBody, SweepSpecBody, SweepStatusBody,
} from '../schemas/sweep-bodies.js';
import { statusJson, sweepLinks } from '../sweep-views.js';
import { sweepCheckRoute } from './sweep-check.js';
import { sweepEventsRoute } from './sweep-events.js';
import type { Planner } from '../planner.js';

/**
 * A validator compiler whose body validator is the sweep runner's own spec parser (schema,
 * semantic checks against the lattice, canonical form), so HTTP and CLI report the same
 * issues; other parts use the zod validator.
 */
export function specValidatorCompiler(planner: Planner): FastifySchemaCompiler<unknown> {
  return (route) => {
    if (route.httpPart !== 'body') return validatorCompiler(route as Parameters<typeof validatorCompiler>[0]);
    return (data: unknown) => {
      const parsed = planner.parse(data);
      if (parsed.success) return { value: parsed.spec };
      const issues = parsed.issues.map((i) => ({ code: i.code, path: i.path, message: i.message }));
      const shown = issues.slice(0, 3).map((i) => i.message).join('; ');
      const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : '';
      return { error: new BetasweepApiError('BSW_ERR_SPEC_INVALID', [shown + more], { issues }) };
    };
  };
}

/** The caller's sweep (the gate's prefetched read when it made one), or a 400 (malformed id) / 404 (missing or another owner's). */
export async function ownedSweep(ctx: ApiContext, request: FastifyRequest, id: string): Promise<SweepRecord> {
  if (!SWEEP_ID_PATTERN.test(id)) throw apiError('BSW_ERR_BAD_SWEEP_ID', id.slice(0, 64));
  const caller = callerOf(request);
  const pre = request.prefetchedSweep;
  const record = pre !== null && pre.id === id ? ctx.store.sweepFromState(id, pre.raw, pre.read) : await ctx.store.getSweep(id);
  if (!record || record.owner !== caller.owner) throw apiError('BSW_ERR_SWEEP_NOT_FOUND', id);
  return record;
}

export function sweepsRoutes(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.post('', {
      validatorCompiler: specValidatorCompiler(ctx.planner),
      schema: {
        summary: 'Submit a sweep',
        description: 'Validates the spec, plans it and queues one job per branch. The same canonical spec from the same owner returns the existing sweep (200, deduplicated) unless fresh=true.',
        tags: ['sweeps'],
        querystring: SubmitQuery,
        body: SweepSpecBody,
        response: { 200: SubmitReply, 201: SubmitReply, ...errorResponses(400, 401, 413, 415, 422, 429) },
      },
    }, async (request, reply) => {
      const caller = callerOf(request);
      const spec = request.body;
      const parsed = ctx.planner.parse(spec);
      if (!parsed.success) throw new BetasweepApiError('BSW_ERR_SPEC_INVALID', [parsed.issues[0]?.message ?? 'invalid'], { issues: parsed.issues });
      const { plan, header } = ctx.planner.plan(parsed.spec, parsed.hash);
      if (!plan.feasible) {
        const r = plan.refusal;
        throw new BetasweepApiError('BSW_ERR_SPEC_REFUSED', [r?.message ?? plan.reason], {
          issues: [{ code: 'refused', path: r ? r.field.split('.').filter(Boolean) : [], message: r ? `${r.field || 'spec'}: ${r.message} (estimate ${r.estimate}, limit ${r.limit})` : plan.reason }],
        });
      }
      const fresh = request.query.fresh === 'true' || request.query.fresh === '1';
      const out = await ctx.store.createSweep({
        owner: caller.owner, spec: parsed.spec, specHash: parsed.hash, plan, header, fresh, maxActive: ctx.options.maxActivePerOwner,
      });
      if (out.kind === 'capped') {
        throw new BetasweepApiError('BSW_ERR_TOO_MANY_ACTIVE', [out.active, ctx.options.maxActivePerOwner], { retryAfter: 30 });
      }
      if (out.kind === 'created') {
        try {
          await ctx.queue.enqueue(out.id, plan);
          await ctx.store.markEnqueued(out.id);
        } catch (err) {
          // Still listed in the outbox: if the sweep cannot be failed either, the reconciler re-queues it.
          if (await ctx.store.failSweep(out.id, `could not enqueue: ${(err as Error).message}`).catch(() => false)) {
            await ctx.store.markEnqueued(out.id).catch(() => undefined);
          }
          throw err;
        }
      }
      const status = (await ctx.store.getStatus(out.id)) ?? 'queued';
      void reply.status(out.kind === 'created' ? 201 : 200).header('location', sweepLinks(out.id).self);
      return { id: out.id, status, deduplicated: out.kind === 'existing', specHash: parsed.hash, links: sweepLinks(out.id) };
    });

    app.get('', {
      schema: {
        summary: "List the caller's sweeps, newest first",
        tags: ['sweeps'],
        querystring: ListQuery,
        response: { 200: ListReply, ...errorResponses(400, 401, 429) },
      },
    }, async (request) => {
      const caller = callerOf(request);
      const { status, cursor, limit } = request.query;
      if (cursor !== undefined && !decodeCursor(cursor)) throw apiError('BSW_ERR_BAD_CURSOR', cursor.slice(0, 64));
      return ctx.store.listSummaries(caller.owner, { status, cursor, limit });
    });

    app.get('/:id', {
      // The hot polling route: the gate reads the sweep in its own script call (prefetchSweep),
      // and the body is serialised by statusJson (from validated records, the fixed part kept
      // per sweep); the OpenAPI test checks real bodies against the schema.
      config: { prefetchSweep: true },
      serializerCompiler: () => (data) => (typeof data === 'string' ? data : JSON.stringify(data)),
      schema: {
        summary: 'Status of one sweep: per-branch progress, timings, plan',
        tags: ['sweeps'],
        params: SweepIdParams,
        response: { 200: SweepStatusBody, ...errorResponses(400, 401, 404, 429) },
      },
    }, async (request, reply) => {
      const body = statusJson(await ownedSweep(ctx, request, request.params.id));
      return reply.header('content-type', 'application/json; charset=utf-8').send(body as never);
    });

    const sendResult = async (request: FastifyRequest, id: string, format: 'json' | 'csv') => {
      const record = await ownedSweep(ctx, request, id);
      if (record.status !== 'succeeded') throw apiError('BSW_ERR_RESULT_NOT_READY', id, record.status);
      const json = await ctx.store.getResultJson(id);
      if (json === null) throw apiError('BSW_ERR_RESULT_NOT_READY', id, 'expired');
      return format === 'csv' ? ctx.planner.toCsv(JSON.parse(json) as SweepResult) : json;
    };

    app.get('/:id/result', {
      schema: {
        summary: 'The result document (JSON), or CSV with format=csv',
        description: 'CSV: one row per (beta, time, series) with value and error, then thermodynamics rows.',
        tags: ['sweeps'],
        params: SweepIdParams,
        querystring: ResultQuery,
        response: { 200: SweepResultBody, ...errorResponses(400, 401, 404, 409, 429) },
      },
    }, async (request, reply) => {
      const { format } = request.query;
      const body = await sendResult(request, request.params.id, format);
      if (format === 'csv') {
        void reply.header('content-type', 'text/csv; charset=utf-8')
          .header('content-disposition', `attachment; filename="${request.params.id}.csv"`);
      } else {
        void reply.header('content-type', 'application/json; charset=utf-8');
      }
      // Already serialized text (stored JSON, or CSV): fastify sends strings with a content type as they are.
      return reply.send(body as never);
    });

    app.get('/:id/result.csv', {
      schema: {
        summary: 'The result as CSV: beta,time,series,value,error',
        tags: ['sweeps'],
        params: SweepIdParams,
        response: errorResponses(400, 401, 404, 409, 429),
      },
    }, async (request, reply) => {
      const csv = await sendResult(request, request.params.id, 'csv');
      return reply.header('content-type', 'text/csv; charset=utf-8')
        .header('content-disposition', `attachment; filename="${request.params.id}.csv"`).send(csv as never);
    });

    app.post('/:id/cancel', {
      schema: {
        summary: 'Cancel a queued or running sweep (running branches stop within 2 s)',
        tags: ['sweeps'],
        params: SweepIdParams,
        response: { 200: CancelReply, ...errorResponses(400, 401, 404, 409, 429) },
      },
    }, async (request) => {
      const record = await ownedSweep(ctx, request, request.params.id);
      const id = record.id;
      let changed = false;
      if (!isTerminal(record.status)) {
        changed = await ctx.store.cancelSweep(id);
        if (changed) await ctx.queue.dropWaiting(id, record.plan.branches.length);
      }
      const status = (await ctx.store.getStatus(id)) ?? record.status;
      if (!changed && status !== 'cancelled') throw apiError('BSW_ERR_SWEEP_FINISHED', id, status);
      return { id, status, changed };
    });

    app.post('/:id/stream-token', {
      schema: {
        summary: 'A short-lived token for the event stream (for EventSource, which cannot send headers)',
        tags: ['sweeps'],
        params: SweepIdParams,
        response: { 200: StreamTokenReply, ...errorResponses(400, 401, 404, 429) },
      },
    }, async (request) => {
      const record = await ownedSweep(ctx, request, request.params.id);
      const secret = `bst_${randomBytes(24).toString('base64url')}`;
      const sha = createHash('sha256').update(secret).digest('hex');
      const ttl = ctx.options.streamTokenTtlSeconds;
      await ctx.redis.set(ctx.store.keys.streamToken(sha), JSON.stringify({ owner: record.owner, sweepId: record.id }), 'EX', ttl);
      return {
        streamToken: secret,
        expiresAt: new Date(Date.now() + ttl * 1000).toISOString(),
        url: `${sweepLinks(record.id).events}?streamToken=${secret}`,
      };
    });

    await app.register(sweepEventsRoute(ctx));
    await app.register(sweepCheckRoute(ctx));
  };
}

