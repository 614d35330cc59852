/**
 * The temperature scale: one colour per β, from warm (high temperature, small β) to cold
 * (low temperature, large β). Colours are spaced evenly in β order (by rank, not by value),
 * so neighbouring temperatures stay distinguishable however the grid is spaced; the legend
 * names each β and T. The seven stops are our own, interpolated in sRGB; neighbouring colours
 * differ in hue and lightness (CIE ΔE ≥ 20 for up to 8 βs, checked in the tests) and every
 * colour keeps at least 3:1 contrast against white, so thin lines stay readable.
 */

/** Stops of the scale from hottest to coldest, as [r, g, b] in 0..255. */
export const TEMPERATURE_STOPS: ReadonlyArray<readonly [number, number, number]> = [
  [150, 20, 30], // garnet (hottest)
  [200, 65, 30], // vermilion
  [200, 120, 25], // amber
  [95, 145, 65], // moss
  [30, 125, 135], // teal
  [50, 90, 170], // cobalt
  [45, 35, 110], // indigo (coldest)
];

const hex = (n: number) => n.toString(16).padStart(2, '0');

/** The colour at position `u` ∈ [0, 1] along the scale (0 = hottest), as `#rrggbb`. */
export function temperatureColourAt(u: number): string {
  const x = Number.isFinite(u) ? Math.min(1, Math.max(0, u)) : 0;
  const pos = x * (TEMPERATURE_STOPS.length - 1);
  const i = Math.min(TEMPERATURE_STOPS.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = TEMPERATURE_STOPS[i];
  const b = TEMPERATURE_STOPS[i + 1];
  return `#${[0, 1, 2].map((k) => hex(Math.round(a[k] * (1 - f) + b[k] * f))).join('')}`;
}

/**
 * One colour per β of `betas` (any order; equal βs get equal colours): the smallest β (hottest)
 * gets the warm end, the largest the cold end. A single β gets the middle of the scale.
 */
export function temperatureColours(betas: readonly number[]): string[] {
  const distinct = [...new Set(betas)].sort((p, q) => p - q);
  const rank = new Map(distinct.map((b, i) => [b, i]));
  const n = distinct.length;
  return betas.map((b) => temperatureColourAt(n <= 1 ? 0.5 : rank.get(b)! / (n - 1)));
}

/** Parses `#rrggbb` to [r, g, b] (used by the tests and the PNG checks). */
export function parseHexColour(colour: string): [number, number, number] {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(colour);
  if (!m) throw new RangeError(`colour must be #rrggbb; got ${JSON.stringify(colour)}`);
  return [parseInt(m[1], 16), parseInt(m[2], 16), parseInt(m[3], 16)];
}
