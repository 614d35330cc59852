/**
 * MpsMeasurement — measures every string of a setup (the layout's primitives and the energy
 * strings, mps-setup.ts) on a state, and evaluates sums of them. Holds the buckets and the
 * workspaces so that repeated measurements allocate little.
 */
import { createMeasureWorkspace, bucketByFirstSite, measureStrings } from './measure-strings.js';
import type { FactorString, MeasureWorkspace } from './measure-strings.js';
import type { MoveWorkspace } from './move-center.js';
import type { PurifiedMps } from './purified-mps.js';
import type { MeasuredSum } from './mps-setup.js';

/** Measures the strings of a setup (see the file header). */
export class MpsMeasurement {
  readonly #strings: readonly FactorString[];
  readonly #buckets: number[][];
  readonly #ws: MeasureWorkspace = createMeasureWorkspace();
  readonly #move: MoveWorkspace;

  constructor(strings: readonly FactorString[], sites: number, move: MoveWorkspace) {
    this.#strings = strings;
    this.#buckets = bucketByFirstSite(strings, sites);
    this.#move = move;
  }

  /** Number of strings. */
  get count(): number {
    return this.#strings.length;
  }

  /** Re⟨P⟩ of every string into `values`; returns the largest |Im⟨P⟩|. */
  measure(mps: PurifiedMps, values: Float64Array): number {
    return measureStrings(mps, this.#strings, values, this.#move, this.#ws, this.#buckets);
  }
}

/** c + Σ w·values[k] of a measured sum. */
export function sumOf(sum: MeasuredSum, values: Float64Array): number {
  let v = sum.constant;
  for (const [k, w] of sum.terms) v += w * values[k];
  return v;
}
