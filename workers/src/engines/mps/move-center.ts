/**
 * moveCenter — shifts the orthogonality centre of a purified MPS one site at a time, by
 * Householder LQ factorisations with row pivoting (tensor/lq-row-pivoted.ts):
 *
 *   right (c → c+1): M = A_c as (α, p) × β.  LQ of Mᴴ: Π·Mᴴ = L·Q_r, so M = Q_rᴴ·(Lᴴ·Π):
 *                    A_c ← Q_rᴴ (left-orthonormal), A_{c+1} ← (Lᴴ·Π)·A_{c+1}.
 *   left (c → c−1):  M = A_c as α × (p, β).  Π·M = L·Q_r:
 *                    A_c ← Q_r (right-orthonormal), A_{c−1} ← A_{c−1}·(Πᵀ·L).
 * The factorisation stops at numerical rank (unreduced weight ≤ NEGLIGIBLE_WEIGHT of the
 * total), so a bond can shrink but never loses more than rounding-level weight.
 * Standard gauge moves of MPS algorithms (Verstraete, García-Ripoll & Cirac 2004); cost per
 * move ≈ 8·(4χ_l)·χ_r² + 8·χ_r²·(4χ') flops.
 */
import { complexGemmUnchecked } from '../../tensor/complex-gemm.js';
import { applyLqRowsUnchecked, lqRowPivotedUnchecked } from '../../tensor/lq-row-pivoted.js';
import { NEGLIGIBLE_WEIGHT } from '../../tensor/truncated-svd.js';
import { LOCAL_DIM } from './local-operators.js';
import type { PurifiedMps } from './purified-mps.js';

/** Scratch buffers of the centre moves (grown on demand). */
export interface MoveWorkspace {
  a: Float64Array;
  perm: Int32Array;
  norms: Float64Array;
  tau: Float64Array;
  weights: Float64Array;
}

/** An empty workspace. */
export function createMoveWorkspace(): MoveWorkspace {
  return { a: new Float64Array(0), perm: new Int32Array(0), norms: new Float64Array(0), tau: new Float64Array(0), weights: new Float64Array(2) };
}

function grow(ws: MoveWorkspace, m: number, n: number): void {
  if (ws.a.length < 2 * m * n) ws.a = new Float64Array(2 * m * n);
  if (ws.perm.length < m) ws.perm = new Int32Array(m);
  if (ws.norms.length < m) ws.norms = new Float64Array(m);
  if (ws.tau.length < 2 * Math.min(m, n)) ws.tau = new Float64Array(2 * Math.min(m, n));
}

/** Moves the centre one site to the right (requires center < sites − 1). */
export function moveCenterRight(mps: PurifiedMps, ws: MoveWorkspace): void {
  const c = mps.center;
  if (c >= mps.sites - 1) throw new RangeError(`moveCenterRight: the centre is at the last site ${c}`);
  const chiL = mps.dims[c];
  const chiR = mps.dims[c + 1];
  const chiN = mps.dims[c + 2];
  const rows = chiL * LOCAL_DIM;
  // Mᴴ: chiR × rows.
  grow(ws, chiR, rows);
  const a = ws.a;
  const t = mps.tensors[c];
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < chiR; j++) {
      a[2 * (j * rows + i)] = t[2 * (i * chiR + j)];
      a[2 * (j * rows + i) + 1] = -t[2 * (i * chiR + j) + 1];
    }
  }
  const r = lqRowPivotedUnchecked(chiR, rows, a, rows, ws.perm, ws.tau, ws.norms, NEGLIGIBLE_WEIGHT, ws.weights);
  // Q_r (r × rows), then A_c = Q_rᴴ (rows × r).
  const q = new Float64Array(2 * r * rows);
  for (let j = 0; j < r; j++) q[2 * (j * rows + j)] = 1;
  applyLqRowsUnchecked(r, rows, a, rows, ws.tau, r, q, rows);
  const ac = new Float64Array(2 * rows * r);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < r; j++) {
      ac[2 * (i * r + j)] = q[2 * (j * rows + i)];
      ac[2 * (i * r + j) + 1] = -q[2 * (j * rows + i) + 1];
    }
  }
  // R = Lᴴ·Π (r × chiR): R[j, perm[i]] = conj(L[i, j]) for j ≤ i.
  const rm = new Float64Array(2 * r * chiR);
  for (let i = 0; i < chiR; i++) {
    const jEnd = Math.min(i + 1, r);
    for (let j = 0; j < jEnd; j++) {
      rm[2 * (j * chiR + ws.perm[i])] = a[2 * (i * rows + j)];
      rm[2 * (j * chiR + ws.perm[i]) + 1] = -a[2 * (i * rows + j) + 1];
    }
  }
  const next = new Float64Array(2 * r * LOCAL_DIM * chiN);
  complexGemmUnchecked('N', r, LOCAL_DIM * chiN, chiR, rm, chiR, mps.tensors[c + 1], LOCAL_DIM * chiN, next, LOCAL_DIM * chiN, false);
  mps.tensors[c] = ac;
  mps.tensors[c + 1] = next;
  mps.dims[c + 1] = r;
  mps.center = c + 1;
}

/** Moves the centre one site to the left (requires center > 0). */
export function moveCenterLeft(mps: PurifiedMps, ws: MoveWorkspace): void {
  const c = mps.center;
  if (c <= 0) throw new RangeError('moveCenterLeft: the centre is at site 0');
  const chiL = mps.dims[c];
  const chiR = mps.dims[c + 1];
  const chiP = mps.dims[c - 1];
  const cols = LOCAL_DIM * chiR;
  grow(ws, chiL, cols);
  const a = ws.a;
  a.set(mps.tensors[c].subarray(0, 2 * chiL * cols));
  const r = lqRowPivotedUnchecked(chiL, cols, a, cols, ws.perm, ws.tau, ws.norms, NEGLIGIBLE_WEIGHT, ws.weights);
  const q = new Float64Array(2 * r * cols);
  for (let j = 0; j < r; j++) q[2 * (j * cols + j)] = 1;
  applyLqRowsUnchecked(r, cols, a, cols, ws.tau, r, q, cols);
  // Πᵀ·L (chiL × r): row perm[i] = L[i, 0..min(i, r−1)].
  const lm = new Float64Array(2 * chiL * r);
  for (let i = 0; i < chiL; i++) {
    const jEnd = Math.min(i + 1, r);
    for (let j = 0; j < jEnd; j++) {
      lm[2 * (ws.perm[i] * r + j)] = a[2 * (i * cols + j)];
      lm[2 * (ws.perm[i] * r + j) + 1] = a[2 * (i * cols + j) + 1];
    }
  }
  const prevRows = chiP * LOCAL_DIM;
  const prev = new Float64Array(2 * prevRows * r);
  complexGemmUnchecked('N', prevRows, r, chiL, mps.tensors[c - 1], chiL, lm, r, prev, r, false);
  mps.tensors[c] = q;
  mps.tensors[c - 1] = prev;
  mps.dims[c] = r;
  mps.center = c - 1;
}

/** Moves the centre to `target` (0 ≤ target < sites). */
export function moveCenterTo(mps: PurifiedMps, target: number, ws: MoveWorkspace): void {
  if (!Number.isInteger(target) || target < 0 || target >= mps.sites) {
    throw new RangeError(`moveCenterTo: target ${target} is not a site (0..${mps.sites - 1})`);
  }
  while (mps.center < target) moveCenterRight(mps, ws);
  while (mps.center > target) moveCenterLeft(mps, ws);
}
