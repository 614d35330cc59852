/**
 * truncatedSvd — singular value decomposition of a complex m×n row-major matrix, truncated by
 * a rank cap and a discarded-weight threshold:
 *
 *   A ≈ U·diag(s)·Vh,  U m×k with orthonormal columns, Vh k×n with orthonormal rows,
 *   s descending and > 0,  ‖A − U·diag(s)·Vh‖²_F = discarded weight (reported exactly).
 *
 * The preconditioned one-sided Jacobi SVD of Drmač & Veselić (SIAM J. Matrix Anal. Appl. 29,
 * 1322 and 1343 (2008); LAPACK zgejsv), transposed for row-major storage:
 *   1. Π·A = L·Q_r + E by Householder LQ with row pivoting (lqRowPivoted), stopped when the
 *      unreduced weight ‖E‖² ≤ (QR_SHARE·maxWeight + NEGLIGIBLE_WEIGHT)·‖A‖² or at the rank
 *      cap `lqRankCap` (callers pass ≈ 2·maxRank when only the leading values are wanted; the
 *      pivoted factorisation is rank-revealing in practice, and E counts as discarded weight,
 *      exactly, so a cap only makes the truncation slightly less than optimal);
 *   2. second preconditioner: L = Q₂·R₂ (the LQ of Lᵀ, again with pivoting), X = R₂ᴴ (r×r);
 *   3. one-sided Jacobi on the columns of X (jacobiRows): X·J = U_X·Σ — after the two
 *      factorisations X is close to column-orthogonal and the iteration takes a few sweeps;
 *   4. rank choice (chooseRank): the smallest k ≤ maxRank with tail Σ_{j≥k} σ_j² + ‖E‖² ≤
 *      maxWeight·‖A‖²; σ_j² ≤ NEGLIGIBLE_WEIGHT·‖A‖² is always dropped (rounding level);
 *   5. A ≈ Πᵀ·(Q₂J)·Σ·(U_Xᴴ Q_r): U = Πᵀ·Q₂·J[:, kept] (orthonormal by construction, no
 *      division by σ), Vh = U_X[:, kept]ᴴ·Q_r (applyLqRows both).
 * `maxWeight` is RELATIVE to ‖A‖²_F.
 *
 * Cost, r the rank reached in step 1, S Jacobi sweeps (2–5 observed): ≈ 8mnr + 8mr² +
 * S·21r³ + 8k(m + n)r flops; workspace O((m + r)·r). Accuracy: backward stable;
 * ‖UᴴU − I‖, ‖VhVhᴴ − I‖ = O(√m·ε). Caveat: `a` is overwritten (it holds reflectors).
 */
import { jacobiRowsUnchecked } from './jacobi-rows.js';
import { applyLqRowsUnchecked, lqRowPivotedUnchecked } from './lq-row-pivoted.js';

/** Share of the discarded-weight budget the pivoted LQ may spend before the SVD proper. */
export const QR_SHARE = 0.1;
/** Relative weight always treated as zero (σ ≲ 1e−15·‖A‖: rounding level). */
export const NEGLIGIBLE_WEIGHT = 1e-30;

/** Scratch space of {@link truncatedSvdUnchecked}; grow with {@link ensureSvdWorkspace}. */
export interface SvdWorkspace {
  /** Largest m and n this workspace serves. */
  maxM: number;
  maxN: number;
  perm: Int32Array;
  perm2: Int32Array;
  norms: Float64Array;
  tau: Float64Array;
  tau2: Float64Array;
  /** Lᵀ (r rows of length m), then the reflectors of its LQ. */
  lt: Float64Array;
  /** X = R₂ᴴ stored by columns (r × r), rotated into U_X·Σ. */
  xt: Float64Array;
  /** J stored by columns (r × r). */
  jt: Float64Array;
  /** Rows of (Q₂J)ᵀ for the kept values (k × m). */
  ut: Float64Array;
  order: Int32Array;
  /** σ_j² in descending order. */
  sorted: Float64Array;
  /** [‖A‖², ‖E‖²] of an LQ step. */
  weights: Float64Array;
}

/** What one decomposition did. */
export interface SvdReport {
  /** Kept rank k. */
  rank: number;
  /** ‖A‖²_F. */
  totalWeight: number;
  /** ‖A − U·diag(s)·Vh‖²_F (absolute, not relative). */
  discardedWeight: number;
  /** Rank reached by the pivoted LQ. */
  lqRank: number;
  /** Jacobi sweeps. */
  sweeps: number;
}

