/**
 * denseBlock — a sparse symmetry block (symmetry/block-matrix.ts) as a dense complex matrix,
 * column-major, complex interleaved (element (i, j) at 2·(i + j·d)), the layout hermitianEigen
 * reads. Entries are copied, not recomputed.
 *
 * Cost: zeroing 2d² doubles plus one store per non-zero entry; no allocation.
 */
import type { SparseBlock } from '../../symmetry/index.js';

/**
 * Fills `out` (≥ 2d² doubles) with the block.
 * @throws RangeError if `out` is too short.
 */
export function denseBlock(block: SparseBlock, out: Float64Array): void {
  const d = block.size;
  if (out.length < 2 * d * d) throw new RangeError(`out must hold at least ${2 * d * d} doubles; got ${out.length}`);
  out.fill(0, 0, 2 * d * d);
  const { colStart, row, re, im } = block;
  for (let j = 0; j < d; j++) {
    const col = 2 * j * d;
    for (let p = colStart[j]; p < colStart[j + 1]; p++) {
      out[col + 2 * row[p]] = re[p];
      out[col + 2 * row[p] + 1] = im[p];
    }
  }
}
