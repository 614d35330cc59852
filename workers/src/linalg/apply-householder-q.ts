/**
 * applyHouseholderQ — C ← Q·C for the orthogonal Q = H_0 H_1 ⋯ H_{n−3} of a
 * {@link skewTridiagonalize} reduction (reflectors stored below the subdiagonal of `a`).
 *
 * Mirrors LAPACK dormtr (SIDE = 'L', UPLO = 'L', TRANS = 'N'), unblocked: the reflectors are
 * applied last to first, H_k acting on rows k+1 … n−1 of C:
 *   C[k+1:, :] ← C[k+1:, :] − τ_k·v·(vᵀ·C[k+1:, :]),  v = (1, a[k+2, k], …, a[n−1, k]).
 * Cost: Σ_k 4·(n−k−1)·ncols ≈ 2·n²·ncols flops; scratch: `row` of ncols doubles. Backward
 * stable (each reflector is applied in the standard way; Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), §5.1.4).
 */

/**
 * Overwrites the n × ncols row-major matrix `c` with Q·c.
 * @throws RangeError if a buffer is too short or a size is not a non-negative integer.
 */
export function applyHouseholderQ(
  n: number, a: Float64Array, tau: Float64Array, c: Float64Array, ncols: number, row: Float64Array,
): void {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`applyHouseholderQ: n must be a non-negative integer; got ${n}`);
  if (!Number.isInteger(ncols) || ncols < 0) throw new RangeError(`applyHouseholderQ: ncols must be a non-negative integer; got ${ncols}`);
  if (a.length < n * n) throw new RangeError(`applyHouseholderQ: a needs ${n * n} entries; got ${a.length}`);
  if (tau.length < Math.max(0, n - 2)) throw new RangeError(`applyHouseholderQ: tau needs ${n - 2} entries; got ${tau.length}`);
  if (c.length < n * ncols) throw new RangeError(`applyHouseholderQ: c needs ${n * ncols} entries; got ${c.length}`);
  if (row.length < ncols) throw new RangeError(`applyHouseholderQ: row needs ${ncols} entries; got ${row.length}`);
  for (let k = n - 3; k >= 0; k--) {
    const t = tau[k];
    if (t === 0) continue;
    const r0 = k + 1;
    // row = vᵀ·C[r0:, :] (v_0 = 1 implicit).
    const c0 = r0 * ncols;
    for (let j = 0; j < ncols; j++) row[j] = c[c0 + j];
    for (let i = r0 + 1; i < n; i++) {
      const vi = a[i * n + k];
      if (vi === 0) continue;
      const ci = i * ncols;
      for (let j = 0; j < ncols; j++) row[j] += vi * c[ci + j];
    }
    for (let j = 0; j < ncols; j++) {
      const s = t * row[j];
      row[j] = s;
      c[c0 + j] -= s;
    }
    for (let i = r0 + 1; i < n; i++) {
      const vi = a[i * n + k];
      if (vi === 0) continue;
      const ci = i * ncols;
      for (let j = 0; j < ncols; j++) c[ci + j] -= vi * row[j];
    }
  }
}
