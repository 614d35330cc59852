import { describe, expect, it } from 'vitest';
import { pauliExpectation } from '../../../workers/src/kernels/index.js';
import { matVec, pauliDense, randomVector, seededRandom } from './dense-reference.js';

// Sums of ≤ 2·16·3 products of O(1) numbers: rounding ~1e-14 at worst; 1e-13 keeps headroom.
const TOL = 1e-13;

describe('pauliExpectation', () => {
  it('matches Σ_v ⟨v|P|v⟩ from the dense Pauli matrix for every string on N = 1..3 and a batch', () => {
    const rand = seededRandom(41);
    const out = new Float64Array(2);
    for (let n = 1; n <= 3; n++) {
      const dim = 2 ** n;
      const nv = 3;
      const v = randomVector(rand, 2 * dim * nv);
      for (let x = 0; x < dim; x++) for (let z = 0; z < dim; z++) {
        const pv = matVec(pauliDense(x, z, n), v, nv);
        let er = 0, ei = 0;
        for (let k = 0; k < pv.length; k += 2) {
          er += v[k] * pv[k] + v[k + 1] * pv[k + 1];
          ei += v[k] * pv[k + 1] - v[k + 1] * pv[k];
        }
        pauliExpectation({ x, z }, v, dim, nv, out);
        expect(Math.abs(out[0] - er)).toBeLessThan(TOL);
        expect(Math.abs(out[1] - ei)).toBeLessThan(TOL);
        // Hermitian P: the expectation is real.
        expect(Math.abs(out[1])).toBeLessThan(TOL);
      }
    }
  });

  it('covers N = 4 with Y strings and gives the basis-state values exactly', () => {
    const rand = seededRandom(42);
    const dim = 16;
    const v = randomVector(rand, 2 * dim);
    const out = new Float64Array(2);
    for (const [x, z] of [[15, 15], [5, 6], [8, 9]] as const) {
      const pv = matVec(pauliDense(x, z, 4), v);
      let er = 0;
      for (let k = 0; k < pv.length; k += 2) er += v[k] * pv[k] + v[k + 1] * pv[k + 1];
      pauliExpectation({ x, z }, v, dim, 1, out);
      expect(Math.abs(out[0] - er)).toBeLessThan(TOL);
    }
    // |01⟩ (site 0 up... bit 0 = 1): Z0 = −1, Z1 = +1, X0 = 0 — exactly representable.
    const basis = new Float64Array(8);
    basis[2 * 1] = 1;
    pauliExpectation({ x: 0, z: 1 }, basis, 4, 1, out);
    expect(out[0]).toBe(-1);
    pauliExpectation({ x: 0, z: 2 }, basis, 4, 1, out);
    expect(out[0]).toBe(1);
    pauliExpectation({ x: 1, z: 0 }, basis, 4, 1, out);
    expect(out[0]).toBe(0);
  });

  it('on a doubled state with nVectors = dim gives Tr(M†PM): the β = 0 state has ⟨Z0⟩ = 0 and ⟨1⟩ = 1', () => {
    const dim = 8;
    const m = new Float64Array(2 * dim * dim);
    for (let r = 0; r < dim; r++) m[2 * (r + dim * r)] = 1 / Math.sqrt(dim);
    const out = new Float64Array(2);
    pauliExpectation({ x: 0, z: 0 }, m, dim, dim, out);
    expect(Math.abs(out[0] - 1)).toBeLessThan(TOL);
    pauliExpectation({ x: 0, z: 1 }, m, dim, dim, out);
    expect(Math.abs(out[0])).toBeLessThan(TOL);
  });

  it('returns zero for no vectors and rejects bad masks, dims and buffers', () => {
    const out = new Float64Array([9, 9]);
    pauliExpectation({ x: 1, z: 0 }, new Float64Array(0), 4, 0, out);
    expect(Array.from(out)).toEqual([0, 0]);
    const v = new Float64Array(8);
    expect(() => pauliExpectation({ x: 4, z: 0 }, v, 4, 1, out)).toThrow(/p\.x/);
    expect(() => pauliExpectation({ x: 0, z: 8 }, v, 4, 1, out)).toThrow(/p\.z/);
    expect(() => pauliExpectation({ x: 0, z: 0 }, v, 3, 1, out)).toThrow(/dim/);
    expect(() => pauliExpectation({ x: 0, z: 0 }, v, 4, 2, out)).toThrow(/state/);
    expect(() => pauliExpectation({ x: 0, z: 0 }, v, 4, 1, new Float64Array(1))).toThrow(/out/);
  });
});
