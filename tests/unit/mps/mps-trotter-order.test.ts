/**
 * Trotter error of the mps engine against the exact engine: second order falls as dt², fourth
 * order as dt⁴, and the step-doubling estimate in every point's error bar covers the error.
 *
 * Setup: open chain of 5 sites (bond cap 16 = the largest bond, truncation 0: the Trotter error
 * is the only approximation), H0 Ising (J = 1, hx = 0.9, hz = 0.3), H1 XXZ (J = 0.6, Δ = 0.5,
 * hz = 0.4), β = 0.6, one time t = 1; error = max over the site and pair series of |mps − exact|.
 * Slopes log₂(ε(dt)/ε(dt/2)) over dt = 0.1, 0.05, 0.025 measured 1.99, 2.00 (order 2) and 3.98,
 * 4.00 (order 4); the bands [1.9, 2.1] and [3.8, 4.2] leave room for the pre-asymptotic part
 * (at dt = 0.2 → 0.1 the slopes are 1.56 and 3.55, outside, which is why dt ≤ 0.1).
 */
import { describe, expect, it } from 'vitest';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { MpsEngine } from '../../../workers/src/engines/mps/index.js';
import { collect, spec } from './collect.js';

const make = (order: 2 | 4, dt: number) => spec({
  lattice: { kind: 'chain', length: 5 },
  h0: { model: 'ising', J: 1, hx: 0.9, hz: 0.3 },
  h1: { model: 'xxz', J: 0.6, delta: 0.5, hz: 0.4 },
  betas: [0.6],
  times: { values: [1] },
  observables: [
    { kind: 'site', pauli: 'X', perSite: true },
    { kind: 'pair', paulis: 'ZZ', perPair: true },
    { kind: 'pair', paulis: 'XX', perPair: true },
  ],
  tolerance: 1e-12,
  mps: { maxBond: 16, truncation: 0, trotterOrder: order, dt },
});

describe('MpsEngine Trotter error', () => {
  for (const [order, lo, hi] of [[2, 1.9, 2.1], [4, 3.8, 4.2]] as const) {
    it(`falls as dt^${order} for the order-${order} splitting, within its step-doubling estimate`, async () => {
      const reference = await collect(new ExactEngine(), make(order, 0.1), [0]);
      const ref = reference.points[0].values;
      const errors: number[] = [];
      for (const dt of [0.1, 0.05, 0.025]) {
        const run = await collect(new MpsEngine(), make(order, dt), [0]);
        const p = run.points[0];
        let e = 0;
        p.values.forEach((v, k) => {
          const d = Math.abs(v - ref[k]);
          e = Math.max(e, d);
          expect(d).toBeLessThanOrEqual(p.errors[k]);
        });
        errors.push(e);
      }
      for (let k = 1; k < errors.length; k++) {
        const slope = Math.log2(errors[k - 1] / errors[k]);
        expect(slope).toBeGreaterThan(lo);
        expect(slope).toBeLessThan(hi);
      }
    });
  }
});
