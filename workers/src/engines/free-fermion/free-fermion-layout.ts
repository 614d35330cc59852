/**
 * freeFermionLayout — the spec's observables as Pauli strings (primitives, with explicit site
 * factors, for lattices of any size) and the weights that make each series: recipes, labels
 * and weights from observables/build-series-terms.ts, shared by every engine.
 * Series are evaluated by {@link evaluateLayout} (first-order error propagation as
 * observables/evaluate-series.ts for systematic errors, in quadrature for random rounding).
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { buildSeriesTerms } from '../../observables/build-series-terms.js';
import type { SeriesTerms } from '../../observables/observable-layout.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import type { LatticeGraph } from '../../physics/types.js';
import { factorsWord, type SiteTerm } from '../../physics/site-terms.js';

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
  const primitives: FactorPrimitive[] = [];
  const index = new Map<string, number>();
  const prim = (factors: readonly PauliFactor[]): number => {
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
  const series = buildSeriesTerms(spec, graph, {
    who: 'freeFermionLayout',
    product: prim,
    energy: (of, add) => {
      let constant = 0;
      for (const t of of === 'h0' ? h0 : h1) {
        if (t.factors.length === 0) constant += t.weight;
        else add(prim(t.factors), t.weight);
      }
      return constant;
    },
  });
  let h1Constant = 0;
  const h1Linear = new Map<number, number>();
  for (const t of h1) {
    if (t.factors.length === 0) h1Constant += t.weight;
    else {
      const p = prim(t.factors);
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
