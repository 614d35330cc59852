/**
 * The branch runner without Redis or BullMQ (the in-memory job store): it resumes after the
 * stored points, writes each point once, assembles the result when the last branch ends,
 * stops on cancel, and refuses a branch that does not match the plan.
 */
import { describe, expect, it } from 'vitest';
import { BranchJobInvalidError, runStoredBranch } from '../../workers/src/queue/index.js';
import { MemoryJobStore } from '../../workers/src/store/index.js';
import { localResult, newSweepFor, smallSpec } from './support/harness.js';

describe('runStoredBranch', () => {
  describe('when every branch of a sweep runs', () => {
    it('should assemble the same result as the local run, once', async () => {
      const spec = smallSpec({ label: 'mem' });
      const store = new MemoryJobStore();
      const input = await newSweepFor(spec);
      const { id } = await store.createSweep(input) as { id: string };
      const outcomes = [];
      for (const [branchIndex, betaIndices] of input.plan.branches.entries()) {
        outcomes.push(await runStoredBranch({ store, data: { sweepId: id, branchIndex, betaIndices } }));
      }
      expect(outcomes.map((o) => o.finalized)).toEqual([...Array(input.plan.branches.length - 1).fill(false), true]);
      expect(outcomes.every((o) => o.outcome === 'done')).toBe(true);
      const record = await store.getSweep(id);
      expect(record!.status).toBe('succeeded');
      const result = JSON.parse((await store.getResultJson(id))!);
      const local = await localResult(spec);
      expect(result.series).toEqual(local.series);
      expect(result.thermo).toEqual(local.thermo);
    });
  });

  describe('when a branch is retried after some of its points were stored', () => {
    it('should resume after the stored prefix and write only the rest', async () => {
      const spec = smallSpec({ label: 'resume', betas: [0.5], times: { stop: 2, count: 9 } });
      const store = new MemoryJobStore();
      const input = await newSweepFor(spec);
      const { id } = await store.createSweep(input) as { id: string };
      const local = await localResult(spec);
      const seeded = [0, 1, 2, 3].map((t) => ({
        kind: 'point' as const, betaIndex: 0, timeIndex: t,
        json: JSON.stringify({ betaIndex: 0, timeIndex: t, values: local.series.map((s) => s.values[0][t]), errors: local.series.map((s) => s.errors[0][t]) }),
      }));
      await store.writeRecords(id, 0, seeded);
      const out = await runStoredBranch({ store, data: { sweepId: id, branchIndex: 0, betaIndices: [0] }, attempt: 2 });
      expect(out.resumedFrom).toEqual({ 0: 4 });
      expect(out.pointsWritten).toBe(5);
      expect(out.finalized).toBe(true);
      expect((await store.getSweep(id))!.branches[0].attempts).toBe(2);
      expect(JSON.parse((await store.getResultJson(id))!).series).toEqual(local.series);
    });
  });

  describe('when the sweep is cancelled while the branch runs', () => {
    it('should stop with outcome cancelled and write no more points', async () => {
      const store = new MemoryJobStore();
      const input = await newSweepFor(smallSpec({ label: 'stop', betas: [0.5], times: { stop: 20, count: 2000 } }));
      const { id } = await store.createSweep(input) as { id: string };
      const run = runStoredBranch({ store, data: { sweepId: id, branchIndex: 0, betaIndices: [0] }, pollMs: 20 });
      await new Promise((r) => setTimeout(r, 100));
      await store.cancelSweep(id);
      const t0 = Date.now();
      const out = await run;
      expect(Date.now() - t0).toBeLessThan(1000);
      expect(out.outcome).toBe('cancelled');
      const done = (await store.getSweep(id))!;
      expect(done.pointsDone).toBeLessThan(2000);
      expect(done.branches[0].state).toBe('cancelled');
    });
  });

  describe('when the job does not match the stored plan', () => {
    it('should throw an unrecoverable error', async () => {
      const store = new MemoryJobStore();
      const input = await newSweepFor(smallSpec());
      const { id } = await store.createSweep(input) as { id: string };
      const run = runStoredBranch({ store, data: { sweepId: id, branchIndex: 0, betaIndices: [0, 1] } });
      await expect(run).rejects.toBeInstanceOf(BranchJobInvalidError);
      await expect(run).rejects.toMatchObject({ name: 'UnrecoverableError', code: 'BSW_ERR_BRANCH_INVALID' });
    });
  });

  describe('when the sweep no longer exists or already finished', () => {
    it('should skip without running', async () => {
      const store = new MemoryJobStore();
      expect((await runStoredBranch({ store, data: { sweepId: 'sw_aaaaaaaaaaaaaaaa', branchIndex: 0, betaIndices: [0] } })).outcome).toBe('skipped');
      const { id } = await store.createSweep(await newSweepFor(smallSpec())) as { id: string };
      await store.failSweep(id, 'x');
      expect((await runStoredBranch({ store, data: { sweepId: id, branchIndex: 0, betaIndices: [0] } })).outcome).toBe('skipped');
    });
  });
});
