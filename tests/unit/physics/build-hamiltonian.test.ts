import { describe, expect, it } from 'vitest';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { formatPauliWord } from '../../../workers/src/physics/pauli-word.js';
import type { PauliSum } from '../../../workers/src/physics/types.js';
import { denseSum } from './dense-pauli.js';

const words = (h: PauliSum) => new Map(h.terms.map((t) => [formatPauliWord(t), t.weight]));
const chain = (length: number) => buildLattice({ kind: 'chain', length, boundary: 'open' });

describe('buildHamiltonian: ising', () => {
  it('has −J per bond and −hx per site and drops the zero hz terms', () => {
    const h = buildHamiltonian({ model: 'ising', J: 1, hx: 0.5, hz: 0 }, chain(4));
    expect(h.sites).toBe(4);
    expect(h.terms.length).toBe(7);
    const w = words(h);
    expect(w.get('Z0 Z1')).toBe(-1);
    expect(w.get('Z2 Z3')).toBe(-1);
    expect(w.get('X3')).toBe(-0.5);
    expect(w.has('Z0')).toBe(false);
  });

  it('has one ZZ term per bond on a 2×2 torus (4, not 8)', () => {
    const g = buildLattice({ kind: 'square', size: [2, 2], boundary: ['periodic', 'periodic'] });
    const h = buildHamiltonian({ model: 'ising', J: 2, hx: 0, hz: 0.25 }, g);
    expect(h.terms.filter((t) => t.x === 0 && t.z !== 0 && (t.z & (t.z - 1)) !== 0).map((t) => t.weight)).toEqual([-2, -2, -2, -2]);
    expect(h.terms.length).toBe(8);
  });
});

describe('buildHamiltonian: xxz', () => {
  it('matches the explicit two-site matrix J(XX + YY + ΔZZ) − hz(Z0 + Z1)', () => {
    const J = 0.7; const delta = -0.3; const hz = 0.2;
    const h = buildHamiltonian({ model: 'xxz', J, delta, hz }, chain(2));
    expect(h.terms.length).toBe(5);
    const m = denseSum(h.terms.map((t) => ({ ...t, re: t.weight, im: 0 })), 2);
    // basis |s1 s0⟩ with s = 0..3; Z|0⟩ = +|0⟩. XX + YY swaps |01⟩ and |10⟩ with amplitude 2.
    const expected = [
      [J * delta - 2 * hz, 0, 0, 0],
      [0, -J * delta, 2 * J, 0],
      [0, 2 * J, -J * delta, 0],
      [0, 0, 0, J * delta + 2 * hz],
    ];
    for (let r = 0; r < 4; r++) for (let c = 0; c < 4; c++) {
      expect(m.re[r * 4 + c]).toBeCloseTo(expected[r][c], 14);
      expect(m.im[r * 4 + c]).toBe(0);
    }
  });

  it('has three terms per bond plus one per site, and drops ZZ when Δ = 0', () => {
    const g = buildLattice({ kind: 'square', size: [2, 2], boundary: ['periodic', 'periodic'] });
    expect(buildHamiltonian({ model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, g).terms.length).toBe(16);
    expect(buildHamiltonian({ model: 'xxz', J: 1, delta: 0, hz: 0 }, g).terms.length).toBe(8);
  });
});

describe('buildHamiltonian: pauli-sum', () => {
  it('merges repeated words, keeps the identity and drops cancelled terms', () => {
    const h = buildHamiltonian({
      model: 'pauli-sum',
      terms: [
        { weight: 1, word: 'X0 Z1' }, { weight: 0.5, word: 'Z1 X0' }, { weight: 3, word: '' },
        { weight: 0.1, word: 'Y2' }, { weight: 0.2, word: 'Y2' }, { weight: -0.3, word: 'Y2' },
      ],
    }, chain(3));
    expect(words(h)).toEqual(new Map([['X0 Z1', 1.5], ['', 3]]));
  });

  it('rejects a word with a site outside the lattice', () => {
    expect(() => buildHamiltonian({ model: 'pauli-sum', terms: [{ weight: 1, word: 'X3' }] }, chain(3))).toThrow(/site 3.*0\.\.2/);
  });
});

describe('buildHamiltonian: limits', () => {
  it('accepts 30 sites and refuses 31', () => {
    expect(buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(30)).terms.length).toBe(59);
    expect(() => buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(31))).toThrow(/31 sites exceeds/);
  });

  it('gives an empty sum for a single site with no field', () => {
    expect(buildHamiltonian({ model: 'ising', J: 1, hx: 0, hz: 0 }, chain(1)).terms).toEqual([]);
  });
});
