/**
 * Expands a spec's observables into the Pauli strings to measure, in the two-mask form of the
 * 2^N engines (sites 0..29), and the weights that make each reported series: the recipes and
 * weights are those of build-series-terms.ts, shared by every engine.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import type { LatticeGraph, PauliString, PauliSum } from '../physics/types.js';
import { pauliKey } from '../physics/pauli-algebra.js';
import { MAX_MASK_SITE, type PauliFactor } from '../physics/pauli-word.js';
import { buildSeriesTerms } from './build-series-terms.js';
import type { ObservableLayout } from './observable-layout.js';

export type { ObservableLayout, SeriesTerms } from './observable-layout.js';
export { evaluateSeries } from './evaluate-series.js';
export { COS_ZERO } from './build-series-terms.js';

/** The mask form of a product of single-site factors on distinct sites. */
function maskString(factors: readonly PauliFactor[]): PauliString {
  let x = 0;
  let z = 0;
  for (const { letter, site } of factors) {
    const bit = 1 << site;
    if (letter !== 'Z') x |= bit;
    if (letter !== 'X') z |= bit;
  }
  return { x, z };
}

/**
 * Builds the {@link ObservableLayout} of a spec on its lattice.
 * @throws RangeError if a site is outside the lattice or above the mask limit (29), or a
 *   staggered magnetisation is asked on a lattice without sublattice signs.
 */
export function expandObservables(spec: SweepSpec, graph: LatticeGraph, h0: PauliSum, h1: PauliSum): ObservableLayout {
  const n = graph.sites;
  const primitives: PauliString[] = [];
  const index = new Map<bigint, number>();
  const prim = (p: PauliString): number => {
    const key = pauliKey(p);
    let k = index.get(key);
    if (k === undefined) {
      k = primitives.length;
      primitives.push({ x: p.x, z: p.z });
      index.set(key, k);
    }
    return k;
  };
  const series = buildSeriesTerms(spec, graph, {
    who: 'expandObservables',
    maxSite: MAX_MASK_SITE,
    product: (factors) => prim(maskString(factors)),
    energy: (of, add) => {
      let constant = 0;
      for (const t of (of === 'h0' ? h0 : h1).terms) {
        if (t.x === 0 && t.z === 0) constant += t.weight;
        else {
          if ((t.x | t.z) >= 2 ** n) throw new RangeError(`expandObservables: ${of} acts on sites outside the lattice (sites 0..${n - 1})`);
          add(prim(t), t.weight);
        }
      }
      return constant;
    },
  });
  return { primitives, series };
}
