/**
 * bidiagonalSvd — singular value decomposition of a real upper bidiagonal matrix,
 * C = X·Σ·Yᵀ (diagonal d, superdiagonal e), by implicitly shifted QR.
 *
 * Mirrors the bidiagonal phase of LINPACK dsvdc (Dongarra, Bunch, Moler & Stewart, LINPACK
 * Users' Guide (SIAM 1979), ch. 11), i.e. the Golub–Kahan–Reinsch algorithm (Golub & Reinsch,
 * Numer. Math. 14, 403 (1970); Golub & Van Loan, Matrix Computations, 4th ed. (2013),
 * Alg. 8.6.1–8.6.2). Each pass looks at the trailing unreduced block and does one of:
 *   1. d[p−1] negligible: chase e[p−2] upward with right rotations (into Y);
 *   2. some d[k] negligible inside the block: split there, chasing e[k] right with left
 *      rotations (into X);
 *   3. a QR sweep with the shift from the trailing 2 × 2 of CᵀC (Wilkinson), bulge chased
 *      by alternating right/left Givens rotations;
 *   4. e[p−2] negligible: d[p−1] has converged; make it ≥ 0 (negating column p−1 of Y).
 * Negligible: |e[k]| ≤ TINY + EPS·(|d[k]| + |d[k+1]|), |d[k]| ≤ TINY + EPS·(adjacent |e|).
 * Singular values come out ≥ 0, NOT sorted (sorting is left to the caller).
 *
 * Vectors are stored as ROWS (xt[j·n + i] = X[i][j]) so each rotation streams two contiguous
 * rows. Pass null to skip either set. The caller initialises xt, yt (usually to the identity);
 * the routine post-multiplies them: X ← X·G_left, Y ← Y·G_right.
 *
 * Every rotation has determinant +1, so det(X)·det(Y) changes only by the sign flips of step 4;
 * their number is returned (det X · det Y = (−1)^negations when both start as the identity).
 *
 * Accuracy: singular values to absolute error ≈ c·n·u·‖C‖ (backward stable; u = 2⁻⁵³),
 * X and Y orthogonal to ≈ c·n·u. Cost: O(n²) without vectors; ≈ 12·n³ flops with both
 * (about 2 sweeps of n rotations per singular value, 6n flops per rotation and vector set).
 */

/** Relative precision used in the negligibility tests (2⁻⁵²), as in LINPACK dsvdc. */
const EPS = 2 ** -52;
/** Absolute floor of the negligibility tests (2⁻⁹⁶⁶), avoids underflow trouble. */
const TINY = 2 ** -966;
/** QR sweeps allowed per singular value before giving up. */
const MAX_SWEEPS_PER_VALUE = 75;

/** What the iteration did. */
export interface BidiagonalSvdReport {
  /** QR sweeps (case 3) in all. */
  sweeps: number;
  /** Singular values made non-negative by a sign flip (det X · det Y = (−1)^negations). */
  negations: number;
}

/** Rotates rows j and k of a row-vector store: (r_j, r_k) ← (cs·r_j + sn·r_k, −sn·r_j + cs·r_k). */
function rotateRows(v: Float64Array, n: number, j: number, k: number, cs: number, sn: number): void {
  const oj = j * n;
  const ok = k * n;
  for (let i = 0; i < n; i++) {
    const a = v[oj + i];
    const b = v[ok + i];
    v[oj + i] = cs * a + sn * b;
    v[ok + i] = cs * b - sn * a;
  }
}

/**
 * Overwrites d with the singular values (≥ 0, unsorted) of the n × n upper bidiagonal matrix
 * with diagonal d[0..n−1] and superdiagonal e[0..n−2]; e is destroyed (e[n−1] must exist and is
 * used as scratch). xt / yt (n × n, vectors as rows) accumulate the left / right rotations.
 * @throws RangeError on bad sizes; Error if the iteration does not converge.
 */
