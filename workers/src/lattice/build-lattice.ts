/**
 * Builds the site graph of a lattice spec: nearest and next-nearest bonds, coordinates,
 * sublattice signs and a minimum-image distance.
 *
 * Geometry (unit nearest-neighbour spacing everywhere):
 * - chain: sites at (x, 0); bonds x–x+1; far bonds x–x+2.
 * - ladder: legs y = 0, 1 at (x, y); site = x + L·y; leg bonds, rung bonds, and the two
 *   plaquette diagonals as far bonds. `boundary` = [along the legs, across the rungs]; across
 *   has length 2, so periodic across still gives one rung per x.
 * - square: site = x + Lx·y at (x, y); far bonds along the diagonals (distance √2).
 * - triangular: a1 = (1, 0), a2 = (1/2, √3/2); neighbours at a1, a2, a1 − a2; far bonds at
 *   a1 + a2, 2a2 − a1, 2a1 − a2 (distance √3).
 * - honeycomb: a1 = (√3, 0), a2 = (√3/2, 3/2); sublattice A at the cell origin, B at +(0, 1);
 *   site = 2·(x + Lx·y) + s (s = 0 for A, 1 for B). A(x, y) bonds to B(x, y), B(x, y−1),
 *   B(x+1, y−1); far bonds join equal sublattices at a1, a2, a1 − a2 (distance √3). On a torus
 *   large enough that is 3 bonds and 6 far bonds per unit cell.
 * - bonds (explicit): as given, normalised to i < j; self-bonds and duplicates are rejected.
 *   Positions default to a line, site i at (i, 0) (so distance = |i − j|), open boundaries.
 *
 * Rules common to the generated lattices: bonds are generated per site and per offset, wrapped
 * along periodic directions, then de-duplicated, so a periodic direction of length 2 gives one
 * bond (not two) and one of length 1 gives none (no self-bonds). Far bonds that coincide with a
 * nearest bond (e.g. a periodic ring of 3) are dropped, so the two lists are disjoint. Both
 * lists are sorted by (i, j). Sublattice signs come from a 2-colouring of the nearest-bond
 * graph (the lowest site of each connected component gets +1); null if the graph has an odd
 * cycle (triangular plaquettes, odd periodic rings).
 */
import type { Lattice } from '../../../shared-types/src/index.js';
import { LIMITS } from '../../../shared-types/src/index.js';
import type { LatticeGraph } from '../physics/types.js';

type Vec = readonly [number, number];
/** A bond offset: from basis site `from` of cell (x, y) to basis site `to` of cell (x + dx, y + dy). */
type Offset = readonly [from: number, to: number, dx: number, dy: number];

interface CellLattice {
  a1: Vec;
  a2: Vec;
  basis: readonly Vec[];
  lx: number;
  ly: number;
  periodic: readonly [boolean, boolean];
  nearest: readonly Offset[];
  far: readonly Offset[];
}

const S3 = Math.sqrt(3);

/**
 * Builds the {@link LatticeGraph} of a lattice spec (see the file comment for geometry and
 * numbering).
 * @throws RangeError if the lattice has more than LIMITS.maxSites sites, or (explicit bonds)
 *   a bond names a site outside 0..sites−1, joins a site to itself, or is repeated.
 */
