/**
 * Unit tests of Padé approximants and the truncation estimates (workers/src/series): closed-form
 * approximants, and estimates that bound the actual error of functions with known Taylor series.
 */
import { describe, expect, it } from 'vitest';
import { evaluatePade, padeApproximant, resumSeries, seriesShape } from '../../../workers/src/series/index.js';

/** Taylor coefficients of e^x. */
const expCoeffs = (n: number) => Array.from({ length: n + 1 }, (_, k) => 1 / [...Array(k).keys()].reduce((p, j) => p * (j + 1), 1));
/** Taylor coefficients of ln(1 + x) (radius 1, singular at x = −1). */
const log1p = (n: number) => Array.from({ length: n + 1 }, (_, k) => (k === 0 ? 0 : (-1) ** (k + 1) / k));
/** Taylor coefficients of 1/(1 − x)² (radius 1, singular at x = +1). */
const inverseSquare = (n: number) => Array.from({ length: n + 1 }, (_, k) => k + 1);

describe('padeApproximant', () => {
  it('gives [1/1] of e^x = (1 + x/2)/(1 − x/2) (Baker & Graves-Morris, Padé Approximants, §1.2)', () => {
    const a = padeApproximant(expCoeffs(4), 1, 1)!;
    expect(Array.from(a.p)).toEqual([1, 0.5]);
    expect(a.q[0]).toBe(1);
    expect(a.q[1]).toBeCloseTo(-0.5, 15);
  });

  it('reproduces a rational function exactly from enough coefficients', () => {
    // f = (1 + 2x)/(1 − 3x + x²): coefficients from the recursion c_k = 3c_{k−1} − c_{k−2} (+ numerator).
    const c = [1, 5];
    for (let k = 2; k < 8; k++) c.push(3 * c[k - 1] - c[k - 2]);
    const a = padeApproximant(c, 1, 2)!;
    for (const x of [0.1, 0.2, -0.4]) expect(evaluatePade(a, x)).toBeCloseTo((1 + 2 * x) / (1 - 3 * x + x * x), 12);
  });

  it('returns null for a singular table entry and refuses bad sizes', () => {
    // [1/1] of an even series: the 1×1 system is c_1·q_1 = −c_2 with c_1 = 0.
    expect(padeApproximant([1, 0, 1], 1, 1)).toBeNull();
    expect(() => padeApproximant([1, 2], 1, 1)).toThrow(RangeError);
    expect(() => padeApproximant([1, 2, 3], -1, 1)).toThrow(RangeError);
  });
});

describe('seriesShape', () => {
  it('finds stride 2 for an even series and the radius of ln(1 + x) near 1', () => {
    const even = [1, 0, 0.5, 0, 0.25, 0, 0.125, 0, 1 / 16];
    expect(seriesShape(even).stride).toBe(2);
    const s = seriesShape(log1p(12));
    expect(s.stride).toBe(1);
    expect(s.radius).toBeGreaterThan(0.7);
    expect(s.radius).toBeLessThan(1.3);
  });
});

describe('resumSeries', () => {
  it('bounds the actual error of the partial sum inside the radius, and the bound falls with the order', () => {
    for (const x of [0.2, 0.4, 0.6]) {
      let previous = Infinity;
      for (const n of [6, 9, 12]) {
        const est = resumSeries(inverseSquare(n), x, { pade: false });
        const err = Math.abs(est.value - 1 / (1 - x) ** 2);
        expect(err).toBeLessThanOrEqual(est.error);
        expect(est.error).toBeLessThan(previous);
        previous = est.error;
      }
    }
  });

  it('continues ln(1 + x) beyond the radius with Padé approximants and an honest spread', () => {
    const est = resumSeries(log1p(14), 1.5);
    expect(est.method).toBe('pade');
    expect(est.inWindow).toBe(true);
    expect(Math.abs(est.value - Math.log(2.5))).toBeLessThanOrEqual(est.error);
    expect(est.error).toBeLessThan(1e-3);
  });

  it('reports outside the window where neither the sum nor Padé can be trusted', () => {
    // 1/(1 − x)² has a double pole at 1; beyond it nothing is claimed.
    const est = resumSeries(inverseSquare(10), 1.2, { pade: false });
    expect(est.inWindow).toBe(false);
    expect(est.error).toBe(Infinity);
  });

  it('is exact at x = 0 and charges an all-zero tail with the fallback radius', () => {
    expect(resumSeries([3, 1, 2], 0)).toMatchObject({ value: 3, error: 0, inWindow: true });
    const zeroTail = resumSeries([0, 0, 0, 0, 0], 0.1, { fallbackRadius: 1, fallbackScale: 2 });
    expect(zeroTail.value).toBe(0);
    // 2 × scale × q^{N+1}/(1 − q) with q = 0.1, N = 4.
    expect(zeroTail.error).toBeCloseTo((2 * 2 * 0.1 ** 5) / 0.9, 15);
    expect(resumSeries([0, 0, 0], 0.1).error).toBe(0);
  });

  it('refuses negative or non-finite x and an empty series', () => {
    expect(() => resumSeries([1], -0.1)).toThrow(RangeError);
    expect(() => resumSeries([1], Number.NaN)).toThrow(RangeError);
    expect(() => resumSeries([], 0.1)).toThrow(RangeError);
  });
});
