/**
 * Which lattice symmetries the spectral engine may use (workers/src/symmetry): decided from the
 * Pauli terms of H0 and H1, never from the model name.
 * - latticePermutations proposes bijections with the right orders (translations) and
 *   involutions (reflections);
 * - analyseSymmetry keeps translations and a reflection only when both Hamiltonians map onto
 *   themselves term by term, and says which one broke a dropped candidate: one site with a
 *   different field, a missing boundary bond, a chiral X Y − Y X (Dzyaloshinskii–Moriya) term
 *   that reverses under reflection, a staggered field (keeps translations by two cells).
 */
import { describe, expect, it } from 'vitest';
import { Hamiltonian as HamiltonianSchema, Lattice as LatticeSchema } from '../../../shared-types/src/index.js';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import {
  analyseSymmetry, invariantUnder, latticePermutations, termTable,
} from '../../../workers/src/symmetry/index.js';
import { checkPermutation, composePermutations, isIdentityPermutation, permutationPower } from '../../../workers/src/symmetry/site-permutation.js';

type Lattice = SweepSpecInput['lattice'];
type Hamiltonian = SweepSpecInput['h0'];
type PauliSumInput = Extract<Hamiltonian, { model: 'pauli-sum' }>;
const ring = (length: number): Lattice => ({ kind: 'chain', length, boundary: 'periodic' });
/** The parsed lattice (defaults applied) and its graph. */
const built = (l: Lattice) => ({ lattice: LatticeSchema.parse(l), graph: buildLattice(LatticeSchema.parse(l)) });
const ham = (h: Hamiltonian, l: Lattice) => buildHamiltonian(HamiltonianSchema.parse(h), built(l).graph);
const analyse = (lattice: Lattice, h0: Hamiltonian, h1: Hamiltonian = h0) =>
  analyseSymmetry(built(lattice).lattice, ham(h0, lattice), ham(h1, lattice), 'all');
/** XX + YY + Δ ZZ + D (X Y − Y X) on every bond of a ring, with a uniform field. */
function chiralRing(n: number, d: number, hz: number): PauliSumInput {
  const terms = [];
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    terms.push({ weight: 1, word: `X${i} X${j}` }, { weight: 1, word: `Y${i} Y${j}` }, { weight: 0.7, word: `Z${i} Z${j}` });
    terms.push({ weight: d, word: `X${i} Y${j}` }, { weight: -d, word: `Y${i} X${j}` }, { weight: -hz, word: `Z${i}` });
  }
  return { model: 'pauli-sum', terms };
}

describe('latticePermutations', () => {
  it('proposes translations of the lattice orders and involutive reflections for every lattice kind', () => {
    const lattices: Lattice[] = [
      ring(6), { kind: 'ladder', length: 3, boundary: ['open', 'open'] }, { kind: 'square', size: [3, 2], boundary: ['periodic', 'open'] },
      { kind: 'triangular', size: [3, 3], boundary: ['periodic', 'periodic'] },
      { kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] }, { kind: 'bonds', sites: 4, bonds: [[0, 1]] },
    ];
    for (const lattice of lattices) {
      const n = built(lattice).graph.sites;
      const c = latticePermutations(built(lattice).lattice, n);
      for (const t of c.translations) {
        checkPermutation(t.perm, n);
        expect(isIdentityPermutation(permutationPower(t.perm, t.order))).toBe(true);
        for (let k = 1; k < t.order; k++) expect(isIdentityPermutation(permutationPower(t.perm, k))).toBe(false);
      }
      for (const r of c.reflections) {
        checkPermutation(r.perm, n);
        expect(isIdentityPermutation(r.perm)).toBe(false);
        expect(isIdentityPermutation(composePermutations(r.perm, r.perm))).toBe(true);
      }
    }
    const r4 = built(ring(4)).lattice;
    expect(Array.from(latticePermutations(r4, 4).translations[0].perm)).toEqual([1, 2, 3, 0]);
    expect(Array.from(latticePermutations(r4, 4).reflections[0].perm)).toEqual([3, 2, 1, 0]);
    expect(() => latticePermutations(r4, 5)).toThrow(RangeError);
  });
});

describe('invariantUnder', () => {
  it('compares merged weights exactly', () => {
    const shift = latticePermutations(built(ring(3)).lattice, 3).translations[0].perm;
    const h = (w: number) => ham({ model: 'pauli-sum', terms: [
      { weight: 1, word: 'Z0 Z1' }, { weight: 1, word: 'Z1 Z2' }, { weight: w, word: 'Z0 Z2' }] }, ring(3));
    expect(invariantUnder(termTable(h(1).terms), shift)).toBe(true);
    expect(invariantUnder(termTable(h(1 + 2 ** -40).terms), shift)).toBe(false);
  });
});