export function buildLattice(lattice: Lattice): LatticeGraph {
  const per = (b: string) => b === 'periodic';
  switch (lattice.kind) {
    case 'chain':
      return buildCells({
        a1: [1, 0], a2: [0, 1], basis: [[0, 0]], lx: lattice.length, ly: 1,
        periodic: [per(lattice.boundary), false],
        nearest: [[0, 0, 1, 0]], far: [[0, 0, 2, 0]],
      });
    case 'ladder':
      return buildCells({
        a1: [1, 0], a2: [0, 1], basis: [[0, 0]], lx: lattice.length, ly: 2,
        periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])],
        nearest: [[0, 0, 1, 0], [0, 0, 0, 1]], far: [[0, 0, 1, 1], [0, 0, 1, -1]],
      });
    case 'square':
      return buildCells({
        a1: [1, 0], a2: [0, 1], basis: [[0, 0]], lx: lattice.size[0], ly: lattice.size[1],
        periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])],
        nearest: [[0, 0, 1, 0], [0, 0, 0, 1]], far: [[0, 0, 1, 1], [0, 0, 1, -1]],
      });
    case 'triangular':
      return buildCells({
        a1: [1, 0], a2: [0.5, S3 / 2], basis: [[0, 0]], lx: lattice.size[0], ly: lattice.size[1],
        periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])],
        nearest: [[0, 0, 1, 0], [0, 0, 0, 1], [0, 0, 1, -1]],
        far: [[0, 0, 1, 1], [0, 0, -1, 2], [0, 0, 2, -1]],
      });
    case 'honeycomb':
      return buildCells({
        a1: [S3, 0], a2: [S3 / 2, 1.5], basis: [[0, 0], [0, 1]], lx: lattice.size[0], ly: lattice.size[1],
        periodic: [per(lattice.boundary[0]), per(lattice.boundary[1])],
        nearest: [[0, 1, 0, 0], [0, 1, 0, -1], [0, 1, 1, -1]],
        far: [[0, 0, 1, 0], [0, 0, 0, 1], [0, 0, 1, -1], [1, 1, 1, 0], [1, 1, 0, 1], [1, 1, 1, -1]],
      });
    case 'bonds':
      return buildExplicit(lattice);
    default: {
      const never: never = lattice;
      throw new TypeError(`buildLattice: unknown lattice kind ${JSON.stringify(never)}`);
    }
  }
}

function checkSiteCount(sites: number): void {
  if (sites > LIMITS.maxSites) {
    throw new RangeError(`buildLattice: ${sites} sites exceeds the limit of ${LIMITS.maxSites}`);
  }
}

function sortPairs(pairs: Array<readonly [number, number]>): Array<readonly [number, number]> {
  return pairs.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
}

function buildCells(c: CellLattice): LatticeGraph {
  const nb = c.basis.length;
  const sites = nb * c.lx * c.ly;
  checkSiteCount(sites);
  const siteOf = (b: number, x: number, y: number) => b + nb * (x + c.lx * y);
  const wrap = (v: number, len: number, periodic: boolean): number | null => {
    if (periodic) return ((v % len) + len) % len;
    return v >= 0 && v < len ? v : null;
  };

  const collect = (offsets: readonly Offset[], exclude: Set<number> | null) => {
    const seen = new Set<number>();
    const out: Array<readonly [number, number]> = [];
    for (let y = 0; y < c.ly; y++) {
      for (let x = 0; x < c.lx; x++) {
        for (const [from, to, dx, dy] of offsets) {
          const nx = wrap(x + dx, c.lx, c.periodic[0]);
          const ny = wrap(y + dy, c.ly, c.periodic[1]);
          if (nx === null || ny === null) continue;
          const a = siteOf(from, x, y);
          const b = siteOf(to, nx, ny);
          if (a === b) continue;
          const i = Math.min(a, b);
          const j = Math.max(a, b);
          const key = i * sites + j;
          if (seen.has(key) || exclude?.has(key)) continue;
          seen.add(key);
          out.push([i, j]);
        }
      }
    }
    return { pairs: sortPairs(out), keys: seen };
  };
  const near = collect(c.nearest, null);
  const far = collect(c.far, near.keys);

  const positions: Array<readonly [number, number]> = new Array(sites);
  for (let y = 0; y < c.ly; y++) {
    for (let x = 0; x < c.lx; x++) {
      for (let b = 0; b < nb; b++) {
        positions[siteOf(b, x, y)] = [
          x * c.a1[0] + y * c.a2[0] + c.basis[b][0],
          x * c.a1[1] + y * c.a2[1] + c.basis[b][1],
        ];
      }
    }
  }

  // Minimum image: reduce the cell difference to the nearest period, then search a small box
  // of period shifts (wider when the cell is skewed and both directions wrap).
  const skewed = c.a1[0] * c.a2[0] + c.a1[1] * c.a2[1] !== 0 && c.periodic[0] && c.periodic[1];
  const m1 = c.periodic[0] ? (skewed ? 2 + Math.ceil(c.ly / c.lx) : 1) : 0;
  const m2 = c.periodic[1] ? (skewed ? 2 + Math.ceil(c.lx / c.ly) : 1) : 0;
  const cache = new Map<number, number>();
  const distance = (i: number, j: number): number => {
    checkIndex(i, sites);
    checkIndex(j, sites);
    const bi = i % nb;
    const bj = j % nb;
    const ci = (i - bi) / nb;
    const cj = (j - bj) / nb;
    let dx = (cj % c.lx) - (ci % c.lx);
    let dy = Math.floor(cj / c.lx) - Math.floor(ci / c.lx);
    if (c.periodic[0]) dx -= c.lx * Math.round(dx / c.lx);
    if (c.periodic[1]) dy -= c.ly * Math.round(dy / c.ly);
    const key = ((dx + c.lx) * (2 * c.ly + 1) + (dy + c.ly)) * nb * nb + bi * nb + bj;
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const bx = c.basis[bj][0] - c.basis[bi][0];
    const by = c.basis[bj][1] - c.basis[bi][1];
    let best = Infinity;
    for (let n1 = -m1; n1 <= m1; n1++) {
      for (let n2 = -m2; n2 <= m2; n2++) {
        const u = dx + n1 * c.lx;
        const v = dy + n2 * c.ly;
        const rx = u * c.a1[0] + v * c.a2[0] + bx;
        const ry = u * c.a1[1] + v * c.a2[1] + by;
        best = Math.min(best, Math.hypot(rx, ry));
      }
    }
    cache.set(key, best);
    return best;
  };

  return {
    sites,
    bonds: near.pairs,
    farBonds: far.pairs,
    positions,
    sublattice: twoColour(sites, near.pairs),
    distance,
  };
}

