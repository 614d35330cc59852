import { describe, expect, it } from 'vitest';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import type { LatticeGraph } from '../../../workers/src/physics/types.js';
import type { Lattice } from '../../../shared-types/src/index.js';

// Geometric tolerances: distances are sums of a few products of O(10) numbers (rounding only).
const GEOM = 1e-12;
const P = 'periodic' as const;
const O = 'open' as const;

function degrees(g: LatticeGraph, list = g.bonds): number[] {
  const d = new Array<number>(g.sites).fill(0);
  for (const [i, j] of list) { d[i]++; d[j]++; }
  return d;
}

function expectWellFormed(g: LatticeGraph): void {
  const keys = new Set<string>();
  for (const [i, j] of [...g.bonds, ...g.farBonds]) {
    expect(i).toBeLessThan(j);
    expect(j).toBeLessThan(g.sites);
    keys.add(`${i}-${j}`);
  }
  // no pair twice, and bonds and farBonds disjoint
  expect(keys.size).toBe(g.bonds.length + g.farBonds.length);
  expect(g.positions.length).toBe(g.sites);
}

const chain = (length: number, boundary: 'open' | 'periodic'): Lattice => ({ kind: 'chain', length, boundary });

describe('buildLattice: chain', () => {
  it.each([
    [2, O, 1, 0], [3, O, 2, 1], [5, O, 4, 3],
    // periodic L=2: one bond, not two; L=3: next-nearest pairs are nearest the other way round, so none
    [2, P, 1, 0], [3, P, 3, 0], [4, P, 4, 2], [5, P, 5, 5],
    [1, P, 0, 0], [1, O, 0, 0],
  ] as const)('length %i %s has %i bonds and %i far bonds', (length, boundary, nb, nf) => {
    const g = buildLattice(chain(length, boundary));
    expectWellFormed(g);
    expect(g.sites).toBe(length);
    expect(g.bonds.length).toBe(nb);
    expect(g.farBonds.length).toBe(nf);
  });

  it('wraps the distance around a periodic ring and not an open one', () => {
    const ring = buildLattice(chain(6, P));
    expect(ring.distance(0, 5)).toBe(1);
    expect(ring.distance(0, 3)).toBe(3);
    expect(ring.distance(4, 1)).toBe(3);
    expect(buildLattice(chain(6, O)).distance(0, 5)).toBe(5);
  });

  it('is bipartite when open or an even ring, not for an odd ring', () => {
    expect(buildLattice(chain(5, O)).sublattice).toEqual([1, -1, 1, -1, 1]);
    expect(buildLattice(chain(6, P)).sublattice).toEqual([1, -1, 1, -1, 1, -1]);
    expect(buildLattice(chain(5, P)).sublattice).toBeNull();
    expect(buildLattice(chain(1, P)).sublattice).toEqual([1]);
  });

  it('rejects a distance query outside the lattice', () => {
    expect(() => buildLattice(chain(3, O)).distance(0, 3)).toThrow(RangeError);
  });
});

describe('buildLattice: ladder', () => {
  it('has 2L−2 leg bonds plus L rungs and two diagonals per plaquette when open', () => {
    const g = buildLattice({ kind: 'ladder', length: 4, boundary: [O, O] });
    expectWellFormed(g);
    expect(g.sites).toBe(8);
    expect(g.bonds.length).toBe(10);
    expect(g.farBonds.length).toBe(6);
    expect(g.positions[5]).toEqual([1, 1]); // site = x + L·y
  });

  it('keeps one rung per x when the rung direction (length 2) is periodic', () => {
    const open = buildLattice({ kind: 'ladder', length: 4, boundary: [P, O] });
    const both = buildLattice({ kind: 'ladder', length: 4, boundary: [P, P] });
    expect(open.bonds.length).toBe(12);
    expect(both.bonds).toEqual(open.bonds);
    expect(both.farBonds).toEqual(open.farBonds);
    expect(degrees(both)).toEqual(new Array(8).fill(3));
  });

  it('gives one bond per leg for a periodic ladder of length 2', () => {
    const g = buildLattice({ kind: 'ladder', length: 2, boundary: [P, O] });
    expect(g.bonds).toEqual([[0, 1], [0, 2], [1, 3], [2, 3]]);
  });

  it('puts far bonds at distance √2', () => {
    const g = buildLattice({ kind: 'ladder', length: 5, boundary: [P, O] });
    for (const [i, j] of g.farBonds) expect(g.distance(i, j)).toBeCloseTo(Math.SQRT2, 12);
  });
});

