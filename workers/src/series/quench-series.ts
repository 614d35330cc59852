/**
 * quenchSeries — ⟨O(t)⟩_β after a quench, as a double series in t and β.
 *
 * Heisenberg picture (DESIGN.md §2: M(t) = U M U†, U = e^{−iH1 t}, so O(t) = e^{iH1t} O e^{−iH1t}):
 *   O(t) = Σ_k (it)^k/k! ad_{H1}^k O,   ad_{H1} X = [H1, X],
 *   A_0 = O,  A_{k+1} = i[H1, A_k]   (A_k = i^k ad^k O is Hermitian when O is),
 *   ⟨O(t)⟩_β = Σ_k t^k/k! ⟨A_k⟩_β,  ⟨A_k⟩_β = Σ_m a_{k,m} β^m from thermal-series.ts,
 * truncated at total order k + m ≤ K (common practice: short-time expansion of the Heisenberg
 * equation combined with the high-temperature expansion of the initial state).
 * Cost: K commutators (|A_k|·|H1| products each; |A_k| grows roughly like (z·r)^k on a lattice)
 * plus mixed moments of each A_k to order K − k against the shared powers of H0.
 */
import type { DoubleSeries } from './double-series.js';
import { emptyDoubleSeries } from './double-series.js';
import { multiplyTables } from './multiply-tables.js';
import type { PauliTable } from './pauli-table.js';
import type { HamiltonianPowers } from './thermal-moments.js';
import { mixedMoments, powerMoments } from './thermal-moments.js';
import { expectationSeries } from './thermal-series.js';

/** Inputs of {@link quenchSeries}. */
export interface QuenchSeriesInput {
  /** The observable O (Hermitian). */
  readonly observable: PauliTable;
  /** The quench Hamiltonian H1. */
  readonly h1: PauliTable;
  /** Powers of H0 with order ≥ K (hamiltonianPowers). */
  readonly h0Powers: HamiltonianPowers;
  /** Moments m_0..m_K of H0 (powerMoments(h0Powers) when omitted). */
  readonly h0Moments?: Float64Array;
  /** Total order K. */
  readonly order: number;
  readonly signal?: AbortSignal;
}

/**
 * The double series c_{k,m} of ⟨O(t)⟩_β (t^k β^m), k + m ≤ K.
 * @throws RangeError if K exceeds the powers' order or the word counts differ.
 */
export function quenchSeries(input: QuenchSeriesInput): DoubleSeries {
  const { observable, h1, h0Powers, order: K, signal } = input;
  if (!Number.isInteger(K) || K < 0) throw new RangeError(`order must be a non-negative integer; got ${String(K)}`);
  if (K > h0Powers.order) throw new RangeError(`quenchSeries: order ${K} exceeds the powers' order ${h0Powers.order}`);
  if (observable.words !== h1.words || h1.words !== h0Powers.words) {
    throw new RangeError('quenchSeries: observable, h1 and h0 powers must have the same word count');
  }
  const moments = input.h0Moments ?? powerMoments(h0Powers);
  const out = emptyDoubleSeries(K);
  let a = observable;
  let factorial = 1;
  for (let k = 0; k <= K; k++) {
    signal?.throwIfAborted();
    if (k > 0) {
      a = multiplyTables(h1, a, { commutator: true, factor: [0, 1] }).pruned();
      factorial *= k;
    }
    if (a.size === 0) break;
    const mm = mixedMoments(a, h0Powers, K - k, signal);
    const s = expectationSeries(mm.re, moments.subarray(0, K - k + 1));
    for (let m = 0; m <= K - k; m++) {
      out.value[k * (K + 1) + m] = s.value[m] / factorial;
      out.magnitude[k * (K + 1) + m] = s.magnitude[m] / factorial;
    }
  }
  return out;
}
