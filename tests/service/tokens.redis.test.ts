/**
 * Tokens and limits: every sweep belongs to its token's owner (others get 404), no token or
 * a revoked token gets 401, a token over its rate gets 429 with Retry-After, and an owner
 * cannot queue more than the cap.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { TokenStore, hashToken } from '../../workers/src/store/index.js';
import { parseSseChunk } from '../../services/cli/src/client/index.js';
import { bearer, smallSpec, startTestApi, testRedisUrl, uniquePrefix } from './support/harness.js';

describe('tokens and limits', () => {
  const prefix = uniquePrefix('tokens');
  let api: Api;
  let redis: Redis;
  let tokens: TokenStore;
  let alice: string;
  let aliceLaptop: string;
  let bob: string;
  let aliceSweep: string;

  beforeAll(async () => {
    // No worker: sweeps stay queued, which the cap test needs.
    api = await startTestApi({ prefix, rateLimitMax: 1000, maxActivePerOwner: 3 });
    redis = new Redis(testRedisUrl());
    tokens = new TokenStore(redis, { prefix });
    alice = (await tokens.create('alice-desk', 'alice')).secret;
    aliceLaptop = (await tokens.create('alice-laptop', 'alice')).secret;
    bob = (await tokens.create('bob')).secret;
    const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(alice), payload: smallSpec({ label: 'alice-1' }) });
    expect(res.statusCode).toBe(201);
    aliceSweep = res.json().id;
  });

  afterAll(async () => {
    await api?.close();
    redis?.disconnect();
  });

  describe('when stored', () => {
    it('should keep only the SHA-256 of the secret', async () => {
      const keys = await redis.keys(`${prefix}token*`);
      const dump = (await Promise.all(keys.map(async (k) => ((await redis.type(k)) === 'hash' ? JSON.stringify(await redis.hgetall(k)) : (await redis.type(k)) === 'string' ? await redis.get(k) : k)))).join(' ') + keys.join(' ');
      expect(dump).not.toContain(alice);
      expect(dump).toContain(hashToken(alice));
      const list = await tokens.list();
      expect(list.map((t) => t.name)).toEqual(['alice-desk', 'alice-laptop', 'bob']);
      expect(JSON.stringify(list)).not.toContain(alice);
    });

    it('should refuse a second active token with the same name', async () => {
      await expect(tokens.create('bob')).rejects.toThrow(/named 'bob' exists/);
    });
  });

  describe('when another owner asks for a sweep', () => {
    it.each([
      ['GET', ''], ['GET', '/result'], ['GET', '/result.csv'], ['GET', '/events'], ['POST', '/cancel'], ['POST', '/stream-token'],
    ] as const)('should answer 404 to %s …%s', async (method, suffix) => {
      const res = await api.app.inject({ method, url: `/v1/sweeps/${aliceSweep}${suffix}`, headers: bearer(bob) });
      expect(res.statusCode).toBe(404);
      expect(res.json().code).toBe('BSW_ERR_SWEEP_NOT_FOUND');
    });

    it('should not list it', async () => {
      const list = (await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: bearer(bob) })).json();
      expect(list.items).toEqual([]);
    });

    it('should let another token of the same owner see it', async () => {
      const res = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${aliceSweep}`, headers: bearer(aliceLaptop) });
      expect(res.statusCode).toBe(200);
      expect(res.json().label).toBe('alice-1');
    });
  });

  describe('when no token is sent', () => {
    it.each(['/v1/sweeps', `/v1/sweeps/${'sw_aaaaaaaaaaaaaaaa'}`, '/v1/engines'])('should answer 401 to GET %s', async (url) => {
      const res = await api.app.inject({ method: 'GET', url });
      expect(res.statusCode).toBe(401);
      expect(res.json().code).toBe('BSW_ERR_UNAUTHORIZED');
    });

    it('should still serve health, metrics and the OpenAPI document', async () => {
      for (const url of ['/healthz', '/readyz', '/metrics', '/openapi.json']) {
        expect((await api.app.inject({ method: 'GET', url })).statusCode, url).toBe(200);
      }
    });
  });

  describe('when a token is revoked', () => {
    it('should answer 401 from then on, and leave other tokens working', async () => {
      const { secret } = await tokens.create('temp', 'alice');
      expect((await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: bearer(secret) })).statusCode).toBe(200);
      const revoked = await tokens.revoke('temp');
      expect(revoked?.revokedAt).toBeTruthy();
      const res = await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: bearer(secret) });
      expect(res.statusCode).toBe(401);
      expect(res.json().code).toBe('BSW_ERR_TOKEN_REJECTED');
      expect((await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: bearer(alice) })).statusCode).toBe(200);
      expect(await tokens.revoke('temp')).toBeNull();
      // The name is free again.
      expect((await tokens.create('temp', 'alice')).info.name).toBe('temp');
    });
  });

  describe('when an owner reaches the cap on queued sweeps', () => {
    it('should answer 429 with Retry-After and store nothing, until one is cancelled', async () => {
      const ids = [aliceSweep];
      for (const hx of [0.11, 0.12]) {
        const r = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(alice), payload: smallSpec({ h0: { model: 'ising', J: 1, hx } }) });
        expect(r.statusCode).toBe(201);
        ids.push(r.json().id);
      }
      const before = await redis.zcard(`${prefix}owner:alice:sweeps`);
      const over = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(aliceLaptop), payload: smallSpec({ h0: { model: 'ising', J: 1, hx: 0.13 } }) });
      expect(over.statusCode).toBe(429);
      expect(over.json().code).toBe('BSW_ERR_TOO_MANY_ACTIVE');
      expect(over.json().message).toMatch(/3 queued or running sweeps \(the cap is 3\)/);
      expect(Number(over.headers['retry-after'])).toBeGreaterThan(0);
      expect(await redis.zcard(`${prefix}owner:alice:sweeps`)).toBe(before);
      // Bob has his own allowance.
      expect((await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(bob), payload: smallSpec() })).statusCode).toBe(201);
      // Cancelling frees a slot; the queued branch jobs are dropped.
      const cancel = await api.app.inject({ method: 'POST', url: `/v1/sweeps/${ids[2]}/cancel`, headers: bearer(alice) });
      expect(cancel.json()).toEqual({ id: ids[2], status: 'cancelled', changed: true });
      expect(await api.ctx.queue.queue.getJob(`${ids[2]}.0`)).toBeUndefined();
      const again = await api.app.inject({ method: 'POST', url: `/v1/sweeps/${ids[2]}/cancel`, headers: bearer(alice) });
      expect(again.json()).toEqual({ id: ids[2], status: 'cancelled', changed: false });
      const now = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(alice), payload: smallSpec({ h0: { model: 'ising', J: 1, hx: 0.13 } }) });
      expect(now.statusCode).toBe(201);
    });
  });

  describe('when a stream token is used', () => {
    it('should open the stream of its sweep only, without a bearer header', async () => {
      const grant = (await api.app.inject({ method: 'POST', url: `/v1/sweeps/${aliceSweep}/stream-token`, headers: bearer(alice) })).json();
      expect(grant.url).toContain(grant.streamToken);
      await api.ctx.store.cancelSweep(aliceSweep);
      const res = await api.app.inject({ method: 'GET', url: grant.url });
      expect(res.statusCode).toBe(200);
      const types = parseSseChunk(res.body).events.map((e) => e.type);
      expect(types[0]).toBe('status');
      expect(types.at(-1)).toBe('end');
      const other = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(bob), payload: smallSpec({ label: 'b2', betas: [3] }) })).json().id;
      const wrong = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${other}/events?streamToken=${grant.streamToken}` });
      expect(wrong.statusCode).toBe(401);
      expect(wrong.json().code).toBe('BSW_ERR_STREAM_TOKEN_REJECTED');
    });
  });
});

describe('rate limit', () => {
  const prefix = uniquePrefix('rate');
  let api: Api;
  let redis: Redis;

  beforeAll(async () => {
    api = await startTestApi({ prefix, rateLimitMax: 5, rateLimitWindowMs: 60_000 });
    redis = new Redis(testRedisUrl());
  });

  afterAll(async () => {
    await api?.close();
    redis?.disconnect();
  });

  describe('when a token sends more requests than its limit', () => {
    it('should answer 429 with Retry-After, per token, with counters in Redis', async () => {
      const store = new TokenStore(redis, { prefix });
      const busy = (await store.create('busy')).secret;
      const calm = (await store.create('calm')).secret;
      const codes: number[] = [];
      const remaining: string[] = [];
      for (let i = 0; i < 7; i++) {
        const r = await api.app.inject({ method: 'GET', url: '/v1/engines', headers: bearer(busy) });
        codes.push(r.statusCode);
        remaining.push(String(r.headers['x-ratelimit-remaining']));
      }
      expect(codes).toEqual([200, 200, 200, 200, 200, 429, 429]);
      expect(remaining).toEqual(['4', '3', '2', '1', '0', '0', '0']);
      const limited = await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: bearer(busy) });
      expect(limited.statusCode).toBe(429);
      expect(limited.json().code).toBe('BSW_ERR_RATE_LIMITED');
      expect(limited.json().message).toMatch(/at most 5 requests per 60 s/);
      const retry = Number(limited.headers['retry-after']);
      expect(retry).toBeGreaterThan(0);
      expect(retry).toBeLessThanOrEqual(60);
      expect((await api.app.inject({ method: 'GET', url: '/v1/engines', headers: bearer(calm) })).statusCode).toBe(200);
      expect((await redis.keys(`${prefix}rl:*`)).length).toBeGreaterThan(0);
      // A second API process shares the counters.
      const twin = await startTestApi({ prefix, rateLimitMax: 5, rateLimitWindowMs: 60_000 });
      try {
        expect((await twin.app.inject({ method: 'GET', url: '/v1/engines', headers: bearer(busy) })).statusCode).toBe(429);
      } finally {
        await twin.close();
      }
    });
  });
});
