/**
 * skewSchur — real Schur (canonical) form of a real skew-symmetric matrix of even order n = 2m:
 *
 *   A = O·(⊕_k ε_k J)·Oᵀ,   J = [[0, 1], [−1, 0]],   ε_k ≥ 0,   O orthogonal,
 *
 * i.e. A·o_{2k+1} = ε_k·o_{2k} and A·o_{2k} = −ε_k·o_{2k+1} for the columns o of O.
 *
 * Method (Ward & Gray, ACM TOMS 4, 278 (1978)):
 *   1. A = Q·T·Qᵀ with T skew tridiagonal (skewTridiagonalize, LAPACK dsytd2-style Householder);
 *      skipped when A is already skew tridiagonal (Q = 1; e.g. the open transverse-field chain).
 *   2. In the order (even indices | odd indices) T = [[0, B], [−Bᵀ, 0]] with B lower
 *      bidiagonal, B_kk = T_{2k,2k+1}, B_{k+1,k} = T_{2k+2,2k+1}. The SVD B = U·Σ·Vᵀ
 *      (bidiagonalSvd on the upper bidiagonal Bᵀ) gives T·(0 ⊕ v_k) = σ_k·(u_k ⊕ 0) and
 *      T·(u_k ⊕ 0) = −σ_k·(0 ⊕ v_k), so the Schur vectors of T are u_k on the even rows
 *      (column 2k) and v_k on the odd rows (column 2k+1), ε_k = σ_k.
 *   3. O = Q·(those vectors) (applyHouseholderQ, LAPACK dormtr-style).
 * Working through the SVD of B (rather than an eigensolver of AᵀA) keeps small ε_k accurate
 * to ≈ u·‖A‖ absolutely, not ≈ √u·‖A‖, and gives orthogonal O even for ε_k = 0.
 *
 * det O = det Q · det U · det V = (−1)^{reflections + negations} is returned exactly (no
 * determinant is computed): it fixes the sign of Pf(A) = det O · Π ε_k.
 *
 * Cost: ≈ (4/3)n³ (reduction) + ≈ 1.5·n³ (SVD with vectors, m = n/2) + ≈ 2n³ (applying Q)
 * flops; the tridiagonal shortcut leaves only the SVD. Memory: O (n²), 2 × m² for U and V,
 * O(n) scratch; `a` (n²) is destroyed. Accuracy: backward stable, ‖A − OΛOᵀ‖ ≈ c·n·u·‖A‖,
 * ‖OᵀO − 1‖ ≈ c·n·u.
 */
import { applyHouseholderQ } from './apply-householder-q.js';
import { bidiagonalSvd } from './bidiagonal-svd.js';
import { skewTridiagonalizeUnchecked } from './skew-tridiagonalize.js';

/** The result of {@link skewSchur}. */
export interface SkewSchur {
  /** Order n (even). */
  readonly n: number;
  /** O, n × n row-major; columns 2k, 2k+1 span mode k. */
  readonly o: Float64Array;
  /** ε_k ≥ 0, n/2 of them, in the order of the column pairs (not sorted). */
  readonly eps: Float64Array;
  /** det O = ±1. */
  readonly det: 1 | -1;
  /** True when A was already skew tridiagonal (no Householder step). */
  readonly tridiagonalInput: boolean;
  /** QR sweeps of the bidiagonal SVD. */
  readonly sweeps: number;
}

/** True when every entry of the strictly lower triangle below the first subdiagonal is 0. */
function isTridiagonal(n: number, a: Float64Array): boolean {
  for (let i = 2; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < i - 1; j++) if (a[row + j] !== 0) return false;
  }
  return true;
}

/**
 * Schur form of the skew-symmetric n × n matrix whose strictly lower triangle is stored in
 * `a` (row-major; destroyed). The upper triangle is not read.
 * @throws RangeError if n is odd or negative, `a` is too short or holds a non-finite entry.
 */
export function skewSchur(n: number, a: Float64Array): SkewSchur {
  if (!Number.isInteger(n) || n < 0 || n % 2 !== 0) throw new RangeError(`skewSchur: n must be a non-negative even integer; got ${n}`);
  if (a.length < n * n) throw new RangeError(`skewSchur: a has ${a.length} entries; needs n² = ${n * n}`);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      if (!Number.isFinite(a[i * n + j])) throw new RangeError(`skewSchur: a[${i}][${j}] = ${a[i * n + j]} is not finite`);
    }
  }
  const m = n / 2;
  const sub = new Float64Array(Math.max(0, n - 1));
  const tau = new Float64Array(Math.max(0, n - 2));
  const tridiagonalInput = isTridiagonal(n, a);
  let reflections = 0;
  if (tridiagonalInput) {
    for (let i = 0; i + 1 < n; i++) sub[i] = a[(i + 1) * n + i];
  } else {
    reflections = skewTridiagonalizeUnchecked(n, a, { sub, tau, w: new Float64Array(n), v: new Float64Array(n) });
  }
  // Bᵀ (upper bidiagonal): diagonal T_{2k,2k+1} = −sub[2k], superdiagonal T_{2k+2,2k+1} = sub[2k+1].
  const d = new Float64Array(m);
  const e = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    d[k] = -sub[2 * k];
    if (k + 1 < m) e[k] = sub[2 * k + 1];
  }
  // Bᵀ = X Σ Yᵀ  ⇒  B = Y Σ Xᵀ: left vectors of B (u) are Y's columns, right vectors (v) X's.
  const xt = identity(m);
  const yt = identity(m);
  const report = bidiagonalSvd(m, d, e, xt, yt);
  const o = new Float64Array(n * n);
  for (let k = 0; k < m; k++) {
    const yk = k * m;
    for (let r = 0; r < m; r++) {
      o[(2 * r) * n + 2 * k] = yt[yk + r];
      o[(2 * r + 1) * n + 2 * k + 1] = xt[yk + r];
    }
  }
  if (reflections > 0) applyHouseholderQ(n, a, tau, o, n, new Float64Array(n));
  const det = (reflections + report.negations) % 2 === 0 ? 1 : -1;
  return { n, o, eps: d, det, tridiagonalInput, sweeps: report.sweeps };
}

function identity(m: number): Float64Array {
  const x = new Float64Array(m * m);
  for (let i = 0; i < m; i++) x[i * m + i] = 1;
  return x;
}
