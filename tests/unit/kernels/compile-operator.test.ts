import { describe, expect, it } from 'vitest';
import { compileOperator, groupEntryIm, groupEntryRe } from '../../../workers/src/kernels/index.js';
import { pauliDense, randomSum, seededRandom, sumDense } from './dense-reference.js';

// Tables are sums of at most ~10 weights of size ≤ 1: rounding stays below a few 1e-16,
// so 1e-13 is loose but still far below any sign or index error (which would be O(0.1)).
const TOL = 1e-13;

describe('compileOperator', () => {
  it('tabulates the same matrix elements as the dense Kronecker-product matrix for N = 1..4', () => {
    const rand = seededRandom(11);
    for (let n = 1; n <= 4; n++) {
      const sum = randomSum(rand, n, 3 * n);
      const op = compileOperator(sum);
      const h = sumDense(sum);
      const dim = 2 ** n;
      // Rebuild the dense matrix from the compiled tables and compare every entry.
      const re = new Float64Array(dim * dim);
      const im = new Float64Array(dim * dim);
      if (op.diagonal) for (let s = 0; s < dim; s++) re[s * dim + s] += op.diagonal[s];
      for (const g of op.groups) {
        for (let s = 0; s < dim; s++) {
          re[(s ^ g.x) * dim + s] += g.table[2 * s];
          im[(s ^ g.x) * dim + s] += g.table[2 * s + 1];
        }
      }
      for (let k = 0; k < dim * dim; k++) {
        expect(Math.abs(re[k] - h.re[k])).toBeLessThan(TOL);
        expect(Math.abs(im[k] - h.im[k])).toBeLessThan(TOL);
      }
    }
  });

  it('keeps compact terms that reproduce every table entry, and flags real groups', () => {
    const rand = seededRandom(12);
    const sum = randomSum(rand, 4, 14);
    const op = compileOperator(sum);
    for (const g of op.groups) {
      let imag = false;
      for (let s = 0; s < op.dim; s++) {
        expect(Math.abs(groupEntryRe(g, s) - g.table[2 * s])).toBeLessThan(TOL);
        expect(Math.abs(groupEntryIm(g, s) - g.table[2 * s + 1])).toBeLessThan(TOL);
        if (g.table[2 * s + 1] !== 0) imag = true;
      }
      if (g.real) expect(imag).toBe(false);
    }
    const compact = compileOperator(sum, { tables: false });
    expect(compact.groups.map((g) => g.x)).toEqual(op.groups.map((g) => g.x));
    expect(compact.groups.every((g) => g.table.length === 0)).toBe(true);
    expect(Array.from(compact.diagonal!)).toEqual(Array.from(op.diagonal!));
  });

  it('combines duplicate strings and drops strings that cancel', () => {
    const op = compileOperator({
      sites: 2,
      terms: [
        { x: 1, z: 0, weight: 0.5 }, { x: 1, z: 0, weight: 0.25 }, // X0 twice
        { x: 2, z: 2, weight: 1 }, { x: 2, z: 2, weight: -1 },      // Y1 cancels
        { x: 0, z: 3, weight: -2 },
      ],
    });
    expect(op.groups.map((g) => g.x)).toEqual([1]);
    expect(op.groups[0].table[0]).toBe(0.75);
    expect(op.normBound).toBe(0.75 + 2);
  });

  it('sorts groups by flip mask, one group per distinct mask', () => {
    const op = compileOperator({
      sites: 3,
      terms: [
        { x: 6, z: 0, weight: 1 }, { x: 6, z: 6, weight: 1 }, { x: 1, z: 0, weight: 1 }, { x: 3, z: 1, weight: 1 },
      ],
    });
    expect(op.groups.map((g) => g.x)).toEqual([1, 3, 6]);
  });

  it('reports the identity weight as shift and bounds the spectrum by shift ± normBound', () => {
    const rand = seededRandom(5);
    const sum = randomSum(rand, 3, 8);
    const op = compileOperator(sum);
    expect(op.shift).toBeCloseTo(0.37, 15);
    // Gershgorin-free check: every diagonal entry of a Hermitian matrix lies in its spectral range.
    for (let s = 0; s < op.dim; s++) {
      expect(Math.abs(op.diagonal![s] - op.shift)).toBeLessThanOrEqual(op.normBound + TOL);
    }
    let sumAbs = 0;
    for (const t of sum.terms) if (t.x !== 0 || t.z !== 0) sumAbs += Math.abs(t.weight);
    expect(op.normBound).toBeLessThanOrEqual(sumAbs + TOL);
  });

  it('puts i^{#Y} on Y strings: Y on one site has ⟨1|Y|0⟩ = i and ⟨0|Y|1⟩ = −i', () => {
    const op = compileOperator({ sites: 1, terms: [{ x: 1, z: 1, weight: 1 }] });
    const t = op.groups[0].table;
    // entry s = ⟨s⊕1|Y|s⟩: s = 0 → ⟨1|Y|0⟩ = i, s = 1 → ⟨0|Y|1⟩ = −i (Y = [[0,−i],[i,0]], common practice)
    expect(Array.from(t)).toEqual([0, 1, 0, -1]);
    const y = pauliDense(1, 1, 1);
    expect(y.im[1 * 2 + 0]).toBe(1);
  });

  it('handles a single site, an empty sum and an identity-only sum', () => {
    const single = compileOperator({ sites: 1, terms: [{ x: 0, z: 1, weight: 2 }] });
    expect(Array.from(single.diagonal!)).toEqual([2, -2]);
    expect(single.groups).toHaveLength(0);

    const empty = compileOperator({ sites: 3, terms: [] });
    expect(empty.diagonal).toBeNull();
    expect(empty.groups).toHaveLength(0);
    expect(empty.shift).toBe(0);
    expect(empty.normBound).toBe(0);
    expect(empty.dim).toBe(8);

    const ident = compileOperator({ sites: 2, terms: [{ x: 0, z: 0, weight: 1.5 }] });
    expect(Array.from(ident.diagonal!)).toEqual([1.5, 1.5, 1.5, 1.5]);
    expect(ident.shift).toBe(1.5);
    expect(ident.normBound).toBe(0);

    const zeroSites = compileOperator({ sites: 0, terms: [{ x: 0, z: 0, weight: 3 }] });
    expect(zeroSites.dim).toBe(1);
    expect(zeroSites.diagonal![0]).toBe(3);
  });

  it('throws a RangeError naming the argument for too many sites, oversized masks and bad weights', () => {
    expect(() => compileOperator({ sites: 31, terms: [] })).toThrow(/sum\.sites/);
    expect(() => compileOperator({ sites: -1, terms: [] })).toThrow(RangeError);
    expect(() => compileOperator({ sites: 2.5, terms: [] })).toThrow(RangeError);
    expect(() => compileOperator({ sites: 2, terms: [{ x: 4, z: 0, weight: 1 }] })).toThrow(/sum\.terms\[0\]\.x/);
    expect(() => compileOperator({ sites: 2, terms: [{ x: 0, z: 1, weight: 1 }, { x: 0, z: -1, weight: 1 }] }))
      .toThrow(/sum\.terms\[1\]\.z/);
    expect(() => compileOperator({ sites: 2, terms: [{ x: 1, z: 0, weight: Number.NaN }] })).toThrow(/weight/);
    expect(() => compileOperator({ sites: 2, terms: [{ x: 1, z: 0, weight: Infinity }] })).toThrow(RangeError);
  });
});
