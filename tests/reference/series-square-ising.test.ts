/**
 * External check: the high-temperature series of ln Z per site of the classical square-lattice
 * Ising model (hx = hz = 0), computed by the series code's linked clusters, against Onsager's
 * exact free energy (L. Onsager, Phys. Rev. 65, 117 (1944)) expanded in K = βJ, coefficient by
 * coefficient:
 *   ln Z/N = ln 2 + (1/2π²) ∫_0^π∫_0^π dθ1 dθ2 ln[cosh²2K − sinh 2K (cos θ1 + cos θ2)].
 * The Taylor coefficients of the integrand in K are obtained point by point from the series of
 * cosh²2K = (1 + cosh 4K)/2 and sinh 2K by the logarithm recursion, then averaged with the
 * midpoint rule, exact here because the coefficient of K^k is a polynomial of degree ≤ k in
 * cos θ1 + cos θ2. No tabulated coefficients are used.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpec } from '../../shared-types/src/index.js';
import { infiniteLatticeLnZ } from '../../workers/src/series/index.js';

/** Coefficients of K^0..K^order of ln Z/N from Onsager's double integral. */
function onsagerCoefficients(order: number, points = 16): number[] {
  const fact: number[] = [1];
  for (let k = 1; k <= order; k++) fact.push(fact[k - 1] * k);
  const out = new Array<number>(order + 1).fill(0);
  for (let i = 0; i < points; i++) {
    for (let j = 0; j < points; j++) {
      const s = Math.cos((Math.PI * (i + 0.5)) / points) + Math.cos((Math.PI * (j + 0.5)) / points);
      // a(K) = cosh²2K − s·sinh 2K.
      const a = new Array<number>(order + 1).fill(0);
      a[0] = 1;
      for (let k = 1; k <= order; k++) a[k] = k % 2 === 0 ? 2 ** (2 * k - 1) / fact[k] : (-s * 2 ** k) / fact[k];
      const l = new Array<number>(order + 1).fill(0);
      for (let k = 1; k <= order; k++) {
        let acc = 0;
        for (let m = 1; m < k; m++) acc += m * l[m] * a[k - m];
        l[k] = a[k] - acc / k;
      }
      for (let k = 1; k <= order; k++) out[k] += l[k] / 2 / (points * points);
    }
  }
  out[0] = Math.LN2;
  return out;
}

/** Onsager's ln Z/N at K by the midpoint rule (the log singularity at K_c is integrable). */
function onsagerLnZ(K: number, points: number): number {
  let s = 0;
  const c2 = Math.cosh(2 * K) ** 2;
  const sh = Math.sinh(2 * K);
  for (let i = 0; i < points; i++) {
    const c1 = Math.cos((Math.PI * (i + 0.5)) / points);
    for (let j = 0; j < points; j++) s += Math.log(c2 - sh * (c1 + Math.cos((Math.PI * (j + 0.5)) / points)));
  }
  return Math.LN2 + s / (2 * points * points);
}

const classical = {
  lattice: { kind: 'square', size: [30, 30], boundary: ['periodic', 'periodic'] },
  h0: { model: 'ising', J: 1, hx: 0, hz: 0 },
  h1: { model: 'ising', J: 1, hx: 0, hz: 0 },
} as unknown as SweepSpec;

describe('classical square-lattice Ising, ln Z per site (Onsager 1944)', () => {
  it('reads the double integral correctly: ln 2 + K² at small K and −βf = ln 2/2 + 2G/π at K_c', () => {
    // Leading term from Tr(H²)/2^N = 2J² per site (common practice).
    expect(onsagerCoefficients(2)[2]).toBeCloseTo(1, 14);
    // Critical free energy, G = Catalan's constant 0.915965594177219… (value from memory).
    const Kc = 0.5 * Math.log(1 + Math.SQRT2);
    expect(onsagerLnZ(Kc, 1500)).toBeCloseTo(Math.LN2 / 2 + (2 * 0.915965594177219) / Math.PI, 4);
  });

  it('matches the Taylor coefficients through K^10', () => {
    const order = 10;
    const series = infiniteLatticeLnZ(classical, order, order);
    const exact = onsagerCoefficients(order);
    for (let k = 1; k <= order; k++) {
      // Relative 1e−8: the cluster sums of up to 10-site clusters lose ~6 digits to cancellation.
      expect(Math.abs(series[k] - exact[k])).toBeLessThan(1e-8 * Math.max(1, Math.abs(exact[k])));
    }
    // Not vacuous: odd orders vanish, even ones do not, and K^4 carries the first plaquette.
    expect(Math.abs(exact[3])).toBeLessThan(1e-14);
    expect(exact[4]).toBeCloseTo(5 / 6, 12);
    expect(exact[10]).toBeGreaterThan(1);
  });
});
