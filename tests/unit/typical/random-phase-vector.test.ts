/**
 * Random-phase vectors |r⟩ = 2^{−N/2} Σ_s e^{iφ_s}|s⟩: normalised, reproducible, and unbiased
 * for traces, E⟨r|A|r⟩ = Tr A/2^N, with Var⟨r|A|r⟩ = (Tr A² − Σ_s A_ss²)/4^N
 * (Sugiura & Shimizu, PRL 108, 240401 (2012); the phase form is common practice).
 */
import { describe, expect, it } from 'vitest';
import { fillRandomPhaseVector, measurePauliBatch, pauliBatch } from '../../../workers/src/engines/typical/index.js';

describe('fillRandomPhaseVector', () => {
  it('is normalised with every amplitude of modulus 2^{−N/2}', () => {
    for (const n of [1, 5, 10]) {
      const dim = 2 ** n;
      const v = new Float64Array(2 * dim);
      fillRandomPhaseVector(v, dim, 1, 0);
      let norm = 0;
      for (let s = 0; s < dim; s++) {
        const p = v[2 * s] ** 2 + v[2 * s + 1] ** 2;
        norm += p;
        // cos² + sin² of a double: 1 ± 2ε, times 1/dim.
        expect(Math.abs(p * dim - 1)).toBeLessThan(1e-15);
      }
      expect(Math.abs(norm - 1)).toBeLessThan(1e-13);
    }
  });

  it('depends on (seed, stream) only: the same pair gives the same vector, another pair another', () => {
    const dim = 64;
    const a = new Float64Array(2 * dim), b = new Float64Array(2 * dim), c = new Float64Array(2 * dim), d = new Float64Array(2 * dim);
    fillRandomPhaseVector(a, dim, 7, 3);
    fillRandomPhaseVector(c, dim, 7, 4);
    fillRandomPhaseVector(d, dim, 8, 3);
    fillRandomPhaseVector(b, dim, 7, 3);
    expect(Array.from(b)).toEqual(Array.from(a));
    expect(Array.from(c)).not.toEqual(Array.from(a));
    expect(Array.from(d)).not.toEqual(Array.from(a));
  });

  it('estimates Tr A/2^N without bias, with the predicted variance, and diagonal operators exactly', () => {
    // A = 0.7 + 0.5 X0 + 0.3 Y1Z2 + 0.2 X0X3 + 0.4 Z1 + 0.6 Z0Z2 on 4 sites (2^N = 16):
    // Tr A/16 = 0.7; distinct flip masks are uncorrelated and each off-diagonal string has
    // variance 1/16, so Var = (0.25 + 0.09 + 0.04)/16 = 0.02375. With K = 4000 samples the mean
    // has standard error 2.4e-3 (bound: 5 of them) and the sample variance ~4 % relative
    // scatter (bound: 15 %). The diagonal part (0.7 + 0.4 Z1 + 0.6 Z0Z2) must come out as 0.7
    // in every single sample (|r_s|² = 1/16 exactly): bound 1e-14.
    const dim = 16;
    const strings = [
      { x: 0, z: 0 }, { x: 1, z: 0 }, { x: 2, z: 6 }, { x: 9, z: 0 }, { x: 0, z: 2 }, { x: 0, z: 5 },
    ];
    const w = [0.7, 0.5, 0.3, 0.2, 0.4, 0.6];
    const batch = pauliBatch(strings, dim);
    const v = new Float64Array(2 * dim);
    const re = new Float64Array(6);
    const K = 4000;
    let s1 = 0, s2 = 0;
    for (let k = 0; k < K; k++) {
      fillRandomPhaseVector(v, dim, 2024, k);
      measurePauliBatch(batch, v, re);
      let a = 0, diag = 0;
      w.forEach((wk, j) => { a += wk * re[j]; if (strings[j].x === 0) diag += wk * re[j]; });
      expect(Math.abs(diag - 0.7)).toBeLessThan(1e-14);
      s1 += a; s2 += a * a;
    }
    const mean = s1 / K;
    const variance = (s2 - K * mean * mean) / (K - 1);
    expect(Math.abs(mean - 0.7)).toBeLessThan(5 * Math.sqrt(0.02375 / K));
    expect(Math.abs(variance / 0.02375 - 1)).toBeLessThan(0.15);
  });

  it('rejects a non-power-of-two dimension, a short buffer and seeds or streams out of range', () => {
    expect(() => fillRandomPhaseVector(new Float64Array(12), 0, 1, 0)).toThrow(/dim/);
    expect(() => fillRandomPhaseVector(new Float64Array(12), 2.5, 1, 0)).toThrow(/dim/);
    expect(() => fillRandomPhaseVector(new Float64Array(6), 4, 1, 0)).toThrow(/out/);
    expect(() => fillRandomPhaseVector(new Float64Array(8), 4, -1, 0)).toThrow(/seed/);
    expect(() => fillRandomPhaseVector(new Float64Array(8), 4, 1, 2 ** 32)).toThrow(/stream/);
  });
});
