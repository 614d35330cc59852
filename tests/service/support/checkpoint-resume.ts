/**
 * Test support (not a test): a branch of an mps sweep that is stopped after a few stored points
 * (as if its worker had been killed) and retried, on any job store. Used by
 * branch-checkpoints.test.ts (in-memory store) and checkpoints.redis.test.ts (Redis).
 */
import { expect } from 'vitest';
import type { DiagnosticsRecord, SweepResult, SweepSpecInput } from '../../../shared-types/src/index.js';
import { decodeCheckpoint } from '../../../workers/src/engines/mps/index.js';
import { BranchAbortedError, runStoredBranch } from '../../../workers/src/queue/index.js';
import type { JobStore } from '../../../workers/src/store/index.js';
import { localResult, newSweepFor } from './harness.js';

/** An mps sweep: 6-site open Ising chain, field quench, two β, seven grid times, fourth order, little truncation. */
export const MPS_RESUME_SPEC: SweepSpecInput = {
  label: 'mps-resume',
  lattice: { kind: 'chain', length: 6 },
  h0: { model: 'ising', J: 1, hx: 0.6 },
  h1: { model: 'ising', J: 1, hx: 1.4 },
  betas: [0.5, 1],
  times: { stop: 1.2, count: 7 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  engine: 'mps',
  tolerance: 1e-6,
  mps: { maxBond: 16, truncation: 1e-14, trotterOrder: 4, dt: 0.1 },
};

/** `store` with its point writes counted: once `limit` points of the sweep are stored, `onLimit` runs. */
function watched(store: JobStore, limit: number, onLimit: () => void): JobStore {
  let points = 0;
  return new Proxy(store, {
    get(target, key) {
      const v = Reflect.get(target, key, target) as unknown;
      if (key === 'writeRecords') {
        return async (...args: Parameters<JobStore['writeRecords']>) => {
          const n = await target.writeRecords(...args);
          points += n ?? 0;
          if (points >= limit) onLimit();
          return n;
        };
      }
      return typeof v === 'function' ? (v as (...a: unknown[]) => unknown).bind(target) : v;
    },
  });
}

/**
 * Runs branch 1 (β = 1) until `stopAfter` of its points are stored, stops it as an orphaned
 * sandbox stops, retries it, runs branch 0, and checks: the retry resumed from a quench
 * checkpoint without re-running the imaginary time, the result equals the uninterrupted local
 * run to 1e-12, and the checkpoints are gone after the sweep succeeded.
 */
export async function checkResumeFromCheckpoint(store: JobStore, stopAfter = 3): Promise<{ id: string; result: SweepResult }> {
  const input = await newSweepFor(MPS_RESUME_SPEC);
  const { id } = await store.createSweep({ ...input, fresh: true }) as { id: string };
  const data = { sweepId: id, branchIndex: 1, betaIndices: [1] };
  const stop = new AbortController();
  const first = runStoredBranch({ store: watched(store, stopAfter, () => stop.abort('orphaned')), data, signal: stop.signal, checkpointSeconds: 0 });
  await expect(first).rejects.toBeInstanceOf(BranchAbortedError);
  const saved = await store.loadCheckpoint(id, 1);
  expect(saved).not.toBeNull();
  const c = decodeCheckpoint(saved!);
  const stored = (await store.storedPointCounts(id, [1], 7))[1];
  expect(c.kind).toBe('quench');
  expect(stored).toBeGreaterThanOrEqual(stopAfter);
  expect(stored).toBeLessThan(7);
  if (c.kind === 'quench') expect(c.progress.nextTimeIndex).toBe(stored);

  const retry = await runStoredBranch({ store, data, attempt: 2, checkpointSeconds: 0 });
  expect(retry.outcome).toBe('done');
  expect(retry.resumedFrom).toEqual({ 1: stored });
  expect(retry.pointsWritten).toBe(7 - stored);
  const diag = (await store.readRecords(id)).diagnostics.map((d) => JSON.parse(d) as DiagnosticsRecord).find((d) => d.betaIndex === 1)!;
  // The retry did not run the imaginary time again: it started from the stored quench state.
  expect(diag.extra.resumedFrom).toBe(`quench:t=${stored}`);
  expect(diag.extra.imaginaryUpdatesRun).toBe(0);
  expect(Number(diag.extra.imaginaryUpdates)).toBeGreaterThan(0);

  expect((await runStoredBranch({ store, data: { sweepId: id, branchIndex: 0, betaIndices: [0] } })).finalized).toBe(true);
  const result = JSON.parse((await store.getResultJson(id))!) as SweepResult;
  const local = await localResult(MPS_RESUME_SPEC);
  let diff = 0;
  result.series.forEach((s, k) => s.values.forEach((row, b) => row.forEach((v, t) => {
    diff = Math.max(diff, Math.abs(v - local.series[k].values[b][t]), Math.abs(s.errors[b][t] - local.series[k].errors[b][t]));
  })));
  expect(diff).toBeLessThanOrEqual(1e-12);
  result.thermo.forEach((t, b) => expect(Math.abs(t.lnZ - local.thermo[b].lnZ)).toBeLessThanOrEqual(1e-12));
  expect(await store.loadCheckpoint(id, 0)).toBeNull();
  expect(await store.loadCheckpoint(id, 1)).toBeNull();
  return { id, result };
}