describe('analyseSymmetry', () => {
  it('uses magnetisation, translations and the inversion for a uniform XXZ ring', () => {
    const a = analyse(ring(8), { model: 'xxz', J: 1, delta: 0.5, hz: 0.3 }, { model: 'xxz', J: 1, delta: 2 });
    expect(a.used).toEqual(['magnetisation', 'translation a1 (order 8)', 'reflection inversion']);
    expect(a.group.elements).toHaveLength(16);
    expect(a.rejected).toEqual([]);
  });

  it('rejects translations when one site has a different field, naming the Hamiltonian that breaks them', () => {
    const h0 = chiralRing(6, 0, 0.4);
    const bent: PauliSumInput = { model: 'pauli-sum', terms: [...h0.terms, { weight: 0.1, word: 'Z2' }] };
    const a = analyse(ring(6), h0, bent);
    expect(a.used.some((u) => u.startsWith('translation'))).toBe(false);
    expect(a.rejected).toContain('translation a1: broken by h1');
    // The reflection about the bent site's axis is not among the candidates; inversion i → 5 − i is broken too.
    expect(a.group.elements).toHaveLength(1);
    expect(a.used).toEqual(['magnetisation']);
  });

  it('keeps translations but rejects the reflection for a chiral X Y − Y X term', () => {
    const a = analyse(ring(8), chiralRing(8, 0.4, 0.2), chiralRing(8, -0.3, 0));
    expect(a.used).toEqual(['magnetisation', 'translation a1 (order 8)']);
    expect(a.rejected).toEqual(['reflection inversion: broken by h0 and h1']);
    expect(a.sectors).toHaveLength(8);
    expect(a.sectors.every((s) => s.multiplicity === 1 && s.parity === 0)).toBe(true);
  });

  it('keeps translations by two cells for a staggered field', () => {
    const terms = [...chiralRing(6, 0, 0).terms, ...[0, 1, 2, 3, 4, 5].map((i) => ({ weight: i % 2 === 0 ? 0.5 : -0.5, word: `Z${i}` }))];
    const a = analyse(ring(6), { model: 'pauli-sum', terms });
    expect(a.used).toContain('translation a1 by 2 cells (order 3)');
    expect(a.group.translationCount).toBe(3);
  });

  it('keeps only the inversion on an open chain, and uses no spatial symmetry in the weaker modes', () => {
    const open: Lattice = { kind: 'chain', length: 7, boundary: 'open' };
    const a = analyse(open, { model: 'ising', J: 1, hx: 0.5 });
    expect(a.used).toEqual(['reflection inversion']);
    expect(a.rejected).toEqual(['magnetisation: broken by h0 and h1', 'translation a1: broken by h0 and h1']);
    const h = ham({ model: 'xxz', J: 1, delta: 1 }, ring(6));
    const r6 = built(ring(6)).lattice;
    expect(analyseSymmetry(r6, h, h, 'translations').used).toEqual(['magnetisation', 'translation a1 (order 6)']);
    expect(analyseSymmetry(r6, h, h, 'magnetisation').group.elements).toHaveLength(1);
    expect(analyseSymmetry(r6, h, h, 'none')).toMatchObject({ label: 'none', magnetisation0: false });
  });

  it('finds both translations and the inversion on tori, the rung swap of a ladder, and the honeycomb inversion', () => {
    const torus = analyse({ kind: 'square', size: [4, 2], boundary: ['periodic', 'periodic'] }, { model: 'ising', J: 1, hx: 0.8 });
    expect(torus.used).toEqual(['translation a1 (order 4)', 'translation a2 (order 2)', 'reflection inversion']);
    const tri = analyse({ kind: 'triangular', size: [3, 3], boundary: ['periodic', 'periodic'] }, { model: 'ising', J: 1, hx: 0.8 });
    expect(tri.used).toEqual(['translation a1 (order 3)', 'translation a2 (order 3)', 'reflection inversion']);
    // Open legs: no translation along them, but the rung swap y → 1 − y is translation a2.
    const ladder = analyse({ kind: 'ladder', length: 3, boundary: ['open', 'open'] }, { model: 'xxz', J: 1, delta: 0.5 });
    expect(ladder.used).toEqual(['magnetisation', 'translation a2 (order 2)', 'reflection inversion']);
    const honey = analyse({ kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] }, { model: 'ising', J: 1, hx: 0.8 });
    expect(honey.used).toEqual(['translation a1 (order 2)', 'translation a2 (order 2)', 'reflection inversion']);
    // A field on one sublattice breaks the sublattice-exchanging inversion, not the translations.
    const honeycomb: Lattice = { kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] };
    const ising = ham({ model: 'ising', J: 1, hx: 0.8 }, honeycomb);
    const sub = { sites: 8, terms: [...ising.terms, ...[0, 2, 4, 6].map((i) => ({ x: 0, z: 1 << i, weight: 0.3 }))] };
    const a = analyseSymmetry(built(honeycomb).lattice, sub, sub, 'all');
    expect(a.used).toEqual(['translation a1 (order 2)', 'translation a2 (order 2)']);
    expect(a.rejected).toEqual(['magnetisation: broken by h0 and h1', 'reflection inversion: broken by h0 and h1']);
  });
});
