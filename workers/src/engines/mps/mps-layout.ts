/**
 * mpsLayout — the spec's observables as Pauli strings with explicit site factors (any lattice
 * size; the two-mask layout of observables/expand-observables.ts stops at 30 sites); recipes,
 * labels and weights from observables/build-series-terms.ts, shared by every engine. Series are
 * evaluated with observables/evaluate-series.ts (same SeriesTerms shape).
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { buildSeriesTerms } from '../../observables/build-series-terms.js';
import type { SeriesTerms } from '../../observables/observable-layout.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import type { LatticeGraph } from '../../physics/types.js';
import { wordOf, type ChainTerm } from './chain-terms.js';
import type { FactorString } from './measure-strings.js';

/** Strings to measure (non-empty, factors ascending) and the series built from them. */
export interface MpsLayout {
  readonly primitives: readonly FactorString[];
  readonly series: readonly SeriesTerms[];
}

/**
 * Interns strings by canonical word: `add(factors)` returns the index of the (sorted) string in
 * `list`, adding it if new.
 */
export function stringTable(): { list: FactorString[]; add(factors: readonly PauliFactor[]): number } {
  const list: FactorString[] = [];
  const index = new Map<string, number>();
  return {
    list,
    add(factors) {
      const sorted = [...factors].sort((p, q) => p.site - q.site);
      const word = wordOf(sorted);
      let k = index.get(word);
      if (k === undefined) {
        k = list.length;
        list.push({ factors: sorted });
        index.set(word, k);
      }
      return k;
    },
  };
}

/**
 * The layout of `spec` on `graph` with the merged terms of h0 and h1 (chain-terms.ts).
 * @throws RangeError if a site is outside the lattice, a pair joins a site to itself, or a
 *   staggered magnetisation is asked on a non-bipartite lattice.
 */
export function mpsLayout(
  spec: SweepSpec, graph: LatticeGraph, h0: readonly ChainTerm[], h1: readonly ChainTerm[],
): MpsLayout {
  const table = stringTable();
  const series = buildSeriesTerms(spec, graph, {
    who: 'mpsLayout',
    product: (factors) => table.add(factors),
    energy: (of, add) => {
      let constant = 0;
      for (const t of of === 'h0' ? h0 : h1) {
        if (t.factors.length === 0) constant += t.weight;
        else add(table.add(t.factors), t.weight);
      }
      return constant;
    },
  });
  return { primitives: table.list, series };
}
