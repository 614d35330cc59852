/**
 * measurementPlan — which Hermitian operators the spectral engine transforms into the H1
 * eigenbasis (one dense O(d³) product each per block), chosen to need as few as possible:
 *   'primitives'  one operator per primitive Pauli string (the observables layer's layout);
 *   'series'      one operator per distinct linear part Σ w·P of a series (an energy with 3N
 *                 terms is then one transform, not 3N), plus one per primitive that enters a
 *                 product ⟨A⟩⟨B⟩ of a connected correlator.
 * With a `canonical` map (the group average of symmetry/symmetrise-terms.ts) every operator is
 * replaced by its image before operators are merged, so ⟨Z_0⟩ … ⟨Z_N−1⟩ on a ring become one
 * operator; linear parts that then share an operator have their weights added.
 * The plan with fewer operators is taken; both give the same numbers. The plan carries a
 * layout over its operators that evaluateSeries accepts (in 'series' mode each series reads
 * its linear operator with weight 1 and its product terms from single-string operators), and
 * each operator's weight Σ|w| (its norm bound), which scales its error (spectral-error.ts).
 * Cost: O(total terms) with hashing, times the cost of `canonical`.
 */
import type { ObservableLayout, SeriesTerms } from '../../observables/expand-observables.js';
import { pauliKey } from '../../physics/pauli-algebra.js';
import type { PauliTermMask } from '../../physics/types.js';

/** A Hermitian operator Σ_k w_k·P_k to transform. */
export interface MeasuredOperator {
  readonly terms: readonly PauliTermMask[];
}

/** Operators, their norm bounds, and the layout evaluateSeries reads them through. */
export interface MeasurementPlan {
  readonly mode: 'primitives' | 'series';
  readonly operators: readonly MeasuredOperator[];
  /** Σ|w_k| per operator (≥ ‖O‖₂). */
  readonly weights: Float64Array;
  /** Layout whose "primitives" are the operators (their strings are placeholders). */
  readonly layout: ObservableLayout;
}

/** A map of an operator onto an equivalent one (e.g. its group average). */
export type CanonicalTerms = (terms: readonly PauliTermMask[]) => readonly PauliTermMask[];

/** Operators merged by their (canonical) terms. */
function operatorSet(canonical: CanonicalTerms | undefined) {
  const keys = new Map<string, number>();
  const operators: MeasuredOperator[] = [];
  const add = (raw: readonly PauliTermMask[]): number => {
    const terms = canonical ? canonical(raw) : raw;
    const key = terms.map((t) => `${pauliKey(t)}:${t.weight}`).sort().join('|');
    let k = keys.get(key);
    if (k === undefined) {
      k = operators.length;
      keys.set(key, k);
      operators.push({ terms });
    }
    return k;
  };
  return { operators, add };
}

const weightsOf = (ops: readonly MeasuredOperator[]) => Float64Array.from(ops, (o) => o.terms.reduce((acc, t) => acc + Math.abs(t.weight), 0));

/** [operator, weight] pairs with repeated operators merged. */
function mergeLinear(pairs: ReadonlyArray<readonly [number, number]>): Array<readonly [number, number]> {
  const m = new Map<number, number>();
  for (const [k, w] of pairs) m.set(k, (m.get(k) ?? 0) + w);
  return [...m].map(([k, w]) => [k, w] as const);
}

/** The cheaper measurement plan for a layout (see file header). */
export function measurementPlan(layout: ObservableLayout, canonical?: CanonicalTerms): MeasurementPlan {
  const prims = layout.primitives;
  const single = (p: number): PauliTermMask[] => [{ x: prims[p].x, z: prims[p].z, weight: 1 }];
  const bySeries = operatorSet(canonical);
  const series: SeriesTerms[] = layout.series.map((s) => {
    const linear: Array<readonly [number, number]> = [];
    if (s.linear.length > 0) linear.push([bySeries.add(s.linear.map(([p, w]) => ({ x: prims[p].x, z: prims[p].z, weight: w }))), 1]);
    const quadratic = s.quadratic.map(([a, b, w]) => [bySeries.add(single(a)), bySeries.add(single(b)), w] as const);
    return { label: s.label, observable: s.observable, constant: s.constant, linear, quadratic };
  });
  const seriesPlan = (): MeasurementPlan => ({
    mode: 'series', operators: bySeries.operators, weights: weightsOf(bySeries.operators),
    layout: { primitives: bySeries.operators.map(() => ({ x: 0, z: 0 })), series },
  });
  if (canonical === undefined) {
    if (bySeries.operators.length < prims.length) return seriesPlan();
    const operators = prims.map((_, p) => ({ terms: single(p) }));
    return { mode: 'primitives', operators, weights: weightsOf(operators), layout };
  }
  const byPrim = operatorSet(canonical);
  const opOf = prims.map((_, p) => byPrim.add(single(p)));
  if (bySeries.operators.length < byPrim.operators.length) return seriesPlan();
  return {
    mode: 'primitives', operators: byPrim.operators, weights: weightsOf(byPrim.operators),
    layout: {
      primitives: byPrim.operators.map(() => ({ x: 0, z: 0 })),
      series: layout.series.map((s) => ({
        label: s.label, observable: s.observable, constant: s.constant,
        linear: mergeLinear(s.linear.map(([p, w]) => [opOf[p], w] as const)),
        quadratic: s.quadratic.map(([a, b, w]) => [opOf[a], opOf[b], w] as const),
      })),
    },
  };
}
