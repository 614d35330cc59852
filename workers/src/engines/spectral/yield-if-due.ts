/**
 * yieldIfDue — cooperative scheduling for long synchronous work: throws an AbortError at once if
 * the signal has fired, and gives the event loop a turn (setImmediate) when at least
 * YIELD_INTERVAL_MS have passed since the last turn, so timers, job-lock renewals and abort
 * events are not starved. Cheap enough to call once per time point.
 */
import { performance } from 'node:perf_hooks';
import { abortError } from '../abort-error.js';

/** Longest stretch of synchronous work between two event-loop turns, ms. */
export const YIELD_INTERVAL_MS = 25;

let lastTurn = performance.now();

/** Checks the signal; yields to the event loop when a turn is due. Rejects with an AbortError. */
export async function yieldIfDue(signal?: AbortSignal): Promise<void> {
  if (signal?.aborted) throw abortError(signal);
  if (performance.now() - lastTurn < YIELD_INTERVAL_MS) return;
  await new Promise<void>((resolve) => setImmediate(resolve));
  lastTurn = performance.now();
  if (signal?.aborted) throw abortError(signal);
}
