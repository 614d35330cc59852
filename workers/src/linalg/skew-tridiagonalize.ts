/**
 * skewTridiagonalize — Householder reduction of a real skew-symmetric matrix to skew-symmetric
 * tridiagonal form, A = Q·T·Qᵀ.
 *
 * Mirrors LAPACK dsytd2 (UPLO = 'L', the unblocked reduction of dsytrd) adapted to skew
 * symmetry as in Ward & Gray, ACM TOMS 4, 278 (1978), "Eigensystem computation for
 * skew-symmetric and a class of symmetric matrices". Step k (k = 0 … n−3) builds a reflector
 * H_k = I − τ_k v vᵀ (dlarfg convention: v_0 = 1, τ ∈ [1, 2] or τ = 0) that maps
 * A[k+1:, k] to (β, 0, …, 0), then updates the trailing block A₂₂ = A[k+1:, k+1:] by
 *   A₂₂ ← H A₂₂ H = A₂₂ + v wᵀ − w vᵀ,  w = τ·A₂₂·v
 * (the symmetric case's correction term vanishes because vᵀA₂₂v = 0 for skew A₂₂).
 * Q = H_0 H_1 ⋯ H_{n−3}, det Q = (−1)^{number of τ_k ≠ 0}.
 *
 * Storage (row-major, n × n): only the strictly lower triangle of `a` is read and written.
 * On return sub[i] = T_{i+1,i} (so T_{i,i+1} = −sub[i]), tau[k] = τ_k, and the reflector
 * vectors v[1:] are stored below the subdiagonal, in a[(k+2..n−1)·n + k].
 *
 * Cost: ≈ (4/3)·n³ flops (a skew matrix-vector product and a rank-2 update on a triangle per
 * step), memory: `w` and `v` scratch of n doubles each. Backward stable: T is the exact
 * reduction of A + E with ‖E‖ ≲ c·n·u·‖A‖ (as for dsytrd; Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), §8.3.1).
 */

/** Output buffers of {@link skewTridiagonalize}. */
export interface SkewTridiagonalOut {
  /** n − 1 entries: sub[i] = T_{i+1,i}. */
  sub: Float64Array;
  /** n − 2 entries (max 0): the reflector scalars τ_k. */
  tau: Float64Array;
  /** Scratch of n doubles. */
  w: Float64Array;
  /** Scratch of n doubles. */
  v: Float64Array;
}

/**
 * Reduces the skew-symmetric n × n matrix stored (strictly lower triangle) in `a` in place;
 * returns the number of reflectors with τ ≠ 0 (det Q = (−1)^that).
 * @throws RangeError if n is not a non-negative integer or a buffer is too short.
 */
export function skewTridiagonalize(n: number, a: Float64Array, out: SkewTridiagonalOut): number {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`skewTridiagonalize: n must be a non-negative integer; got ${n}`);
  if (a.length < n * n) throw new RangeError(`skewTridiagonalize: a has ${a.length} entries; needs n² = ${n * n}`);
  if (out.sub.length < Math.max(0, n - 1)) throw new RangeError(`skewTridiagonalize: sub needs ${n - 1} entries; got ${out.sub.length}`);
  if (out.tau.length < Math.max(0, n - 2)) throw new RangeError(`skewTridiagonalize: tau needs ${n - 2} entries; got ${out.tau.length}`);
  if (out.w.length < n || out.v.length < n) throw new RangeError(`skewTridiagonalize: w and v need ${n} entries each`);
  return skewTridiagonalizeUnchecked(n, a, out);
}

/** {@link skewTridiagonalize} without argument checks. */
export function skewTridiagonalizeUnchecked(n: number, a: Float64Array, out: SkewTridiagonalOut): number {
  const { sub, tau, w, v } = out;
  let reflections = 0;
  for (let k = 0; k + 2 < n; k++) {
    const r0 = k + 1; // first row of the trailing block
    const m = n - r0;
    // dlarfg on x = a[r0.., k].
    const alpha = a[r0 * n + k];
    let scale = 0;
    for (let i = r0 + 1; i < n; i++) scale = Math.max(scale, Math.abs(a[i * n + k]));
    let xnorm = 0;
    if (scale > 0) {
      let s = 0;
      for (let i = r0 + 1; i < n; i++) { const t = a[i * n + k] / scale; s += t * t; }
      xnorm = scale * Math.sqrt(s);
    }
    if (xnorm === 0) {
      tau[k] = 0;
      sub[k] = alpha;
      continue;
    }
    const beta = -Math.sign(alpha || 1) * Math.hypot(alpha, xnorm);
    const t = (beta - alpha) / beta;
    const inv = 1 / (alpha - beta);
    tau[k] = t;
    sub[k] = beta;
    reflections++;
    v[0] = 1;
    for (let i = r0 + 1; i < n; i++) {
      const vi = a[i * n + k] * inv;
      a[i * n + k] = vi;
      v[i - r0] = vi;
    }
    a[r0 * n + k] = beta;
    // w = τ·A₂₂·v from the strictly lower triangle (A₂₂[j][i] = −A₂₂[i][j]).
    for (let i = 0; i < m; i++) w[i] = 0;
    for (let i = 1; i < m; i++) {
      const row = (r0 + i) * n + r0;
      const vi = v[i];
      let s = 0;
      for (let j = 0; j < i; j++) {
        const lij = a[row + j];
        s += lij * v[j];
        w[j] -= lij * vi;
      }
      w[i] += s;
    }
    for (let i = 0; i < m; i++) w[i] *= t;
    // A₂₂ ← A₂₂ + v wᵀ − w vᵀ on the strictly lower triangle.
    for (let i = 1; i < m; i++) {
      const row = (r0 + i) * n + r0;
      const vi = v[i];
      const wi = w[i];
      for (let j = 0; j < i; j++) a[row + j] += vi * w[j] - wi * v[j];
    }
  }
  if (n >= 2) sub[n - 2] = a[(n - 1) * n + (n - 2)];
  return reflections;
}
