/** Number formatting for legends, axes and tables: short, exact enough, no trailing zeros. */

/** `x` with at most `digits` significant digits, without trailing zeros; ∞ and − signs typeset. */
export function formatNumber(x: number, digits = 4): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  let s: string;
  if (abs >= 1e-3 && abs < 1e6) {
    s = String(Number(x.toPrecision(digits)));
  } else {
    const [m, e] = x.toExponential(digits - 1).split('e');
    s = `${String(Number(m))}e${Number(e)}`;
  }
  return s.replace('-', '−');
}

/** The legend text of one β: "β = 0.5 (T = 2)"; β = 0 is "β = 0 (T = ∞)". */
export function formatBeta(beta: number): string {
  return `β = ${formatNumber(beta)} (T = ${beta === 0 ? '∞' : formatNumber(1 / beta)})`;
}

/** Plain-ASCII form of {@link formatNumber} for CSV and file names. */
export function plainNumber(x: number): string {
  return Number.isFinite(x) ? String(x) : Number.isNaN(x) ? 'NaN' : x > 0 ? 'Infinity' : '-Infinity';
}
