/**
 * The spec's observables as combinations of Pauli strings on sites (any lattice size), with
 * the recipes, labels and weights shared by every engine (observables/build-series-terms.ts):
 *   value = constant + Σ w·⟨P⟩ + Σ w·⟨A⟩⟨B⟩.
 * Cost: O(pairs) for pair means, O(N²) for a structure factor.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { buildSeriesTerms } from '../observables/build-series-terms.js';
import type { LatticeGraph } from '../physics/types.js';
import type { SitePauli } from './cluster-expansion.js';
import type { LocalModel } from './local-terms.js';
import { letterCode } from './pauli-masks.js';

/** One reported series as a combination of primitive expectations. */
export interface SeriesCombination {
  readonly label: string;
  readonly observable: number;
  readonly constant: number;
  readonly linear: ReadonlyArray<readonly [prim: number, weight: number]>;
  readonly quadratic: ReadonlyArray<readonly [a: number, b: number, weight: number]>;
}

/** Primitives (Pauli strings by site) and the combinations that make the series. */
export interface SeriesObservables {
  readonly primitives: readonly SitePauli[];
  readonly combinations: readonly SeriesCombination[];
}

/**
 * Expands the spec's observables on the graph (see file header).
 * @throws RangeError if a site is outside the lattice, a pair joins a site to itself, or a
 *   staggered magnetisation is asked on a non-bipartite lattice.
 */
export function expandSeriesObservables(spec: SweepSpec, graph: LatticeGraph, h0: LocalModel, h1: LocalModel): SeriesObservables {
  const primitives: SitePauli[] = [];
  const index = new Map<string, number>();
  const prim = (sites: number[], codes: number[]): number => {
    const order = sites.map((_, k) => k).sort((a, b) => sites[a] - sites[b]);
    const p: SitePauli = { sites: order.map((k) => sites[k]), codes: order.map((k) => codes[k]) };
    const key = `${p.sites.join(',')}|${p.codes.join('')}`;
    let k = index.get(key);
    if (k === undefined) {
      k = primitives.length;
      primitives.push(p);
      index.set(key, k);
    }
    return k;
  };
  const combinations: SeriesCombination[] = buildSeriesTerms(spec, graph, {
    who: 'series observables',
    product: (factors) => prim(factors.map((f) => f.site), factors.map((f) => letterCode(f.letter))),
    energy: (of, add) => {
      const m = of === 'h0' ? h0 : h1;
      for (const t of m.terms) add(prim([...t.sites], [...t.codes]), t.weight);
      return m.shift;
    },
  });
  return { primitives, combinations };
}
