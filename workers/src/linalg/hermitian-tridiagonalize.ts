/**
 * hermitianTridiagonalize — unitary reduction of a complex Hermitian matrix to REAL symmetric
 * tridiagonal form, Qᴴ·A·Q = T, using its lower triangle (mirrors LAPACK zhetd2, UPLO = 'L').
 *
 * Q = H(0)·H(1)·…·H(n−2), H(i) = I − τ_i·v_i·v_iᴴ with v_i zero in rows 0..i, v_i[i+1] = 1 and
 * v_i[i+2..n−1] stored in A below the subdiagonal of column i (complexHouseholder makes every
 * subdiagonal β real). For each i, with A₂₂ the trailing block and v = v_i:
 *   x = τ·A₂₂·v,   w = x − ½·τ·(xᴴv)·v,   A₂₂ ← A₂₂ − v·wᴴ − w·vᴴ      (a Hermitian rank-2 update)
 * Storage: column-major, complex interleaved; element (r, c) at 2·(r + c·n). Only the lower
 * triangle (and the real part of the diagonal) is read; the strict upper triangle is neither
 * read nor written.
 *
 * Source: LAPACK 3.x zhetd2 / zlarfg; Golub & Van Loan, Matrix Computations, 4th ed., §8.3.1.
 * Cost: (16/3)·n³ real flops (the hemv and her2 each 4n² per step, lower half only), 2n complex
 * scratch entries; no allocation. Unblocked: each step streams the trailing lower triangle
 * twice, which is fine for the block sizes the spectral engine uses (n ≲ 2000).
 * Caveats: backward stable (the computed T is exactly Qᴴ(A + E)Q with ‖E‖ = O(n·ε·‖A‖));
 * inputs must be finite.
 */
import { complexHouseholder } from './complex-householder.js';

/**
 * Unchecked kernel. On return: d[0..n) diagonal of T, e[0..n−1) subdiagonal of T (real),
 * tau[0..2(n−1)) the complex τ_i, and the reflector tails in `a` below the subdiagonal (the
 * subdiagonal entries of `a` hold e). `work` needs 2n doubles.
 */
export function hermitianTridiagonalize(
  n: number, a: Float64Array, d: Float64Array, e: Float64Array, tau: Float64Array, work: Float64Array,
): void {
  for (let i = 0; i < n - 1; i++) {
    const len = n - i - 1;
    const off = 2 * (i + 1 + i * n); // A(i+1, i): α, then x below it
    complexHouseholder(len, a, off, tau, 2 * i);
    const beta = a[off];
    e[i] = beta;
    const tr = tau[2 * i];
    const ti = tau[2 * i + 1];
    const base = i + 1; // first row/column of A₂₂
    if (tr !== 0 || ti !== 0) {
      a[off] = 1;
      a[off + 1] = 0;
      // x = τ·A₂₂·v (zhemv, lower), x in work[0 .. 2len).
      for (let k = 0; k < 2 * len; k++) work[k] = 0;
      for (let j = 0; j < len; j++) {
        const vr = a[off + 2 * j];
        const vi = a[off + 2 * j + 1];
        const t1r = tr * vr - ti * vi; // τ·v_j
        const t1i = tr * vi + ti * vr;
        const col = 2 * (base + (base + j) * n); // A₂₂(0, j)
        const djj = a[col + 2 * j];
        let t2r = 0;
        let t2i = 0;
        for (let k = j + 1; k < len; k++) {
          const p = col + 2 * k;
          const ar = a[p];
          const ai = a[p + 1];
          // x_k += A_kj·(τ v_j)
          work[2 * k] += ar * t1r - ai * t1i;
          work[2 * k + 1] += ar * t1i + ai * t1r;
          // t2 += conj(A_kj)·v_k
          const q = off + 2 * k;
          const ur = a[q];
          const ui = a[q + 1];
          t2r += ar * ur + ai * ui;
          t2i += ar * ui - ai * ur;
        }
        work[2 * j] += djj * t1r + (tr * t2r - ti * t2i);
        work[2 * j + 1] += djj * t1i + (tr * t2i + ti * t2r);
      }
      // α = −½·τ·(xᴴv); x ← x + α·v  (x becomes w).
      let dr = 0;
      let di = 0;
      for (let k = 0; k < len; k++) {
        const xr = work[2 * k], xi = work[2 * k + 1];
        const ur = a[off + 2 * k], ui = a[off + 2 * k + 1];
        dr += xr * ur + xi * ui;
        di += xr * ui - xi * ur;
      }
      const alr = -0.5 * (tr * dr - ti * di);
      const ali = -0.5 * (tr * di + ti * dr);
      for (let k = 0; k < len; k++) {
        const ur = a[off + 2 * k], ui = a[off + 2 * k + 1];
        work[2 * k] += alr * ur - ali * ui;
        work[2 * k + 1] += alr * ui + ali * ur;
      }
      // A₂₂ ← A₂₂ − v·wᴴ − w·vᴴ (zher2, lower; diagonal kept real).
      for (let j = 0; j < len; j++) {
        const vjr = a[off + 2 * j], vji = a[off + 2 * j + 1];
        const wjr = work[2 * j], wji = work[2 * j + 1];
        const col = 2 * (base + (base + j) * n);
        // diagonal: −2·Re(v_j·conj(w_j))
        a[col + 2 * j] -= 2 * (vjr * wjr + vji * wji);
        a[col + 2 * j + 1] = 0;
        for (let k = j + 1; k < len; k++) {
          const vkr = a[off + 2 * k], vki = a[off + 2 * k + 1];
          const wkr = work[2 * k], wki = work[2 * k + 1];
          const p = col + 2 * k;
          // v_k·conj(w_j) + w_k·conj(v_j)
          a[p] -= vkr * wjr + vki * wji + wkr * vjr + wki * vji;
          a[p + 1] -= vki * wjr - vkr * wji + wki * vjr - wkr * vji;
        }
      }
    } else {
      const dd = 2 * (base + base * n);
      a[dd + 1] = 0;
    }
    a[off] = beta;
    a[off + 1] = 0;
    d[i] = a[2 * (i + i * n)];
  }
  if (n > 0) d[n - 1] = a[2 * (n - 1 + (n - 1) * n)];
}
