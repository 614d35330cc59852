/**
 * The job store contract, run against both implementations (Redis and in-memory):
 * idempotent records, status guards, dedupe, the cap, listing. Then what only Redis does:
 * concurrent writers, retention, cursor paging.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MemoryJobStore, RedisJobStore, type BranchRecord, type JobStore } from '../../workers/src/store/index.js';
import { newSweepFor, smallSpec, testRedisUrl, uniquePrefix } from './support/harness.js';

const point = (b: number, t: number, v = b + t / 10): BranchRecord => ({
  kind: 'point', betaIndex: b, timeIndex: t, json: JSON.stringify({ betaIndex: b, timeIndex: t, values: [v, -v], errors: [0, 0] }),
});

let redis: Redis;
beforeAll(() => { redis = new Redis(testRedisUrl()); });
afterAll(() => { redis?.disconnect(); });

describe.each([
  ['memory', () => new MemoryJobStore() as JobStore],
  ['redis', () => new RedisJobStore(redis, { prefix: uniquePrefix('store') }) as JobStore],
])('job store (%s)', (_name, make) => {
  let store: JobStore;
  beforeAll(() => { store = make(); });

  describe('when the same point is written twice', () => {
    it('should keep the first write and count it once', async () => {
      const { id } = await store.createSweep(await newSweepFor(smallSpec())) as { id: string };
      expect(await store.writeRecords(id, 0, [point(0, 0, 1), point(0, 1)])).toBe(2);
      expect(await store.writeRecords(id, 0, [point(0, 0, 99), point(0, 2)])).toBe(1);
      const stored = await store.readRecords(id);
      expect(stored.points).toHaveLength(3);
      expect(stored.points.map((p) => JSON.parse(p)).find((p) => p.timeIndex === 0).values[0]).toBe(1);
      expect((await store.getSweep(id))!.branches[0].pointsDone).toBe(3);
    });

    it('should report the contiguous stored prefix per β for resuming', async () => {
      const { id } = await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string };
      await store.writeRecords(id, 0, [point(0, 0), point(0, 1), point(0, 3), point(1, 0)]);
      expect(await store.storedPointCounts(id, [0, 1], 5)).toEqual({ 0: 2, 1: 1 });
    });
  });

  describe('when a sweep is finished', () => {
    it('should refuse further writes and status changes', async () => {
      const { id } = await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string };
      expect(await store.branchStarted(id, 0, { state: 'running', attempts: 1, worker: 'w', startedAt: null, finishedAt: null, error: null })).toBe(true);
      expect(await store.getStatus(id)).toBe('running');
      expect(await store.cancelSweep(id)).toBe(true);
      expect(await store.writeRecords(id, 0, [point(0, 0)])).toBeNull();
      expect(await store.branchStarted(id, 1, { state: 'running', attempts: 1, worker: 'w', startedAt: null, finishedAt: null, error: null })).toBe(false);
      expect(await store.completeSweep(id, '{}')).toBe(false);
      expect(await store.failSweep(id, 'late')).toBe(false);
      expect(await store.cancelSweep(id)).toBe(false);
      expect((await store.getSweep(id))!.status).toBe('cancelled');
      expect((await store.control(id)).status).toBe('cancelled');
    });

    it('should let only one process claim the final assembly', async () => {
      const { id } = await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string };
      expect(await store.claimFinalize(id, 10_000)).toBe(true);
      expect(await store.claimFinalize(id, 10_000)).toBe(false);
      await store.releaseFinalize(id);
      expect(await store.claimFinalize(id, 10_000)).toBe(true);
    });

    it('should report all branches done only after the last one', async () => {
      const { id } = await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string };
      const info = { state: 'done' as const, attempts: 1, worker: 'w', startedAt: null, finishedAt: null, error: null };
      expect(await store.branchFinished(id, 1, info)).toEqual({ allDone: false });
      expect(await store.branchFinished(id, 1, info)).toEqual({ allDone: false });
      expect(await store.branchFinished(id, 0, info)).toEqual({ allDone: true });
    });
  });

  describe('when the same owner submits the same canonical spec', () => {
    it('should return the existing sweep unless fresh, and a failed one never blocks a rerun', async () => {
      const base = await newSweepFor(smallSpec({ betas: [3] }), 'dedupe-owner');
      const a = await store.createSweep(base);
      expect(a.kind).toBe('created');
      expect(await store.createSweep(base)).toEqual({ kind: 'existing', id: (a as { id: string }).id });
      expect(await store.createSweep({ ...base, owner: 'someone-else' })).toMatchObject({ kind: 'created' });
      const fresh = await store.createSweep({ ...base, fresh: true });
      expect(fresh.kind).toBe('created');
      await store.failSweep((fresh as { id: string }).id, 'boom');
      expect((await store.createSweep(base)).kind).toBe('created');
    });
  });

  describe('when an owner reaches the cap', () => {
    it('should refuse with the active count, and accept again after one finishes', async () => {
      const owner = `capped-${Math.random()}`;
      const mk = async (hx: number) => store.createSweep({ ...(await newSweepFor(smallSpec({ h0: { model: 'ising', J: 1, hx } }), owner)), maxActive: 2 });
      const a = await mk(0.1);
      await mk(0.2);
      expect(await mk(0.3)).toEqual({ kind: 'capped', active: 2 });
      await store.cancelSweep((a as { id: string }).id);
      expect((await mk(0.3)).kind).toBe('created');
      const page = await store.listSweeps(owner, { status: 'cancelled' });
      expect(page.items.map((s) => s.id)).toEqual([(a as { id: string }).id]);
    });
  });
});

describe('redis job store', () => {
  describe('when many writers race on the same points (a retried branch and a zombie)', () => {
    it('should store and stream each point exactly once', async () => {
      const store = new RedisJobStore(redis, { prefix: uniquePrefix('race') });
      const { id } = await store.createSweep(await newSweepFor(smallSpec())) as { id: string };
      const writers = Array.from({ length: 6 }, (_, w) => {
        const c = redis.duplicate();
        const s = new RedisJobStore(c, { prefix: store.keys.prefix });
        const batch = Array.from({ length: 5 }, (_, t) => point(t % 2, (t + w) % 5));
        return s.writeRecords(id, 0, batch).finally(() => c.disconnect());
      });
      const written = (await Promise.all(writers)).reduce((a, n) => a! + n!, 0);
      const stored = await store.readRecords(id);
      const events = await store.readEvents(id, '0', 1000);
      const pointEvents = events.filter((e) => e.type === 'point');
      expect(written).toBe(stored.points.length);
      expect(pointEvents).toHaveLength(stored.points.length);
      expect(new Set(pointEvents.map((e) => e.data)).size).toBe(pointEvents.length);
      expect(await store.pointsWritten()).toBe(stored.points.length);
    });
  });

  describe('when a sweep finishes with a retention time', () => {
    it('should put every key of the sweep on that TTL and leave running sweeps without one', async () => {
      const store = new RedisJobStore(redis, { prefix: uniquePrefix('ttl'), retentionSeconds: 120 });
      const { id } = await store.createSweep(await newSweepFor(smallSpec())) as { id: string };
      await store.writeRecords(id, 0, [point(0, 0)]);
      expect(await redis.ttl(store.keys.sweep(id))).toBe(-1);
      await store.completeSweep(id, '{"ok":true}');
      for (const key of [store.keys.sweep(id), store.keys.points(id), store.keys.events(id), store.keys.result(id), store.keys.branches(id)]) {
        const ttl = await redis.ttl(key);
        expect(ttl, key).toBeGreaterThan(100);
        expect(ttl, key).toBeLessThanOrEqual(120);
      }
      expect(await store.getResultJson(id)).toBe('{"ok":true}');
      expect(await redis.sismember(store.keys.ownerActive('tester'), id)).toBe(0);
    });
  });

  describe('when an owner pages through many sweeps', () => {
    it('should return each exactly once, newest first, even as new ones arrive', async () => {
      const store = new RedisJobStore(redis, { prefix: uniquePrefix('page') });
      const ids: string[] = [];
      for (let i = 0; i < 7; i++) {
        ids.push(((await store.createSweep({ ...(await newSweepFor(smallSpec({ betas: [i + 1] }))), fresh: true })) as { id: string }).id);
      }
      const seen: string[] = [];
      let cursor: string | undefined;
      let pages = 0;
      do {
        const page = await store.listSummaries('tester', { limit: 3, cursor });
        seen.push(...page.items.map((s) => s.id));
        cursor = page.nextCursor ?? undefined;
        if (pages++ === 0) await store.createSweep({ ...(await newSweepFor(smallSpec({ betas: [42] }))), fresh: true });
      } while (cursor);
      expect(seen).toEqual([...ids].reverse());
      expect(pages).toBe(3);
    });
  });
});
