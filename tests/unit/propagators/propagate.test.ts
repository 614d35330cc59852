/**
 * Chebyshev propagators against mathjs `expm` (mathjs: a general-purpose math library, used as
 * an independent dense reference) on a random 8×8 Hermitian matrix.
 */
import { describe, expect, it } from 'vitest';
import { propagateImaginaryTime } from '../../../workers/src/propagators/propagate-imaginary-time.js';
import { propagateRealTime } from '../../../workers/src/propagators/propagate-real-time.js';
import {
  denseApply, distance, expmTimes, hermitianEigenvalues, norm, randomHermitian, randomVector, rowSumBound,
} from './dense-complex.js';

const n = 8;
const h = randomHermitian(n, 7);
const apply = denseApply(h);
const r = rowSumBound(h); // Gershgorin: spectrum ⊂ [−r, r]
const interval = { lo: -r - 0.3, hi: r + 0.1 }; // deliberately off-centre and loose
const work = () => [new Float64Array(2 * n), new Float64Array(2 * n)];

describe('propagateRealTime', () => {
  it('matches expm(−itH)ψ within the returned bound, for loose and tight tolerances', () => {
    for (const t of [0.05, 1.3, 20]) {
      for (const tol of [1e-3, 1e-12]) {
        const psi0 = randomVector(n, 11);
        const psi = psi0.slice();
        const rep = propagateRealTime(apply, interval, t, psi, work(), { tolerance: tol });
        const ref = expmTimes(h, 0, -t, psi0);
        const err = distance(psi, ref) / norm(psi0);
        expect(rep.errorBound).toBeLessThanOrEqual(tol * (1 + 1e-9));
        // The bound covers truncation; 1e-12 covers expm's and the recurrence's rounding.
        expect(err).toBeLessThanOrEqual(rep.errorBound + 1e-12);
        expect(Math.abs(norm(psi) / norm(psi0) - 1)).toBeLessThanOrEqual(rep.errorBound + 1e-12);
        expect(rep.matvecs).toBe(rep.order * rep.steps);
      }
    }
  });

  it('gives the same result when the span is split into many sub-steps', () => {
    const psi0 = randomVector(n, 12);
    const a = psi0.slice();
    const b = psi0.slice();
    propagateRealTime(apply, interval, 9, a, work(), { tolerance: 1e-13 });
    const rep = propagateRealTime(apply, interval, 9, b, work(), { tolerance: 1e-13, maxStepTau: 3 });
    expect(rep.steps).toBeGreaterThan(10);
    expect(distance(a, b)).toBeLessThan(1e-11);
  });

  it('runs backwards for negative time (forward then back returns the start)', () => {
    const psi0 = randomVector(n, 13);
    const psi = psi0.slice();
    propagateRealTime(apply, interval, 4, psi, work(), { tolerance: 1e-13 });
    expect(distance(psi, psi0)).toBeGreaterThan(0.1);
    propagateRealTime(apply, interval, -4, psi, work(), { tolerance: 1e-13 });
    expect(distance(psi, psi0) / norm(psi0)).toBeLessThan(1e-12);
  });

  it('applies a pure phase without matvecs when the interval is a point', () => {
    const psi = Float64Array.of(1, 0, 0, 2);
    const rep = propagateRealTime(() => { throw new Error('no matvec expected'); }, { lo: 2, hi: 2 }, 0.5, psi,
      [new Float64Array(4), new Float64Array(4)], { tolerance: 1e-12 });
    expect(rep.matvecs).toBe(0);
    expect(psi[0]).toBeCloseTo(Math.cos(1), 15);
    expect(psi[1]).toBeCloseTo(-Math.sin(1), 15);
    expect(psi[2]).toBeCloseTo(2 * Math.sin(1), 15);
  });

  it('rejects aliased work buffers and an inverted interval', () => {
    const psi = randomVector(n, 1);
    const w = new Float64Array(2 * n);
    expect(() => propagateRealTime(apply, interval, 1, psi, [w, w], { tolerance: 1e-8 })).toThrow(RangeError);
    expect(() => propagateRealTime(apply, interval, 1, psi, [psi, w], { tolerance: 1e-8 })).toThrow(RangeError);
    expect(() => propagateRealTime(apply, { lo: 1, hi: 0 }, 1, psi, work(), { tolerance: 1e-8 })).toThrow(RangeError);
  });
});

