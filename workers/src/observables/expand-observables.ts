/**
 * Expands a spec's observables into the Pauli strings to measure and the weights that make
 * each reported series (labels: plan-series.ts).
 *
 * - site mean over S:      Σ_{i∈S} (1/|S|)·⟨P_i⟩
 * - pair mean over pairs Π: Σ_{(i,j)∈Π} (1/|Π|)·⟨A_i B_j⟩, connected: − (1/|Π|)·⟨A_i⟩⟨B_j⟩
 * - energy:                Σ w_P ⟨P⟩ over the terms of h0 or h1 (identity terms → constant)
 * - magnetisation:         (1/N) Σ_i s_i ⟨P_i⟩, s_i = 1 or the sublattice sign
 * - structure factor:      S(q) = (1/N) Σ_ij cos(q·(r_i − r_j)) ⟨P_i P_j⟩ with P_i² = 1, so
 *                          the i = j terms give the constant 1 and each pair i < j carries
 *                          2cos(q·(r_i − r_j))/N; connected subtracts (1/N) Σ_ij cos(…)⟨P_i⟩⟨P_j⟩,
 *                          i = j included. r are the stored positions (not minimum images):
 *                          at momenta allowed by a periodic lattice the two agree.
 * Structure-factor weights with |cos| below {@link COS_ZERO} are dropped (cos(π/2) = 6e−17 is
 * rounding, not a term).
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import type { LatticeGraph, PauliString, PauliSum } from '../physics/types.js';
import { pauliKey } from '../physics/pauli-algebra.js';
import { MAX_MASK_SITE } from '../physics/pauli-word.js';
import type { ObservableLayout, SeriesTerms } from './observable-layout.js';
import { planSeries, type PauliLetter } from './plan-series.js';

export type { ObservableLayout, SeriesTerms } from './observable-layout.js';
export { evaluateSeries } from './evaluate-series.js';

/** |cos(q·Δr)| below this is treated as an exact zero. */
export const COS_ZERO = 1e-14;

function letterString(letter: PauliLetter, site: number): PauliString {
  const bit = 1 << site;
  return { x: letter === 'Z' ? 0 : bit, z: letter === 'X' ? 0 : bit };
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
  const checkSite = (s: number, what: string) => {
    if (!Number.isInteger(s) || s < 0 || s >= n) throw new RangeError(`expandObservables: ${what} names site ${s}, outside the lattice (sites 0..${n - 1})`);
    if (s > MAX_MASK_SITE) throw new RangeError(`expandObservables: ${what} names site ${s}, above the mask limit (sites 0..${MAX_MASK_SITE})`);
  };
  const single = (letter: PauliLetter, s: number, what: string) => {
    checkSite(s, what);
    return prim(letterString(letter, s));
  };

  const series: SeriesTerms[] = [];
  for (const entry of planSeries(spec, graph)) {
    const what = `"${entry.label}" (observables[${entry.observable}])`;
    let constant = 0;
    const linear = new Map<number, number>();
    const quadratic = new Map<string, [number, number, number]>();
    const lin = (p: number, w: number) => linear.set(p, (linear.get(p) ?? 0) + w);
    const quad = (a: number, b: number, w: number) => {
      const key = a <= b ? `${a},${b}` : `${b},${a}`;
      const t = quadratic.get(key);
      if (t === undefined) quadratic.set(key, [Math.min(a, b), Math.max(a, b), w]);
      else t[2] += w;
    };

    const r = entry.recipe;
    switch (r.type) {
      case 'site-mean': {
        const w = 1 / r.sites.length;
        for (const s of r.sites) lin(single(r.letter, s, what), w);
        break;
      }
      case 'pair-mean': {
        const pairs = r.pairs();
        const w = 1 / pairs.length;
        for (const [i, j] of pairs) {
          if (i === j) throw new RangeError(`expandObservables: ${what} pairs site ${i} with itself`);
          const a = single(r.letters[0], i, what);
          const b = single(r.letters[1], j, what);
          const ab = prim({ x: primitives[a].x | primitives[b].x, z: primitives[a].z | primitives[b].z });
          lin(ab, w);
          if (r.connected) quad(a, b, -w);
        }
        break;
      }
      case 'energy':
        for (const t of (r.of === 'h0' ? h0 : h1).terms) {
          if (t.x === 0 && t.z === 0) constant += t.weight;
          else {
            if ((t.x | t.z) >= 2 ** n) throw new RangeError(`expandObservables: ${r.of} acts on sites outside the lattice (sites 0..${n - 1})`);
            lin(prim(t), t.weight);
          }
        }
        break;
      case 'magnetisation': {
        const signs = r.pattern === 'staggered' ? graph.sublattice : null;
        if (r.pattern === 'staggered' && signs === null) {
          throw new RangeError(`expandObservables: ${what} needs a bipartite lattice; this lattice has an odd cycle`);
        }
        for (let s = 0; s < n; s++) lin(single(r.letter, s, what), (signs ? signs[s] : 1) / n);
        break;
      }
      case 'structure-factor': {
        constant += 1;
        const ps = Array.from({ length: n }, (_, s) => single(r.letter, s, what));
        if (r.connected) for (let i = 0; i < n; i++) quad(ps[i], ps[i], -1 / n);
        for (let i = 0; i < n; i++) {
          for (let j = i + 1; j < n; j++) {
            const c = Math.cos(r.q[0] * (graph.positions[i][0] - graph.positions[j][0])
              + r.q[1] * (graph.positions[i][1] - graph.positions[j][1]));
            if (Math.abs(c) < COS_ZERO) continue;
            const w = (2 * c) / n;
            lin(prim({ x: primitives[ps[i]].x | primitives[ps[j]].x, z: primitives[ps[i]].z | primitives[ps[j]].z }), w);
            if (r.connected) quad(ps[i], ps[j], -w);
          }
        }
        break;
      }
      default: {
        const never: never = r;
        throw new TypeError(`expandObservables: unknown recipe ${JSON.stringify(never)}`);
      }
    }
    series.push({
      label: entry.label,
      observable: entry.observable,
      constant,
      linear: [...linear.entries()].filter(([, w]) => w !== 0),
      quadratic: [...quadratic.values()].filter(([, , w]) => w !== 0),
    });
  }
  return { primitives, series };
}
