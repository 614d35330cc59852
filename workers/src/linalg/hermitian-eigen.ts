/**
 * hermitianEigen — all eigenvalues and (optionally) eigenvectors of a dense complex Hermitian
 * matrix, A = V·diag(λ)·Vᴴ with λ ascending and V unitary (mirrors LAPACK zheev, JOBZ = 'V',
 * UPLO = 'L'; the checked entry point over the unchecked stages):
 *   1. hermitianTridiagonalize   Qᴴ·A·Q = T, T real symmetric tridiagonal      (16/3)·n³ flops
 *   2. hermitianTridiagonalQl    T = Z·diag(λ)·Zᵀ, Z real orthogonal            ≈ 3·n³
 *   3. hermitianBackTransform    V = Q·Z                                        ≈ 8·n³
 * Real fast path: when every imaginary part of the strict lower triangle is exactly 0 the
 * matrix is real symmetric and stages 1 and 3 run in real arithmetic
 * (hermitianTridiagonalizeReal, hermitianBackTransformReal: (4/3)·n³ + 2·n³), ≈ 3× faster.
 *
 * Storage: column-major, complex interleaved: element (r, c) at 2·(r + c·n). Only the lower
 * triangle and the real part of the diagonal of `a` are read; `a` is not modified. Eigenvector
 * k is column k of `vectors` (contiguous, 2n doubles at offset 2kn).
 *
 * Source: LAPACK 3.x zheev / zhetrd / zsteqr / zunmtr (Anderson et al., LAPACK Users' Guide,
 * 3rd ed., SIAM 1999); Golub & Van Loan, Matrix Computations, 4th ed., §8.3.
 * Cost: ≈ 16·n³ flops complex (≈ 6·n³ real fast path); memory: a workspace of 3n² + 6n doubles
 * (pass one to reuse it across calls).
 * Accuracy: backward stable: the result is the exact decomposition of A + E with
 * ‖E‖₂ = O(n·ε·‖A‖₂), and ‖VᴴV − I‖ = O(n·ε). Eigenvalue errors are ≤ ‖E‖₂ (Weyl);
 * eigenvectors of clustered eigenvalues are only determined as a subspace.
 * Caveats: no pre-scaling of A (entries beyond ~1e150 may overflow in stage 1); at most
 * 30·n QL sweeps in total (then an Error is thrown).
 */
import { hermitianBackTransform } from './hermitian-back-transform.js';
import { hermitianBackTransformReal } from './hermitian-back-transform-real.js';
import { hermitianTridiagonalQl } from './hermitian-tridiagonal-ql.js';
import { hermitianTridiagonalize } from './hermitian-tridiagonalize.js';
import { hermitianTridiagonalizeReal } from './hermitian-tridiagonalize-real.js';

/** Options of {@link hermitianEigen}. */
export interface HermitianEigenOptions {
  /**
   * Run stages 1 and 3 in real arithmetic when the strict lower triangle has no imaginary part.
   * @defaultValue true
   */
  readonly realFastPath?: boolean;
}

/** What one call did. */
export interface HermitianEigenReport {
  /** True when the real fast path ran (eigenvectors then have zero imaginary parts). */
  readonly real: boolean;
}

/** Reusable scratch memory for matrices up to order `n`. */
export interface HermitianEigenWorkspace {
  /** Largest order this workspace serves. */
  readonly n: number;
  /** 2n² doubles: the working copy of A (complex) or its real part (first n²). */
  readonly copy: Float64Array;
  /** n² doubles: the real eigenvector matrix of T. */
  readonly z: Float64Array;
  /** n doubles each: diagonal and off-diagonal of T. */
  readonly d: Float64Array;
  readonly e: Float64Array;
  /** 2n doubles each: the reflector scalars τ and stage-1 scratch. */
  readonly tau: Float64Array;
  readonly work: Float64Array;
}

