/**
 * skewExp — the orthogonal matrix exponential R = e^{A t} of a real skew-symmetric A from its
 * Schur form A = O(⊕ε_k J)Oᵀ (skew-schur.ts): R = O·E(t)·Oᵀ with E(t) the 2 × 2 rotations of
 * rotate-mode-pairs.ts. Exact in exact arithmetic for every t (no series truncation); R is
 * orthogonal to the accuracy of O. (Common practice: exponential through an eigen-/Schur
 * decomposition; Moler & Van Loan, SIAM Rev. 45, 3 (2003), "method 14".)
 * Cost: 6n² (rotation) + 2n³ (one product) flops; scratch: n² + n doubles.
 */
import { gemmUnchecked } from './gemm.js';
import { rotateModePairs } from './rotate-mode-pairs.js';
import type { SkewSchur } from './skew-schur.js';

/**
 * Writes e^{A t} (n × n, row-major) into `out` using the caller's scratch `work` (n² doubles).
 * @throws RangeError on bad sizes or a non-finite t.
 */
export function skewExp(schur: SkewSchur, t: number, out: Float64Array, work: Float64Array): void {
  const { n, o, eps } = schur;
  if (out.length < n * n || work.length < n * n) throw new RangeError(`skewExp: out and work need n² = ${n * n} entries each`);
  const rows = new Int32Array(n);
  for (let i = 0; i < n; i++) rows[i] = i;
  const m = n / 2;
  rotateModePairs(n, o, eps, t, rows, work, new Float64Array(m), new Float64Array(m));
  gemmUnchecked(false, true, n, n, n, 1, work, n, o, n, 0, out, n);
}
