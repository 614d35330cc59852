/** A sweep status as a badge: text first (never colour alone), colour as a second cue. */
import { h } from '../dom.js';
import type { SweepStatusName } from '../types.js';

const ICONS: Record<SweepStatusName, string> = { queued: '◷', running: '▶', succeeded: '✓', failed: '✕', cancelled: '■' };

/** The badge element of a status (`data-status` carries the raw value). */
export function statusBadge(status: SweepStatusName): HTMLElement {
  return h('span', { class: `badge badge-${status}`, 'data-status': status },
    h('span', { 'aria-hidden': 'true' }, ICONS[status] ?? ''), ` ${status}`);
}
