/**
 * LatticeCells — the unit-cell structure behind buildLattice's site numbering
 * (lattice/build-lattice.ts: site = b + nb·(x + Lx·y), b the basis index), used to translate
 * sites along periodic directions (exact symmetries of preset Hamiltonians on such lattices).
 * Explicit bond lists have no cell structure (null).
 * Cost: O(1) per site operation.
 */
import type { Lattice } from '../../../shared-types/src/index.js';

/** Cell layout of a generated lattice. */
export interface LatticeCells {
  readonly kind: Lattice['kind'];
  /** Basis sites per cell. */
  readonly nb: number;
  readonly lx: number;
  readonly ly: number;
  /** Periodic flags [x, y]. */
  readonly periodic: readonly [boolean, boolean];
}

/** The cell layout of a lattice spec, or null for an explicit bond list. */
export function latticeCells(lattice: Lattice): LatticeCells | null {
  const per = (b: string) => b === 'periodic';
  switch (lattice.kind) {
    case 'chain': return { kind: 'chain', nb: 1, lx: lattice.length, ly: 1, periodic: [per(lattice.boundary), false] };
    case 'ladder': return { kind: 'ladder', nb: 1, lx: lattice.length, ly: 2, periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])] };
    case 'square':
    case 'triangular':
      return { kind: lattice.kind, nb: 1, lx: lattice.size[0], ly: lattice.size[1], periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])] };
    case 'honeycomb':
      return { kind: 'honeycomb', nb: 2, lx: lattice.size[0], ly: lattice.size[1], periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])] };
    default: return null;
  }
}

/** [b, x, y] of a site. */
export function cellCoordinates(c: LatticeCells, site: number): [number, number, number] {
  const b = site % c.nb;
  const cell = (site - b) / c.nb;
  return [b, cell % c.lx, Math.floor(cell / c.lx)];
}

/** The site of (b, x, y) (no range check). */
export function siteOfCell(c: LatticeCells, b: number, x: number, y: number): number {
  return b + c.nb * (x + c.lx * y);
}

/**
 * The site translated by (dx, dy) cells; a shift along an open direction is refused (null)
 * unless it is 0. Periodic directions wrap.
 */
export function translateSite(c: LatticeCells, site: number, dx: number, dy: number): number | null {
  if ((dx !== 0 && !c.periodic[0]) || (dy !== 0 && !c.periodic[1])) return null;
  const [b, x, y] = cellCoordinates(c, site);
  const nx = (((x + dx) % c.lx) + c.lx) % c.lx;
  const ny = (((y + dy) % c.ly) + c.ly) % c.ly;
  return siteOfCell(c, b, nx, ny);
}

/** The central cell (⌊Lx/2⌋, ⌊Ly/2⌋). */
export function centralCell(c: LatticeCells): [number, number] {
  return [Math.floor(c.lx / 2), Math.floor(c.ly / 2)];
}
