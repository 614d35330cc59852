/**
 * External check: the typical engine on the classical 4 × 4 Ising torus (hx = hz = 0, 16 sites,
 * 32 bonds) against the exact torus partition function of B. Kaufman, Phys. Rev. 76, 1232
 * (1949) (tests/support/reference/kaufman-torus.ts, itself checked against enumeration and
 * transfer matrices in kaufman-torus.test.ts); K_c = ln(1 + √2)/2 from L. Onsager, Phys. Rev.
 * 65, 117 (1944).
 *
 *   E = −J ∂ln Z/∂K,   C = K² ∂²ln Z/∂K²   (K = βJ; the second derivative by central differences of
 *   Kaufman's exact first derivative at steps 1e-3 and 5e-4 with one Richardson step: truncation
 *   O(1e-12·|∂⁵ln Z|), rounding ~ε·|∂ln Z|/1e-3 ≈ 1e-11 — far below the checks).
 *
 * What this tests. H0 is diagonal, so e^{−βH0/2} is diagonal and a random-phase vector gives
 * ‖ψ_r‖² = Σ_s e^{−βE_s}/2^N and ⟨ψ_r|H0|ψ_r⟩ exactly, in every sample (|r_s|² = 2^{−N}): the
 * jackknife errors are rounding, and the comparison checks the whole imaginary-time pipeline
 * (Chebyshev propagation of 2^16 vectors, ln Z bookkeeping, ratio estimators, C without
 * cancellation) to ~1e-9 relative — much more than "within error bars". It does not test the
 * statistics (typical-vs-exact.test.ts and the free-fermion check do).
 */
import { describe, expect, it } from 'vitest';
import { TypicalEngine } from '../../workers/src/engines/typical/index.js';
import { kaufmanTorus, ONSAGER_KC } from '../support/reference/kaufman-torus.js';
import { collect, spec } from '../unit/exact/collect.js';

const J = 1;
const BETAS = [0.2, ONSAGER_KC, 0.6, 1];

/** C from Kaufman: K² d²ln Z/dK², central differences of the exact derivative with one Richardson step. */
function kaufmanHeatCapacity(K: number): number {
  const central = (d: number) => (kaufmanTorus(4, 4, K + d).dLnZdK - kaufmanTorus(4, 4, K - d).dLnZdK) / (2 * d);
  const d = 1e-3;
  return K * K * ((4 * central(d / 2) - central(d)) / 3);
}

describe('the typical engine on the classical 4 × 4 Ising torus (Kaufman 1949)', () => {
  it('matches ln Z, E and C at four temperatures around T_c, within its error bars and to 1e-8 relative', async () => {
    const s = spec({
      lattice: { kind: 'square', size: [4, 4], boundary: ['periodic', 'periodic'] },
      h0: { model: 'ising', J }, h1: { model: 'ising', J, hx: 1 },
      betas: BETAS, times: { values: [0] },
      observables: [{ kind: 'energy', of: 'h0' }, { kind: 'pair', paulis: 'ZZ' }],
      tolerance: 1e-3,
    });
    const engine = new TypicalEngine();
    const plan = engine.plan(s);
    expect(plan.feasible).toBe(true);
    expect(plan.sites).toBe(16);
    const out = await collect(engine, s, [0, 1, 2, 3]);
    expect(out.thermo).toHaveLength(4);
    for (const rec of out.thermo) {
      const K = rec.beta * J;
      const ref = kaufmanTorus(4, 4, K);
      const want = { lnZ: ref.lnZ, energy: -J * ref.dLnZdK, heatCapacity: kaufmanHeatCapacity(K) };
      for (const key of ['lnZ', 'energy', 'heatCapacity'] as const) {
        const dev = Math.abs(rec[key] - want[key]);
        // Within the reported error (jackknife σ + truncation bound), with 3σ as elsewhere…
        expect(dev, `${key} at K = ${K}`).toBeLessThanOrEqual(3 * rec.errors[key]);
        // …and, H0 being diagonal, exact up to the propagators' truncation (the state error is
        // kept near 1e-2 × tolerance / (10β²a²) for C, a = 32) and rounding: 1e-8 relative.
        expect(dev / Math.abs(want[key]), `${key} at K = ${K}`).toBeLessThan(1e-8);
      }
      // The per-site energy is −2J⟨Z_i Z_j⟩ on this lattice (2 bonds per site): the series agrees.
      const zz = out.points.find((p) => p.betaIndex === rec.betaIndex)!.values[1];
      expect(Math.abs(-2 * J * 16 * zz - rec.energy)).toBeLessThan(1e-9 * Math.abs(rec.energy));
    }
    for (const d of out.diagnostics) {
      // Every sample gives the same numbers: the fewest samples are used and the tolerance is met.
      expect(d.extra.samples).toBe(8);
      expect(d.extra.met).toBe(true);
      expect(Number(d.extra.statErrorMax)).toBeLessThan(1e-12);
    }
  });

});
