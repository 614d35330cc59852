/**
 * Reads a sweep's server-sent events with fetch (so it can send the bearer token), and
 * reconnects with Last-Event-ID when the connection drops, until the stream's `end` event.
 */
import type { ApiClient } from './api-client.js';
import { ClientError } from './api-client.js';
import { parseSseChunk, type SweepEvent } from '../../../../shared-types/src/sse.js';

export type { SweepEvent } from '../../../../shared-types/src/sse.js';
export { parseSseChunk } from '../../../../shared-types/src/sse.js';

/** Options of {@link readSweepEvents}. */
export interface ReadEventsOptions {
  /** Resume after this event id. @defaultValue from the start */
  lastEventId?: string;
  /** Reconnect attempts after a dropped connection. @defaultValue 10 */
  maxReconnects?: number;
  signal?: AbortSignal;
}

export async function* readSweepEvents(client: ApiClient, sweepId: string, options: ReadEventsOptions = {}): AsyncGenerator<SweepEvent> {
  let last = options.lastEventId;
  let reconnects = 0;
  for (;;) {
    const headers: Record<string, string> = { accept: 'text/event-stream' };
    if (last) headers['last-event-id'] = last;
    let res: Response;
    try {
      res = await client.fetchRaw(`/v1/sweeps/${encodeURIComponent(sweepId)}/events`, { headers, signal: options.signal, timeoutMs: null });
    } catch (err) {
      if (options.signal?.aborted) return;
      if (reconnects++ >= (options.maxReconnects ?? 10)) throw err;
      await new Promise((r) => setTimeout(r, 1000));
      continue;
    }
    if (!res.ok) throw client.errorOf(res, await res.text(), { sweepId });
    if (!res.body) throw new ClientError('the server sent an empty event stream');
    const decoder = new TextDecoder();
    let buffer = '';
    try {
      for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
        buffer += decoder.decode(chunk, { stream: true });
        const { events, rest } = parseSseChunk(buffer);
        buffer = rest;
        for (const ev of events) {
          if (ev.id) last = ev.id;
          yield ev;
          if (ev.type === 'end') return;
        }
        reconnects = 0;
      }
    } catch (err) {
      if (options.signal?.aborted) return;
      if (reconnects++ >= (options.maxReconnects ?? 10)) throw new ClientError(`the event stream broke: ${(err as Error).message}`);
    }
    // The connection ended without `end`: reconnect and resume.
    await new Promise((r) => setTimeout(r, 500));
  }
}
