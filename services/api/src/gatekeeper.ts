/**
 * The gate of every /v1 route: bearer-token check and per-token rate limit in ONE Redis
 * script call (the token's lookup hash, then INCR of its window counter), so a status poll
 * pays one round trip for both. Counters live in Redis, so every API process shares them;
 * a fixed window of `windowMs` starts at a token's first request. A request without a
 * bearer header on a route that accepts a stream token is counted per client address.
 * Every answer carries x-ratelimit-limit / -remaining / -reset; a refusal is 429 with
 * Retry-After.
 * A route with `config.prefetchSweep` (the status poll) also reads the sweep named by its :id
 * in the same script (sweep_state, workers/src/store/lua/scripts.ts), after the token check
 * and only for a known token: one round trip per poll instead of two. The route still checks
 * the owner (ownedSweep).
 */
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { Redis } from 'ioredis';
import {
  SWEEP_ID_PATTERN, SWEEP_STATE_FN, hashToken, type RedisJobStore, type StoreKeys, type SweepStateRaw, type SweepStateRead,
} from '../../../workers/src/store/index.js';
import { BetasweepApiError, apiError } from './errors.js';

/** Lua function gate(tokenKey or '', counter prefix, window ms, address): {} or {id, name, owner, count, ttlMs}. */
const GATE_FN = `
local function gate(tk, prefix, window, address)
  local id, name, owner, key
  if tk ~= '' then
    local t = redis.call('HMGET', tk, 'id', 'name', 'owner')
    if not t[1] then return {} end
    id, name, owner = t[1], t[2], t[3]
    key = prefix .. 'tok:' .. id
  else
    id, name, owner = '', '', ''
    key = prefix .. 'ip:' .. address
  end
  local n = redis.call('INCR', key)
  local ttl = redis.call('PTTL', key)
  if ttl < 0 then
    redis.call('PEXPIRE', key, window)
    ttl = tonumber(window)
  end
  return {id, name, owner, n, ttl}
end
`;

/**
 * KEYS: token lookup hash (or '' to count the address in ARGV[3] alone)
 * ARGV: counter key prefix, window ms, address key
 * Returns {} for an unknown or revoked token, else {id, name, owner, count, ttlMs}.
 */
const GATE = `${GATE_FN}
return gate(KEYS[1], ARGV[1], ARGV[2], ARGV[3])
`;

/**
 * KEYS: token lookup hash, then the sweep's record, branches and progress keys
 * ARGV: counter key prefix, window ms, '' (no address), sweep_state mode ('1' whole record)
 * Returns {} for an unknown or revoked token, else {id, name, owner, count, ttlMs, state}.
 */
const GATE_STATE = `${GATE_FN}${SWEEP_STATE_FN}
local g = gate(KEYS[1], ARGV[1], ARGV[2], ARGV[3])
if #g == 0 then return {} end
g[6] = sweep_state(KEYS[2], KEYS[3], KEYS[4], ARGV[4])
return g
`;

type GateFn = (numKeys: number, tokenKey: string, counterPrefix: string, windowMs: number, address: string) => Promise<(string | number)[]>;
type GateStateFn = (
  numKeys: number, tokenKey: string, record: string, branches: string, progress: string,
  counterPrefix: string, windowMs: number, address: string, full: string,
) => Promise<[string, string, string, number, number, SweepStateRaw] | []>;

/** A sweep read by the gate for a prefetchSweep route. */
export interface PrefetchedSweep {
  readonly id: string;
  readonly raw: SweepStateRaw;
  readonly read: SweepStateRead;
}

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
    /** The sweep of a prefetchSweep route, read by the gate (null when not read). */
    prefetchedSweep: PrefetchedSweep | null;
  }
  interface FastifyContextConfig {
    /** The route accepts a stream token in the query instead of a bearer token. */
    allowStreamToken?: boolean;
    /** The gate also reads the sweep of params.id (a well-formed sweep id) in its script call. */
    prefetchSweep?: boolean;
  }
}

/** Options of the gate. */
export interface GateOptions {
  keys: StoreKeys;
  /** Plans and parses the prefetched sweep reads. */
  store: Pick<RedisJobStore, 'sweepStateRead'>;
  /** Requests per window and token. */
  max: number;
  windowMs: number;
}

const BEARER = /^Bearer\s+([A-Za-z0-9._~+/=-]{1,256})\s*$/i;

/** Adds the gate to `app` (call inside the /v1 plugin). */
export function installGate(app: FastifyInstance, redis: Redis, options: GateOptions): void {
  const { keys, store, max, windowMs } = options;
  const commands = redis as unknown as Record<string, unknown>;
  if (typeof commands.bswGate !== 'function') redis.defineCommand('bswGate', { lua: GATE });
  if (typeof commands.bswGateState !== 'function') redis.defineCommand('bswGateState', { lua: GATE_STATE });
  const gate: GateFn = (...args) => (redis as unknown as { bswGate: GateFn }).bswGate(...args);
  const gateState: GateStateFn = (...args) => (redis as unknown as { bswGateState: GateStateFn }).bswGateState(...args);
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
    const tokenKey = keys.tokenHash(hashToken(m[1]));
    const id = request.routeOptions.config?.prefetchSweep ? (request.params as { id?: unknown } | undefined)?.id : undefined;
    let out: (string | number | SweepStateRaw)[];
    if (typeof id === 'string' && SWEEP_ID_PATTERN.test(id)) {
      const read = store.sweepStateRead(id);
      out = await gateState(4, tokenKey, ...read.keys, counterPrefix, windowMs, '', read.full);
      if (out.length > 0) request.prefetchedSweep = { id, raw: out[5] as SweepStateRaw, read };
    } else {
      out = await gate(1, tokenKey, counterPrefix, windowMs, '');
    }
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
