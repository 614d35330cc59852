/**
 * hermitianTridiagonalizeReal — the real fast path of hermitianTridiagonalize: orthogonal
 * reduction of a real symmetric matrix (a Hermitian matrix whose imaginary parts are all 0)
 * to symmetric tridiagonal form, Qᵀ·A·Q = T, from its lower triangle (mirrors LAPACK dsytd2,
 * UPLO = 'L', with the reflectors of dlarfg).
 *
 * Q = H(0)·…·H(n−2), H(i) = I − τ_i·v_i·v_iᵀ, v_i[i+1] = 1, tail stored below the subdiagonal.
 * Per step: x = τ·A₂₂·v, w = x − ½·τ·(xᵀv)·v, A₂₂ ← A₂₂ − v·wᵀ − w·vᵀ.
 * Storage: real column-major n×n, element (r, c) at r + c·n; lower triangle only.
 *
 * Source: LAPACK 3.x dsytd2 / dlarfg; Golub & Van Loan, Matrix Computations, 4th ed., §8.3.1.
 * Cost: (4/3)·n³ flops — a quarter of the complex reduction; n doubles of scratch; no allocation.
 * Caveats: backward stable; inputs must be finite; no rescaling of tiny reflectors (a column
 * whose norm is below ~1e−292 is treated as already reduced: τ = 0).
 */

/** Column norms below this are treated as zero (the reflector would lose accuracy). */
const TINY_NORM = 2 ** -970;

/**
 * Unchecked kernel. On return: d[0..n), e[0..n−1) (e[i] = T(i+1, i)), tau[0..n−1) and the
 * reflector tails in `a` below the subdiagonal (subdiagonal entries of `a` hold e). `work`
 * needs n doubles.
 */
export function hermitianTridiagonalizeReal(
  n: number, a: Float64Array, d: Float64Array, e: Float64Array, tau: Float64Array, work: Float64Array,
): void {
  for (let i = 0; i < n - 1; i++) {
    const len = n - i - 1;
    const off = i + 1 + i * n; // A(i+1, i)
    // dlarfg on (α, x) = A(i+1.., i).
    const alpha = a[off];
    let big = 0;
    for (let k = 1; k < len; k++) big = Math.max(big, Math.abs(a[off + k]));
    let xnorm = 0;
    if (big > 0) {
      const inv = 1 / big;
      let s = 0;
      for (let k = 1; k < len; k++) { const v = a[off + k] * inv; s += v * v; }
      xnorm = big * Math.sqrt(s);
    }
    let t = 0;
    let beta = alpha;
    if (xnorm > TINY_NORM) {
      const m = Math.max(Math.abs(alpha), xnorm);
      beta = -Math.sign(alpha || 1) * m * Math.sqrt((alpha / m) ** 2 + (xnorm / m) ** 2);
      t = (beta - alpha) / beta;
      const scale = 1 / (alpha - beta);
      for (let k = 1; k < len; k++) a[off + k] *= scale;
    }
    e[i] = beta;
    tau[i] = t;
    if (t !== 0) {
      a[off] = 1;
      const base = i + 1;
      // x = τ·A₂₂·v (dsymv, lower).
      for (let k = 0; k < len; k++) work[k] = 0;
      for (let j = 0; j < len; j++) {
        const t1 = t * a[off + j];
        const col = base + (base + j) * n;
        let t2 = 0;
        for (let k = j + 1; k < len; k++) {
          const ak = a[col + k];
          work[k] += ak * t1;
          t2 += ak * a[off + k];
        }
        work[j] += a[col + j] * t1 + t * t2;
      }
      // w = x − ½·τ·(xᵀv)·v.
      let dot = 0;
      for (let k = 0; k < len; k++) dot += work[k] * a[off + k];
      const al = -0.5 * t * dot;
      for (let k = 0; k < len; k++) work[k] += al * a[off + k];
      // A₂₂ ← A₂₂ − v·wᵀ − w·vᵀ (dsyr2, lower).
      for (let j = 0; j < len; j++) {
        const vj = a[off + j];
        const wj = work[j];
        const col = base + (base + j) * n;
        for (let k = j; k < len; k++) a[col + k] -= a[off + k] * wj + work[k] * vj;
      }
      a[off] = beta;
    }
    d[i] = a[i + i * n];
  }
  if (n > 0) d[n - 1] = a[n - 1 + (n - 1) * n];
}