/** A workspace for matrices up to maxM × maxN. */
export function createSvdWorkspace(maxM: number, maxN: number): SvdWorkspace {
  const r = Math.max(Math.min(maxM, maxN), 1);
  return {
    maxM, maxN,
    perm: new Int32Array(maxM),
    perm2: new Int32Array(r),
    norms: new Float64Array(Math.max(maxM, 1)),
    tau: new Float64Array(2 * r),
    tau2: new Float64Array(2 * r),
    lt: new Float64Array(2 * r * maxM),
    xt: new Float64Array(2 * r * r),
    jt: new Float64Array(2 * r * r),
    ut: new Float64Array(2 * r * maxM),
    order: new Int32Array(r),
    sorted: new Float64Array(r),
    weights: new Float64Array(2),
  };
}

/** Returns `ws` if it serves m × n, else a larger workspace. */
export function ensureSvdWorkspace(ws: SvdWorkspace | null, m: number, n: number): SvdWorkspace {
  if (ws !== null && ws.maxM >= m && ws.maxN >= n) return ws;
  return createSvdWorkspace(Math.max(m, ws?.maxM ?? 0), Math.max(n, ws?.maxN ?? 0));
}

/**
 * The kept rank for descending weights σ_j² (`sq`, length r), the unreduced weight `residual`
 * and the allowed discarded weight `allowed` (absolute): the smallest k ≤ maxRank with
 * residual + Σ_{j≥k} sq[j] ≤ allowed, and never keeping an entry ≤ `negligible`.
 */
export function chooseRank(
  sq: ArrayLike<number>, r: number, residual: number, maxRank: number, allowed: number, negligible: number,
): number {
  let k = Math.min(r, maxRank);
  let tail = residual;
  for (let j = r - 1; j >= k; j--) tail += sq[j];
  while (k > 0 && (sq[k - 1] <= negligible || tail + sq[k - 1] <= allowed)) {
    tail += sq[k - 1];
    k--;
  }
  return k;
}

/**
 * Decomposes A (overwritten) as in the file header. Outputs, compact row-major: u (m×k,
 * ld = k), s (k), vh (k×n, ld = n); each buffer must hold the largest possible k =
 * min(m, n, maxRank). `lqRankCap` bounds the rank of step 1 (default: no bound).
 * Throws an Error if the Jacobi iteration does not converge.
 */
export function truncatedSvdUnchecked(
  m: number, n: number, a: Float64Array, lda: number,
  maxRank: number, maxWeight: number, ws: SvdWorkspace,
  u: Float64Array, s: Float64Array, vh: Float64Array, report: SvdReport, lqRankCap = Infinity,
): number {
  const { perm, perm2, norms, tau, tau2, lt, xt, jt, ut, order, sorted, weights } = ws;
  const stop = QR_SHARE * maxWeight + NEGLIGIBLE_WEIGHT;
  const r = lqRowPivotedUnchecked(m, n, a, lda, perm, tau, norms, stop, weights, lqRankCap);
  const total = weights[0];
  let residual = weights[1];
  // Lᵀ: row j = column j of L (zero above the diagonal).
  lt.fill(0, 0, 2 * r * m);
  for (let i = 0; i < m; i++) {
    const jEnd = Math.min(i + 1, r);
    for (let j = 0; j < jEnd; j++) {
      lt[2 * (j * m + i)] = a[2 * (i * lda + j)];
      lt[2 * (j * m + i) + 1] = a[2 * (i * lda + j) + 1];
    }
  }
  // Π₂·Lᵀ = L₃·Q₃, so L = Q₂·R₂ with Q₂ = Q₃ᵀ, R₂ = L₃ᵀ·Π₂ and X = R₂ᴴ = Π₂ᵀ·conj(L₃).
  const r2 = lqRowPivotedUnchecked(r, m, lt, m, perm2, tau2, norms, NEGLIGIBLE_WEIGHT * (total > 0 ? 1 : 0), weights);
  residual += weights[1];
  // Column j of X (length r) as row j of xt: X[perm2[i], j] = conj(L₃[i, j]).
  xt.fill(0, 0, 2 * r2 * r);
  for (let i = 0; i < r; i++) {
    const jEnd = Math.min(i + 1, r2);
    for (let j = 0; j < jEnd; j++) {
      xt[2 * (j * r + perm2[i])] = lt[2 * (i * m + j)];
      xt[2 * (j * r + perm2[i]) + 1] = -lt[2 * (i * m + j) + 1];
    }
  }
  jt.fill(0, 0, 2 * r2 * r2);
  for (let j = 0; j < r2; j++) jt[2 * (j * r2 + j)] = 1;
  const sweeps = jacobiRowsUnchecked(r2, r, xt, r, r2, jt, r2, norms);
  if (sweeps < 0) throw new Error(`truncatedSvd: one-sided Jacobi did not converge on a ${m}×${n} matrix (rank ${r2})`);
  // Insertion sort by descending σ² (de Rijk's pivoting leaves the rows nearly sorted).
  for (let j = 0; j < r2; j++) {
    const w = norms[j];
    let i = j;
    while (i > 0 && sorted[i - 1] < w) {
      sorted[i] = sorted[i - 1];
      order[i] = order[i - 1];
      i--;
    }
    sorted[i] = w;
    order[i] = j;
  }
  const k = chooseRank(sorted, r2, residual, maxRank, maxWeight * total, NEGLIGIBLE_WEIGHT * total);
  let discarded = residual;
  for (let c = k; c < r2; c++) discarded += sorted[c];
  for (let c = 0; c < k; c++) {
    const j = order[c];
    const sigma = Math.sqrt(sorted[c]);
    s[c] = sigma;
    // (Q₂J)[:, j]ᵀ = J[:, j]ᵀ·Q₃: start from row j of jt (length r2).
    const uo = 2 * c * m;
    const jo = 2 * j * r2;
    for (let q = 0; q < 2 * r2; q++) ut[uo + q] = jt[jo + q];
    // Vh row c = conj(U_X[:, j])ᵀ·Q_r, U_X[:, j] = row j of xt / σ.
    const inv = 1 / sigma;
    const xo = 2 * j * r;
    const vo = 2 * c * n;
    for (let q = 0; q < r; q++) {
      vh[vo + 2 * q] = xt[xo + 2 * q] * inv;
      vh[vo + 2 * q + 1] = -xt[xo + 2 * q + 1] * inv;
    }
  }
  applyLqRowsUnchecked(r2, m, lt, m, tau2, k, ut, m);
  applyLqRowsUnchecked(r, n, a, lda, tau, k, vh, n);
  for (let c = 0; c < k; c++) {
    const uo = 2 * c * m;
    for (let i = 0; i < m; i++) {
      const o = 2 * (perm[i] * k + c);
      u[o] = ut[uo + 2 * i];
      u[o + 1] = ut[uo + 2 * i + 1];
    }
  }
  report.rank = k;
  report.totalWeight = total;
  report.discardedWeight = discarded;
  report.lqRank = r;
  report.sweeps = sweeps;
  return k;
}

