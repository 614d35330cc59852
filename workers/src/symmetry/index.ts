/**
 * Symmetry blocks of the computational basis (public door of workers/src/symmetry): which
 * basis states a set of Hamiltonians keeps together. Used by the spectral engine.
 */
export { partitionByLabel } from './basis-partition.js';
export type { BasisPartition } from './basis-partition.js';
export { joinPartitions } from './join-partitions.js';
export { conservesMagnetisation } from './conserves-magnetisation.js';
export { symmetryBlocks } from './symmetry-blocks.js';
export type { SymmetryMode } from './symmetry-blocks.js';