describe('buildLattice: square', () => {
  it('has 4 bonds on a 2×2 torus (each periodic length-2 direction gives one bond)', () => {
    const g = buildLattice({ kind: 'square', size: [2, 2], boundary: [P, P] });
    expectWellFormed(g);
    expect(g.bonds).toEqual([[0, 1], [0, 2], [1, 3], [2, 3]]);
    expect(g.farBonds).toEqual([[0, 3], [1, 2]]);
  });

  it('has 18 bonds and 18 far bonds on a 3×3 torus, coordination 4, and is not bipartite', () => {
    const g = buildLattice({ kind: 'square', size: [3, 3], boundary: [P, P] });
    expectWellFormed(g);
    expect(g.bonds.length).toBe(18);
    expect(g.farBonds.length).toBe(18);
    expect(degrees(g)).toEqual(new Array(9).fill(4));
    expect(g.sublattice).toBeNull();
  });

  it('has 2N bonds and 2N far bonds on a 4×4 torus with checkerboard signs', () => {
    const g = buildLattice({ kind: 'square', size: [4, 4], boundary: [P, P] });
    expect(g.bonds.length).toBe(32);
    expect(g.farBonds.length).toBe(32);
    expect(degrees(g, g.farBonds)).toEqual(new Array(16).fill(4));
    for (let s = 0; s < 16; s++) expect(g.sublattice![s]).toBe(((s % 4) + Math.floor(s / 4)) % 2 === 0 ? 1 : -1);
  });

  it('has (Lx−1)Ly + Lx(Ly−1) bonds when open, numbered row-major', () => {
    const g = buildLattice({ kind: 'square', size: [3, 2], boundary: [O, O] });
    expect(g.bonds.length).toBe(7);
    expect(g.positions[5]).toEqual([2, 1]);
  });

  it('uses the minimum image per periodic direction only', () => {
    const torus = buildLattice({ kind: 'square', size: [4, 4], boundary: [P, P] });
    expect(torus.distance(0, 15)).toBeCloseTo(Math.SQRT2, 12);
    const cyl = buildLattice({ kind: 'square', size: [4, 4], boundary: [P, O] });
    expect(cyl.distance(0, 15)).toBeCloseTo(Math.hypot(1, 3), 12);
  });
});

/** Brute-force minimum image: every shift n1·Lx·a1 + n2·Ly·a2 with |n| ≤ 6 along periodic directions. */
function bruteDistance(g: LatticeGraph, i: number, j: number, t1: [number, number], t2: [number, number], per: [boolean, boolean]): number {
  let best = Infinity;
  for (let n1 = per[0] ? -6 : 0; n1 <= (per[0] ? 6 : 0); n1++) {
    for (let n2 = per[1] ? -6 : 0; n2 <= (per[1] ? 6 : 0); n2++) {
      const dx = g.positions[j][0] - g.positions[i][0] + n1 * t1[0] + n2 * t2[0];
      const dy = g.positions[j][1] - g.positions[i][1] + n1 * t1[1] + n2 * t2[1];
      best = Math.min(best, Math.hypot(dx, dy));
    }
  }
  return best;
}

