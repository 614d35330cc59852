/**
 * joinPartitions — the finest partition that both `a` and `b` refine: two states share a block
 * of the join when a chain of blocks of a and b links them (connected components, by
 * union–find with path halving). An operator block-diagonal in a and one block-diagonal in b
 * are both block-diagonal in the join — the blocks a quench with H0 ≠ H1 can use.
 * Cost: O(dim·α(dim)) time, 4·dim bytes of scratch.
 */
import { partitionByLabel } from './basis-partition.js';
import type { BasisPartition } from './basis-partition.js';

/**
 * The join of two partitions of the same basis.
 * @throws RangeError when the dimensions differ.
 */
export function joinPartitions(a: BasisPartition, b: BasisPartition): BasisPartition {
  if (a.dim !== b.dim) throw new RangeError(`partitions of different bases: a.dim = ${a.dim}, b.dim = ${b.dim}`);
  const parent = new Int32Array(a.dim);
  for (let s = 0; s < a.dim; s++) parent[s] = s;
  const find = (s: number): number => {
    while (parent[s] !== s) {
      parent[s] = parent[parent[s]];
      s = parent[s];
    }
    return s;
  };
  for (const p of [a, b]) {
    for (const block of p.blocks) {
      let root = find(block[0]);
      for (let i = 1; i < block.length; i++) {
        const r = find(block[i]);
        if (r !== root) {
          // Attach to the smaller root so roots stay the smallest state of a component.
          if (r < root) {
            parent[root] = r;
            root = r;
          } else {
            parent[r] = root;
          }
        }
      }
    }
  }
  // Component roots as labels; a second find after all unions.
  const symmetry = a.symmetry === b.symmetry ? a.symmetry : 'joint';
  return partitionByLabel(a.dim, (s) => find(s), symmetry);
}
