/**
 * Truncated Chebyshev series of e^{−iτx} and e^{−τ(x+1)}: the reported tail bound must hold
 * on a dense grid of [−1, 1], and the chosen order must be the smallest that meets the tolerance.
 */
import { describe, expect, it } from 'vitest';
import { chebyshevExpSeries, seriesRemainderBound } from '../../../workers/src/propagators/chebyshev-exp-series.js';
import { besselJSequence } from '../../../workers/src/propagators/bessel-j-sequence.js';
import { scaledBesselISequence } from '../../../workers/src/propagators/scaled-bessel-i-sequence.js';

function maxError(kind: 'real' | 'imaginary', tau: number, tol: number): { err: number; bound: number } {
  const s = chebyshevExpSeries(kind, tau, tol);
  let err = 0;
  for (let g = 0; g <= 400; g++) {
    const x = Math.cos((Math.PI * g) / 400);
    const theta = Math.acos(x);
    let re = 0, im = 0;
    for (let k = 0; k <= s.order; k++) {
      const t = Math.cos(k * theta); // T_k(x), independent of the recurrence
      re += s.coefficients[2 * k] * t;
      im += s.coefficients[2 * k + 1] * t;
    }
    const [fr, fi] = kind === 'real' ? [Math.cos(tau * x), -Math.sin(tau * x)] : [Math.exp(-tau * (x + 1)), 0];
    err = Math.max(err, Math.hypot(re - fr, im - fi));
  }
  return { err, bound: s.tailBound };
}

describe('chebyshevExpSeries', () => {
  it('keeps the real-time truncation error below the reported bound, and the bound below the tolerance', () => {
    for (const tau of [0.3, 3, 30, 150]) {
      for (const tol of [1e-4, 1e-9]) {
        const { err, bound } = maxError('real', tau, tol);
        expect(bound).toBeLessThanOrEqual(tol);
        // Rounding of the grid evaluation (~order·1e-16) is added to the bound.
        expect(err).toBeLessThanOrEqual(bound + 1e-13);
      }
    }
  });

  it('keeps the imaginary-time truncation error below the reported bound', () => {
    for (const tau of [0.3, 2, 20, 150]) {
      for (const tol of [1e-4, 1e-9]) {
        const { err, bound } = maxError('imaginary', tau, tol);
        expect(bound).toBeLessThanOrEqual(tol);
        expect(err).toBeLessThanOrEqual(bound + 1e-13);
      }
    }
  });

  it('picks the smallest order: dropping the last kept coefficient would exceed the tolerance', () => {
    for (const kind of ['real', 'imaginary'] as const) {
      for (const tau of [0.5, 5, 50]) {
        const tol = 1e-8;
        const s = chebyshevExpSeries(kind, tau, tol);
        const last = Math.hypot(s.coefficients[2 * s.order], s.coefficients[2 * s.order + 1]);
        expect(s.tailBound + last).toBeGreaterThan(tol);
      }
    }
  });

  it('has a rigorous remainder that dominates the actual coefficient tail', () => {
    for (const tau of [1, 10, 60]) {
      const big = Math.ceil(2 * tau) + 80;
      const j = besselJSequence(tau, big);
      const i = scaledBesselISequence(tau, big);
      for (let order = Math.ceil(tau); order < big - 20; order += 5) {
        let tj = 0, ti = 0;
        for (let k = order + 1; k <= big; k++) { tj += 2 * Math.abs(j[k]); ti += 2 * i[k]; }
        expect(seriesRemainderBound('real', tau, order)).toBeGreaterThanOrEqual(tj * (1 - 1e-12));
        expect(seriesRemainderBound('imaginary', tau, order)).toBeGreaterThanOrEqual(ti * (1 - 1e-12));
      }
    }
  });

  it('returns the single coefficient 1 at τ = 0 and rejects a non-positive tolerance', () => {
    const s = chebyshevExpSeries('real', 0, 1e-12);
    expect(s.order).toBe(0);
    expect(Array.from(s.coefficients)).toEqual([1, 0]);
    expect(() => chebyshevExpSeries('real', 1, 0)).toThrow(RangeError);
    expect(() => chebyshevExpSeries('imaginary', -1, 1e-8)).toThrow(RangeError);
  });
});