describe('buildLattice: triangular', () => {
  it('has 27 bonds on a 3×3 torus, coordination 6, all of length 1, and no sublattice signs', () => {
    const g = buildLattice({ kind: 'triangular', size: [3, 3], boundary: [P, P] });
    expectWellFormed(g);
    expect(g.bonds.length).toBe(27);
    expect(degrees(g)).toEqual(new Array(9).fill(6));
    for (const [i, j] of g.bonds) expect(g.distance(i, j)).toBeCloseTo(1, 12);
    expect(g.sublattice).toBeNull();
    // on 3×3 the far-neighbour offsets a1+a2, 2a2−a1, 2a1−a2 all wrap onto ±(a1+a2): 2 per site, 9 in all
    expect(g.farBonds.length).toBe(9);
  });

  it('has 3N bonds and 3N far bonds at distance √3 on a 4×4 torus', () => {
    const g = buildLattice({ kind: 'triangular', size: [4, 4], boundary: [P, P] });
    expect(g.bonds.length).toBe(48);
    expect(g.farBonds.length).toBe(48);
    for (const [i, j] of g.farBonds) expect(g.distance(i, j)).toBeCloseTo(Math.sqrt(3), 12);
  });

  it('is the complete graph K4 on a 2×2 torus (6 bonds, no far bonds)', () => {
    const g = buildLattice({ kind: 'triangular', size: [2, 2], boundary: [P, P] });
    expect(g.bonds.length).toBe(6);
    expect(g.farBonds.length).toBe(0);
  });

  it('is a bipartite chain when one cell wide and open', () => {
    const g = buildLattice({ kind: 'triangular', size: [1, 4], boundary: [O, O] });
    expect(g.bonds.length).toBe(3);
    expect(g.sublattice).toEqual([1, -1, 1, -1]);
  });

  it.each([[4, 3, P, P], [5, 2, P, P], [2, 6, P, P], [4, 4, P, O], [4, 4, O, P]] as const)(
    'matches a brute-force minimum image on %i×%i (%s, %s)', (lx, ly, b0, b1) => {
      const g = buildLattice({ kind: 'triangular', size: [lx, ly], boundary: [b0, b1] });
      for (let i = 0; i < g.sites; i++) for (let j = 0; j < g.sites; j++) {
        expect(Math.abs(g.distance(i, j) - bruteDistance(g, i, j, [lx, 0], [ly / 2, ly * Math.sqrt(3) / 2], [b0 === P, b1 === P]))).toBeLessThan(GEOM);
      }
    });
});

describe('buildLattice: honeycomb', () => {
  it('has 3 bonds per unit cell on a 3×3 torus, coordination 3, and 6 far bonds per cell', () => {
    const g = buildLattice({ kind: 'honeycomb', size: [3, 3], boundary: [P, P] });
    expectWellFormed(g);
    expect(g.sites).toBe(18);
    expect(g.bonds.length).toBe(27);
    expect(degrees(g)).toEqual(new Array(18).fill(3));
    expect(g.farBonds.length).toBe(54);
    for (const [i, j] of g.bonds) expect(g.distance(i, j)).toBeCloseTo(1, 12);
    for (const [i, j] of g.farBonds) expect(g.distance(i, j)).toBeCloseTo(Math.sqrt(3), 12);
  });

  it('has 12 bonds on a 2×2 torus (3 per cell) and 12 far bonds (±a1, ±a2 coincide when L = 2)', () => {
    const g = buildLattice({ kind: 'honeycomb', size: [2, 2], boundary: [P, P] });
    expect(g.bonds.length).toBe(12);
    expect(degrees(g)).toEqual(new Array(8).fill(3));
    expect(g.farBonds.length).toBe(12);
  });

  it('has 7 bonds on an open 2×2 patch and one bond on a 1×1 torus', () => {
    expect(buildLattice({ kind: 'honeycomb', size: [2, 2], boundary: [O, O] }).bonds.length).toBe(7);
    expect(buildLattice({ kind: 'honeycomb', size: [1, 1], boundary: [P, P] }).bonds).toEqual([[0, 1]]);
  });

  it('numbers sites 2·(x + Lx·y) + s with B one unit above A, and signs A = +1, B = −1', () => {
    const g = buildLattice({ kind: 'honeycomb', size: [3, 2], boundary: [P, P] });
    const a = g.positions[2 * (1 + 3 * 1)];
    expect(a[0]).toBeCloseTo(Math.sqrt(3) + Math.sqrt(3) / 2, 12);
    expect(a[1]).toBeCloseTo(1.5, 12);
    expect(g.positions[2 * (1 + 3 * 1) + 1][1]).toBeCloseTo(2.5, 12);
    expect(g.sublattice).toEqual(Array.from({ length: 12 }, (_, s) => (s % 2 === 0 ? 1 : -1)));
  });

  it('matches a brute-force minimum image on a 3×2 torus', () => {
    const g = buildLattice({ kind: 'honeycomb', size: [3, 2], boundary: [P, P] });
    const s3 = Math.sqrt(3);
    for (let i = 0; i < g.sites; i++) for (let j = 0; j < g.sites; j++) {
      expect(Math.abs(g.distance(i, j) - bruteDistance(g, i, j, [3 * s3, 0], [s3, 3], [true, true]))).toBeLessThan(GEOM);
    }
  });
});

