/**
 * typicalLayout — what the typicality estimators need to know about a spec, without compiling
 * any operator: sites, grids, the observables' Pauli strings and series, H0's norm bound and
 * second moment. Cheap (no 2^N tables), so the service can build it wherever it merges samples.
 *
 *   ‖H0 − shift‖ ≤ a = Σ|w| over non-identity terms,
 *   μ₂ = Tr((H0 − shift)²)/2^N = Σ w² over non-identity terms (Pauli strings are orthonormal
 *   under Tr(·)/2^N after merging; buildHamiltonian merges repeated strings).
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { specHash } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { expandObservables } from '../../observables/expand-observables.js';
import type { ObservableLayout } from '../../observables/expand-observables.js';
import { buildHamiltonian } from '../../physics/build-hamiltonian.js';
import type { PauliSum } from '../../physics/types.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';

/** The spec's problem as the typicality estimators see it. */
export interface TypicalLayout {
  /** Physics hash of the spec: samples of different specs never merge. */
  readonly specHash: string;
  /** spec.seed: sample k's random vector is a function of (seed, k) only. */
  readonly seed: number;
  /** Number of sites N. */
  readonly sites: number;
  /** Canonical β grid (ascending). */
  readonly betas: readonly number[];
  /** Canonical time grid (ascending). */
  readonly times: readonly number[];
  /** Primitive Pauli strings and the series built from them. */
  readonly layout: ObservableLayout;
  /** H0 and H1 as Pauli sums. */
  readonly h0: PauliSum;
  readonly h1: PauliSum;
  /** a = Σ|w| over H0's non-identity terms (‖H0 − shift‖ ≤ a). */
  readonly h0NormBound: number;
  /** μ₂ = Σ w² over H0's non-identity terms (the infinite-temperature variance of H0). */
  readonly h0SecondMoment: number;
}

/**
 * Builds the {@link TypicalLayout} of a spec.
 * @throws RangeError when the lattice, the Hamiltonians or the observables cannot be built.
 */
export function typicalLayout(spec: SweepSpec): TypicalLayout {
  const graph = buildLattice(spec.lattice);
  const h0 = buildHamiltonian(spec.h0, graph);
  const h1 = buildHamiltonian(spec.h1, graph);
  const layout = expandObservables(spec, graph, h0, h1);
  let a = 0;
  let mu2 = 0;
  for (const t of h0.terms) {
    if (t.x === 0 && t.z === 0) continue;
    a += Math.abs(t.weight);
    mu2 += t.weight * t.weight;
  }
  return {
    specHash: specHash(spec),
    seed: spec.seed,
    sites: graph.sites,
    betas: betaGrid(spec),
    times: timeGrid(spec),
    layout,
    h0,
    h1,
    h0NormBound: a,
    h0SecondMoment: mu2,
  };
}

/**
 * Layout indices of the primitives some series uses, ascending. (Pair means list their
 * single-site factors as primitives even when only the product enters a series; those are
 * not measured.)
 */
export function measuredPrimitives(layout: ObservableLayout): Int32Array {
  const used = new Set<number>();
  for (const series of layout.series) {
    for (const [p] of series.linear) used.add(p);
    for (const [a, b] of series.quadratic) { used.add(a); used.add(b); }
  }
  return Int32Array.from([...used].sort((a, b) => a - b));
}
