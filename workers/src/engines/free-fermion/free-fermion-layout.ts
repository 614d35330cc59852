/**
 * freeFermionLayout — the spec's observables as Pauli strings (primitives, with explicit site
 * factors, for lattices of any size) and the weights that make each series. The same labels
 * (observables/plan-series.ts) and the same weights as observables/expand-observables.ts, so
 * results are comparable across engines:
 * - site mean over S:        Σ_{i∈S} (1/|S|)·⟨P_i⟩
 * - pair mean over pairs Π:  Σ (1/|Π|)·⟨A_i B_j⟩, connected: − (1/|Π|)·⟨A_i⟩⟨B_j⟩
 * - energy:                  Σ w⟨P⟩ over the merged terms (identity terms → constant)
 * - magnetisation:           (1/N) Σ_i s_i⟨P_i⟩
 * - structure factor:        constant 1 + Σ_{i<j} 2cos(q·Δr)/N ⟨P_iP_j⟩ (|cos| < COS_ZERO dropped);
 *                            connected: − (1/N)Σ_{ij} cos(q·Δr)⟨P_i⟩⟨P_j⟩ (i = j included).
 * Series are evaluated by {@link evaluateLayout} (first-order error propagation as
 * observables/evaluate-series.ts for systematic errors, in quadrature for random rounding).
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { COS_ZERO } from '../../observables/expand-observables.js';
import type { SeriesTerms } from '../../observables/observable-layout.js';
import { planSeries, type PauliLetter } from '../../observables/plan-series.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import type { LatticeGraph } from '../../physics/types.js';
import { factorsWord, type SiteTerm } from './site-terms.js';

/** A Pauli string to measure, factors ascending by site. */
export interface FactorPrimitive {
  readonly word: string;
  readonly factors: readonly PauliFactor[];
}

/** Primitives and the series built from them (same SeriesTerms shape as the observables layer). */
export interface FactorLayout {
  readonly primitives: readonly FactorPrimitive[];
  readonly series: readonly SeriesTerms[];
  /** ⟨H1⟩ as a series over the same primitives (internal: for the drift diagnostic; not reported). */
  readonly h1Energy: SeriesTerms;
}

/**
 * Builds the layout of `spec` on `graph`; h0 and h1 are the merged terms (site-terms.ts).
 * @throws RangeError if a site is outside the lattice, a pair joins a site to itself, or a
 *   staggered magnetisation is asked on a lattice without sublattice signs.
 */
export function freeFermionLayout(
  spec: SweepSpec, graph: LatticeGraph, h0: readonly SiteTerm[], h1: readonly SiteTerm[],
): FactorLayout {
  const n = graph.sites;
  const primitives: FactorPrimitive[] = [];
  const index = new Map<string, number>();
  const prim = (factors: PauliFactor[]): number => {
    const sorted = factors.length > 1 ? [...factors].sort((p, q) => p.site - q.site) : factors;
    const word = factorsWord(sorted);
    let k = index.get(word);
    if (k === undefined) {
      k = primitives.length;
      primitives.push({ word, factors: sorted });
      index.set(word, k);
    }
    return k;
  };
  const checkSite = (s: number, what: string) => {
    if (!Number.isInteger(s) || s < 0 || s >= n) throw new RangeError(`freeFermionLayout: ${what} names site ${s}, outside the lattice (sites 0..${n - 1})`);
  };
  const single = (letter: PauliLetter, s: number, what: string) => {
    checkSite(s, what);
    return prim([{ letter, site: s }]);
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
          if (i === j) throw new RangeError(`freeFermionLayout: ${what} pairs site ${i} with itself`);
          checkSite(i, what);
          checkSite(j, what);
          lin(prim([{ letter: r.letters[0], site: i }, { letter: r.letters[1], site: j }]), w);
          if (r.connected) quad(single(r.letters[0], i, what), single(r.letters[1], j, what), -w);
        }
        break;
      }
      case 'energy':
        for (const t of r.of === 'h0' ? h0 : h1) {
          if (t.factors.length === 0) constant += t.weight;
          else lin(prim([...t.factors]), t.weight);
        }
        break;
      case 'magnetisation': {
        const signs = r.pattern === 'staggered' ? graph.sublattice : null;
        if (r.pattern === 'staggered' && signs === null) {
          throw new RangeError(`freeFermionLayout: ${what} needs a bipartite lattice; this lattice has an odd cycle`);
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
            lin(prim([{ letter: r.letter, site: i }, { letter: r.letter, site: j }]), w);
            if (r.connected) quad(ps[i], ps[j], -w);
          }
        }
        break;
      }
      default: {
        const never: never = r;
        throw new TypeError(`freeFermionLayout: unknown recipe ${JSON.stringify(never)}`);
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
  let h1Constant = 0;
  const h1Linear = new Map<number, number>();
  for (const t of h1) {
    if (t.factors.length === 0) h1Constant += t.weight;
    else {
      const p = prim([...t.factors]);
      h1Linear.set(p, (h1Linear.get(p) ?? 0) + t.weight);
    }
  }
  const h1Energy: SeriesTerms = {
    label: 'E:h1', observable: -1, constant: h1Constant, linear: [...h1Linear.entries()], quadratic: [],
  };
  return { primitives, series, h1Energy };
}

/**
 * value = c + Σ w·⟨P⟩ + Σ w·⟨A⟩⟨B⟩ with the error estimate
 *   Σ|w|·δP_sys + √(Σ (w·δP_rnd)²) + Σ|w|·(|⟨B⟩|δA + |⟨A⟩|δB + δAδB)   (δ = δ_sys + δ_rnd in the last)
 * i.e. observables/evaluate-series.ts's first-order propagation for the systematic part, in
 * quadrature for the random rounding part (error-model.ts).
 */
export function evaluateLayout(
  series: readonly SeriesTerms[], values: Float64Array, sys: Float64Array, rnd: Float64Array,
  outValues: Float64Array, outErrors: Float64Array,
): void {
  series.forEach((s, k) => {
    let v = s.constant;
    let e = 0;
    let q = 0;
    for (const [p, w] of s.linear) {
      v += w * values[p];
      e += Math.abs(w) * sys[p];
      q += (w * rnd[p]) ** 2;
    }
    for (const [a, b, w] of s.quadratic) {
      v += w * values[a] * values[b];
      const ea = sys[a] + rnd[a];
      const eb = sys[b] + rnd[b];
      e += Math.abs(w) * (Math.abs(values[b]) * ea + Math.abs(values[a]) * eb + ea * eb);
    }
    outValues[k] = v;
    outErrors[k] = e + Math.sqrt(q);
  });
}
