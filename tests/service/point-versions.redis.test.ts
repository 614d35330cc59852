/**
 * Re-writable records and raw samples of sampled engines, against both job stores (Redis and
 * in-memory): a record of a higher version replaces the stored one, an older or equal version
 * never does, a version-0 (write-once) record is never replaced; each replacement is streamed
 * (Redis) but a point is counted once; samples are stored once per index; a finished branch
 * ignores late progress reports.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MemoryJobStore, RedisJobStore, type BranchInfo, type BranchRecord, type JobStore } from '../../workers/src/store/index.js';
import { newSweepFor, smallSpec, testRedisUrl, uniquePrefix } from './support/harness.js';

const point = (t: number, value: number, version?: number): BranchRecord => ({
  kind: 'point', betaIndex: 0, timeIndex: t, version,
  json: JSON.stringify({ betaIndex: 0, timeIndex: t, values: [value, value], errors: [1 / (version ?? 1), 0], ...(version ? { samples: version } : {}) }),
});
const thermo = (energy: number, version?: number): BranchRecord => ({ kind: 'thermo', betaIndex: 0, json: JSON.stringify({ betaIndex: 0, energy }), version });
const running: BranchInfo = { state: 'running', attempts: 1, worker: 'w', startedAt: null, finishedAt: null, error: null };

let redis: Redis;
beforeAll(() => { redis = new Redis(testRedisUrl()); });
afterAll(() => { redis?.disconnect(); });

describe.each([
  ['memory', () => new MemoryJobStore() as JobStore],
  ['redis', () => new RedisJobStore(redis, { prefix: uniquePrefix('versions') }) as JobStore],
])('versioned records (%s)', (name, make) => {
  let store: JobStore;
  beforeAll(() => { store = make(); });
  const fresh = async () => (await store.createSweep({ ...(await newSweepFor(smallSpec())), fresh: true }) as { id: string }).id;
  const storedPoint = async (id: string, t: number) => JSON.parse((await store.readRecords(id)).points.find((p) => JSON.parse(p).timeIndex === t)!);

  describe('when versions of one point arrive out of order', () => {
    it('should keep the newest, ignore older and equal ones, and count the point once', async () => {
      const id = await fresh();
      expect(await store.writeRecords(id, 0, [point(0, 4, 4)])).toBe(1);
      expect(await store.writeRecords(id, 0, [point(0, 8, 8)])).toBe(0);
      expect(await store.writeRecords(id, 0, [point(0, 6, 6)])).toBe(0);
      expect(await store.writeRecords(id, 0, [point(0, 99, 8)])).toBe(0);
      const p = await storedPoint(id, 0);
      expect(p.values[0]).toBe(8);
      expect(p.samples).toBe(8);
      expect((await store.getSweep(id))!.pointsDone).toBe(1);
      if (store instanceof RedisJobStore) {
        const events = (await store.readEvents(id, '0', 100)).filter((e) => e.type === 'point');
        expect(events.map((e) => JSON.parse(e.data).samples)).toEqual([4, 8]);
      }
    });

    it('should do the same for thermodynamics and keep the points of one batch apart', async () => {
      const id = await fresh();
      await store.writeRecords(id, 0, [thermo(-1, 2), point(1, 2, 2), point(2, 2, 2)]);
      await store.writeRecords(id, 0, [thermo(-3, 3), point(1, 3, 3), point(2, 1, 1)]);
      const stored = await store.readRecords(id);
      expect(stored.thermo.map((t) => JSON.parse(t).energy)).toEqual([-3]);
      expect((await storedPoint(id, 1)).values[0]).toBe(3);
      expect((await storedPoint(id, 2)).values[0]).toBe(2);
    });
  });

  describe('when write-once and versioned records meet', () => {
    it('should never replace a version-0 record, and ignore a version-0 write over a versioned one', async () => {
      const id = await fresh();
      await store.writeRecords(id, 0, [point(0, 1), point(1, 5, 5)]);
      expect(await store.writeRecords(id, 0, [point(0, 7, 7), point(1, 0)])).toBe(0);
      expect((await storedPoint(id, 0)).values[0]).toBe(1);
      expect((await storedPoint(id, 1)).values[0]).toBe(5);
    });

    it(`should refuse a version that is not a non-negative integer (${name})`, async () => {
      const id = await fresh();
      await expect(store.writeRecords(id, 0, [point(0, 1, -1)])).rejects.toThrow(RangeError);
      await expect(store.writeRecords(id, 0, [point(0, 1, 1.5)])).rejects.toThrow(RangeError);
    });
  });

  describe('when samples are stored', () => {
    it('should store each index once, count it once, read it back, and stop once the sweep is over', async () => {
      const id = await fresh();
      const bytes = (k: number) => Buffer.from(Float64Array.of(k, k / 3).buffer);
      expect(await store.writeSamples(id, 0, [{ sample: 0, data: bytes(0) }, { sample: 2, data: bytes(2) }])).toBe(2);
      expect(await store.writeSamples(id, 0, [{ sample: 2, data: bytes(99) }, { sample: 1, data: bytes(1) }])).toBe(3);
      expect(await store.writeSamples(id, 1, [{ sample: 0, data: bytes(5) }])).toBe(1);
      expect(await store.writeSamples(id, 0, [])).toBe(3);
      const back = await store.readSamples(id, 0, [0, 1, 2, 3]);
      expect(back.map((b) => (b ? Buffer.from(b).readDoubleLE(0) : null))).toEqual([0, 1, 2, null]);
      await expect(store.writeSamples(id, 0, [{ sample: -1, data: bytes(0) }])).rejects.toThrow(RangeError);
      await store.deleteSamples(id);
      expect(await store.readSamples(id, 0, [0])).toEqual([null]);
      await store.cancelSweep(id);
      expect(await store.writeSamples(id, 0, [{ sample: 4, data: bytes(4) }])).toBeNull();
    });
  });

  describe('when a branch reports progress after it finished', () => {
    it('should keep the finished state', async () => {
      const id = await fresh();
      expect(await store.branchProgress(id, 0, { ...running, samples: { stored: 3, target: 4, final: false } })).toBe(true);
      expect((await store.getSweep(id))!.branches[0].samples).toEqual({ stored: 3, target: 4, final: false });
      await store.branchFinished(id, 0, { ...running, state: 'done', samples: { stored: 8, target: 8, final: true } });
      expect(await store.branchProgress(id, 0, { ...running, samples: { stored: 6, target: 8, final: false } })).toBe(false);
      const b = (await store.getSweep(id))!.branches[0];
      expect([b.state, b.samples]).toEqual(['done', { stored: 8, target: 8, final: true }]);
    });
  });
});