export function bidiagonalSvd(
  n: number, d: Float64Array, e: Float64Array, xt: Float64Array | null, yt: Float64Array | null,
): BidiagonalSvdReport {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`bidiagonalSvd: n must be a non-negative integer; got ${n}`);
  if (d.length < n) throw new RangeError(`bidiagonalSvd: d needs ${n} entries; got ${d.length}`);
  if (e.length < n) throw new RangeError(`bidiagonalSvd: e needs ${n} entries (the last is scratch); got ${e.length}`);
  if (xt !== null && xt.length < n * n) throw new RangeError(`bidiagonalSvd: xt needs ${n * n} entries; got ${xt.length}`);
  if (yt !== null && yt.length < n * n) throw new RangeError(`bidiagonalSvd: yt needs ${n * n} entries; got ${yt.length}`);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(d[i]) || (i + 1 < n && !Number.isFinite(e[i]))) {
      throw new RangeError(`bidiagonalSvd: entries must be finite; d[${i}] = ${d[i]}, e[${i}] = ${e[i]}`);
    }
  }
  if (n > 0) e[n - 1] = 0;
  let p = n;
  let sweeps = 0;
  let negations = 0;
  let iter = 0;
  while (p > 0) {
    if (iter > MAX_SWEEPS_PER_VALUE) throw new Error(`bidiagonalSvd: no convergence after ${iter} sweeps on singular value ${p - 1}`);
    // Find the trailing unreduced block: e[k] negligible, k < p − 1.
    let k: number;
    for (k = p - 2; k >= 0; k--) {
      if (Math.abs(e[k]) <= TINY + EPS * (Math.abs(d[k]) + Math.abs(d[k + 1]))) {
        e[k] = 0;
        break;
      }
    }
    let kase: number;
    if (k === p - 2) {
      kase = 4;
    } else {
      let ks: number;
      for (ks = p - 1; ks > k; ks--) {
        const t = (ks !== p - 1 ? Math.abs(e[ks]) : 0) + (ks !== k + 1 ? Math.abs(e[ks - 1]) : 0);
        if (Math.abs(d[ks]) <= TINY + EPS * t) {
          d[ks] = 0;
          break;
        }
      }
      if (ks === k) kase = 3;
      else if (ks === p - 1) kase = 1;
      else {
        kase = 2;
        k = ks;
      }
    }
    k++;

    switch (kase) {
      case 1: {
        // d[p−1] = 0: zero e[p−2] with right rotations on columns (j, p−1), j = p−2 … k.
        let f = e[p - 2];
        e[p - 2] = 0;
        for (let j = p - 2; j >= k; j--) {
          const t = Math.hypot(d[j], f);
          const cs = d[j] / t;
          const sn = f / t;
          d[j] = t;
          if (j !== k) {
            f = -sn * e[j - 1];
            e[j - 1] = cs * e[j - 1];
          }
          if (yt !== null) rotateRows(yt, n, j, p - 1, cs, sn);
        }
        break;
      }
      case 2: {
        // d[k−1] = 0: zero e[k−1] with left rotations on rows (j, k−1), j = k … p−1.
        let f = e[k - 1];
        e[k - 1] = 0;
        for (let j = k; j < p; j++) {
          const t = Math.hypot(d[j], f);
          const cs = d[j] / t;
          const sn = f / t;
          d[j] = t;
          f = -sn * e[j];
          e[j] = cs * e[j];
          if (xt !== null) rotateRows(xt, n, j, k - 1, cs, sn);
        }
        break;
      }
      case 3: {
        // One implicit-shift QR sweep on the block k … p−1.
        const scale = Math.max(Math.abs(d[p - 1]), Math.abs(d[p - 2]), Math.abs(e[p - 2]), Math.abs(d[k]), Math.abs(e[k]));
        const sp = d[p - 1] / scale;
        const spm1 = d[p - 2] / scale;
        const epm1 = e[p - 2] / scale;
        const sk = d[k] / scale;
        const ek = e[k] / scale;
        const b = ((spm1 + sp) * (spm1 - sp) + epm1 * epm1) / 2;
        const c = (sp * epm1) * (sp * epm1);
        let shift = 0;
        if (b !== 0 || c !== 0) {
          shift = Math.sqrt(b * b + c);
          if (b < 0) shift = -shift;
          shift = c / (b + shift);
        }
        let f = (sk + sp) * (sk - sp) + shift;
        let g = sk * ek;
        for (let j = k; j < p - 1; j++) {
          let t = Math.hypot(f, g);
          let cs = f / t;
          let sn = g / t;
          if (j !== k) e[j - 1] = t;
          f = cs * d[j] + sn * e[j];
          e[j] = cs * e[j] - sn * d[j];
          g = sn * d[j + 1];
          d[j + 1] = cs * d[j + 1];
          if (yt !== null) rotateRows(yt, n, j, j + 1, cs, sn);
          t = Math.hypot(f, g);
          cs = f / t;
          sn = g / t;
          d[j] = t;
          f = cs * e[j] + sn * d[j + 1];
          d[j + 1] = -sn * e[j] + cs * d[j + 1];
          g = sn * e[j + 1];
          e[j + 1] = cs * e[j + 1];
          if (xt !== null) rotateRows(xt, n, j, j + 1, cs, sn);
        }
        e[p - 2] = f;
        iter++;
        sweeps++;
        break;
      }
      default: {
        // Converged: d[k] (k = p − 1) made non-negative.
        if (d[k] < 0) {
          negations++;
          if (yt !== null) {
            const o = k * n;
            for (let i = 0; i < n; i++) yt[o + i] = -yt[o + i];
          }
        }
        d[k] = Math.abs(d[k]);
        iter = 0;
        p--;
        break;
      }
    }
  }
  return { sweeps, negations };
}
