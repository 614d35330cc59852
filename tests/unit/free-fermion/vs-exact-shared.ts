/**
 * Shared body of the free-fermion vs exact-engine checks (issue 6: "free-fermion against the
 * exact engine at L = 8, 10 to 1e−10, open and periodic"). Both engines run the same parsed
 * spec through runBranch; every series, ln Z, E and C must agree to 1e−10. The exact engine is
 * the reference here (its own error bound is ≤ the spec tolerance 1e−10).
 */
import { expect } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { runEngine, type EngineRun } from './run-engine.js';

/** Agreement asked of every value. */
export const AGREEMENT = 1e-10;

/** Runs both engines on `input` and returns the two runs. */
export async function runBoth(input: SweepSpecInput): Promise<{ ff: EngineRun; exact: EngineRun }> {
  const ff = await runEngine(new FreeFermionEngine(), input);
  const exact = await runEngine(new ExactEngine(), input);
  return { ff, exact };
}

/** Asserts agreement of thermodynamics and every series; returns the largest deviation. */
export function expectAgreement(ff: EngineRun, exact: EngineRun): number {
  expect(ff.labels).toEqual(exact.labels);
  let worst = 0;
  ff.thermo.forEach((r, b) => {
    const q = exact.thermo[b];
    for (const key of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) {
      const dev = Math.abs(r[key] - q[key]);
      worst = Math.max(worst, dev);
      expect(dev, `${key} at β = ${r.beta}`).toBeLessThan(AGREEMENT);
    }
  });
  ff.values.forEach((rows, b) => rows.forEach((row, t) => row.forEach((v, k) => {
    const dev = Math.abs(v - exact.values[b][t][k]);
    worst = Math.max(worst, dev);
    expect(dev, `${ff.labels[k]} at β = ${ff.thermo[b].beta}, t index ${t}`).toBeLessThan(AGREEMENT);
  })));
  return worst;
}
