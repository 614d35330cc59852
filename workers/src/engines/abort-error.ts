/**
 * abortError — the error a branch rejects with when its AbortSignal fires (name 'AbortError',
 * the signal's reason as `cause`), as the Engine contract asks (engine.ts). Shared by the exact
 * and spectral engines.
 */

/** An Error named 'AbortError' carrying `signal.reason`. */
export function abortError(signal: AbortSignal): Error {
  const e = new Error('the branch was aborted', { cause: signal.reason });
  e.name = 'AbortError';
  return e;
}
