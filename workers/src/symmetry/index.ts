/**
 * Symmetry blocks (public door of workers/src/symmetry): which symmetries a quench keeps
 * (conserved magnetisation, lattice translations, one reflection — decided from the Pauli
 * terms), the symmetry-adapted basis they define, its blocks, and the blocks of Pauli sums in
 * it. Used by the spectral engine.
 */
export { partitionByLabel } from './basis-partition.js';
export type { BasisPartition } from './basis-partition.js';
export { conservesMagnetisation } from './conserves-magnetisation.js';
export { analyseSymmetry, SYMMETRY_MODES } from './analyse-symmetry.js';
export type { SymmetryAnalysis, SymmetryMode } from './analyse-symmetry.js';
export { latticePermutations } from './lattice-permutations.js';
export type { LatticePermutations, ReflectionCandidate, TranslationCandidate } from './lattice-permutations.js';
export { termTable, invariantUnder } from './invariant-under.js';
export type { TermTable } from './invariant-under.js';
export { chooseSpatialGroup, trivialGroup } from './spatial-group.js';
export type { SpatialGroup, SymmetryChoice } from './spatial-group.js';
export { groupSectors } from './group-sectors.js';
export type { Sector } from './group-sectors.js';
export { sectorDimensions } from './sector-dimensions.js';
export { orbitTable } from './orbit-table.js';
export type { OrbitTable } from './orbit-table.js';
export { sectorBasis, sectorOrbits } from './sector-basis.js';
export type { SectorBasis } from './sector-basis.js';
export { blockShapes, sectorPartition, blockSector } from './sector-blocks.js';
export type { BlockShape } from './sector-blocks.js';
export { blockMatrix } from './block-matrix.js';
export type { SparseBlock } from './block-matrix.js';
export { symmetriseTerms } from './symmetrise-terms.js';
export {
  checkPermutation, composePermutations, cycleLengths, identityPermutation, isIdentityPermutation,
  mapState, permutationKey, permutationPower, permuteMask, stateMapper,
} from './site-permutation.js';
export type { SitePermutation } from './site-permutation.js';
