/**
 * symmetryBlocks — the basis partition a Hamiltonian is block-diagonal in, for a requested
 * symmetry mode:
 *   'none'           one block (the whole 2^N space);
 *   'magnetisation'  popcount sectors (fixed Σ_i Z_i) when conservesMagnetisation(h) holds,
 *                    else one block.
 * Translations and reflections are not used: momentum sectors need symmetrised (complex)
 * basis vectors rather than subsets of the computational basis, which this partition type
 * cannot express (workers/src/engines/spectral/README.md).
 * Cost: O(T·N) for the algebra check, O(2^N) for the tables.
 */
import { partitionByLabel } from './basis-partition.js';
import type { BasisPartition } from './basis-partition.js';
import { conservesMagnetisation } from './conserves-magnetisation.js';
import { popcount } from '../physics/pauli-algebra.js';
import type { PauliSum } from '../physics/types.js';

/** Which symmetries may split the basis. */
export type SymmetryMode = 'none' | 'magnetisation';

/** The partition for `h` under `mode` (see the file header). */
export function symmetryBlocks(h: PauliSum, mode: SymmetryMode): BasisPartition {
  const dim = 2 ** h.sites;
  if (mode === 'magnetisation' && conservesMagnetisation(h)) {
    return partitionByLabel(dim, popcount, 'magnetisation');
  }
  return partitionByLabel(dim, () => 0, 'none');
}
