/**
 * transformOperatorReal — transformOperator for a block with REAL eigenvectors V_J: the sparse
 * block splits as O = O_re + i·O_im with real O_re, O_im (real strings and real characters give
 * O_re, imaginary strings such as X Y give O_im), so
 *   Õ = V_Jᵀ·O_re·V_J + i·V_Jᵀ·O_im·V_J
 * takes at most two real products (one when O is real or purely imaginary), written straight
 * into the real and imaginary parts of the packed complex result.
 *
 * Cost: 2 flops per stored entry and column per part, then ≈ d³ flops per non-empty part
 * (vs 4·d³ complex). Scratch 2d² doubles.
 */
import type { SparseBlock } from '../../symmetry/index.js';
import { realTransposeProduct } from './real-transpose-product.js';

/**
 * Writes V_Jᵀ·O_JJ·V_J packed complex into `out` (≥ d(d+1) doubles). `vectors` is V_J as
 * compact real column-major (d² doubles); `scratch` needs 2d² doubles.
 */
export function transformOperatorReal(op: SparseBlock, vectors: Float64Array, scratch: Float64Array, out: Float64Array): void {
  const d = op.size;
  const { colStart, row, re: ore, im: oim } = op;
  const re = scratch.subarray(0, d * d);
  const im = scratch.subarray(d * d, 2 * d * d);
  let hasRe = false;
  let hasIm = false;
  for (let p = 0; p < ore.length; p++) {
    if (ore[p] !== 0) hasRe = true;
    if (oim[p] !== 0) hasIm = true;
  }
  re.fill(0);
  im.fill(0);
  // (O·V)(i, n) = Σ_j O(i, j)·V(j, n), by columns j of O.
  for (let n = 0; n < d; n++) {
    const col = n * d;
    for (let j = 0; j < d; j++) {
      const v = vectors[j + col];
      if (v === 0) continue;
      for (let p = colStart[j]; p < colStart[j + 1]; p++) {
        re[row[p] + col] += ore[p] * v;
        im[row[p] + col] += oim[p] * v;
      }
    }
  }
  out.fill(0, 0, d * (d + 1));
  if (hasRe) realTransposeProduct(d, d, d, vectors, re, out, 'upper-packed', 2, 0);
  if (hasIm) realTransposeProduct(d, d, d, vectors, im, out, 'upper-packed', 2, 1);
}
