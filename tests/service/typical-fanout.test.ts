/**
 * A `typical` sweep through the branch runner without Redis (the in-memory store): its branches
 * fan out into sample-block jobs, each block's samples are stored once by index, the estimate
 * is re-written with a higher version as samples arrive, and the final result equals the local
 * run bit for bit — also when a block is cut off mid-way and retried.
 * Bit-for-bit: the final estimate rests on exactly the samples [0, R) the local run uses, each
 * computed by the same code from the same (seed, k) stream, and the jackknife sums run over the
 * records sorted by sample index, so summation order does not depend on the split.
 */
import { describe, expect, it } from 'vitest';
import type { SweepResult } from '../../shared-types/src/index.js';
import { BranchAbortedError, runStoredBranch, type BranchJobData } from '../../workers/src/queue/index.js';
import { MemoryJobStore, type BranchRecord, type JobStore } from '../../workers/src/store/index.js';
import { localResult, newSweepFor, smallSpec } from './support/harness.js';

/** 6-site chain, two β, tolerance that needs a second round after the pilot. */
const SPEC = smallSpec({
  label: 'typical-fanout', lattice: { kind: 'chain', length: 6 }, engine: 'typical', tolerance: 0.02, seed: 5,
  h0: { model: 'ising', J: 1, hx: 0.7 }, betas: [0.5, 1.5], times: { values: [0, 0.5, 1] },
});

const withoutTiming = (r: SweepResult) => ({ ...r, timing: null });

/** A memory store that records every versioned write and can stop a job after some samples. */
class WatchedStore extends MemoryJobStore {
  writes: BranchRecord[] = [];
  stopAfterSamples = Infinity;
  readonly controller = new AbortController();
  override async writeRecords(id: string, branchIndex: number, records: BranchRecord[]) {
    this.writes.push(...records);
    return super.writeRecords(id, branchIndex, records);
  }
  override async writeSamples(...args: Parameters<JobStore['writeSamples']>) {
    const n = await super.writeSamples(...args);
    if (--this.stopAfterSamples === 0) this.controller.abort('orphaned');
    return n;
  }
}

describe('typical sweep through the branch runner', () => {
  describe('when every branch job runs in-process', () => {
    it('should sharpen each point version by version and end with the local result, bit for bit', async () => {
      const store = new WatchedStore();
      const input = await newSweepFor(SPEC);
      expect(input.plan.engine).toBe('typical');
      const { id } = await store.createSweep(input) as { id: string };
      let finalized = 0;
      for (const [branchIndex, betaIndices] of input.plan.branches.entries()) {
        const out = await runStoredBranch({ store, data: { sweepId: id, branchIndex, betaIndices } });
        expect(out.outcome).toBe('done');
        finalized += Number(out.finalized);
      }
      expect(finalized).toBe(1);
      const record = (await store.getSweep(id))!;
      expect(record.status).toBe('succeeded');
      const result = JSON.parse((await store.getResultJson(id))!) as SweepResult;
      const local = await localResult(SPEC);
      expect(withoutTiming(result)).toEqual(withoutTiming(local));
      const samples = Number(local.diagnostics[0].extra.samples);
      expect(Number(local.diagnostics[0].extra.rounds)).toBeGreaterThanOrEqual(2);
      expect(record.branches[0].samples).toEqual({ stored: samples, target: samples, final: true });

      // One point, followed through its versions: more samples, and the largest error bar first.
      const versions = store.writes.filter((w) => w.kind === 'point' && w.betaIndex === 0 && w.timeIndex === 2);
      const counts = versions.map((w) => w.version!);
      expect(counts.length).toBeGreaterThanOrEqual(2);
      expect(counts[0]).toBeLessThan(samples);
      expect(Math.max(...counts)).toBe(samples);
      const errorOf = (w: BranchRecord) => JSON.parse(w.json).errors[1] as number;
      expect(errorOf(versions[0])).toBeGreaterThan(errorOf(versions.find((w) => w.version === samples)!));
      expect(JSON.parse(versions.find((w) => w.version === samples)!.json).samples).toBe(samples);
      // The samples are gone once the result holds their estimates.
      expect(await store.readSamples(id, 0, [0, 1])).toEqual([null, null]);
    });
  });

  describe('when a block job is cut off after its first sample and retried', () => {
    it('should compute only the missing samples and still end with the local result', async () => {
      const store = new WatchedStore();
      const input = await newSweepFor({ ...SPEC, label: 'typical-retry' });
      const { id } = await store.createSweep(input) as { id: string };
      const queued: BranchJobData[] = [];
      const enqueue = async (jobs: BranchJobData[]) => { queued.push(...jobs); };
      for (const [branchIndex, betaIndices] of input.plan.branches.entries()) {
        await runStoredBranch({ store, data: { sweepId: id, branchIndex, betaIndices }, enqueue });
      }
      // Cheap samples: each round is one block (sample-rounds.ts MIN_SPLIT_SECONDS).
      const block = queued.find((j) => j.samples!.count >= 2)!;
      expect(block).toBeDefined();
      store.stopAfterSamples = 1;
      await expect(runStoredBranch({ store, data: block, enqueue, signal: store.controller.signal }))
        .rejects.toBeInstanceOf(BranchAbortedError);
      const retry = await runStoredBranch({ store, data: block, enqueue, attempt: 2 });
      expect(retry.samples).toEqual({ computed: block.samples!.count - 1, alreadyStored: 1 });
      const again = await runStoredBranch({ store, data: block, enqueue, attempt: 3 });
      expect(again.samples).toEqual({ computed: 0, alreadyStored: block.samples!.count });
      // Run everything queued (duplicates included, as a queue that lost its dedupe would).
      while (queued.length > 0) await runStoredBranch({ store, data: queued.shift()!, enqueue });
      expect((await store.getSweep(id))!.status).toBe('succeeded');
      const result = JSON.parse((await store.getResultJson(id))!) as SweepResult;
      expect(withoutTiming(result)).toEqual(withoutTiming(await localResult({ ...SPEC, label: 'typical-retry' })));
    });
  });
});
