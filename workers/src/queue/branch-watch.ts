/**
 * The stop signal of a running branch job: an external abort (BullMQ's cancel, an orphaned
 * sandbox) and a poll of the store every `pollMs` for cancel and hand-back, folded into one
 * AbortController whose reason is a BranchAbortedError.
 */
import type { JobStore } from '../store/index.js';
import { BranchAbortedError } from './errors/branch-aborted-error.js';

/** A running branch's stop signal; call `dispose` when the branch ends. */
export interface BranchWatch {
  readonly signal: AbortSignal;
  /** Why it stopped, or null while it runs. */
  reason(): BranchAbortedError['reason'] | null;
  stop(reason: BranchAbortedError['reason']): void;
  dispose(): void;
}

/** Starts watching (see file header). */
export function watchBranch(store: JobStore, sweepId: string, workerId: string, pollMs: number, external?: AbortSignal): BranchWatch {
  const controller = new AbortController();
  const stop = (reason: BranchAbortedError['reason']) => {
    if (!controller.signal.aborted) controller.abort(new BranchAbortedError(reason));
  };
  const onExternal = () => {
    const r = external?.reason;
    stop(r === 'handback' || r === 'orphaned' ? r : r instanceof BranchAbortedError ? r.reason : 'cancelled');
  };
  if (external?.aborted) onExternal();
  external?.addEventListener('abort', onExternal, { once: true });
  let polling = false;
  const poll = setInterval(() => {
    if (polling) return;
    polling = true;
    store.control(sweepId, workerId).then((c) => {
      if (c.status !== 'queued' && c.status !== 'running') stop('cancelled');
      else if (c.handback) stop('handback');
    }, () => { /* a failed poll is retried on the next tick */ }).finally(() => { polling = false; });
  }, pollMs);
  return {
    signal: controller.signal,
    reason: () => (controller.signal.aborted ? (controller.signal.reason as BranchAbortedError).reason : null),
    stop,
    dispose() {
      clearInterval(poll);
      external?.removeEventListener('abort', onExternal);
    },
  };
}
