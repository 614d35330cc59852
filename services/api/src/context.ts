/** What the routes share: connections, stores, the queue, the planner and the limits. */
import type { Redis } from 'ioredis';
import type { SweepQueue } from '../../../workers/src/queue/index.js';
import type { RedisJobStore, TokenStore } from '../../../workers/src/store/index.js';
import type { Metrics } from './metrics.js';
import type { Planner } from './planner.js';

/** Limits and knobs of the API. */
export interface ApiOptions {
  /** Largest request body, bytes. @defaultValue 2097152 (2 MiB) */
  bodyLimit?: number;
  /** Requests per token per window. @defaultValue 600 */
  rateLimitMax?: number;
  /** Rate-limit window, ms. @defaultValue 60000 */
  rateLimitWindowMs?: number;
  /** Queued or running sweeps an owner may have; 0 = no cap. @defaultValue 20 */
  maxActivePerOwner?: number;
  /** Lifetime of a stream token, seconds. @defaultValue 300 */
  streamTokenTtlSeconds?: number;
  /** Heartbeat comment interval of event streams, ms. @defaultValue 15000 */
  heartbeatMs?: number;
  /** Log requests (pino). @defaultValue false */
  logger?: boolean;
}

export const API_DEFAULTS: Required<ApiOptions> = {
  bodyLimit: 2 * 1024 * 1024,
  rateLimitMax: 600,
  rateLimitWindowMs: 60_000,
  maxActivePerOwner: 20,
  streamTokenTtlSeconds: 300,
  heartbeatMs: 15_000,
  logger: false,
};

export interface ApiContext {
  /** The main connection (commands; never blocked). */
  redis: Redis;
  store: RedisJobStore;
  tokens: TokenStore;
  queue: SweepQueue;
  planner: Planner;
  metrics: Metrics;
  options: Required<ApiOptions>;
}
