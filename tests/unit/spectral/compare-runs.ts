/**
 * Test support (not a test): compare two engines' runs of one spec, value by value.
 */
import { expect } from 'vitest';
import type { Collected } from '../exact/collect.js';

/** Largest differences of a run `a` against a reference `b`, and the largest error `a` reported. */
export interface RunDifference {
  thermo: number;
  points: number;
  maxError: number;
}

/**
 * Largest |a − b| over thermodynamics and points (points matched by indices); also asserts that
 * every difference lies within the two runs' reported errors combined.
 */
export function compareRuns(a: Collected, b: Collected): RunDifference {
  let thermo = 0;
  let maxError = 0;
  for (const r of a.thermo) {
    const q = b.thermo.find((x) => x.betaIndex === r.betaIndex)!;
    for (const k of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) {
      const diff = Math.abs(r[k] - q[k]);
      thermo = Math.max(thermo, diff);
      expect(diff).toBeLessThanOrEqual(r.errors[k] + q.errors[k]);
      maxError = Math.max(maxError, r.errors[k]);
    }
    if (r.freeEnergy !== null) thermo = Math.max(thermo, Math.abs(r.freeEnergy - q.freeEnergy!));
  }
  let points = 0;
  expect(a.points).toHaveLength(b.points.length);
  for (const p of a.points) {
    const q = b.points.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex)!;
    p.values.forEach((v, k) => {
      const diff = Math.abs(v - q.values[k]);
      points = Math.max(points, diff);
      expect(diff).toBeLessThanOrEqual(p.errors[k] + q.errors[k]);
      maxError = Math.max(maxError, p.errors[k]);
    });
  }
  return { thermo, points, maxError };
}

/** Largest change of series k over the time grid at the last β (the quench must move things). */
export function motion(out: Collected, k: number): number {
  const last = Math.max(...out.points.map((p) => p.betaIndex));
  const vals = out.points.filter((p) => p.betaIndex === last).map((p) => p.values[k]);
  return Math.max(...vals) - Math.min(...vals);
}