describe('buildLattice: explicit bonds', () => {
  it('normalises bonds to i < j and keeps their order', () => {
    const g = buildLattice({ kind: 'bonds', sites: 4, bonds: [[2, 1], [0, 3]], farBonds: [[0, 2]] });
    expect(g.bonds).toEqual([[1, 2], [0, 3]]);
    expect(g.farBonds).toEqual([[0, 2]]);
  });

  it('places sites on a line by default and uses given positions otherwise', () => {
    expect(buildLattice({ kind: 'bonds', sites: 4, bonds: [], farBonds: [] }).distance(0, 3)).toBe(3);
    const g = buildLattice({ kind: 'bonds', sites: 2, bonds: [[0, 1]], farBonds: [], positions: [[0, 0], [3, 4]] });
    expect(g.distance(1, 0)).toBe(5);
  });

  it('rejects self-bonds, repeated bonds (either orientation or across lists) and sites out of range', () => {
    expect(() => buildLattice({ kind: 'bonds', sites: 3, bonds: [[1, 1]], farBonds: [] })).toThrow(/itself/);
    expect(() => buildLattice({ kind: 'bonds', sites: 3, bonds: [[0, 1], [1, 0]], farBonds: [] })).toThrow(/repeats the bond 0-1/);
    expect(() => buildLattice({ kind: 'bonds', sites: 3, bonds: [[0, 1]], farBonds: [[1, 0]] })).toThrow(/farBonds\[0\] repeats/);
    expect(() => buildLattice({ kind: 'bonds', sites: 3, bonds: [[0, 3]], farBonds: [] })).toThrow(/site 3.*0\.\.2/);
  });

  it('rejects a positions list of the wrong length', () => {
    expect(() => buildLattice({ kind: 'bonds', sites: 3, bonds: [], farBonds: [], positions: [[0, 0]] })).toThrow(RangeError);
  });

  it('detects odd cycles', () => {
    expect(buildLattice({ kind: 'bonds', sites: 3, bonds: [[0, 1], [1, 2], [0, 2]], farBonds: [] }).sublattice).toBeNull();
    expect(buildLattice({ kind: 'bonds', sites: 4, bonds: [[0, 1], [2, 3]], farBonds: [] }).sublattice).toEqual([1, -1, 1, -1]);
  });
});

describe('buildLattice: limits', () => {
  it('refuses more sites than LIMITS.maxSites', () => {
    expect(() => buildLattice({ kind: 'square', size: [65, 64], boundary: [O, O] })).toThrow(/4160 sites exceeds the limit of 4096/);
  });
});
