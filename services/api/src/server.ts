/**
 * Starts the API against a Redis URL: connections, stores, queue, planner, app, listen.
 * Used by `betasweep serve` and by the tests that need a real socket.
 */
import type { FastifyInstance } from 'fastify';
import { SweepQueue, startUnqueuedReconciler } from '../../../workers/src/queue/index.js';
import { RedisJobStore, TokenStore, STORE_DEFAULTS, connectRedis } from '../../../workers/src/store/index.js';
import { buildApp } from './app.js';
import { API_DEFAULTS, type ApiContext, type ApiOptions } from './context.js';
import { Metrics } from './metrics.js';
import { loadSweepPlanner, type Planner } from './planner.js';

/** Options of {@link createApi}. */
export interface CreateApiOptions extends ApiOptions {
  redisUrl: string;
  /** Store key prefix. @defaultValue 'bsw:' */
  prefix?: string;
  /** Retention of finished sweeps, seconds. @defaultValue 604800 */
  retentionSeconds?: number;
  /** Attempts per branch job. @defaultValue 5 */
  attempts?: number;
  /** First retry delay of a branch, ms (doubles per attempt). @defaultValue 1000 */
  backoffMs?: number;
  /** The sweep runner by default. */
  planner?: Planner;
  /**
   * How often to re-queue sweeps whose submit stored them but did not confirm their branch
   * jobs (a crash in between), ms; 0 turns it off. A first pass runs at start. @defaultValue 15000
   */
  reconcileEveryMs?: number;
  /** Age below which an unconfirmed sweep is left alone (its submit may be in flight), ms. @defaultValue 10000 */
  reconcileGraceMs?: number;
}

export interface Api {
  app: FastifyInstance;
  ctx: ApiContext;
  /** Closes the app and the connections. */
  close(): Promise<void>;
}

export async function createApi(options: CreateApiOptions): Promise<Api> {
  const { redisUrl, prefix = STORE_DEFAULTS.prefix, retentionSeconds, attempts, backoffMs } = options;
  const redis = connectRedis(redisUrl, { maxRetriesPerRequest: 3, enableAutoPipelining: true }, 'api');
  const queueConnection = connectRedis(redisUrl, { maxRetriesPerRequest: null }, 'api queue');
  const store = new RedisJobStore(redis, { prefix, retentionSeconds });
  const ctx: ApiContext = {
    redis,
    store,
    tokens: new TokenStore(redis, { prefix }),
    queue: new SweepQueue(queueConnection, { prefix, attempts, backoffMs }),
    planner: options.planner ?? (await loadSweepPlanner()),
    metrics: new Metrics(),
    options: {
      ...API_DEFAULTS,
      ...Object.fromEntries(Object.entries(options).filter(([k, v]) => v !== undefined && k in API_DEFAULTS)),
    } as Required<ApiOptions>,
  };
  const app = await buildApp(ctx);
  const { reconcileEveryMs = 15_000, reconcileGraceMs = 10_000 } = options;
  const stopReconciler = reconcileEveryMs > 0
    ? startUnqueuedReconciler(store, ctx.queue, { everyMs: reconcileEveryMs, graceMs: reconcileGraceMs })
    : () => undefined;
  return {
    app,
    ctx,
    async close() {
      stopReconciler();
      await app.close();
      await ctx.queue.close();
      redis.disconnect();
      queueConnection.disconnect();
    },
  };
}