/** Scratch for {@link hermitianEigen} on matrices of order ≤ n (3n² + 6n doubles). */
export function createHermitianEigenWorkspace(n: number): HermitianEigenWorkspace {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer; got ${n}`);
  return {
    n,
    copy: new Float64Array(2 * n * n),
    z: new Float64Array(n * n),
    d: new Float64Array(n),
    e: new Float64Array(Math.max(n, 1)),
    tau: new Float64Array(2 * Math.max(n, 1)),
    work: new Float64Array(2 * Math.max(n, 1)),
  };
}

/**
 * Eigen-decomposition of the Hermitian matrix `a` of order n (see the file header).
 *
 * @param n - order, ≥ 0 (n = 0 does nothing).
 * @param a - ≥ 2n² doubles, column-major complex; lower triangle read, not modified.
 * @param values - ≥ n doubles; receives λ ascending.
 * @param vectors - ≥ 2n² doubles receiving V (column k ↔ λ_k), or null for eigenvalues only.
 * @param options - see {@link HermitianEigenOptions}.
 * @param workspace - scratch of order ≥ n (allocated per call when omitted).
 * @throws RangeError naming the argument: bad n, a short buffer, a non-finite entry of the lower
 *   triangle, or a workspace of too small an order. Error when the QL iteration fails to converge.
 */
export function hermitianEigen(
  n: number,
  a: Float64Array,
  values: Float64Array,
  vectors: Float64Array | null,
  options: HermitianEigenOptions = {},
  workspace?: HermitianEigenWorkspace,
): HermitianEigenReport {
  const { realFastPath = true } = options;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer; got ${n}`);
  const nn = n * n;
  if (a.length < 2 * nn) throw new RangeError(`a must hold at least 2n² = ${2 * nn} doubles; got ${a.length}`);
  if (values.length < n) throw new RangeError(`values must hold at least n = ${n} doubles; got ${values.length}`);
  if (vectors !== null && vectors.length < 2 * nn) {
    throw new RangeError(`vectors must hold at least 2n² = ${2 * nn} doubles; got ${vectors.length}`);
  }
  const ws = workspace ?? createHermitianEigenWorkspace(n);
  if (ws.n < n) throw new RangeError(`workspace serves order ≤ ${ws.n}; got n = ${n}`);
  let real = realFastPath;
  for (let c = 0; c < n; c++) {
    const col = 2 * c * n;
    if (!Number.isFinite(a[col + 2 * c])) throw new RangeError(`a has a non-finite diagonal entry at (${c}, ${c}): ${a[col + 2 * c]}`);
    for (let r = c + 1; r < n; r++) {
      const re = a[col + 2 * r];
      const im = a[col + 2 * r + 1];
      if (!Number.isFinite(re) || !Number.isFinite(im)) {
        throw new RangeError(`a has a non-finite entry at (${r}, ${c}): ${re} + ${im}i`);
      }
      if (im !== 0) real = false;
    }
  }
  if (n === 0) return { real };
  const { copy, z, d, e, tau, work } = ws;
  if (real) {
    for (let c = 0; c < n; c++) for (let r = c; r < n; r++) copy[r + c * n] = a[2 * (r + c * n)];
    hermitianTridiagonalizeReal(n, copy, d, e, tau, work);
  } else {
    copy.set(a.subarray(0, 2 * nn));
    hermitianTridiagonalize(n, copy, d, e, tau, work);
  }
  let zr: Float64Array | null = null;
  if (vectors !== null) {
    zr = z.subarray(0, nn);
    zr.fill(0);
    for (let k = 0; k < n; k++) zr[k + k * n] = 1;
  }
  const bad = hermitianTridiagonalQl(n, d, e, zr, work); // work is free after stage 1
  if (bad > 0) throw new Error(`hermitianEigen: the tridiagonal QL iteration left ${bad} off-diagonal entries unconverged (n = ${n})`);
  for (let k = 0; k < n; k++) values[k] = d[k];
  if (vectors === null || zr === null) return { real };
  if (real) {
    hermitianBackTransformReal(n, copy, tau, zr, n);
    for (let k = 0; k < nn; k++) { vectors[2 * k] = zr[k]; vectors[2 * k + 1] = 0; }
  } else {
    for (let k = 0; k < nn; k++) { vectors[2 * k] = zr[k]; vectors[2 * k + 1] = 0; }
    hermitianBackTransform(n, copy, tau, vectors, n);
  }
  return { real };
}
