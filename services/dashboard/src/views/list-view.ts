/**
 * The owner's sweeps, newest first: label (a link to the sweep), status, progress, engine and
 * age. Refreshes itself every few seconds while any sweep is queued or running.
 */
import { ApiError, apiJson } from '../api.js';
import { age, h, replace } from '../dom.js';
import { isFinished, type SweepList, type SweepSummary } from '../types.js';
import { statusBadge } from './status-badge.js';

const REFRESH_MS = 4000;
const STATUSES = ['', 'queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;

/** The series cross-check in one cell: flagged disagreements stand out; blank until computed. */
function checkCell(s: SweepSummary): HTMLElement | string {
  const c = s.check;
  if (!c) return s.status === 'succeeded' ? 'pending' : '—';
  if (c.flagged) return h('span', { class: 'warn', title: `${c.counts.disagree} value(s) disagree with the series inside its window` }, `⚠ ${c.counts.disagree} disagree`);
  if (c.verdict === 'agree') return h('span', { class: 'ok', title: `${c.counts.agree} value(s) checked inside the series window` }, `✓ ${c.counts.agree} agree`);
  return h('span', { title: c.verdict }, c.verdict === 'no-window' ? 'no window' : c.verdict);
}

/** The list view; returns its element and a stop function. */
export function listView(): { el: HTMLElement; stop: () => void } {
  let items: SweepSummary[] = [];
  let cursor: string | null = null;
  let status = '';
  let timer: ReturnType<typeof setTimeout> | null = null;
  let stopped = false;
  const body = h('div', { class: 'list-body', 'aria-live': 'polite', 'aria-busy': 'true' }, h('p', {}, 'Loading…'));
  const filter = h('select', { id: 'status-filter' }, ...STATUSES.map((s) => h('option', { value: s }, s || 'any status')));
  const more = h('button', { type: 'button', class: 'load-more', hidden: true }, 'Show older sweeps');

  const row = (s: SweepSummary) => {
    const pct = s.pointsTotal ? Math.round((100 * s.pointsDone) / s.pointsTotal) : 0;
    return h('tr', { 'data-sweep': s.id },
      h('th', { scope: 'row' },
        h('a', { href: `#/sweeps/${s.id}`, class: 'sweep-link' }, s.label || s.id),
        h('div', { class: 'sweep-id' }, h('code', {}, s.id))),
      h('td', {}, statusBadge(s.status), s.error ? h('div', { class: 'row-error' }, s.error) : null),
      h('td', {},
        h('progress', { max: '100', value: String(pct), 'aria-label': `progress of ${s.label || s.id}`, 'aria-valuetext': `${pct} % (${s.pointsDone} of ${s.pointsTotal} points)` }),
        h('span', { class: 'progress-text' }, `${s.pointsDone}/${s.pointsTotal}`)),
      h('td', {}, s.engine),
      h('td', {}, checkCell(s)),
      h('td', {}, h('time', { datetime: s.createdAt, title: new Date(s.createdAt).toLocaleString() }, age(s.createdAt))),
    );
  };

  const render = () => {
    body.setAttribute('aria-busy', 'false');
    if (items.length === 0) {
      replace(body, h('p', { class: 'empty' }, status ? `No ${status} sweeps.` : 'No sweeps yet. ', status ? null : h('a', { href: '#/new' }, 'Submit one.')));
      return;
    }
    replace(body, h('div', { class: 'table-scroll', tabindex: '0', role: 'region', 'aria-label': 'Sweeps table' },
      h('table', { class: 'sweeps' },
        h('caption', { class: 'visually-hidden' }, 'Your sweeps, newest first'),
        h('thead', {}, h('tr', {}, ...['Sweep', 'Status', 'Progress', 'Engine', 'Series check', 'Submitted'].map((c) => h('th', { scope: 'col' }, c)))),
        h('tbody', {}, ...items.map(row)))));
  };

  const load = async (append = false) => {
    if (timer) clearTimeout(timer);
    const q = new URLSearchParams({ limit: '20' });
    if (status) q.set('status', status);
    if (append && cursor) q.set('cursor', cursor);
    try {
      const page = await apiJson<SweepList>('GET', `/v1/sweeps?${q}`);
      if (stopped) return;
      items = append ? [...items, ...page.items] : page.items;
      if (!append) cursor = page.nextCursor;
      else cursor = page.nextCursor;
      more.hidden = !cursor;
      render();
    } catch (err) {
      if (stopped) return;
      replace(body, h('p', { class: 'field-error', role: 'alert' }, `Could not load the sweeps: ${(err as ApiError).message}`));
    }
    if (!stopped && items.some((s) => !isFinished(s.status))) timer = setTimeout(() => void load(), REFRESH_MS);
  };

  filter.addEventListener('change', () => { status = filter.value; cursor = null; void load(); });
  more.addEventListener('click', () => void load(true));
  const el = h('section', { class: 'panel', 'aria-labelledby': 'list-heading' },
    h('div', { class: 'panel-head' },
      h('h1', { id: 'list-heading', tabindex: '-1' }, 'Your sweeps'),
      h('div', { class: 'toolbar' },
        h('label', { for: 'status-filter' }, 'Show'), filter,
        h('button', { type: 'button', onclick: () => void load() }, 'Refresh'),
        h('a', { href: '#/new', class: 'button primary' }, 'New sweep'))),
    body, more);
  void load();
  return { el, stop: () => { stopped = true; if (timer) clearTimeout(timer); } };
}
