/**
 * abortError — the error a spectral branch rejects with when its AbortSignal fires
 * (name 'AbortError', the signal's reason as `cause`), as the Engine contract asks.
 */

/** An Error named 'AbortError' carrying `signal.reason`. */
export function abortError(signal: AbortSignal): Error {
  const e = new Error('the branch was aborted', { cause: signal.reason });
  e.name = 'AbortError';
  return e;
}
