/**
 * pfaffian — Pfaffian of a real skew-symmetric matrix of even order n, as a sign and the log
 * of its magnitude (so long products neither overflow nor underflow): Pf(A) = sign·e^{logAbs}.
 *
 * Method: Parlett–Reid elimination with partial pivoting (Parlett & Reid, BIT 10, 386 (1970);
 * as analysed for Pfaffians by Wimmer, ACM TOMS 38, 30 (2012), Alg. 1). For k = 0, 2, 4, …:
 * swap row/column k+1 with the row/column holding the largest |a_{ik}|, i > k (a swap flips
 * the sign of Pf); then with pivot p = a_{k,k+1} and τ_j = a_{k,j}/p (j ≥ k+2) the congruence
 * that clears row k beyond k+1 leaves the trailing block
 *   a_{ij} ← a_{ij} + τ_i·a_{j,k+1} − a_{i,k+1}·τ_j       (i, j ≥ k+2),
 * and Pf(A) = p · Pf(trailing block). Exact zero pivot column ⇒ Pf = 0.
 * Pf(A)² = det(A) (Cayley) is the invariant the tests check.
 *
 * Cost: ≈ n³/3 flops (only the strictly lower triangle is updated); works in place on a
 * scratch copy of the strictly lower triangle (`work`, n² doubles). Accuracy: backward stable
 * in practice with pivoting (growth as for LU with partial pivoting; Wimmer 2012, §3).
 * Convenience: n = 0 gives Pf = 1; odd n gives 0.
 */

/** Sign and log-magnitude of a Pfaffian: Pf = sign·exp(logAbs); sign 0 means Pf = 0 (logAbs = −∞). */
export interface LogPfaffian {
  sign: -1 | 0 | 1;
  logAbs: number;
}

/**
 * Pf of the n × n skew-symmetric matrix whose strictly lower triangle is stored row-major in
 * `a` (offset 0, leading dimension `lda`); `a` is not modified. `work` must hold n² doubles.
 * @throws RangeError on bad sizes or a non-finite entry.
 */
export function pfaffian(n: number, a: Float64Array, lda: number, work: Float64Array): LogPfaffian {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`pfaffian: n must be a non-negative integer; got ${n}`);
  if (!Number.isInteger(lda) || lda < n) throw new RangeError(`pfaffian: lda must be an integer ≥ n = ${n}; got ${lda}`);
  if (n > 0 && a.length < (n - 1) * lda + n) throw new RangeError(`pfaffian: a is too short for n = ${n}, lda = ${lda}`);
  if (work.length < n * n) throw new RangeError(`pfaffian: work needs n² = ${n * n} entries; got ${work.length}`);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const v = a[i * lda + j];
      if (!Number.isFinite(v)) throw new RangeError(`pfaffian: a[${i}][${j}] = ${v} is not finite`);
      work[i * n + j] = v;
    }
  }
  return pfaffianInPlace(n, work);
}

/** {@link pfaffian} on a contiguous n × n strictly-lower-triangle store that it destroys (no checks). */
export function pfaffianInPlace(n: number, w: Float64Array): LogPfaffian {
  if (n % 2 === 1) return { sign: 0, logAbs: -Infinity };
  let sign: -1 | 1 = 1;
  let logAbs = 0;
  // Lower-triangle accessor: A[i][j] for i > j is w[i·n + j]; A[j][i] = −A[i][j].
  for (let k = 0; k < n; k += 2) {
    // Pivot: largest |A[i][k]| for i ≥ k+1 (stored at w[i·n + k]).
    let piv = k + 1;
    let best = Math.abs(w[(k + 1) * n + k]);
    for (let i = k + 2; i < n; i++) {
      const v = Math.abs(w[i * n + k]);
      if (v > best) { best = v; piv = i; }
    }
    if (best === 0) return { sign: 0, logAbs: -Infinity };
    if (piv !== k + 1) {
      swapSymmetric(n, w, k + 1, piv);
      sign = -sign as -1 | 1;
    }
    // p = A[k][k+1] = −A[k+1][k].
    const p = -w[(k + 1) * n + k];
    if (p < 0) sign = -sign as -1 | 1;
    logAbs += Math.log(Math.abs(p));
    if (k + 2 >= n) break;
    // τ_j = A[k][j]/p = −A[j][k]/p; c_j = A[j][k+1] (j ≥ k+2). Store τ in column k, c stays.
    const inv = 1 / p;
    for (let j = k + 2; j < n; j++) w[j * n + k] = -w[j * n + k] * inv;
    // A[i][j] += τ_i·A[j][k+1] − A[i][k+1]·τ_j for k+2 ≤ j < i.
    for (let i = k + 3; i < n; i++) {
      const ti = w[i * n + k];
      const ci = w[i * n + k + 1];
      const row = i * n;
      for (let j = k + 2; j < i; j++) {
        w[row + j] += ti * w[j * n + k + 1] - ci * w[j * n + k];
      }
    }
  }
  return { sign, logAbs };
}

/** Swaps rows and columns r < s of the skew matrix held in the strictly lower triangle. */
function swapSymmetric(n: number, w: Float64Array, r: number, s: number): void {
  // Entries with both indices outside {r, s}: A[r][j] ↔ A[s][j].
  for (let j = 0; j < r; j++) {
    const t = w[r * n + j]; w[r * n + j] = w[s * n + j]; w[s * n + j] = t;
  }
  for (let j = r + 1; j < s; j++) {
    // A[j][r] (stored, j > r) ↔ A[s][j] (stored, s > j) with A[j][r] = −A[r][j].
    const t = w[j * n + r];
    w[j * n + r] = -w[s * n + j];
    w[s * n + j] = -t;
  }
  for (let i = s + 1; i < n; i++) {
    const t = w[i * n + r]; w[i * n + r] = w[i * n + s]; w[i * n + s] = t;
  }
  // A[s][r] → A[r][s] = −A[s][r].
  w[s * n + r] = -w[s * n + r];
}
