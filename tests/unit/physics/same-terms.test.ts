import { describe, expect, it } from 'vitest';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { sameTerms } from '../../../workers/src/physics/same-terms.js';
import type { PauliSum } from '../../../workers/src/physics/types.js';

const sum = (sites: number, terms: Array<[number, number, number]>): PauliSum =>
  ({ sites, terms: terms.map(([x, z, weight]) => ({ x, z, weight })) });

describe('sameTerms', () => {
  it('holds for the same Hamiltonian built twice and in another term order', () => {
    const g = buildLattice({ kind: 'chain', length: 4, boundary: 'open' });
    const h = buildHamiltonian({ model: 'ising', J: 1, hx: 0.5, hz: 0 }, g);
    expect(sameTerms(h, buildHamiltonian({ model: 'ising', J: 1, hx: 0.5, hz: 0 }, g))).toBe(true);
    expect(sameTerms(h, { sites: h.sites, terms: [...h.terms].reverse() })).toBe(true);
  });

  it('merges repeated strings and drops those whose weights cancel', () => {
    expect(sameTerms(sum(2, [[1, 0, 0.25], [1, 0, 0.25], [0, 3, 1], [0, 3, -1]]), sum(2, [[1, 0, 0.5]]))).toBe(true);
  });

  it('fails for a different weight, an extra string or a different site count', () => {
    expect(sameTerms(sum(2, [[1, 0, 0.5]]), sum(2, [[1, 0, 0.5000000000000001]]))).toBe(false);
    expect(sameTerms(sum(2, [[1, 0, 0.5]]), sum(2, [[1, 0, 0.5], [2, 0, 0.5]]))).toBe(false);
    expect(sameTerms(sum(2, [[1, 0, 0.5]]), sum(3, [[1, 0, 0.5]]))).toBe(false);
  });

  it('holds for two empty sums on the same sites', () => {
    expect(sameTerms(sum(1, []), sum(1, []))).toBe(true);
  });
});
