/**
 * GET /v1/sweeps/:id/events — server-sent events of one sweep: `status`, `branch`, `thermo`,
 * `point` and `diagnostics`, each with its Redis stream id as the event id, so a client
 * resumes with Last-Event-ID (or ?after=) and misses nothing still in the stream. The
 * stream ends with an `end` event once the sweep is finished and every event is sent.
 *
 * Each open stream uses its own duplicated Redis connection (XREAD BLOCK holds it).
 */
import { createHash } from 'node:crypto';
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { SWEEP_ID_PATTERN, isTerminal, type SweepStatus } from '../../../../workers/src/store/index.js';
import type { ApiContext } from '../context.js';
import { apiError } from '../errors.js';
import { errorResponses } from '../schemas/error-body.js';
import { EventsHeaders, EventsQuery, SweepIdParams } from '../schemas/sweep-bodies.js';
import { ownedSweep } from './sweeps.js';

const STREAM_ID = /^\d{1,20}-\d{1,20}$/;
/** Events per XREAD. */
const BATCH = 500;
/** Longest XREAD BLOCK, ms (between two status checks). */
const BLOCK_MS = 2000;

export function sweepEventsRoute(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.get('/:id/events', {
      config: { allowStreamToken: true },
      schema: {
        summary: 'Live events of a sweep (server-sent events; resume with Last-Event-ID)',
        description: 'text/event-stream. Events: status, branch, thermo, point, diagnostics (data = JSON), then end. ' +
          'Authenticate with the bearer token, or with ?streamToken= from POST /v1/sweeps/{id}/stream-token.',
        tags: ['sweeps'],
        params: SweepIdParams,
        querystring: EventsQuery,
        headers: EventsHeaders,
        response: { 200: z.string().describe('text/event-stream'), ...errorResponses(400, 401, 404, 429) },
      },
    }, async (request, reply) => {
      const { id } = request.params;
      if (!request.caller) {
        // Stream-token authentication (the auth hook let it through only with a token present).
        if (!SWEEP_ID_PATTERN.test(id)) throw apiError('BSW_ERR_BAD_SWEEP_ID', id.slice(0, 64));
        const sha = createHash('sha256').update(request.query.streamToken ?? '').digest('hex');
        const raw = await ctx.redis.get(ctx.store.keys.streamToken(sha));
        const grant = raw ? (JSON.parse(raw) as { owner: string; sweepId: string }) : null;
        if (!grant || grant.sweepId !== id) throw apiError('BSW_ERR_STREAM_TOKEN_REJECTED');
        request.caller = { owner: grant.owner, tokenId: 'stream', tokenName: 'stream' };
      }
      const after = request.headers['last-event-id'] ?? request.query.after ?? '0';
      if (after !== '0' && !STREAM_ID.test(after)) throw apiError('BSW_ERR_BAD_EVENT_ID', after.slice(0, 64));
      await ownedSweep(ctx, request, id);

      reply.hijack();
      const res = reply.raw;
      res.writeHead(200, {
        'content-type': 'text/event-stream; charset=utf-8',
        'cache-control': 'no-cache, no-transform',
        connection: 'keep-alive',
        'x-accel-buffering': 'no',
      });
      res.write('retry: 2000\n\n');

      const conn = ctx.redis.duplicate({ maxRetriesPerRequest: 1, lazyConnect: true });
      conn.on('error', () => { /* the read fails and the stream closes; the client resumes with Last-Event-ID */ });
      let closed = false;
      const finish = () => {
        if (closed) return;
        closed = true;
        clearInterval(heartbeat);
        conn.disconnect();
        if (!res.writableEnded) res.end();
      };
      res.on('close', finish);
      const heartbeat = setInterval(() => { if (!closed) res.write(': keepalive\n\n'); }, ctx.options.heartbeatMs);

      let last = after;
      try {
        while (!closed) {
          let ended = false;
          let events = await ctx.store.readEvents(id, last, BATCH);
          if (events.length === 0) {
            const status = await ctx.store.getStatus(id);
            if (status === null || isTerminal(status)) {
              // Finished (or expired) and everything up to its final event was sent: a late
              // reader must not wait. Re-read once in case the final event landed meanwhile.
              events = await ctx.store.readEvents(id, last, BATCH);
              if (events.length === 0) ended = true;
            } else {
              events = await ctx.store.readEvents(id, last, BATCH, BLOCK_MS, conn);
            }
          }
          for (const ev of events) {
            res.write(`id: ${ev.id}\nevent: ${ev.type}\ndata: ${ev.data}\n\n`);
            last = ev.id;
            if (ev.type === 'status' && isTerminal((JSON.parse(ev.data) as { status: SweepStatus }).status)) ended = true;
          }
          if (ended) {
            res.write('event: end\ndata: {}\n\n');
            break;
          }
        }
      } catch (err) {
        if (!closed) request.log.warn({ err }, 'event stream stopped');
      } finally {
        finish();
      }
    });
  };
}
