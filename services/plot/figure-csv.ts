/**
 * The data behind one figure as CSV. Time-series figures: one row per (β, t) with the value
 * and its error, plus the series check where the figure has one. Thermodynamics figures: one
 * row per β. Missing values (points not yet arrived) are empty cells.
 */
import type { Figure } from './figure-model.js';
import { plainNumber } from './format-number.js';

const cell = (v: number | null | undefined) => (v === null || v === undefined || Number.isNaN(v) ? '' : plainNumber(v));
const quote = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

/** CSV text (header line first, `\n` line ends, a final newline). */
export function figureCsv(fig: Figure): string {
  const rows: string[] = [];
  const withCheck = fig.check !== null;
  const checkAt = (betaIndex: number | null, x: number): [number, number] | null => {
    const line = fig.check?.lines.find((c) => c.betaIndex === betaIndex);
    const i = line ? line.x.indexOf(x) : -1;
    return line && i >= 0 ? [line.y[i], (line.hi[i] - line.lo[i]) / 2] : null;
  };
  if (fig.kind === 'series') {
    rows.push(['beta', 'time', quote(fig.yLabel), 'error', ...(withCheck ? ['series_check', 'series_check_error'] : [])].join(','));
    for (const line of fig.lines) {
      const beta = fig.legend[line.betaIndex ?? 0]?.beta ?? NaN;
      fig.x.forEach((t, i) => {
        const err = line.hi && line.lo ? (line.hi[i] - line.lo[i]) / 2 : null;
        const c = withCheck ? checkAt(line.betaIndex, t) : null;
        rows.push([cell(beta), cell(t), cell(line.y[i]), cell(err), ...(withCheck ? [cell(c?.[0]), cell(c?.[1])] : [])].join(','));
      });
    }
  } else {
    rows.push(['beta', quote(fig.yLabel), 'error', ...(withCheck ? ['series_check', 'series_check_error'] : [])].join(','));
    const line = fig.lines[0];
    fig.x.forEach((beta, b) => {
      const m = fig.markers.find((k) => k.betaIndex === b);
      const err = m && m.lo !== null && m.hi !== null ? (m.hi - m.lo) / 2 : null;
      const c = withCheck ? checkAt(null, beta) : null;
      rows.push([cell(beta), cell(line?.y[b]), cell(err), ...(withCheck ? [cell(c?.[0]), cell(c?.[1])] : [])].join(','));
    });
  }
  return rows.join('\n') + '\n';
}

/** A file-name-safe stem for a figure: "series-X-avg", "thermo-energy". */
export function figureFileStem(fig: Figure): string {
  return fig.id.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/-+/g, '-').replace(/^-|-$/g, '');
}
