/**
 * Reference-only eigendecomposition of a small real symmetric matrix by the cyclic Jacobi
 * method: S = V diag(λ) Vᵀ with V orthogonal (columns are eigenvectors).
 *
 * Method: Golub & Van Loan, "Matrix Computations", 4th ed., §8.5 (cyclic Jacobi with the
 * stable rotation formulas of Rutishauser). Written independently of the engine's kernels so
 * that reference checks do not share numerics with the code they check.
 *
 * Cost: O(n³) per sweep, typically 6–10 sweeps to machine precision. Meant for n ≲ 200.
 * Caveat: eigenvalues are returned unsorted (diagonal order after convergence) unless `sort`.
 */

/** Stop when the off-diagonal Frobenius norm is below this fraction of the full norm. */
const RELATIVE_OFF_DIAGONAL_STOP = 1e-15;
/** Hard cap on sweeps (convergence is quadratic; hitting this means bad input, e.g. NaN). */
const MAX_SWEEPS = 100;

/** Eigenvalues and orthonormal eigenvectors (vectors[i][k] = component i of eigenvector k). */
export interface SymmetricEigen {
  values: number[];
  vectors: number[][];
}

/**
 * Eigen-decomposition of a real symmetric matrix given as rows (only symmetry up to rounding
 * is assumed: the matrix is symmetrised first). Throws RangeError on a non-square or
 * non-finite input, and Error if Jacobi fails to converge.
 */
export function symmetricEigen(matrix: readonly (readonly number[])[], sort = true): SymmetricEigen {
  const n = matrix.length;
  for (const row of matrix) {
    if (row.length !== n) throw new RangeError(`symmetricEigen: matrix must be square, got a row of length ${row.length} for n = ${n}`);
    for (const v of row) if (!Number.isFinite(v)) throw new RangeError(`symmetricEigen: non-finite entry ${v}`);
  }
  const a: number[][] = [];
  for (let i = 0; i < n; i++) {
    a.push([]);
    for (let j = 0; j < n; j++) a[i].push(0.5 * (matrix[i][j] + matrix[j][i]));
  }
  const v: number[][] = [];
  for (let i = 0; i < n; i++) { v.push(new Array<number>(n).fill(0)); v[i][i] = 1; }

  let total = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) total += a[i][j] * a[i][j];
  const stop = RELATIVE_OFF_DIAGONAL_STOP * RELATIVE_OFF_DIAGONAL_STOP * total;

  let converged = n <= 1;
  for (let sweep = 0; sweep < MAX_SWEEPS && !converged; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j) off += a[i][j] * a[i][j];
    if (off <= stop) { converged = true; break; }
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p][q];
        if (apq === 0) continue;
        // Rutishauser's formulas: t = tan θ is the smaller root of t² + 2τt − 1 = 0.
        const tau = (a[q][q] - a[p][p]) / (2 * apq);
        const t = Math.sign(tau || 1) / (Math.abs(tau) + Math.sqrt(1 + tau * tau));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k][p], akq = a[k][q];
          a[k][p] = c * akp - s * akq;
          a[k][q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p][k], aqk = a[q][k];
          a[p][k] = c * apk - s * aqk;
          a[q][k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k][p], vkq = v[k][q];
          v[k][p] = c * vkp - s * vkq;
          v[k][q] = s * vkp + c * vkq;
        }
      }
    }
  }
  if (!converged) throw new Error(`symmetricEigen: no convergence after ${MAX_SWEEPS} sweeps`);

  const order = [...Array(n).keys()];
  if (sort) order.sort((x, y) => a[x][x] - a[y][y]);
  return {
    values: order.map((k) => a[k][k]),
    vectors: v.map((row) => order.map((k) => row[k])),
  };
}
