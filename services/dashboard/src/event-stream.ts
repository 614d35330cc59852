/**
 * Follows a sweep's server-sent events with fetch, so the bearer token goes in the
 * Authorization header (EventSource cannot send it). Reconnects with Last-Event-ID when the
 * connection drops, until the stream's `end` event or the signal aborts.
 */
import { apiFetch } from './api.js';
import { parseSseChunk as parseSse, type SweepEvent } from '../../../shared-types/src/sse.js';

export type { SweepEvent } from '../../../shared-types/src/sse.js';

/** Options of {@link followEvents}. */
export interface FollowOptions {
  signal: AbortSignal;
  /** Reconnect attempts in a row before giving up. @defaultValue 10 */
  maxReconnects?: number;
}

/** Calls `onEvent` for each event; resolves after `end` (or on abort); rejects after too many failures. */
export async function followEvents(sweepId: string, onEvent: (ev: SweepEvent) => void, options: FollowOptions): Promise<void> {
  const { signal, maxReconnects = 10 } = options;
  let last: string | null = null;
  let failures = 0;
  while (!signal.aborted) {
    try {
      const headers: Record<string, string> = { accept: 'text/event-stream' };
      if (last) headers['last-event-id'] = last;
      const res = await apiFetch(`/v1/sweeps/${encodeURIComponent(sweepId)}/events`, { headers, signal });
      if (!res.body) throw new Error('empty event stream');
      const reader = res.body.getReader();
      const decoder = new TextDecoder();
      let buffer = '';
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        buffer += decoder.decode(value, { stream: true });
        const { events, rest } = parseSse(buffer);
        buffer = rest;
        for (const ev of events) {
          if (ev.id) last = ev.id;
          if (ev.type === 'end') return;
          onEvent(ev);
        }
        failures = 0;
      }
    } catch (err) {
      if (signal.aborted) return;
      if ((err as { status?: number }).status && (err as { status: number }).status < 500) throw err;
      if (++failures > maxReconnects) throw err;
    }
    await new Promise((r) => setTimeout(r, 1000));
  }
}
