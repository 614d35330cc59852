/**
 * orbitTable — the orbits of the 2^N basis states under a group of site permutations, with
 * what a symmetrised basis needs to locate any state:
 *   orbitOf[s]    orbit index of state s (orbits numbered by ascending representative);
 *   elementOf[s]  an element g with g·rep = s (rep = the smallest state of the orbit);
 *   reps, sizes   representative and size |O| = |S|/|Stab| of each orbit;
 *   stabiliser    the non-identity elements fixing each representative (CSR: stabStart,
 *                 stabElements; empty for the free orbits, which are most of them).
 * States are visited in ascending order, so the first unvisited state is the smallest of its
 * orbit. Group elements map states through byte tables (site-permutation.ts stateMapper).
 * Cost: O(2^N·|S|) table look-ups; memory 5·2^N bytes (+ 8 per orbit).
 */
import type { SitePermutation } from './site-permutation.js';
import { mapState, stateMapper } from './site-permutation.js';

/** Orbits of the basis states under a permutation group (see the file header). */
export interface OrbitTable {
  /** |S|. */
  readonly order: number;
  readonly orbitOf: Int32Array;
  readonly elementOf: Uint8Array;
  readonly reps: Int32Array;
  readonly sizes: Int32Array;
  readonly stabStart: Int32Array;
  readonly stabElements: Int32Array;
}

/** Largest group the Uint8 element index holds. */
export const MAX_GROUP_ORDER = 255;

/**
 * The orbit table of `elements` (a group, element 0 the identity) on `sites` sites.
 * @throws RangeError if there are more than MAX_GROUP_ORDER elements or sites > 30.
 */
export function orbitTable(sites: number, elements: readonly SitePermutation[]): OrbitTable {
  if (elements.length > MAX_GROUP_ORDER) throw new RangeError(`at most ${MAX_GROUP_ORDER} group elements; got ${elements.length}`);
  if (!Number.isInteger(sites) || sites < 1 || sites > 30) throw new RangeError(`sites must be an integer in 1..30; got ${sites}`);
  const dim = 2 ** sites;
  const order = elements.length;
  const maps = new Int32Array(1024 * order);
  elements.forEach((g, e) => maps.set(stateMapper(g), 1024 * e));
  const orbitOf = new Int32Array(dim).fill(-1);
  const elementOf = new Uint8Array(dim);
  const reps: number[] = [];
  const sizes: number[] = [];
  const stabStart: number[] = [0];
  const stab: number[] = [];
  for (let s = 0; s < dim; s++) {
    if (orbitOf[s] >= 0) continue;
    const id = reps.length;
    let size = 0;
    for (let e = 0; e < order; e++) {
      const t = mapState(maps, 1024 * e, s);
      if (t === s && e > 0) stab.push(e);
      if (orbitOf[t] < 0) {
        orbitOf[t] = id;
        elementOf[t] = e;
        size++;
      }
    }
    reps.push(s);
    sizes.push(size);
    stabStart.push(stab.length);
  }
  return {
    order, orbitOf, elementOf, reps: Int32Array.from(reps), sizes: Int32Array.from(sizes),
    stabStart: Int32Array.from(stabStart), stabElements: Int32Array.from(stab),
  };
}
