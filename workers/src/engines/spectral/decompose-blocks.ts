/**
 * decomposeBlocks — H = ⊕_B W_B·diag(λ_B)·W_Bᴴ block by block over a partition of a
 * symmetry-adapted basis (symmetry/sector-basis.ts; the computational basis when no spatial
 * symmetry is used), with an a-posteriori backward error from the computed residuals.
 *
 * Per block (d vectors): blockMatrix (sparse, strict: H must not couple blocks) → denseBlock →
 * hermitianEigen (complex, or its real fast path) →
 *   residuals  r_k = ‖H_B·w_k − λ_k·w_k‖₂          (applyBlock on the sparse block: 8·nnz·d flops)
 *   δ_B = ‖W_BᴴW_B − I‖_F                           (complexAdjointProduct, packed: 4·d³ flops;
 *                                                     realTransposeProduct, d³, for real blocks)
 * Backward error. Let R = HW − WΛ and WᴴW = I + Δ with δ = ‖Δ‖₂ < 1. The unitary polar factor
 * W̃ of W has ‖W − W̃‖₂ ≤ δ, and (H + E)·W̃ = W̃·Λ exactly with
 *   ‖E‖₂ ≤ ‖R‖₂ + (‖H − c‖₂ + ‖Λ − c‖₂)·δ   for any real c (a shift moves H and Λ alike and
 *                                             leaves R unchanged),
 * so the computed eigenvalues are those of a Hermitian H + E (each within ‖E‖ of a true one,
 * Weyl) and e^{−iΛt} on W̃ is exactly e^{−i(H+E)t}. With c the midpoint of the block's computed
 * spectrum both norms are its half-width h_B (‖H_B − c‖₂ ≤ h_B + ‖E‖, a second-order
 * correction), and blocks are independent (the symmetry-adapted basis is orthonormal, so a
 * block-diagonal E in it has the norm of its largest block), so
 *   η = max_B (‖R_B‖_F + 2·h_B·δ_B)
 * is reported as the backward error (first order in δ; rigorous up to the rounding in forming R
 * and Δ themselves, which is of the same tiny order).
 *
 * Cost: ≈ 16·d³ (complex) or ≈ 6·d³ (real) per block for the eigensolver + 4·d³ for δ_B.
 * Memory: the eigenvectors of every block (16·Σd² bytes, + 8·d² for a compact real copy when
 * the real fast path ran) + scratch of 3 dense blocks of the largest size. The event loop gets
 * a turn (and the abort signal is checked) between blocks.
 */
import { complexAdjointProduct } from '../../linalg/complex-adjoint-product.js';
import { createHermitianEigenWorkspace, hermitianEigen } from '../../linalg/hermitian-eigen.js';
import type { PauliTermMask } from '../../physics/types.js';
import { blockMatrix } from '../../symmetry/index.js';
import type { BasisPartition, SectorBasis } from '../../symmetry/index.js';
import { applyBlock } from './apply-block.js';
import { realTransposeProduct } from './real-transpose-product.js';
import { denseBlock } from './dense-block.js';
import { yieldIfDue } from './yield-if-due.js';

/** The eigen-decomposition of one block. */
export interface BlockEigen {
  /** Basis vectors of the block (ascending); row i of `vectors` is basis vector states[i]. */
  readonly states: Int32Array;
  /** Eigenvalues λ_k, ascending. */
  readonly values: Float64Array;
  /** W_B: column-major complex d×d, column k ↔ values[k]. */
  readonly vectors: Float64Array;
  /** W_B as compact real column-major d×d when the real fast path ran, else null. */
  readonly realVectors: Float64Array | null;
  /** ‖H_B·w_k − λ_k·w_k‖₂ per eigenpair. */
  readonly residuals: Float64Array;
  /** ‖R_B‖_F = √Σ r_k². */
  readonly residualNorm: number;
  /** δ_B = ‖W_BᴴW_B − I‖_F. */
  readonly orthogonality: number;
  /** True when the real fast path ran. */
  readonly real: boolean;
  /** W_BᴴW_B packed upper (kept when `keepGram`), else null. */
  readonly gram: Float64Array | null;
}

/** A Hamiltonian decomposed over a partition. */
export interface Decomposition {
  readonly partition: BasisPartition;
  readonly blocks: readonly BlockEigen[];
  /** η: the computed pairs are exact for some H + E with ‖E‖₂ ≤ η (file header). */
  readonly backwardError: number;
  /** max_B δ_B. */
  readonly orthogonality: number;
  /** max_B,k r_k. */
  readonly maxResidual: number;
  /** Size of the largest block. */
  readonly largestBlock: number;
  /** Number of blocks that took the real fast path. */
  readonly realBlocks: number;
}

