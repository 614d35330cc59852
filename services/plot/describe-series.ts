/**
 * Human-readable names of series labels (see workers/src/observables/plan-series.ts for the
 * label grammar): "X:avg" → "⟨X⟩, site average", "ZZ:nearest~conn" → "⟨ZZ⟩ connected, nearest
 * pairs", "E:h1" → "⟨H1⟩", "S_ZZ(3.1416,0)" → "S_ZZ(q = 3.1416, 0)". Unknown labels are
 * shown as they are.
 */

const PAIR_SETS: Record<string, string> = {
  nearest: 'nearest pairs',
  'next-nearest': 'next-nearest pairs',
  pairs: 'listed pairs',
};

/** The y-axis label and title for a series label. */
export function describeSeries(label: string): string {
  const conn = label.endsWith('~conn');
  const base = conn ? label.slice(0, -'~conn'.length) : label;
  const c = conn ? ' connected' : '';
  let m: RegExpExecArray | null;
  if ((m = /^([XYZ]):avg$/.exec(base))) return `⟨${m[1]}⟩, site average`;
  if ((m = /^([XYZ])@(\d+)$/.exec(base))) return `⟨${m[1]}${sub(m[2])}⟩`;
  if ((m = /^E:(h0|h1)$/.exec(base))) return `⟨${m[1].toUpperCase()}⟩`;
  if ((m = /^m([XYZ]):(.+)$/.exec(base))) return `m${m[1]}, ${m[2]} pattern`;
  if ((m = /^([XYZ]{2})@(\d+)-(\d+)$/.exec(base))) return `⟨${m[1][0]}${sub(m[2])}${m[1][1]}${sub(m[3])}⟩${c}`;
  if ((m = /^([XYZ]{2}):d=(.+)$/.exec(base))) return `⟨${m[1]}⟩${c}, distance ${m[2]}`;
  if ((m = /^([XYZ]{2}):(.+)$/.exec(base))) return `⟨${m[1]}⟩${c}, ${PAIR_SETS[m[2]] ?? m[2]}`;
  if ((m = /^S_([XYZ]{2})\((.+)\)$/.exec(base))) return `S_${m[1]}(q = ${m[2].replace(',', ', ')})${c}`;
  return label;
}

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';
function sub(digits: string): string {
  return [...digits].map((d) => SUBSCRIPTS[Number(d)]).join('');
}
