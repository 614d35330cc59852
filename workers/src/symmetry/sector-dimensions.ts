/**
 * sectorDimensions — how many basis vectors each symmetry sector holds, per magnetisation,
 * WITHOUT enumerating the 2^N states (what a plan needs before committing memory).
 *
 * The multiplicity of a one-dimensional character χ of a group S in a permutation
 * representation is (1/|S|)·Σ_g conj(χ(g))·Tr(g), and the trace of a permutation of basis
 * states is its number of fixed states (character theory; e.g. Serre, Linear Representations
 * of Finite Groups, §2.3). A state is fixed by a site permutation g when it is constant on
 * every cycle of g, so the fixed states with M set bits are counted by the coefficient of u^M
 * in Π_cycles (1 + u^len). Site permutations keep the magnetisation, so the count splits by M.
 * The counts equal the numbers of compatible orbits that sector-basis.ts enumerates (a unit
 * test checks both).
 * Cost: O(|S|·N²) per sector; no 2^N tables.
 */
import type { Sector } from './group-sectors.js';
import { cycleLengths } from './site-permutation.js';
import type { SpatialGroup } from './spatial-group.js';

/** Fixed-state counts by magnetisation of each element: counts[g][M]. */
function fixedCounts(group: SpatialGroup): Float64Array[] {
  const n = group.sites;
  return group.elements.map((g) => {
    let poly = new Float64Array(n + 1);
    poly[0] = 1;
    for (const len of cycleLengths(g)) {
      const next = new Float64Array(n + 1);
      for (let m = 0; m <= n; m++) {
        if (poly[m] === 0) continue;
        next[m] += poly[m];
        if (m + len <= n) next[m + len] += poly[m];
      }
      poly = next;
    }
    return poly;
  });
}

/**
 * dims[σ][M] = number of basis vectors of sector σ whose states have M bits set, M = 0..N.
 * @throws Error if a count is not an integer (an inconsistent group or sector list).
 */
export function sectorDimensions(group: SpatialGroup, sectors: readonly Sector[]): number[][] {
  const fixed = fixedCounts(group);
  const n = group.sites;
  return sectors.map((s) => {
    const order = s.characters.length / 2;
    const dims: number[] = [];
    for (let m = 0; m <= n; m++) {
      let re = 0;
      let im = 0;
      for (let g = 0; g < order; g++) {
        re += s.characters[2 * g] * fixed[g][m];
        im -= s.characters[2 * g + 1] * fixed[g][m];
      }
      const d = re / order;
      const r = Math.round(d);
      if (Math.abs(d - r) > 1e-6 || Math.abs(im / order) > 1e-6) {
        throw new Error(`sectorDimensions: sector ${s.label} at M = ${m} has a non-integer dimension ${d} + ${im / order}i`);
      }
      dims.push(r);
    }
    return dims;
  });
}
