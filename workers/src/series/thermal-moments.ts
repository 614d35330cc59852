/**
 * Thermal moments by Pauli-string algebra: m_n = Tr(H^n)/2^N and the mixed moments
 * Tr(A·H^n)/2^N, n = 0..order, for a Hamiltonian H and an operator A given as sparse sums.
 *
 * Meet in the middle: only H^k for k ≤ K = ⌈order/2⌉ is formed, and
 *   m_{a+b} = Tr(H^a H^b)/2^N = Σ_P (H^a)_P (H^b)_P        (trace-product.ts),
 *   Tr(A H^n)/2^N = Tr((A H^j) H^{n−j})/2^N with j = max(0, n − K),
 * so the largest table is H^K instead of H^order (common practice for moment methods).
 * Cost: Σ_{k<K} |H^k|·|H| string products (|H^k| ≤ min(4^N, C(T+k−1, k)) for T terms), plus
 * |A H^j|·|H| for the mixed moments; memory: the K+1 power tables.
 */
import { multiplyTables } from './multiply-tables.js';
import { PauliTable } from './pauli-table.js';
import { traceProduct } from './trace-product.js';

/** H^0..H^K for moments up to `order` (K = ⌈order/2⌉). */
export interface HamiltonianPowers {
  readonly words: number;
  /** Highest moment order these powers serve. */
  readonly order: number;
  /** powers[k] = H^k, k = 0..⌈order/2⌉. */
  readonly powers: readonly PauliTable[];
}

/**
 * Forms H^0..H^⌈order/2⌉.
 * @param signal - checked between powers (throws its reason when aborted).
 * @throws RangeError if order is not a non-negative integer.
 */
export function hamiltonianPowers(h: PauliTable, order: number, signal?: AbortSignal): HamiltonianPowers {
  if (!Number.isInteger(order) || order < 0) throw new RangeError(`order must be a non-negative integer; got ${String(order)}`);
  const K = Math.ceil(order / 2);
  const powers: PauliTable[] = [PauliTable.identity(h.words)];
  for (let k = 1; k <= K; k++) {
    signal?.throwIfAborted();
    powers.push(k === 1 ? h : multiplyTables(powers[k - 1], h));
  }
  return { words: h.words, order, powers };
}

/** m_n = Tr(H^n)/2^N for n = 0..powers.order (real: H is Hermitian). */
export function powerMoments(p: HamiltonianPowers): Float64Array {
  const K = p.powers.length - 1;
  const out = new Float64Array(p.order + 1);
  for (let n = 0; n <= p.order; n++) {
    const a = Math.min(n, K);
    out[n] = traceProduct(p.powers[a], p.powers[n - a])[0];
  }
  return out;
}

/**
 * Tr(A H^n)/2^N for n = 0..order as [re[], im[]].
 * @throws RangeError if order exceeds powers.order or the word counts differ.
 */
export function mixedMoments(
  a: PauliTable, p: HamiltonianPowers, order = p.order, signal?: AbortSignal,
): { re: Float64Array; im: Float64Array } {
  if (order > p.order) throw new RangeError(`mixedMoments: order ${order} exceeds the powers' order ${p.order}`);
  if (a.words !== p.words) throw new RangeError(`mixedMoments: word counts differ (${a.words} vs ${p.words})`);
  const K = p.powers.length - 1;
  const h = p.powers[Math.min(1, K)];
  const re = new Float64Array(order + 1);
  const im = new Float64Array(order + 1);
  let aHj = a;
  let j = 0;
  for (let n = 0; n <= order; n++) {
    const need = Math.max(0, n - K);
    while (j < need) {
      signal?.throwIfAborted();
      aHj = multiplyTables(aHj, h);
      j++;
    }
    const [r, i] = traceProduct(aHj, p.powers[n - j]);
    re[n] = r;
    im[n] = i;
  }
  return { re, im };
}
