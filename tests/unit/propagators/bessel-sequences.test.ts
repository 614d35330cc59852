/**
 * Bessel sequences by Miller's backward recurrence: identities, independent series, asymptotics.
 * Sources: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), cited per check.
 */
import { describe, expect, it } from 'vitest';
import { besselJSequence } from '../../../workers/src/propagators/bessel-j-sequence.js';
import { scaledBesselISequence } from '../../../workers/src/propagators/scaled-bessel-i-sequence.js';

/** Power series A&S 9.1.10 (sign = −1) or 9.6.10 (sign = +1), summed term by term. */
function powerSeries(k: number, x: number, sign: 1 | -1): number {
  let term = 1;
  for (let j = 1; j <= k; j++) term *= x / 2 / j;
  let sum = term;
  const q = (x * x) / 4;
  for (let m = 1; m < 200; m++) {
    term *= (sign * q) / (m * (m + k));
    sum += term;
    if (Math.abs(term) < 1e-18 * Math.abs(sum)) break;
  }
  return sum;
}

/** Hankel asymptotic expansion A&S 9.2.5 with P, Q from 9.2.9–9.2.10 (three terms each). */
function jAsymptotic(nu: number, x: number): number {
  const mu = 4 * nu * nu;
  const e = 8 * x;
  const p = 1 - ((mu - 1) * (mu - 9)) / (2 * e ** 2) + ((mu - 1) * (mu - 9) * (mu - 25) * (mu - 49)) / (24 * e ** 4);
  const q = (mu - 1) / e - ((mu - 1) * (mu - 9) * (mu - 25)) / (6 * e ** 3)
    + ((mu - 1) * (mu - 9) * (mu - 25) * (mu - 49) * (mu - 81)) / (120 * e ** 5);
  const chi = x - (nu / 2 + 0.25) * Math.PI;
  return Math.sqrt(2 / (Math.PI * x)) * (p * Math.cos(chi) - q * Math.sin(chi));
}

describe('besselJSequence', () => {
  it('satisfies J_0² + 2ΣJ_k² = 1 (A&S 9.1.76) from tiny to large arguments', () => {
    for (const x of [1e-6, 0.1, 1, 7.5, 100, 700]) {
      const j = besselJSequence(x, Math.ceil(1.5 * x) + 60);
      let s = j[0] ** 2;
      for (let k = 1; k < j.length; k++) s += 2 * j[k] ** 2;
      // ~k rounding errors of size ulp·|J|² each: 1e-13 is generous and still fails on any bug.
      expect(Math.abs(s - 1)).toBeLessThan(1e-13);
    }
  });

  it('agrees with the power series A&S 9.1.10 for x ≤ 5, including the decaying tail', () => {
    for (const x of [0.01, 0.5, 1, 2.5, 5]) {
      const j = besselJSequence(x, 25);
      for (let k = 0; k <= 25; k++) {
        const ref = powerSeries(k, x, -1);
        // Absolute 1e-15 near O(1) values; relative 1e-12 in the tail where values are tiny.
        expect(Math.abs(j[k] - ref)).toBeLessThan(1e-15 + 1e-12 * Math.abs(ref));
      }
    }
  });

  it('agrees with the Hankel asymptotic expansion A&S 9.2.5 at x = 100 and 1000', () => {
    for (const x of [100, 1000]) {
      const j = besselJSequence(x, 3);
      for (let nu = 0; nu <= 3; nu++) expect(Math.abs(j[nu] - jAsymptotic(nu, x))).toBeLessThan(1e-12);
    }
  });

  it('reproduces tabulated values (value from memory: J_0(1), J_1(1), J_0(10), J_1(10))', () => {
    const a = besselJSequence(1, 1);
    expect(a[0]).toBeCloseTo(0.7651976865579666, 14);
    expect(a[1]).toBeCloseTo(0.4400505857449335, 14);
    const b = besselJSequence(10, 1);
    expect(b[0]).toBeCloseTo(-0.2459357644513483, 14);
    expect(b[1]).toBeCloseTo(0.04347274616886144, 14);
  });

  it('returns the Kronecker delta at x = 0 and J_1(x) ≈ x/2 for tiny x', () => {
    expect(Array.from(besselJSequence(0, 3))).toEqual([1, 0, 0, 0]);
    const j = besselJSequence(1e-10, 2);
    expect(j[1]).toBeCloseTo(5e-11, 24);
    expect(j[2]).toBeCloseTo(1.25e-21, 34);
  });

  it('rejects a negative argument and a fractional order with RangeError', () => {
    expect(() => besselJSequence(-1, 3)).toThrow(RangeError);
    expect(() => besselJSequence(Number.NaN, 3)).toThrow(RangeError);
    expect(() => besselJSequence(1, 2.5)).toThrow(RangeError);
  });
});

describe('scaledBesselISequence', () => {
  it('satisfies e^{−x}(I_0 + 2Σ(−1)^k I_k) = e^{−2x} (A&S 9.6.37 at θ = π), independent of the normalisation', () => {
    for (const x of [1e-4, 0.5, 2, 8]) {
      const s = scaledBesselISequence(x, Math.ceil(x) + 60);
      let alt = s[0];
      for (let k = 1; k < s.length; k++) alt += (k % 2 === 0 ? 2 : -2) * s[k];
      expect(Math.abs(alt - Math.exp(-2 * x))).toBeLessThan(1e-15);
    }
  });

  it('agrees with the power series A&S 9.6.10 times e^{−x} for x ≤ 5', () => {
    for (const x of [0.01, 1, 3, 5]) {
      const s = scaledBesselISequence(x, 20);
      for (let k = 0; k <= 20; k++) {
        const ref = Math.exp(-x) * powerSeries(k, x, 1);
        expect(Math.abs(s[k] - ref)).toBeLessThan(1e-12 * ref + 1e-300);
      }
    }
  });

  it('agrees with the asymptotic expansion A&S 9.7.1 at x = 1000 without overflow', () => {
    const x = 1000;
    const s = scaledBesselISequence(x, 2);
    for (let nu = 0; nu <= 2; nu++) {
      const mu = 4 * nu * nu;
      const e = 8 * x;
      const ref = (1 - (mu - 1) / e + ((mu - 1) * (mu - 9)) / (2 * e * e) - ((mu - 1) * (mu - 9) * (mu - 25)) / (6 * e ** 3))
        / Math.sqrt(2 * Math.PI * x);
      expect(Math.abs(s[nu] - ref) / ref).toBeLessThan(1e-12);
    }
  });

  it('reproduces tabulated values (value from memory: I_0(1), I_1(1))', () => {
    const s = scaledBesselISequence(1, 1);
    expect(s[0] * Math.E).toBeCloseTo(1.2660658777520082, 14);
    expect(s[1] * Math.E).toBeCloseTo(0.5651591039924851, 14);
  });
});
