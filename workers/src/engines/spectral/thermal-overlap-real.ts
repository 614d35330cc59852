/**
 * thermalOverlapReal — thermalOverlap for a block whose mixing matrix X = W_Jᵀ·V_J is real
 * (real eigenvectors of H0 and H1): ρ̃ = Yᵀ·Y with Y = diag(√p)·X, in real arithmetic, written
 * as packed complex with zero imaginary parts (the layout phase-rotate.ts reads).
 * Rows with p_k = 0 (underflow at large β) are skipped.
 *
 * Cost: d² to scale, ≈ d³ flops for the packed product (a quarter of the complex path);
 * scratch d² doubles.
 */
import { realTransposeProduct } from './real-transpose-product.js';

/**
 * out (≥ d(d+1) doubles, packed complex) ← Xᵀ·diag(p)·X, p_k = weights[rowIndex[k]].
 * `mixing` is X (d² doubles, real column-major); `scratch` needs d² doubles.
 */
export function thermalOverlapReal(
  d: number, mixing: Float64Array, rowIndex: Int32Array, weights: Float64Array,
  scratch: Float64Array, out: Float64Array,
): void {
  let rows = 0;
  for (let k = 0; k < d; k++) if (weights[rowIndex[k]] > 0) rows++;
  out.fill(0, 0, d * (d + 1));
  if (rows === 0) return;
  for (let n = 0; n < d; n++) {
    const src = n * d;
    let dst = n * rows;
    for (let k = 0; k < d; k++) {
      const w = weights[rowIndex[k]];
      if (!(w > 0)) continue;
      scratch[dst++] = Math.sqrt(w) * mixing[src + k];
    }
  }
  realTransposeProduct(rows, d, d, scratch, scratch, out, 'upper-packed', 2, 0);
}
