/**
 * What an engine measures for a spec: the distinct Pauli strings (primitives) and how each
 * reported series combines their expectations. Built by expandObservables; evaluated by
 * evaluateSeries.
 */
import type { PauliString } from '../physics/types.js';

/** One series as a function of primitive expectations: constant + Σ w·⟨P⟩ + Σ w·⟨A⟩⟨B⟩. */
export interface SeriesTerms {
  /** Stable label (see plan-series.ts), unique within a valid spec. */
  readonly label: string;
  /** Index of the observable in spec.observables. */
  readonly observable: number;
  /** Constant part (identity terms, e.g. the i = j terms of a structure factor). */
  readonly constant: number;
  /** [primitive index, weight] pairs, each primitive at most once. */
  readonly linear: ReadonlyArray<readonly [prim: number, weight: number]>;
  /** [primitive A, primitive B, weight]: products of two expectations (connected correlators). */
  readonly quadratic: ReadonlyArray<readonly [primA: number, primB: number, weight: number]>;
}

/** The primitives to measure and the series built from them. */
export interface ObservableLayout {
  /** Distinct Pauli strings whose thermal/quench expectations the engine must measure. */
  readonly primitives: readonly PauliString[];
  /** Series in report order. */
  readonly series: readonly SeriesTerms[];
}
