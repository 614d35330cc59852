/**
 * measurementPlan — which Hermitian operators the spectral engine transforms into the H1
 * eigenbasis (one dense O(d³) product each), chosen to need as few as possible:
 *   'primitives'  one operator per primitive Pauli string (the observables layer's layout);
 *   'series'      one operator per distinct linear part Σ w·P of a series (an energy with 3N
 *                 terms is then one transform, not 3N), plus one per primitive that enters a
 *                 product ⟨A⟩⟨B⟩ of a connected correlator.
 * The cheaper is taken; both give the same numbers. The plan also carries a layout over its
 * operators that evaluateSeries accepts (in 'series' mode each series reads its linear operator
 * with weight 1 and its product terms from single-string operators), and each operator's
 * weight Σ|w| (its norm bound), which scales its error (spectral-error.ts).
 * Cost: O(total terms) with hashing.
 */
import type { ObservableLayout, SeriesTerms } from '../../observables/expand-observables.js';
import { pauliKey } from '../../physics/pauli-algebra.js';
import type { PauliString } from '../../physics/types.js';

/** A Hermitian operator Σ_k w_k·P_k to transform. */
export interface MeasuredOperator {
  readonly terms: ReadonlyArray<{ readonly p: PauliString; readonly w: number }>;
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

/** The cheaper measurement plan for a layout (see file header). */
export function measurementPlan(layout: ObservableLayout): MeasurementPlan {
  const prims = layout.primitives;
  const opKeys = new Map<string, number>();
  const operators: MeasuredOperator[] = [];
  const add = (terms: ReadonlyArray<{ p: PauliString; w: number }>): number => {
    const key = terms.map((t) => `${pauliKey(t.p)}:${t.w}`).sort().join('|');
    let k = opKeys.get(key);
    if (k === undefined) {
      k = operators.length;
      opKeys.set(key, k);
      operators.push({ terms });
    }
    return k;
  };
  const series: SeriesTerms[] = layout.series.map((s) => {
    const linear: Array<readonly [number, number]> = [];
    if (s.linear.length > 0) linear.push([add(s.linear.map(([p, w]) => ({ p: prims[p], w }))), 1]);
    const quadratic = s.quadratic.map(([a, b, w]) =>
      [add([{ p: prims[a], w: 1 }]), add([{ p: prims[b], w: 1 }]), w] as const);
    return { label: s.label, observable: s.observable, constant: s.constant, linear, quadratic };
  });
  if (operators.length < prims.length) {
    return {
      mode: 'series',
      operators,
      weights: Float64Array.from(operators, (o) => o.terms.reduce((acc, t) => acc + Math.abs(t.w), 0)),
      layout: { primitives: operators.map(() => ({ x: 0, z: 0 })), series },
    };
  }
  return {
    mode: 'primitives',
    operators: prims.map((p) => ({ terms: [{ p, w: 1 }] })),
    weights: new Float64Array(prims.length).fill(1),
    layout,
  };
}
