/** The error a run rejects with when its AbortSignal fires (name 'AbortError'). */
export function abortError(signal: AbortSignal): Error {
  const e = new Error('the branch was aborted', { cause: signal.reason });
  e.name = 'AbortError';
  return e;
}
