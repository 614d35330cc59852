/**
 * The spec's observables as combinations of Pauli strings on sites (any lattice size), with
 * the labels and weights of the observables layer (observables/plan-series.ts,
 * observables/expand-observables.ts, mirrored here without the 30-site mask form):
 *   value = constant + Σ w·⟨P⟩ + Σ w·⟨A⟩⟨B⟩.
 * Cost: O(pairs) for pair means, O(N²) for a structure factor.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { COS_ZERO } from '../observables/expand-observables.js';
import { planSeries } from '../observables/plan-series.js';
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
  const n = graph.sites;
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
  const check = (s: number, what: string) => {
    if (!Number.isInteger(s) || s < 0 || s >= n) throw new RangeError(`${what} names site ${s}, outside the lattice (sites 0..${n - 1})`);
  };
  const combinations: SeriesCombination[] = [];
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
        for (const s of r.sites) { check(s, what); lin(prim([s], [letterCode(r.letter)]), w); }
        break;
      }
      case 'pair-mean': {
        const pairs = r.pairs();
        const w = 1 / pairs.length;
        const ca = letterCode(r.letters[0]);
        const cb = letterCode(r.letters[1]);
        for (const [i, j] of pairs) {
          check(i, what);
          check(j, what);
          if (i === j) throw new RangeError(`${what} pairs site ${i} with itself`);
          lin(prim([i, j], [ca, cb]), w);
          if (r.connected) quad(prim([i], [ca]), prim([j], [cb]), -w);
        }
        break;
      }
      case 'energy': {
        const m = r.of === 'h0' ? h0 : h1;
        constant += m.shift;
        for (const t of m.terms) lin(prim([...t.sites], [...t.codes]), t.weight);
        break;
      }
      case 'magnetisation': {
        const signs = r.pattern === 'staggered' ? graph.sublattice : null;
        if (r.pattern === 'staggered' && signs === null) throw new RangeError(`${what} needs a bipartite lattice; this lattice has an odd cycle`);
        const c = letterCode(r.letter);
        for (let s = 0; s < n; s++) lin(prim([s], [c]), (signs ? signs[s] : 1) / n);
        break;
      }
      case 'structure-factor': {
        constant += 1;
        const c = letterCode(r.letter);
        const ps = Array.from({ length: n }, (_, s) => prim([s], [c]));
        if (r.connected) for (let i = 0; i < n; i++) quad(ps[i], ps[i], -1 / n);
        for (let i = 0; i < n; i++) {
          for (let j = i + 1; j < n; j++) {
            const cs = Math.cos(r.q[0] * (graph.positions[i][0] - graph.positions[j][0])
              + r.q[1] * (graph.positions[i][1] - graph.positions[j][1]));
            if (Math.abs(cs) < COS_ZERO) continue;
            const w = (2 * cs) / n;
            lin(prim([i, j], [c, c]), w);
            if (r.connected) quad(ps[i], ps[j], -w);
          }
        }
        break;
      }
      default: {
        const never: never = r;
        throw new TypeError(`expandSeriesObservables: unknown recipe ${JSON.stringify(never)}`);
      }
    }
    combinations.push({
      label: entry.label,
      observable: entry.observable,
      constant,
      linear: [...linear.entries()].filter(([, w]) => w !== 0),
      quadratic: [...quadratic.values()].filter(([, , w]) => w !== 0),
    });
  }
  return { primitives, combinations };
}
