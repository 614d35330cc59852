/**
 * traceProduct — the normalised trace Tr(A·B)/2^N of two sparse Pauli sums without forming
 * the product.
 *
 * Formula: Pauli strings (Hermitian convention, P² = 1) are trace-orthonormal,
 * Tr(P Q)/2^N = δ_PQ, so Tr(AB)/2^N = Σ_P a_P b_P (no complex conjugation; common practice).
 * Cost: min(|A|, |B|) hash lookups; no allocation beyond the result pair.
 */
import { PauliTable } from './pauli-table.js';

/**
 * Tr(A·B)/2^N as [re, im].
 * @throws RangeError if the word counts differ.
 */
export function traceProduct(a: PauliTable, b: PauliTable): [number, number] {
  if (a.words !== b.words) throw new RangeError(`traceProduct: word counts differ (a: ${a.words}, b: ${b.words})`);
  const [small, large] = a.size <= b.size ? [a, b] : [b, a];
  let re = 0;
  let im = 0;
  for (let k = 0; k < small.size; k++) {
    const sr = small.re[k], si = small.im[k];
    if (sr === 0 && si === 0) continue;
    const idx = large.find(small.keys, k * small.stride);
    if (idx < 0) continue;
    const lr = large.re[idx], li = large.im[idx];
    re += sr * lr - si * li;
    im += sr * li + si * lr;
  }
  return [re, im];
}
