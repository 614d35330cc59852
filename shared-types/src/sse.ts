/**
 * Server-sent events as the API streams them (text/event-stream: `id:`, `event:`, `data:`
 * lines, blocks separated by a blank line; WHATWG HTML "Server-sent events"). One parser for
 * the command-line client and the dashboard.
 */

/** One server-sent event. */
export interface SweepEvent {
  id: string | null;
  type: string;
  data: string;
}

/** Parses the complete event blocks of `buffer`; returns them and the unparsed rest. */
export function parseSseChunk(buffer: string): { events: SweepEvent[]; rest: string } {
  const events: SweepEvent[] = [];
  const blocks = buffer.split(/\r?\n\r?\n/);
  const rest = blocks.pop() ?? '';
  for (const block of blocks) {
    let id: string | null = null;
    let type = 'message';
    const data: string[] = [];
    for (const line of block.split(/\r?\n/)) {
      if (!line || line.startsWith(':')) continue;
      const colon = line.indexOf(':');
      const field = colon < 0 ? line : line.slice(0, colon);
      const value = colon < 0 ? '' : line.slice(colon + 1).replace(/^ /, '');
      if (field === 'id') id = value;
      else if (field === 'event') type = value;
      else if (field === 'data') data.push(value);
    }
    if (data.length || type !== 'message') events.push({ id, type, data: data.join('\n') });
  }
  return { events, rest };
}
