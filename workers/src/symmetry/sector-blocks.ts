/**
 * The blocks a Hamiltonian is split into: one per symmetry sector, further split by
 * magnetisation M (popcount of the representative; site permutations keep it) when Σ_i Z_i is
 * conserved.
 *   blockShapes      sizes, multiplicities and magnetisations from the character counts
 *                    (sector-dimensions.ts), without building the basis — for plans;
 *   sectorPartition  the same blocks over the vectors of a built basis (basis-partition.ts),
 *                    ordered by sector, then by first appearance of M — for runs.
 * Both list the same multiset of blocks (checked in the unit tests).
 * Cost: blockShapes O(|G|²·N²); sectorPartition O(vectors).
 */
import { popcount } from '../kernels/parity.js';
import { partitionByLabel } from './basis-partition.js';
import type { BasisPartition } from './basis-partition.js';
import type { Sector } from './group-sectors.js';
import type { SectorBasis } from './sector-basis.js';
import { sectorDimensions } from './sector-dimensions.js';
import type { SpatialGroup } from './spatial-group.js';

/** Shape of one block, for cost estimates. */
export interface BlockShape {
  readonly size: number;
  /** Sectors it stands for (1, or 2 for a sector kept for its mirror image too). */
  readonly multiplicity: number;
  /** The sector's characters are real (real Hamiltonian terms then give a real block). */
  readonly realCharacters: boolean;
  /** M (bits set) when split by magnetisation, else null. */
  readonly magnetisation: number | null;
}

/** Non-empty blocks of every sector (see the file header). */
export function blockShapes(group: SpatialGroup, sectors: readonly Sector[], byMagnetisation: boolean): BlockShape[] {
  const dims = sectorDimensions(group, sectors);
  const out: BlockShape[] = [];
  sectors.forEach((s, sigma) => {
    const base = { multiplicity: s.multiplicity, realCharacters: s.real };
    if (byMagnetisation) {
      dims[sigma].forEach((size, m) => { if (size > 0) out.push({ ...base, size, magnetisation: m }); });
    } else {
      const size = dims[sigma].reduce((a, b) => a + b, 0);
      if (size > 0) out.push({ ...base, size, magnetisation: null });
    }
  });
  return out;
}

/** The partition of a built basis into sector (and magnetisation) blocks. */
export function sectorPartition(basis: SectorBasis, byMagnetisation: boolean, name: string): BasisPartition {
  const stride = basis.sites + 1;
  return partitionByLabel(basis.count, (q) => basis.sectorOf[q] * stride + (byMagnetisation ? popcount(basis.rep[q]) : 0), name);
}

/** The sector of block b (all its vectors share one). */
export function blockSector(basis: SectorBasis, partition: BasisPartition, b: number): Sector {
  return basis.sectors[basis.sectorOf[partition.blocks[b][0]]];
}
