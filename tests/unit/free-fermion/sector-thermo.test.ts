/**
 * sectorThermo: the analytic E and C of the parity-projected sum agree with numerical
 * derivatives of its own ln Z (E = −∂_β ln Z, C = β² ∂²_β ln Z; central differences, common
 * practice), including a sector whose weight nearly cancels and exact zero modes; the weights
 * of the Gaussian components sum to one; β = 0 and a single sector reduce to closed forms.
 */
import { describe, expect, it } from 'vitest';
import { lnTanh, lnTwoCosh, sectorThermo, type SectorSpectrum } from '../../../workers/src/engines/free-fermion/sector-thermo.js';

const spec = (eps: number[], det: 1 | -1, constant = 0): SectorSpectrum => ({ eps: Float64Array.from(eps), det, constant });

describe('sectorThermo', () => {
  const cases: Array<[string, SectorSpectrum[], number]> = [
    ['two sectors whose twisted terms add', [spec([0.4, 1.1, 2.3, 0.05], 1, 0.2), spec([0.3, 1.2, 2.2, 0.7], 1, -0.1)], 4],
    ['a sector that nearly cancels (q = −1, low T)', [spec([1.5, 2.0, 2.5], -1), spec([1.4, 2.1, 2.6], 1)], 3],
    ['an exact zero mode in one sector', [spec([0, 1.3, 2.1, 2.9], -1), spec([0.5, 1.3, 2.1, 2.9], 1)], 4],
    ['one sector', [spec([0.2, 0.9, 1.7], 1, 0.3)], 3],
  ];
  for (const [what, spectra, L] of cases) {
    it(`gives E = −∂ ln Z/∂β and C = β² ∂² ln Z/∂β² for ${what}`, () => {
      for (const beta of [0.3, 1, 4, 9]) {
        const d = 1e-4;
        const f = (b: number) => sectorThermo(spectra, b, L).lnZ;
        const t = sectorThermo(spectra, beta, L);
        const e = -(f(beta + d) - f(beta - d)) / (2 * d);
        const c = beta * beta * (f(beta + d) - 2 * f(beta) + f(beta - d)) / (d * d);
        // Central differences: truncation ~d² ≈ 1e−8, rounding in the second difference ~u/d² ≈ 1e−8·|ln Z|.
        expect(Math.abs(t.energy - e), `E at β = ${beta}`).toBeLessThan(1e-7);
        expect(Math.abs(t.heatCapacity - c), `C at β = ${beta}`).toBeLessThan(2e-5 * Math.max(1, beta * beta));
        const total = t.sectors.reduce((s, w) => s + w.plain + w.twisted, 0);
        expect(Math.abs(total - 1)).toBeLessThan(1e-14);
        for (const w of t.sectors) expect(w.probability).toBeGreaterThanOrEqual(0);
      }
    });
  }

  it('gives ln Z = L ln 2 and E = mean constant at β = 0', () => {
    const t = sectorThermo([spec([1, 2, 3], 1, 0.5), spec([1, 2, 3], -1, -0.5)], 0, 3);
    expect(Math.abs(t.lnZ - 3 * Math.LN2)).toBeLessThan(1e-15);
    expect(Math.abs(t.energy)).toBeLessThan(1e-15);
    expect(t.heatCapacity).toBe(0);
    for (const w of t.sectors) expect(Math.abs(w.twisted)).toBe(0);
  });

  it('computes ln 2cosh and ln tanh without overflow or cancellation', () => {
    expect(lnTwoCosh(800)).toBe(800);
    expect(Math.abs(lnTwoCosh(0) - Math.LN2)).toBeLessThan(1e-16);
    expect(lnTanh(0)).toBe(-Infinity);
    // ln tanh x ≈ −2e^{−2x} for large x; at x = 20 that is −8.5e−18, beyond 1 − tanh in doubles.
    expect(Math.abs(lnTanh(20) + 2 * Math.exp(-40)) / (2 * Math.exp(-40))).toBeLessThan(1e-12);
  });

  it('rejects a negative β and a wrong number of sectors', () => {
    expect(() => sectorThermo([spec([1], 1)], -1, 1)).toThrow(RangeError);
    expect(() => sectorThermo([], 1, 1)).toThrow(RangeError);
  });
});