function checkIndex(i: number, sites: number): void {
  if (!Number.isInteger(i) || i < 0 || i >= sites) {
    throw new RangeError(`distance: site ${i} is outside the lattice (sites 0..${sites - 1})`);
  }
}

/** ±1 per site from a BFS 2-colouring of the bond graph, or null if some bond joins equal colours. */
function twoColour(sites: number, bonds: ReadonlyArray<readonly [number, number]>): number[] | null {
  const adj: number[][] = Array.from({ length: sites }, () => []);
  for (const [i, j] of bonds) {
    adj[i].push(j);
    adj[j].push(i);
  }
  const colour = new Array<number>(sites).fill(0);
  const queue: number[] = [];
  for (let s = 0; s < sites; s++) {
    if (colour[s] !== 0) continue;
    colour[s] = 1;
    queue.length = 0;
    queue.push(s);
    for (let q = 0; q < queue.length; q++) {
      const u = queue[q];
      for (const v of adj[u]) {
        if (colour[v] === 0) {
          colour[v] = -colour[u];
          queue.push(v);
        } else if (colour[v] === colour[u]) return null;
      }
    }
  }
  return colour;
}

type BondList = Extract<Lattice, { kind: 'bonds' }>;

function normaliseBonds(
  list: ReadonlyArray<readonly [number, number]>, field: string, sites: number, seen: Set<number>,
): Array<readonly [number, number]> {
  return list.map(([a, b], k) => {
    for (const s of [a, b]) {
      if (!Number.isInteger(s) || s < 0 || s >= sites) {
        throw new RangeError(`buildLattice: ${field}[${k}] names site ${s}, outside the lattice (sites 0..${sites - 1})`);
      }
    }
    if (a === b) throw new RangeError(`buildLattice: ${field}[${k}] joins site ${a} to itself`);
    const i = Math.min(a, b);
    const j = Math.max(a, b);
    const key = i * sites + j;
    if (seen.has(key)) throw new RangeError(`buildLattice: ${field}[${k}] repeats the bond ${i}-${j}`);
    seen.add(key);
    return [i, j] as const;
  });
}

function buildExplicit(l: BondList): LatticeGraph {
  const sites = l.sites;
  checkSiteCount(sites);
  const seen = new Set<number>();
  const bonds = normaliseBonds(l.bonds, 'bonds', sites, seen);
  const farBonds = normaliseBonds(l.farBonds ?? [], 'farBonds', sites, seen);
  let positions: Array<readonly [number, number]>;
  if (l.positions !== undefined) {
    if (l.positions.length !== sites) {
      throw new RangeError(`buildLattice: positions has ${l.positions.length} entries, expected ${sites} (one per site)`);
    }
    positions = l.positions.map(([px, py]) => [px, py] as const);
  } else {
    positions = Array.from({ length: sites }, (_, i) => [i, 0] as const);
  }
  return {
    sites,
    bonds,
    farBonds,
    positions,
    sublattice: twoColour(sites, bonds),
    distance: (i, j) => {
      checkIndex(i, sites);
      checkIndex(j, sites);
      return Math.hypot(positions[j][0] - positions[i][0], positions[j][1] - positions[i][1]);
    },
  };
}
