/**
 * chebyshevSum — ψ ← Σ_{k≤K} c_k T_k(X) ψ with X = (Op − centre)/halfWidth, in place.
 *
 * Three-term recurrence T_{k+1}(X)ψ = 2X·T_k(X)ψ − T_{k−1}(X)ψ (Abramowitz & Stegun,
 * Handbook of Mathematical Functions (1964), 22.7.4); each step is one affine call
 *   w_prev ← (2/a)·Op·w_cur − (2c/a)·w_cur − w_prev
 * so the recurrence needs exactly two work vectors, and ψ itself serves as the accumulator
 * (after T_0ψ = ψ has been copied into a work vector). Memory: ψ + 2 work vectors.
 * Source: Tal-Ezer & Kosloff, J. Chem. Phys. 81, 3967 (1984) (common practice).
 *
 * Cost: K applications of Op, plus 1 copy and K complex axpys over the state; no allocation.
 */
import type { AffineApply } from './types.js';

/**
 * In place: ψ ← Σ_{k=0..K} c_k·T_k((Op − centre)/halfWidth)·ψ, with complex coefficients
 * c_k = (coefficients[2k], coefficients[2k+1]) and K = coefficients.length/2 − 1.
 * `w0` and `w1` are scratch vectors of ψ's length (contents overwritten; must be finite).
 * Returns the number of Op applications (K). Requires halfWidth > 0.
 */
export function chebyshevSum(
  apply: AffineApply,
  centre: number,
  halfWidth: number,
  coefficients: Float64Array,
  psi: Float64Array,
  w0: Float64Array,
  w1: Float64Array,
): number {
  const order = coefficients.length / 2 - 1;
  const n = psi.length;
  if (order === 0) {
    scaleComplexInPlace(psi, coefficients[0], coefficients[1]);
    return 0;
  }
  const inv = 1 / halfWidth;
  w0.set(psi);
  apply(psi, w1, inv, -centre * inv, 0); // T_1ψ = Xψ
  scaleComplexInPlace(psi, coefficients[0], coefficients[1]);
  axpy(psi, coefficients[2], coefficients[3], w1, n);
  let prev = w0;
  let cur = w1;
  for (let k = 2; k <= order; k++) {
    apply(cur, prev, 2 * inv, -2 * centre * inv, -1); // prev ← T_kψ
    axpy(psi, coefficients[2 * k], coefficients[2 * k + 1], prev, n);
    const t = prev; prev = cur; cur = t;
  }
  return order;
}

function scaleComplexInPlace(x: Float64Array, re: number, im: number): void {
  if (im === 0) {
    for (let k = 0, n = x.length; k < n; k++) x[k] *= re;
    return;
  }
  for (let k = 0, n = x.length; k + 1 < n; k += 2) {
    const xr = x[k], xi = x[k + 1];
    x[k] = re * xr - im * xi;
    x[k + 1] = re * xi + im * xr;
  }
}

function axpy(y: Float64Array, re: number, im: number, x: Float64Array, n: number): void {
  if (im === 0) {
    if (re === 0) return;
    for (let k = 0; k < n; k++) y[k] += re * x[k];
  } else if (re === 0) {
    for (let k = 0; k + 1 < n; k += 2) {
      const xr = x[k];
      y[k] -= im * x[k + 1];
      y[k + 1] += im * xr;
    }
  } else {
    for (let k = 0; k + 1 < n; k += 2) {
      const xr = x[k], xi = x[k + 1];
      y[k] += re * xr - im * xi;
      y[k + 1] += re * xi + im * xr;
    }
  }
}

/** x ← (re + i·im)·x over a complex interleaved vector (shared by the propagators). */
export { scaleComplexInPlace };
