/**
 * Test support (not a test): the comparison of the mps engine with the exact engine used by
 * mps-exact-*.test.ts.
 *
 * The mps engine against the exact engine (the full doubled state vector with Chebyshev
 * propagators, accurate to its 1e-11 tolerance here) on small open chains, with truncation
 * effectively off (discarded weight ≤ 1e-20 per update, bond cap 4^⌊L/2⌋: the largest possible)
 * and the fourth-order splitting, so that the Trotter error is the only approximation.
 *
 * What runs (kept small for a loaded 2-core machine; the bench repeats the Ising case):
 *   - Ising, L = 10, β ∈ {0, 0.8}, t ∈ {0, 0.2, 0.4, 0.6}, dt = 0.015;
 *   - XXZ → XXZ + Dzyaloshinskii–Moriya (X_iY_{i+1} − Y_iX_{i+1}, and a Y field: terms with an
 *     odd number of Y, so H1 ≠ H1ᵀ and the auxiliary gate must use the transpose), L = 6,
 *     same β and t, dt = 0.01.
 * Couplings are O(0.5): the fourth-order Trotter error scales as Λ⁵dt⁴ (Λ the bond norm).
 * Tolerance 1e-8 on every series value (measured deviations 2.0e-9 and 1.95e-9, error bars ≤ 3.7e-8); the engine's own
 * error bars must cover each deviation. Thermodynamics are extensive: ln Z, E and C are
 * compared per site to 1e-8 and must lie within the reported estimates.
 */
import { expect } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { buildLattice } from '../../../workers/src/lattice/index.js';
import { MpsEngine } from '../../../workers/src/engines/mps/index.js';
import { collect, compare, spec } from './collect.js';

const exact = new ExactEngine();
const mps = new MpsEngine();

/** Where a comparison differs from the default: the lattice (an open chain of L sites), β and the last time. */
export interface ComparisonOptions {
  readonly lattice?: SweepSpecInput['lattice'];
  /** The non-zero β. @defaultValue 0.8 */
  readonly beta?: number;
  /** Last grid time (grid of 4 times from 0). @defaultValue 0.6 */
  readonly stop?: number;
}

/** The spec of one comparison: L sites, H0, H1, fourth order at step dt, truncation off. */
export function exactComparisonInput(
  L: number, h0: SweepSpecInput['h0'], h1: SweepSpecInput['h1'], dt: number, options: ComparisonOptions = {},
): SweepSpecInput {
  const { lattice = { kind: 'chain', length: L }, beta = 0.8, stop = 0.6 } = options;
  return {
    lattice,
    h0, h1,
    betas: [0, beta],
    times: { start: 0, stop, count: 4 },
    observables: [
      { kind: 'site', pauli: 'X', perSite: true },
      { kind: 'site', pauli: 'Y', perSite: true },
      { kind: 'pair', paulis: 'ZZ', perPair: true },
      { kind: 'pair', paulis: 'XY', pairs: [[0, 3], [1, L - 1]] },
      { kind: 'energy', of: 'h1' },
    ],
    tolerance: 1e-11,
    mps: { maxBond: 4 ** Math.floor(L / 2), truncation: 1e-20, trotterOrder: 4, dt },
  };
}

/** Runs both engines on β indices 0 and 1 and asserts the agreement described in the header. */
export async function checkAgainstExact(input: SweepSpecInput): Promise<void> {
  const s = spec(input);
  const a = await collect(exact, s, [0, 1]);
  const b = await collect(mps, s, [0, 1]);
  const { diff, bar, count } = compare(a, b);
  expect(count).toBeGreaterThan(50);
  if (process.env.MPS_COMPARE_LOG) console.log(`deviation ${diff.toExponential(2)}, largest error bar ${bar.toExponential(2)}`);
  expect(diff).toBeLessThan(1e-8);
  for (const p of b.points) {
    const q = a.points.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex)!;
    p.values.forEach((v, k) => expect(Math.abs(v - q.values[k])).toBeLessThanOrEqual(p.errors[k] + 1e-12));
  }
  expect(bar).toBeLessThan(1e-6); // the error bars are informative, not vacuous
  const L = buildLattice(s.lattice).sites;
  for (let k = 0; k < 2; k++) {
    const x = a.thermo[k];
    const y = b.thermo[k];
    expect(Math.abs(x.lnZ - y.lnZ) / L).toBeLessThan(1e-8);
    expect(Math.abs(x.energy - y.energy) / L).toBeLessThan(1e-8);
    expect(Math.abs(x.heatCapacity - y.heatCapacity) / L).toBeLessThan(1e-8);
    expect(Math.abs(x.lnZ - y.lnZ)).toBeLessThanOrEqual(y.errors.lnZ + 1e-12);
    expect(Math.abs(x.energy - y.energy)).toBeLessThanOrEqual(y.errors.energy + 1e-12);
  }
  for (const d of b.diagnostics) expect(d.h1Drift).toBeLessThan(1e-8);
}

