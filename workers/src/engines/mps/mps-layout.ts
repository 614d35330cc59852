/**
 * mpsLayout — the spec's observables as Pauli strings with explicit site factors (any lattice
 * size; the two-mask layout of observables/expand-observables.ts stops at 30 sites) and the
 * weights that make each series. Labels come from observables/plan-series.ts and the weights
 * are those of expandObservables, so series agree across engines:
 *   site mean Σ (1/|S|)⟨P_i⟩;  pair mean Σ (1/|Π|)⟨A_iB_j⟩ (connected: − (1/|Π|)⟨A_i⟩⟨B_j⟩);
 *   energy Σ w⟨P⟩ + constant;  magnetisation (1/N) Σ s_i⟨P_i⟩;  structure factor
 *   1 + Σ_{i<j} 2cos(q·Δr)/N ⟨P_iP_j⟩ (connected: − (1/N)Σ_{ij} cos(q·Δr)⟨P_i⟩⟨P_j⟩).
 * Series are evaluated with observables/evaluate-series.ts (same SeriesTerms shape).
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { COS_ZERO } from '../../observables/expand-observables.js';
import type { SeriesTerms } from '../../observables/observable-layout.js';
import { planSeries, type PauliLetter } from '../../observables/plan-series.js';
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
  const n = graph.sites;
  const table = stringTable();
  const checkSite = (s: number, what: string) => {
    if (!Number.isInteger(s) || s < 0 || s >= n) throw new RangeError(`mpsLayout: ${what} names site ${s}, outside the lattice (sites 0..${n - 1})`);
  };
  const single = (letter: PauliLetter, s: number, what: string) => {
    checkSite(s, what);
    return table.add([{ letter, site: s }]);
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
          if (i === j) throw new RangeError(`mpsLayout: ${what} pairs site ${i} with itself`);
          checkSite(i, what);
          checkSite(j, what);
          lin(table.add([{ letter: r.letters[0], site: i }, { letter: r.letters[1], site: j }]), w);
          if (r.connected) quad(single(r.letters[0], i, what), single(r.letters[1], j, what), -w);
        }
        break;
      }
      case 'energy':
        for (const t of r.of === 'h0' ? h0 : h1) {
          if (t.factors.length === 0) constant += t.weight;
          else lin(table.add(t.factors), t.weight);
        }
        break;
      case 'magnetisation': {
        const signs = r.pattern === 'staggered' ? graph.sublattice : null;
        if (r.pattern === 'staggered' && signs === null) {
          throw new RangeError(`mpsLayout: ${what} needs a bipartite lattice; this lattice has an odd cycle`);
        }
        for (let s = 0; s < n; s++) lin(single(r.letter, s, what), (signs ? signs[s] : 1) / n);
        break;
      }
      case 'structure-factor': {
        constant += 1;
        const ps = r.connected ? Array.from({ length: n }, (_, s) => single(r.letter, s, what)) : [];
        if (r.connected) for (let i = 0; i < n; i++) quad(ps[i], ps[i], -1 / n);
        for (let i = 0; i < n; i++) {
          for (let j = i + 1; j < n; j++) {
            const c = Math.cos(r.q[0] * (graph.positions[i][0] - graph.positions[j][0])
              + r.q[1] * (graph.positions[i][1] - graph.positions[j][1]));
            if (Math.abs(c) < COS_ZERO) continue;
            const w = (2 * c) / n;
            lin(table.add([{ letter: r.letter, site: i }, { letter: r.letter, site: j }]), w);
            if (r.connected) quad(ps[i], ps[j], -w);
          }
        }
        break;
      }
      default: {
        const never: never = r;
        throw new TypeError(`mpsLayout: unknown recipe ${JSON.stringify(never)}`);
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
  return { primitives: table.list, series };
}
