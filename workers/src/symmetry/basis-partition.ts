/**
 * BasisPartition — a split of the vectors of a basis (the computational basis states, or the
 * symmetry-adapted vectors of sector-basis.ts, numbered 0..dim−1) into blocks that a set of
 * operators leaves invariant (block-diagonal operators), and partitionByLabel, which builds one
 * from a label per basis vector (vectors with equal labels share a block).
 *
 * Blocks are ordered by their smallest vector; vectors inside a block ascend. `blockOf[q]` and
 * `position[q]` map a basis vector to its block and to its index inside the block, so a
 * block-local entry i stands for the basis vector blocks[b][i].
 * Cost: O(dim) time, 12·dim bytes (three Int32 tables).
 */

/** A partition of the basis vectors {0, …, dim − 1} into invariant blocks. */
export interface BasisPartition {
  /** Number of basis vectors. */
  readonly dim: number;
  /** The blocks: ascending vector indices; blocks ordered by their first vector. */
  readonly blocks: readonly Int32Array[];
  /** Block index of each vector. */
  readonly blockOf: Int32Array;
  /** Index of each vector inside its block. */
  readonly position: Int32Array;
  /** Which symmetries made the blocks, for reports (e.g. 'magnetisation + translation a1 (order 8)'). */
  readonly symmetry: string;
}

/**
 * The partition grouping basis vectors q with equal `label(q)` (any integers).
 * @throws RangeError if dim is not a positive integer or a label is not an integer.
 */
export function partitionByLabel(dim: number, label: (s: number) => number, symmetry: string): BasisPartition {
  if (!Number.isInteger(dim) || dim < 1) throw new RangeError(`dim must be a positive integer; got ${dim}`);
  const blockOf = new Int32Array(dim);
  const position = new Int32Array(dim);
  const index = new Map<number, number>();
  const sizes: number[] = [];
  for (let s = 0; s < dim; s++) {
    const l = label(s);
    if (!Number.isInteger(l)) throw new RangeError(`label(${s}) must be an integer; got ${l}`);
    let b = index.get(l);
    if (b === undefined) {
      b = sizes.length;
      index.set(l, b);
      sizes.push(0);
    }
    blockOf[s] = b;
    position[s] = sizes[b]++;
  }
  const blocks = sizes.map((n) => new Int32Array(n));
  for (let s = 0; s < dim; s++) blocks[blockOf[s]][position[s]] = s;
  return { dim, blocks, blockOf, position, symmetry };
}
