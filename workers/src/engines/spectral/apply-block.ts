/**
 * applyBlock — Y ← A·X for a sparse symmetry block A (symmetry/block-matrix.ts, d×d, by
 * columns) and `cols` dense complex column vectors (column-major, interleaved, ld = d): the
 * matrix-free counterpart of denseBlock, used for eigen-residuals H·w − λ·w and for H1·V.
 *
 * Cost: 8 flops per stored entry per column; no allocation.
 */
import type { SparseBlock } from '../../symmetry/index.js';

/** Y (≥ 2·d·cols doubles) ← A·X. Unchecked kernel; `x` and `y` must not overlap. */
export function applyBlock(block: SparseBlock, x: Float64Array, y: Float64Array, cols: number): void {
  const d = block.size;
  const { colStart, row, re, im } = block;
  y.fill(0, 0, 2 * d * cols);
  // Column-outer: each column's X and Y stay in cache while the entries stream past.
  for (let c = 0; c < cols; c++) {
    const base = 2 * c * d;
    for (let j = 0; j < d; j++) {
      const xr = x[base + 2 * j], xi = x[base + 2 * j + 1];
      if (xr === 0 && xi === 0) continue;
      for (let p = colStart[j]; p < colStart[j + 1]; p++) {
        const q = base + 2 * row[p];
        const ar = re[p], ai = im[p];
        y[q] += ar * xr - ai * xi;
        y[q + 1] += ar * xi + ai * xr;
      }
    }
  }
}
