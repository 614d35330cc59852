/**
 * logTwistedBounds: ln √(e_{L−r}(τ²)) against brute-force elementary symmetric polynomials
 * (sum over all subsets; common practice), with zeros among the τ, and the inequality it is used
 * for — |Σ_S det(Q_S)·Π_{k∉S} τ_k| ≤ √(e_{L−r}(τ²)) for Q with orthonormal rows — on random
 * orthogonal matrices.
 */
import { describe, expect, it } from 'vitest';
import { logTwistedBounds } from '../../../workers/src/engines/free-fermion/twisted-bound.js';
import { skewSchur } from '../../../workers/src/linalg/skew-schur.js';
import { determinant, randomSkew, rng } from '../linalg/random-matrices.js';

function elementary(y: number[], j: number): number {
  let total = 0;
  for (let mask = 0; mask < 1 << y.length; mask++) {
    let bits = 0;
    let p = 1;
    for (let k = 0; k < y.length; k++) if (mask & (1 << k)) { bits++; p *= y[k]; }
    if (bits === j) total += p;
  }
  return total;
}

describe('logTwistedBounds', () => {
  for (const tau of [[0.3, 0.9, 0.5, 0.99, 0.1], [0, 0.7, 0.8, 0, 0.95], [0, 0, 0, 0]]) {
    it(`matches brute force for τ = [${tau.join(', ')}]`, () => {
      const L = tau.length;
      const got = logTwistedBounds(tau, L);
      for (let r = 0; r <= L; r++) {
        const want = Math.sqrt(elementary(tau.map((t) => t * t), L - r));
        if (want === 0) expect(got[r]).toBe(-Infinity);
        else expect(Math.abs(Math.exp(got[r]) - want)).toBeLessThan(1e-14 * Math.max(1, want));
      }
    });
  }

  it('bounds the Cauchy–Binet sum for random orthonormal rows', () => {
    // Q: 2r rows of an orthogonal 2L × 2L matrix; S runs over sets of r modes (column pairs).
    const L = 5, r = 2;
    const o = skewSchur(2 * L, randomSkew(2 * L, 77)).o;
    const rand = rng(3);
    const tau = Array.from({ length: L }, () => rand());
    const rows = [1, 4, 6, 9];
    let sum = 0;
    for (let a = 0; a < L; a++) for (let b = a + 1; b < L; b++) {
      const cols = [2 * a, 2 * a + 1, 2 * b, 2 * b + 1];
      const q = rows.flatMap((i) => cols.map((c) => o[i * 2 * L + c]));
      let rest = 1;
      for (let k = 0; k < L; k++) if (k !== a && k !== b) rest *= tau[k];
      sum += determinant(q, 4) * rest;
    }
    expect(Math.abs(sum)).toBeLessThanOrEqual(Math.exp(logTwistedBounds(tau, r)[r]) * (1 + 1e-12));
  });

  it('rejects a negative order', () => {
    expect(() => logTwistedBounds([0.5], -1)).toThrow(RangeError);
  });
});
