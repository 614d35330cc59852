/**
 * The one place where a spec's observables become weighted combinations of Pauli-string
 * expectations. Engines differ only in how they name a string (two 30-bit masks, a factor
 * list, site/code arrays): each passes a {@link StringNamer}, and every engine gets the same
 * labels (plan-series.ts) and the same weights:
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
import type { PauliFactor } from '../physics/pauli-word.js';
import type { LatticeGraph } from '../physics/types.js';
import type { SeriesTerms } from './observable-layout.js';
import { planSeries } from './plan-series.js';

/** |cos(q·Δr)| below this is treated as an exact zero. */
export const COS_ZERO = 1e-14;

/** How an engine names (interns) the strings it measures. */
export interface StringNamer {
  /** Index of the product of `factors` (distinct sites) in the engine's table, added if new. */
  product(factors: readonly PauliFactor[]): number;
  /**
   * Calls `add(index, weight)` for every non-identity term of h0 or h1 and returns the
   * identity part (a constant energy).
   */
  energy(of: 'h0' | 'h1', add: (index: number, weight: number) => void): number;
  /** Highest site a string may name (the mask form stops at 29). @defaultValue no limit */
  readonly maxSite?: number;
  /** Prefix of error messages (the engine's builder name). */
  readonly who: string;
}

/**
 * The series of `spec` on `graph`, in report order.
 * @throws RangeError if a site is outside the lattice or above `maxSite`, a pair joins a site
 *   to itself, or a staggered magnetisation is asked on a lattice without sublattice signs.
 */
export function buildSeriesTerms(spec: SweepSpec, graph: LatticeGraph, namer: StringNamer): SeriesTerms[] {
  const n = graph.sites;
  const { who } = namer;
  const checkSite = (s: number, what: string) => {
    if (!Number.isInteger(s) || s < 0 || s >= n) throw new RangeError(`${who}: ${what} names site ${s}, outside the lattice (sites 0..${n - 1})`);
    if (namer.maxSite !== undefined && s > namer.maxSite) {
      throw new RangeError(`${who}: ${what} names site ${s}, above the mask limit (sites 0..${namer.maxSite})`);
    }
  };
  const series: SeriesTerms[] = [];
  for (const entry of planSeries(spec, graph)) {
    const what = `"${entry.label}" (observables[${entry.observable}])`;
    const single = (letter: PauliFactor['letter'], s: number) => {
      checkSite(s, what);
      return namer.product([{ letter, site: s }]);
    };
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
        for (const s of r.sites) lin(single(r.letter, s), w);
        break;
      }
      case 'pair-mean': {
        const pairs = r.pairs();
        const w = 1 / pairs.length;
        for (const [i, j] of pairs) {
          checkSite(i, what);
          checkSite(j, what);
          if (i === j) throw new RangeError(`${who}: ${what} pairs site ${i} with itself`);
          lin(namer.product([{ letter: r.letters[0], site: i }, { letter: r.letters[1], site: j }]), w);
          if (r.connected) quad(single(r.letters[0], i), single(r.letters[1], j), -w);
        }
        break;
      }
      case 'energy':
        constant += namer.energy(r.of, lin);
        break;
      case 'magnetisation': {
        const signs = r.pattern === 'staggered' ? graph.sublattice : null;
        if (r.pattern === 'staggered' && signs === null) {
          throw new RangeError(`${who}: ${what} needs a bipartite lattice; this lattice has an odd cycle`);
        }
        for (let s = 0; s < n; s++) lin(single(r.letter, s), (signs ? signs[s] : 1) / n);
        break;
      }
      case 'structure-factor': {
        constant += 1;
        for (let s = 0; s < n; s++) checkSite(s, what);
        const ps = r.connected ? Array.from({ length: n }, (_, s) => single(r.letter, s)) : [];
        if (r.connected) for (let i = 0; i < n; i++) quad(ps[i], ps[i], -1 / n);
        for (let i = 0; i < n; i++) {
          for (let j = i + 1; j < n; j++) {
            const c = Math.cos(r.q[0] * (graph.positions[i][0] - graph.positions[j][0])
              + r.q[1] * (graph.positions[i][1] - graph.positions[j][1]));
            if (Math.abs(c) < COS_ZERO) continue;
            const w = (2 * c) / n;
            lin(namer.product([{ letter: r.letter, site: i }, { letter: r.letter, site: j }]), w);
            if (r.connected) quad(ps[i], ps[j], -w);
          }
        }
        break;
      }
      default: {
        const never: never = r;
        throw new TypeError(`${who}: unknown recipe ${JSON.stringify(never)}`);
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
  return series;
}
