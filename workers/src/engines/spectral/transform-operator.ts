/**
 * transformOperator — the block of a Hermitian operator in an eigenbasis:
 * Õ = V_Jᴴ·O_JJ·V_J, packed upper (column n holds Õ_mn for m ≤ n at 2·(n(n+1)/2 + m)), from
 * O_JJ as a sparse symmetry block (symmetry/block-matrix.ts: off-diagonal blocks of O are
 * already dropped there, since they never contribute to Tr(ρ·U†OU) when ρ and U are
 * block-diagonal; a block without entries is null and never reaches this function).
 *
 * Cost: 8 flops per stored entry per column for O·V, then complexAdjointProduct packed:
 * ≈ 4·d³ flops. Scratch 2d² doubles.
 */
import { complexAdjointProduct } from '../../linalg/complex-adjoint-product.js';
import type { SparseBlock } from '../../symmetry/index.js';
import { applyBlock } from './apply-block.js';

/**
 * Writes V_Jᴴ·O_JJ·V_J packed into `out` (≥ d(d+1) doubles). `vectors` is V_J (2d² doubles,
 * column-major); `scratch` needs 2d² doubles.
 */
export function transformOperator(op: SparseBlock, vectors: Float64Array, scratch: Float64Array, out: Float64Array): void {
  const d = op.size;
  applyBlock(op, vectors, scratch, d);
  complexAdjointProduct(d, d, d, vectors, scratch, out, 'upper-packed');
}
