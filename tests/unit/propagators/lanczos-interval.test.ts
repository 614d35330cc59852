/**
 * lanczosInterval against two references: the eigenvalues of a dense random Hermitian matrix
 * (cyclic Jacobi on its real 2n × 2n embedding, tests/support/reference/jacobi-eigen.ts, which
 * shares no code with the engine's tridiagonal solver), and the free-fermion ground-state energy
 * of the periodic transverse-field Ising ring (Lieb, Schultz & Mattis, Ann. Phys. 16, 407
 * (1961); Pfeuty, Ann. Phys. 57, 79 (1970)): for h > J the ground state has even fermion parity
 * with antiperiodic momenta k = π(2m+1)/N and E0 = −Σ_k √(J² + h² − 2Jh·cos k). On an even
 * ring the spectrum is symmetric (Y on one sublattice and Z on the other maps H to −H; common
 * practice), so the top eigenvalue is −E0.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import { typicalSetup } from '../../../workers/src/engines/typical/index.js';
import { applyOperatorAffine } from '../../../workers/src/kernels/index.js';
import { lanczosInterval } from '../../../workers/src/propagators/index.js';
import { denseApply, hermitianEigenvalues, randomHermitian, rowSumBound } from './dense-complex.js';

function ring(n: number, J: number, h: number): SweepSpec {
  return SweepSpecSchema.parse({
    lattice: { kind: 'chain', length: n, boundary: 'periodic' },
    h0: { model: 'ising', J, hx: h }, h1: { model: 'ising', J, hx: h },
    betas: [1], times: { values: [0] }, observables: [{ kind: 'site', pauli: 'X' }],
    engine: 'typical', tolerance: 0.05,
  });
}

const vectors = (dim: number) => [new Float64Array(2 * dim), new Float64Array(2 * dim)] as const;

describe('lanczosInterval', () => {
  describe('when Op is a dense random Hermitian matrix of order 80', () => {
    it('should contain every eigenvalue, put its Ritz extremes within their residual bounds of the true ones, and be narrower than Gershgorin', () => {
      const n = 80;
      const h = randomHermitian(n, 21);
      const eig = hermitianEigenvalues(h);
      const lo = eig[0], hi = eig[eig.length - 1];
      const g = rowSumBound(h);
      const [v, w] = vectors(n);
      const r = lanczosInterval(denseApply(h), n, { lo: -g, hi: g }, v, w);
      expect(r.converged).toBe(true);
      expect(r.steps).toBeLessThanOrEqual(n);
      // Ritz values lie inside the spectrum (Rayleigh quotients); 1e-10 covers rounding.
      expect(r.ritz.lo).toBeGreaterThanOrEqual(lo - 1e-10);
      expect(r.ritz.hi).toBeLessThanOrEqual(hi + 1e-10);
      expect(r.ritz.lo - lo).toBeLessThanOrEqual(r.residuals[0] + 1e-10);
      expect(hi - r.ritz.hi).toBeLessThanOrEqual(r.residuals[1] + 1e-10);
      expect(r.interval.lo).toBeLessThan(lo);
      expect(r.interval.hi).toBeGreaterThan(hi);
      expect(r.interval.hi - r.interval.lo).toBeLessThan(0.5 * 2 * g);
      expect(r.groundBound).toBe(r.ritz.lo);
    });
  });

  describe('when Op is the transverse-field Ising ring of 12 (J = 0.9, h = 2.1)', () => {
    it('should find ±E0 of the free-fermion solution to 1e-6, inside an interval 1 % wider, and deterministically', () => {
      const n = 12, J = 0.9, h = 2.1;
      let e0 = 0;
      for (let m = 0; m < n; m++) e0 -= Math.sqrt(J * J + h * h - 2 * J * h * Math.cos((Math.PI * (2 * m + 1)) / n));
      const s = typicalSetup(ring(n, J, h));
      const apply = (i: Float64Array, o: Float64Array, a: number, b: number, c: number) => applyOperatorAffine(s.h0Op, 1, i, o, a, b, c);
      const [v, w] = vectors(s.dim);
      const r = lanczosInterval(apply, s.dim, s.h0Bound, v, w);
      expect(r.converged).toBe(true);
      // θ_min ≥ E0 (a Rayleigh quotient; 1e-10 for rounding) and within its residual bound; the
      // eigenvalue error is ≈ ρ²/gap, far below ρ: 1e-6 of |E0| ≈ 26 (seen: 2.4e-8).
      expect(r.ritz.lo - e0).toBeGreaterThanOrEqual(-1e-10);
      expect(r.ritz.lo - e0).toBeLessThanOrEqual(Math.min(r.residuals[0], 1e-6));
      expect(-e0 - r.ritz.hi).toBeGreaterThanOrEqual(-1e-10);
      expect(-e0 - r.ritz.hi).toBeLessThanOrEqual(Math.min(r.residuals[1], 1e-6));
      const spread = r.ritz.hi - r.ritz.lo;
      expect(r.interval.lo).toBeLessThanOrEqual(e0 - 0.01 * spread);
      expect(r.interval.lo).toBeGreaterThan(e0 - 0.011 * spread);
      expect(r.interval.hi).toBeGreaterThanOrEqual(-e0 + 0.01 * spread);
      // Σ|w| = 12·(0.9 + 2.1) = 36 against a radius of |E0| ≈ 26.
      expect(s.h0Bound.hi).toBeCloseTo(36, 12);
      expect(r.interval.hi).toBeLessThan(0.8 * s.h0Bound.hi);
      const again = lanczosInterval(apply, s.dim, s.h0Bound, v, w);
      expect(again).toEqual(r);
    });
  });

  describe('when the rigorous bound is tighter than the estimate or trivial', () => {
    it('should never return more than the bound, and return the bound for a point or a 1-dimensional space', () => {
      const h = randomHermitian(6, 3);
      const [v, w] = vectors(6);
      const tight = lanczosInterval(denseApply(h), 6, { lo: -0.1, hi: 0.1 }, v, w);
      expect(tight.interval).toEqual({ lo: -0.1, hi: 0.1 });
      const point = lanczosInterval(() => { throw new Error('no matvec expected'); }, 6, { lo: 2, hi: 2 }, v, w);
      expect(point).toMatchObject({ interval: { lo: 2, hi: 2 }, steps: 0, converged: true });
      const one = lanczosInterval(() => { throw new Error('no matvec expected'); }, 1, { lo: -1, hi: 3 }, new Float64Array(2), new Float64Array(2));
      expect(one.interval).toEqual({ lo: -1, hi: 3 });
    });
  });

  describe('when an argument is bad', () => {
    it('should throw a RangeError naming it', () => {
      const h = randomHermitian(4, 1);
      const [v, w] = vectors(4);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: 1, hi: -1 }, v, w)).toThrow(/bound/);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: -1, hi: Number.NaN }, v, w)).toThrow(/bound/);
      expect(() => lanczosInterval(denseApply(h), 0, { lo: -1, hi: 1 }, v, w)).toThrow(/dim/);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: -1, hi: 1 }, v, v)).toThrow(/distinct/);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: -1, hi: 1 }, v, new Float64Array(3))).toThrow(/distinct/);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: -1, hi: 1 }, v, w, { maxSteps: 0 })).toThrow(/maxSteps/);
      expect(() => lanczosInterval(denseApply(h), 4, { lo: -1, hi: 1 }, v, w, { margin: -0.1 })).toThrow(/margin/);
    });
  });
});
