/**
 * The engine's diagnostics per β: ⟨H1⟩ drift after the quench, norm drift, the stationarity
 * residual (H1 = H0), the propagator's error bound, and the engine's own figures. Values above
 * the requested accuracy are marked in words, not only in colour.
 */
import type { DiagnosticsRecord } from '../../../../shared-types/src/result.js';
import { formatBeta, formatNumber } from '../../../plot/format-number.js';
import { h } from '../dom.js';

const COLUMNS: Array<{ key: keyof DiagnosticsRecord; name: string; checked: boolean }> = [
  { key: 'h1Drift', name: '⟨H1⟩ drift', checked: true },
  { key: 'normDrift', name: 'norm drift', checked: true },
  { key: 'stationarityResidual', name: 'stationarity residual', checked: true },
  { key: 'propagatorErrorBound', name: 'propagator error bound', checked: true },
];

const show = (v: unknown) => (typeof v === 'number' ? formatNumber(v, 3) : v === null || v === undefined ? '—' : String(v));

/** The table (or a note when no diagnostics arrived yet). */
export function diagnosticsTable(records: DiagnosticsRecord[], betas: number[], accuracy: number): HTMLElement {
  if (records.length === 0) return h('p', { class: 'empty' }, 'No diagnostics yet: each β reports them when its quench is done.');
  const extras = [...new Set(records.flatMap((r) => Object.keys(r.extra ?? {})))].sort();
  const limit = accuracy > 0 ? accuracy : Infinity;
  let flagged = 0;
  const rows = records.map((r) => h('tr', {},
    h('th', { scope: 'row' }, formatBeta(betas[r.betaIndex] ?? NaN)),
    ...COLUMNS.map((c) => {
      const v = r[c.key];
      const over = c.checked && typeof v === 'number' && v > limit;
      if (over) flagged++;
      return h('td', { class: over ? 'over' : '' }, show(v), over ? h('span', { class: 'over-note' }, ' (above the requested accuracy)') : null);
    }),
    ...extras.map((k) => h('td', {}, show(r.extra?.[k]))),
  ));
  return h('div', {},
    flagged ? h('p', { class: 'warn', role: 'note' }, `⚠ ${flagged} value${flagged === 1 ? '' : 's'} above the requested accuracy (${formatNumber(accuracy, 2)}).`) : null,
    h('div', { class: 'table-scroll', tabindex: '0', role: 'region', 'aria-label': 'Engine diagnostics table' },
      h('table', { class: 'diagnostics' },
        h('caption', {}, `Per β; the plan promised an accuracy of ${formatNumber(accuracy, 2)}.`),
        h('thead', {}, h('tr', {}, h('th', { scope: 'col' }, 'β'), ...COLUMNS.map((c) => h('th', { scope: 'col' }, c.name)), ...extras.map((k) => h('th', { scope: 'col' }, k)))),
        h('tbody', {}, ...rows))));
}
