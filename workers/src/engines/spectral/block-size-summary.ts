/**
 * blockSizeSummary — block sizes as a short report string, largest first, with counts:
 * "805×7, 715×14, 402×2" (size × number of blocks). At most MAX_SIZES distinct sizes are
 * listed; the rest are summarised as "+ n smaller blocks". Cost: O(b log b).
 */

/** Distinct sizes listed before the rest is summarised. */
export const MAX_SIZES = 12;

/** The summary of `sizes` (see the file header); '' for no blocks. */
export function blockSizeSummary(sizes: readonly number[]): string {
  const counts = new Map<number, number>();
  for (const d of sizes) counts.set(d, (counts.get(d) ?? 0) + 1);
  const sorted = [...counts].sort((a, b) => b[0] - a[0]);
  const shown = sorted.slice(0, MAX_SIZES).map(([d, n]) => `${d}×${n}`);
  const rest = sorted.slice(MAX_SIZES).reduce((acc, [, n]) => acc + n, 0);
  return rest > 0 ? `${shown.join(', ')} + ${rest} smaller blocks` : shown.join(', ');
}