/** Options of {@link decomposeBlocks}. */
export interface DecomposeOptions {
  /** Checked between blocks; rejects with an AbortError. */
  readonly signal?: AbortSignal;
  /** Keep each block's packed Gram matrix W_BᴴW_B (d(d+1) doubles). @defaultValue false */
  readonly keepGram?: boolean;
}

/**
 * Decomposes Σ terms block by block over `partition` of `basis` (see file header). Rejects with
 * an AbortError when aborted, and with a RangeError when the terms couple two blocks.
 */
export async function decomposeBlocks(
  terms: readonly PauliTermMask[], basis: SectorBasis, partition: BasisPartition, options: DecomposeOptions = {},
): Promise<Decomposition> {
  const { signal, keepGram = false } = options;
  let largest = 0;
  for (const b of partition.blocks) largest = Math.max(largest, b.length);
  const dense = new Float64Array(2 * largest * largest);
  const scratch = new Float64Array(2 * largest * largest);
  const ws = createHermitianEigenWorkspace(largest);
  const blocks: BlockEigen[] = [];
  let backwardError = 0;
  let orthogonality = 0;
  let maxResidual = 0;
  let realBlocks = 0;
  for (let b = 0; b < partition.blocks.length; b++) {
    await yieldIfDue(signal);
    const states = partition.blocks[b];
    const d = states.length;
    const sparse = blockMatrix(basis, partition, b, terms, true) ?? emptyBlock(d);
    denseBlock(sparse, dense);
    const values = new Float64Array(d);
    const vectors = new Float64Array(2 * d * d);
    const rep = hermitianEigen(d, dense, values, vectors, {}, ws);
    if (rep.real) realBlocks++;
    // Residuals r_k = ‖H w_k − λ_k w_k‖.
    applyBlock(sparse, vectors, scratch, d);
    const residuals = new Float64Array(d);
    let rf2 = 0;
    for (let k = 0; k < d; k++) {
      const lam = values[k];
      let s = 0;
      for (let i = 2 * k * d, end = 2 * (k + 1) * d; i < end; i++) {
        const r = scratch[i] - lam * vectors[i];
        s += r * r;
      }
      residuals[k] = Math.sqrt(s);
      rf2 += s;
      maxResidual = Math.max(maxResidual, residuals[k]);
    }
    // δ_B = ‖WᴴW − I‖_F from the packed upper triangle (off-diagonal entries count twice).
    let realVectors: Float64Array | null = null;
    if (rep.real) {
      realVectors = new Float64Array(d * d);
      for (let k = 0; k < d * d; k++) realVectors[k] = vectors[2 * k];
      scratch.fill(0, 0, d * (d + 1));
      realTransposeProduct(d, d, d, realVectors, realVectors, scratch, 'upper-packed', 2, 0);
    } else {
      complexAdjointProduct(d, d, d, vectors, vectors, scratch, 'upper-packed');
    }
    let o2 = 0;
    for (let j = 0; j < d; j++) {
      const col = j * (j + 1);
      for (let i = 0; i < j; i++) o2 += 2 * (scratch[col + 2 * i] ** 2 + scratch[col + 2 * i + 1] ** 2);
      o2 += (scratch[col + 2 * j] - 1) ** 2 + scratch[col + 2 * j + 1] ** 2;
    }
    const delta = Math.sqrt(o2);
    const residualNorm = Math.sqrt(rf2);
    const halfWidth = d > 0 ? (values[d - 1] - values[0]) / 2 : 0;
    backwardError = Math.max(backwardError, residualNorm + 2 * halfWidth * delta);
    orthogonality = Math.max(orthogonality, delta);
    const gram = keepGram ? scratch.slice(0, d * (d + 1)) : null;
    blocks.push({ states, values, vectors, realVectors, residuals, residualNorm, orthogonality: delta, real: rep.real, gram });
  }
  return {
    partition, blocks, backwardError, orthogonality, maxResidual, largestBlock: largest, realBlocks,
  };
}

/** The zero d×d block (a Hamiltonian without entries in it, e.g. H = 0 on a sector). */
function emptyBlock(d: number) {
  return { size: d, colStart: new Int32Array(d + 1), row: new Int32Array(0), re: new Float64Array(0), im: new Float64Array(0), real: true };
}
