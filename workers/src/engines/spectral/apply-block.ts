/**
 * applyBlock — Y ← H_B·X for `cols` block-local column vectors, matrix-free from the compiled
 * tables (the sparse counterpart of denseBlock): for each state b_j of the block,
 *   Y(j) += ⟨b_j|H|b_j⟩·X(j),   Y(pos(b_j ⊕ x)) += ⟨b_j ⊕ x|H|b_j⟩·X(j)  per flip group x,
 * keeping only targets inside the block (the partition is a symmetry of H, so nothing else is
 * non-zero). Used for eigen-residuals H·w − λ·w and for H1·V.
 * Storage: column-major complex interleaved, ld = d.
 *
 * Cost: 8·d·(G + 1) flops per column for G flip groups; no allocation.
 */
import { groupEntryIm, groupEntryRe } from '../../kernels/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import type { BasisPartition } from '../../symmetry/index.js';

/** Y (≥ 2·d·cols doubles) ← H_B·X. Unchecked kernel; `x` and `y` must not overlap. */
export function applyBlock(
  op: CompiledOperator, partition: BasisPartition, block: number, x: Float64Array, y: Float64Array, cols: number,
): void {
  const states = partition.blocks[block];
  const d = states.length;
  const { blockOf, position } = partition;
  y.fill(0, 0, 2 * d * cols);
  const groups = op.groups;
  const diag = op.diagonal;
  // Column-outer: each column's X and Y stay in cache while the tables stream past.
  for (let c = 0; c < cols; c++) {
    const base = 2 * c * d;
    for (let j = 0; j < d; j++) {
      const s = states[j];
      const q = base + 2 * j;
      const xr = x[q], xi = x[q + 1];
      if (diag !== null) {
        const h = diag[s];
        y[q] += h * xr;
        y[q + 1] += h * xi;
      }
      for (let k = 0; k < groups.length; k++) {
        const g = groups[k];
        const t = s ^ g.x;
        if (blockOf[t] !== block) continue;
        const re = g.table.length > 0 ? g.table[2 * s] : groupEntryRe(g, s);
        const im = g.table.length > 0 ? g.table[2 * s + 1] : (g.real ? 0 : groupEntryIm(g, s));
        const p = base + 2 * position[t];
        y[p] += re * xr - im * xi;
        y[p + 1] += re * xi + im * xr;
      }
    }
  }
}
