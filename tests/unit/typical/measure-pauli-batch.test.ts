/**
 * measurePauliBatch (half-space flip passes, Walsh–Hadamard for many diagonal strings) against
 * the one-string-per-pass kernel pauliExpectation and against dense Pauli matrices.
 */
import { describe, expect, it } from 'vitest';
import { measurePauliBatch, pauliBatch } from '../../../workers/src/engines/typical/index.js';
import { pauliExpectation } from '../../../workers/src/kernels/index.js';
import { matVec, pauliDense, randomVector, seededRandom } from '../kernels/dense-reference.js';

describe('measurePauliBatch', () => {
  it('equals ⟨ψ|P|ψ⟩ from dense matrices for every Pauli string on 3 sites, in input order', () => {
    // Sums of 8 products of O(1) numbers: rounding ~1e-15; 1e-13 leaves headroom. The 8
    // diagonal strings exceed 0.5 per site: this covers the Walsh–Hadamard path.
    const rand = seededRandom(5);
    const n = 3, dim = 8;
    const psi = randomVector(rand, 2 * dim);
    const strings = [];
    for (let z = dim - 1; z >= 0; z--) for (let x = 0; x < dim; x++) strings.push({ x, z });
    const batch = pauliBatch(strings, dim);
    expect(batch.count).toBe(64);
    expect(batch.groups.map((g) => g.x)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    const out = new Float64Array(64);
    measurePauliBatch(batch, psi, out);
    strings.forEach(({ x, z }, k) => {
      const pv = matVec(pauliDense(x, z, n), psi);
      let er = 0;
      for (let j = 0; j < pv.length; j += 2) er += psi[j] * pv[j] + psi[j + 1] * pv[j + 1];
      expect(Math.abs(out[k] - er), `x=${x} z=${z}`).toBeLessThan(1e-13);
    });
  });

  it('agrees with pauliExpectation on 10 sites, with and without the Walsh–Hadamard path and a caller scratch', () => {
    // 2^10-term sums of O(2^-10) products: rounding ~1e-15 absolute; 1e-13.
    const rand = seededRandom(9);
    const dim = 1024;
    const psi = randomVector(rand, 2 * dim);
    const few = [
      { x: 0, z: 3 }, { x: 0, z: 1023 }, { x: 1, z: 0 }, { x: 1, z: 1 }, { x: 1, z: 6 },
      { x: 0b1100, z: 0b0100 }, { x: 0b1100, z: 0b1100 }, { x: 1023, z: 1023 }, { x: 512, z: 0 }, { x: 768, z: 513 },
    ];
    const manyDiagonal = Array.from({ length: 12 }, (_, k) => ({ x: 0, z: (37 * k + 5) & 1023 }));
    const ref = new Float64Array(2);
    for (const strings of [few, [...few, ...manyDiagonal]]) {
      for (const scratch of [undefined, new Float64Array(2 * dim)]) {
        const out = new Float64Array(strings.length);
        measurePauliBatch(pauliBatch(strings, dim), psi, out, scratch);
        strings.forEach((p, k) => {
          pauliExpectation(p, psi, dim, 1, ref);
          expect(Math.abs(out[k] - ref[0])).toBeLessThan(1e-13);
        });
      }
    }
  });

  it('handles an empty list, a single site and the identity string', () => {
    const psi = Float64Array.from([0.6, 0, 0, 0.8]); // 0.6|0⟩ + 0.8i|1⟩ on one site
    const empty = pauliBatch([], 2);
    expect(empty.count).toBe(0);
    measurePauliBatch(empty, psi, new Float64Array(0));
    const out = new Float64Array(4);
    measurePauliBatch(pauliBatch([{ x: 0, z: 0 }, { x: 0, z: 1 }, { x: 1, z: 0 }, { x: 1, z: 1 }], 2), psi, out);
    // ⟨1⟩ = 1, ⟨Z⟩ = 0.36 − 0.64, ⟨X⟩ = 2 Re(0.6·0.8i) = 0, ⟨Y⟩ = 2 Im(conj(0.6)·0.8i) = 0.96.
    expect(out[0]).toBeCloseTo(1, 15);
    expect(out[1]).toBeCloseTo(-0.28, 15);
    expect(out[2]).toBeCloseTo(0, 15);
    expect(out[3]).toBeCloseTo(0.96, 15);
  });

  it('rejects masks outside the space, a non-power-of-two dimension and short buffers', () => {
    expect(() => pauliBatch([{ x: 4, z: 0 }], 4)).toThrow(/strings\[0\]\.x/);
    expect(() => pauliBatch([{ x: 0, z: -1 }], 4)).toThrow(/strings\[0\]\.z/);
    expect(() => pauliBatch([], 6)).toThrow(/power of two/);
    const b = pauliBatch([{ x: 0, z: 1 }], 4);
    expect(() => measurePauliBatch(b, new Float64Array(6), new Float64Array(1))).toThrow(/state/);
    expect(() => measurePauliBatch(b, new Float64Array(8), new Float64Array(0))).toThrow(/out/);
    expect(() => measurePauliBatch(b, new Float64Array(8), new Float64Array(1), new Float64Array(3))).toThrow(/scratch/);
  });
});