describe('propagateImaginaryTime', () => {
  it('matches expm(−ΔH)ψ/‖·‖ and its log-norm within κ·errorBound', () => {
    for (const delta of [0.01, 0.7, 6]) {
      for (const tol of [1e-4, 1e-12]) {
        const psi0 = randomVector(n, 21);
        const psi = psi0.slice();
        const rep = propagateImaginaryTime(apply, interval, delta, psi, work(), { tolerance: tol });
        const ref = expmTimes(h, -delta, 0, psi0);
        const refNorm = norm(ref);
        for (let k = 0; k < ref.length; k++) ref[k] /= refNorm;
        // κ ≤ ‖ψ‖/‖e^{−Δ(H−lo)}ψ‖ since E0 ≥ lo (see the propagator's header).
        const shifted = expmTimes(h, -delta, 0, psi0);
        const kappa = norm(psi0) / (norm(shifted) * Math.exp(delta * interval.lo));
        const err = distance(psi, ref);
        expect(rep.errorBound).toBeLessThanOrEqual(tol * (1 + 1e-9));
        expect(err).toBeLessThanOrEqual(2 * kappa * rep.errorBound + 1e-12);
        expect(Math.abs(rep.lnNormGrowth - Math.log(refNorm / norm(psi0)))).toBeLessThanOrEqual(
          2 * kappa * rep.errorBound + 1e-12);
        expect(norm(psi)).toBeCloseTo(1, 14);
      }
    }
  });

  it('splits Δ so that each sub-step has τ ≤ maxStepTau and still converges', () => {
    const psi0 = randomVector(n, 22);
    const psi = psi0.slice();
    const rep = propagateImaginaryTime(apply, interval, 3, psi, work(), { tolerance: 1e-13, maxStepTau: 0.5 });
    const halfWidth = (interval.hi - interval.lo) / 2;
    expect(rep.steps).toBe(Math.ceil((3 * halfWidth) / 0.5));
    const ref = expmTimes(h, -3, 0, psi0);
    const refNorm = norm(ref);
    for (let k = 0; k < ref.length; k++) ref[k] /= refNorm;
    expect(distance(psi, ref)).toBeLessThan(1e-11);
  });

  it('takes one long step on a tight interval with a ground bound, within κ·errorBound of expm and with fewer matvecs', () => {
    // Tight interval from the reference eigenvalues (cyclic Jacobi on the real embedding of H,
    // tests/support/reference/jacobi-eigen.ts); any g ≥ E0 is a valid ground bound: E0 + 0.01.
    const eig = hermitianEigenvalues(h);
    const tight = { lo: eig[0] - 0.05, hi: eig[eig.length - 1] + 0.05 };
    for (const delta of [0.7, 6]) {
      const psi0 = randomVector(n, 23);
      const psi = psi0.slice();
      const rep = propagateImaginaryTime(apply, tight, delta, psi, work(), { tolerance: 1e-12, groundBound: eig[0] + 0.01 });
      const plain = propagateImaginaryTime(apply, tight, delta, psi0.slice(), work(), { tolerance: 1e-12 });
      expect(rep.steps).toBe(1);
      expect(rep.matvecs).toBeLessThan(plain.matvecs);
      expect(rep.errorBound).toBeLessThanOrEqual(1e-12 * (1 + 1e-9));
      const ref = expmTimes(h, -delta, 0, psi0);
      const refNorm = norm(ref);
      for (let k = 0; k < ref.length; k++) ref[k] /= refNorm;
      const kappa = norm(psi0) / (refNorm * Math.exp(delta * tight.lo));
      expect(distance(psi, ref)).toBeLessThanOrEqual(2 * kappa * rep.errorBound + 1e-12);
      expect(Math.abs(rep.lnNormGrowth - Math.log(refNorm / norm(psi0)))).toBeLessThanOrEqual(2 * kappa * rep.errorBound + 1e-12);
    }
    expect(() => propagateImaginaryTime(apply, tight, 1, randomVector(n, 3), work(), { tolerance: 1e-8, groundBound: tight.hi + 1 })).toThrow(/groundBound/);
  });

  it('only normalises at Δ = 0 and rejects the zero vector and a negative Δ', () => {
    const psi = Float64Array.of(3, 0, 0, 4);
    const rep = propagateImaginaryTime(apply, interval, 0, psi, [new Float64Array(4), new Float64Array(4)], { tolerance: 1e-8 });
    expect(rep.lnNormGrowth).toBe(0);
    expect(psi[0]).toBeCloseTo(0.6, 15);
    expect(psi[3]).toBeCloseTo(0.8, 15);
    expect(() => propagateImaginaryTime(apply, interval, 1, new Float64Array(2 * n), work(), { tolerance: 1e-8 })).toThrow(RangeError);
    expect(() => propagateImaginaryTime(apply, interval, -1, randomVector(n, 3), work(), { tolerance: 1e-8 })).toThrow(RangeError);
  });
});