/** Options of {@link truncatedSvd}. */
export interface TruncationOptions {
  /** Largest kept rank. @defaultValue min(m, n) */
  maxRank?: number;
  /** Largest discarded weight, relative to ‖A‖²_F, in [0, 1). @defaultValue 0 */
  maxWeight?: number;
  /** Rank cap of the pivoted LQ (step 1), ≥ maxRank. @defaultValue no cap */
  lqRankCap?: number;
}

/**
 * Checked entry: decomposes a COPY of `a` (m×n row-major, ld = n) and returns fresh arrays.
 * @throws RangeError naming the argument for bad sizes, a short buffer, non-finite entries or
 *   an option out of range.
 */
export function truncatedSvd(
  m: number, n: number, a: Float64Array, options: TruncationOptions = {},
): { u: Float64Array; s: Float64Array; vh: Float64Array; report: SvdReport } {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`truncatedSvd: m must be a positive integer; got ${m}`);
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`truncatedSvd: n must be a positive integer; got ${n}`);
  if (a.length < 2 * m * n) throw new RangeError(`truncatedSvd: a has ${a.length} doubles, needs ${2 * m * n}`);
  const { maxRank = Math.min(m, n), maxWeight = 0, lqRankCap = Infinity } = options;
  if (!Number.isInteger(maxRank) || maxRank < 1) throw new RangeError(`truncatedSvd: maxRank must be a positive integer; got ${maxRank}`);
  if (!(maxWeight >= 0 && maxWeight < 1)) throw new RangeError(`truncatedSvd: maxWeight must be in [0, 1); got ${maxWeight}`);
  if (!(lqRankCap >= maxRank)) throw new RangeError(`truncatedSvd: lqRankCap must be ≥ maxRank (${maxRank}); got ${lqRankCap}`);
  for (let k = 0; k < 2 * m * n; k++) {
    if (!Number.isFinite(a[k])) throw new RangeError(`truncatedSvd: a[${k}] is ${a[k]}; entries must be finite`);
  }
  const copy = a.slice(0, 2 * m * n);
  const kmax = Math.min(m, n, maxRank);
  const u = new Float64Array(2 * m * kmax);
  const s = new Float64Array(kmax);
  const vh = new Float64Array(2 * kmax * n);
  const report: SvdReport = { rank: 0, totalWeight: 0, discardedWeight: 0, lqRank: 0, sweeps: 0 };
  const k = truncatedSvdUnchecked(m, n, copy, n, maxRank, maxWeight, createSvdWorkspace(m, n), u, s, vh, report, lqRankCap);
  return { u: u.slice(0, 2 * m * k), s: s.slice(0, k), vh: vh.slice(0, 2 * k * n), report };
}
