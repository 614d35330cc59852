/**
 * The submit outbox's reconciler. Submitting stores the sweep (and lists it in the store's
 * `unqueued` set in the same Lua step), then adds its branch jobs, then confirms. A process
 * that dies between storing and confirming leaves the sweep listed; this pass re-adds the
 * branch jobs of every listed sweep older than a grace period and confirms it. Re-adding is
 * harmless: branch job ids are fixed (`${sweepId}.${branchIndex}`), so a job that exists is not
 * added twice, and a branch that already ran finds its work stored and is skipped.
 */
import { isTerminal, type JobStore } from '../store/index.js';
import type { SweepQueue } from './sweep-queue.js';

/** Options of the reconciler. */
export interface ReconcileOptions {
  /** Leave sweeps younger than this alone (their submit may still be in flight), ms. @defaultValue 10000 */
  graceMs?: number;
  /** Sweeps handled per pass. @defaultValue 100 */
  limit?: number;
}

/** What one pass did. */
export interface ReconcileReport {
  /** Sweeps whose branch jobs were (re-)added. */
  enqueued: string[];
  /** Listed sweeps that were already finished or gone (just confirmed). */
  dropped: string[];
}

/** One pass over the outbox. */
export async function reconcileUnqueued(store: JobStore, queue: Pick<SweepQueue, 'enqueue'>, options: ReconcileOptions = {}): Promise<ReconcileReport> {
  const { graceMs = 10_000, limit = 100 } = options;
  const report: ReconcileReport = { enqueued: [], dropped: [] };
  for (const id of await store.unqueuedSweeps(graceMs, limit)) {
    const record = await store.getSweep(id);
    if (!record || isTerminal(record.status)) {
      report.dropped.push(id);
    } else {
      await queue.enqueue(id, record.plan);
      report.enqueued.push(id);
    }
    await store.markEnqueued(id);
  }
  return report;
}

/**
 * Runs a pass now and then every `everyMs` until the returned function is called. Errors of a
 * pass (Redis restarting) are reported and the next pass tries again.
 */
export function startUnqueuedReconciler(
  store: JobStore, queue: Pick<SweepQueue, 'enqueue'>,
  options: ReconcileOptions & { everyMs?: number; report?: (line: string) => void } = {},
): () => void {
  const { everyMs = 15_000, report = (l) => process.stderr.write(l) } = options;
  let running = false;
  let stopped = false;
  const pass = () => {
    if (running || stopped) return;
    running = true;
    reconcileUnqueued(store, queue, options)
      .then((r) => { if (r.enqueued.length) report(`betasweep: re-queued the branches of ${r.enqueued.length} sweep(s) whose submit did not finish: ${r.enqueued.join(', ')}\n`); })
      // A pass cut short by stopping (connections closing) is not a failure worth reporting.
      .catch((err: unknown) => { if (!stopped) report(`betasweep: outbox reconcile failed: ${(err as Error).message} (will retry)\n`); })
      .finally(() => { running = false; });
  };
  pass();
  const timer = setInterval(pass, everyMs);
  timer.unref();
  return () => { stopped = true; clearInterval(timer); };
}
