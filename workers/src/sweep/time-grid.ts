/**
 * The quench time grid of a spec as an ascending array: `count` evenly spaced points from
 * `start` to `stop` inclusive (count = 1 gives [start]), or the explicit `values` sorted
 * ascending with repeats removed. Point `timeIndex` t refers to element t of this array.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';

export function timeGrid(spec: Pick<SweepSpec, 'times'>): number[] {
  const grid = spec.times;
  if ('values' in grid) {
    return [...new Set(grid.values.map((v) => (Object.is(v, -0) ? 0 : v)))].sort((a, b) => a - b);
  }
  const { start, stop, count } = grid;
  if (count === 1) return [start];
  const step = (stop - start) / (count - 1);
  // Index-based spacing (not accumulation) keeps every point exact to one rounding.
  return Array.from({ length: count }, (_, k) => (k === count - 1 ? stop : start + k * step));
}
