/**
 * denseBlock — one symmetry block of a compiled Pauli sum as a dense complex matrix:
 *   H_B(i, j) = ⟨b_i|H|b_j⟩,  b = partition.blocks[block] (ascending basis states),
 * column-major, complex interleaved (element (i, j) at 2·(i + j·d)), the layout hermitianEigen
 * reads. Column j collects the diagonal entry of b_j and, per flip group x, the entry
 * ⟨b_j ⊕ x|H|b_j⟩ (compile-operator.ts) when b_j ⊕ x lies in the same block; an entry that
 * leaves the block means the partition is not invariant under H, which is an error.
 *
 * Cost: O(d·(G + 1)) for d states and G flip groups, plus zeroing 2d² doubles; no allocation.
 */
import { groupEntryIm, groupEntryRe } from '../../kernels/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import type { BasisPartition } from '../../symmetry/index.js';

/**
 * Fills `out` (≥ 2d² doubles) with block `block` of `op`.
 * @throws RangeError if `out` is too short, or if H couples the block to another block by a
 *   non-zero entry (the partition is not a symmetry of H).
 */
export function denseBlock(op: CompiledOperator, partition: BasisPartition, block: number, out: Float64Array): void {
  const states = partition.blocks[block];
  const d = states.length;
  if (out.length < 2 * d * d) throw new RangeError(`out must hold at least ${2 * d * d} doubles; got ${out.length}`);
  out.fill(0, 0, 2 * d * d);
  const { blockOf, position } = partition;
  for (let j = 0; j < d; j++) {
    const s = states[j];
    const col = 2 * j * d;
    if (op.diagonal !== null) out[col + 2 * j] = op.diagonal[s];
    else out[col + 2 * j] = op.shift;
    for (const g of op.groups) {
      const re = g.table.length > 0 ? g.table[2 * s] : groupEntryRe(g, s);
      const im = g.table.length > 0 ? g.table[2 * s + 1] : (g.real ? 0 : groupEntryIm(g, s));
      if (re === 0 && im === 0) continue;
      const t = s ^ g.x;
      if (blockOf[t] !== block) {
        throw new RangeError(`the operator couples basis states ${s} and ${t} across blocks ${block} and ${blockOf[t]}: the partition is not a symmetry`);
      }
      const p = col + 2 * position[t];
      out[p] += re;
      out[p + 1] += im;
    }
  }
}
