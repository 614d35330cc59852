/**
 * The gate of every /v1 route: bearer-token check and per-token rate limit in ONE Redis
 * script call (the token's lookup hash, then INCR of its window counter), so a status poll
 * pays one round trip for both. Counters live in Redis, so every API process shares them;
 * a fixed window of `windowMs` starts at a token's first request. A request without a
 * bearer header on a route that accepts a stream token is counted per client address.
 * Every answer carries x-ratelimit-limit / -remaining / -reset; a refusal is 429 with
 * Retry-After.
 */
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { Redis } from 'ioredis';
import { hashToken, type StoreKeys } from '../../../workers/src/store/index.js';
import { BetasweepApiError, apiError } from './errors.js';

/**
 * KEYS: token lookup hash (or '' to count the address in ARGV[3] alone)
 * ARGV: counter key prefix, window ms, address key
 * Returns {} for an unknown or revoked token, else {id, name, owner, count, ttlMs}.
 */
const GATE = `
local id, name, owner, key
if KEYS[1] ~= '' then
  local t = redis.call('HMGET', KEYS[1], 'id', 'name', 'owner')
  if not t[1] then return {} end
  id, name, owner = t[1], t[2], t[3]
  key = ARGV[1] .. 'tok:' .. id
else
  id, name, owner = '', '', ''
  key = ARGV[1] .. 'ip:' .. ARGV[3]
end
local n = redis.call('INCR', key)
local ttl = redis.call('PTTL', key)
if ttl < 0 then
  redis.call('PEXPIRE', key, ARGV[2])
  ttl = tonumber(ARGV[2])
end
return {id, name, owner, n, ttl}
`;

type GateFn = (numKeys: number, tokenKey: string, counterPrefix: string, windowMs: number, address: string) => Promise<(string | number)[]>;

/** Who is calling. */
export interface Caller {
  owner: string;
  tokenId: string;
  tokenName: string;
}

declare module 'fastify' {
  interface FastifyRequest {
    /** Set by the gate on /v1 routes (null for a stream-token request). */
    caller: Caller | null;
  }
  interface FastifyContextConfig {
    /** The route accepts a stream token in the query instead of a bearer token. */
    allowStreamToken?: boolean;
  }
}

/** Options of the gate. */
export interface GateOptions {
  keys: StoreKeys;
  /** Requests per window and token. */
  max: number;
  windowMs: number;
}

const BEARER = /^Bearer\s+([A-Za-z0-9._~+/=-]{1,256})\s*$/i;

/** Adds the gate to `app` (call inside the /v1 plugin). */
export function installGate(app: FastifyInstance, redis: Redis, options: GateOptions): void {
  const { keys, max, windowMs } = options;
  if (typeof (redis as unknown as Record<string, unknown>).bswGate !== 'function') redis.defineCommand('bswGate', { lua: GATE });
  const gate: GateFn = (...args) => (redis as unknown as { bswGate: GateFn }).bswGate(...args);
  const counterPrefix = keys.rateLimitPrefix();

  const limit = (reply: FastifyReply, count: number, ttlMs: number) => {
    const resetSeconds = Math.max(1, Math.ceil(ttlMs / 1000));
    void reply.header('x-ratelimit-limit', max).header('x-ratelimit-remaining', Math.max(0, max - count)).header('x-ratelimit-reset', resetSeconds);
    if (count > max) {
      throw new BetasweepApiError('BSW_ERR_RATE_LIMITED', [max, `${windowMs / 1000} s`, `${resetSeconds} s`], { retryAfter: resetSeconds });
    }
  };

  app.addHook('onRequest', async (request: FastifyRequest, reply: FastifyReply) => {
    const header = request.headers.authorization;
    if (!header) {
      const q = request.query as Record<string, unknown> | undefined;
      if (!(request.routeOptions.config?.allowStreamToken && typeof q?.streamToken === 'string')) throw apiError('BSW_ERR_UNAUTHORIZED');
      const [, , , count, ttl] = await gate(1, '', counterPrefix, windowMs, request.ip);
      limit(reply, Number(count), Number(ttl));
      return;
    }
    const m = BEARER.exec(header);
    if (!m) throw apiError('BSW_ERR_UNAUTHORIZED');
    const out = await gate(1, keys.tokenHash(hashToken(m[1])), counterPrefix, windowMs, '');
    if (out.length === 0) throw apiError('BSW_ERR_TOKEN_REJECTED');
    const [tokenId, tokenName, owner, count, ttl] = out;
    request.caller = { owner: String(owner), tokenId: String(tokenId), tokenName: String(tokenName) };
    limit(reply, Number(count), Number(ttl));
  });
}

/** The caller of an authenticated route (throws 401 if the gate did not run). */
export function callerOf(request: FastifyRequest): Caller {
  if (!request.caller) throw apiError('BSW_ERR_UNAUTHORIZED');
  return request.caller;
}
