/**
 * The status poll's one Redis call: the gate checks the token, counts the rate limit and reads
 * the sweep in one script (services/api/src/gatekeeper.ts, config.prefetchSweep), and the
 * route still answers 401 / 404 / 400 / 429 exactly as with separate reads.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { TokenStore } from '../../workers/src/store/index.js';
import { bearer, smallSpec, startTestApi, testRedisUrl, uniquePrefix } from './support/harness.js';

describe('status poll', () => {
  const prefix = uniquePrefix('onecall');
  let api: Api;
  let redis: Redis;
  let tokens: TokenStore;
  let alice: string;
  let bob: string;
  let sweep: string;

  beforeAll(async () => {
    api = await startTestApi({ prefix, rateLimitMax: 40 });
    redis = new Redis(testRedisUrl());
    tokens = new TokenStore(redis, { prefix });
    alice = (await tokens.create('alice')).secret;
    bob = (await tokens.create('bob')).secret;
    const res = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: bearer(alice), payload: smallSpec({ label: 'one-call' }) });
    expect(res.statusCode).toBe(201);
    sweep = res.json().id;
  });

  afterAll(async () => {
    await api?.close();
    redis?.disconnect();
  });

  describe('when the token is good and the sweep is the caller\'s', () => {
    it('should cost one Redis command and answer the same body as the store\'s own read', async () => {
      const first = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(alice) });
      expect(first.statusCode).toBe(200);
      const spy = vi.spyOn(api.ctx.redis, 'sendCommand');
      try {
        const res = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(alice) });
        expect(res.statusCode).toBe(200);
        expect(spy.mock.calls.map(([c]) => (c as { name: string }).name)).toEqual(['evalsha']);
        const viaStore = await api.ctx.store.getSweep(sweep);
        const body = res.json();
        expect(body.id).toBe(sweep);
        expect(body.status).toBe(viaStore!.status);
        expect(body.branches).toEqual(JSON.parse(JSON.stringify(viaStore!.branches)));
        expect(body.plan).toEqual(JSON.parse(JSON.stringify(viaStore!.plan)));
        expect(res.headers['x-ratelimit-remaining']).toBeDefined();
      } finally {
        spy.mockRestore();
      }
    });
  });

  describe('when the caller may not see the sweep', () => {
    it('should answer 404 to another owner, 400 to a malformed id, 401 without or with a revoked token', async () => {
      expect((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(bob) })).statusCode).toBe(404);
      const missing = await api.app.inject({ method: 'GET', url: '/v1/sweeps/sw_aaaaaaaaaaaaaaaa', headers: bearer(alice) });
      expect(missing.statusCode).toBe(404);
      const bad = await api.app.inject({ method: 'GET', url: '/v1/sweeps/not-an-id', headers: bearer(alice) });
      expect(bad.statusCode).toBe(400);
      expect((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}` })).statusCode).toBe(401);
      const temp = (await tokens.create('temp', 'alice')).secret;
      expect((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(temp) })).statusCode).toBe(200);
      await tokens.revoke('temp');
      const revoked = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(temp) });
      expect(revoked.statusCode).toBe(401);
      expect(revoked.body).not.toContain('one-call');
    });
  });

  describe('when a token polls faster than its limit', () => {
    it('should count every poll and answer 429 with Retry-After past the limit', async () => {
      const carol = (await tokens.create('carol', 'alice')).secret;
      const codes: number[] = [];
      for (let i = 0; i < 42; i++) codes.push((await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(carol) })).statusCode);
      expect(codes.slice(0, 40).every((c) => c === 200)).toBe(true);
      expect(codes.slice(40)).toEqual([429, 429]);
      const last = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${sweep}`, headers: bearer(carol) });
      expect(Number(last.headers['retry-after'])).toBeGreaterThan(0);
    });
  });
});
