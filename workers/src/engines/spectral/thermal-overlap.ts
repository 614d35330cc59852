/**
 * thermalOverlap — the thermal state of H0 in the eigenbasis of H1, one joint block J at a time:
 *   ρ̃ = V_Jᴴ·ρ·V_J = Xᴴ·diag(p)·X = Yᴴ·Y,   Y = diag(√p)·X,   X = W_Jᴴ·V_J (the "mixing"
 * matrix: row k ↔ H0 eigenpair k of block J, column n ↔ H1 eigenpair n), with p_k the
 * normalised Boltzmann weights of thermo-from-spectrum.ts. Output packed upper (Hermitian).
 * Only the weights change with β, so X is formed once per sweep and each β costs one Gram
 * product. Rows with p_k = 0 (underflow at large β) are skipped.
 *
 * Cost: 2·d² to scale, ≈ 4·d³ flops for the packed product; scratch 2d² doubles.
 */
import { complexAdjointProduct } from '../../linalg/complex-adjoint-product.js';

/**
 * out (≥ d(d+1) doubles) ← Xᴴ·diag(p)·X packed upper, with p_k = weights[rowIndex[k]].
 * `mixing` is X (2d² doubles, column-major); `scratch` needs 2d² doubles.
 */
export function thermalOverlap(
  d: number, mixing: Float64Array, rowIndex: Int32Array, weights: Float64Array,
  scratch: Float64Array, out: Float64Array,
): void {
  // Keep only rows with non-zero weight: Y is (rows × d), contiguous columns of length `rows`.
  let rows = 0;
  for (let k = 0; k < d; k++) if (weights[rowIndex[k]] > 0) rows++;
  if (rows === 0) {
    out.fill(0, 0, d * (d + 1));
    return;
  }
  for (let n = 0; n < d; n++) {
    const src = 2 * n * d;
    let dst = 2 * n * rows;
    for (let k = 0; k < d; k++) {
      const w = weights[rowIndex[k]];
      if (!(w > 0)) continue;
      const s = Math.sqrt(w);
      scratch[dst] = s * mixing[src + 2 * k];
      scratch[dst + 1] = s * mixing[src + 2 * k + 1];
      dst += 2;
    }
  }
  complexAdjointProduct(rows, d, d, scratch, scratch, out, 'upper-packed');
}
