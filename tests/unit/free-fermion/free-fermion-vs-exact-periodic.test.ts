/**
 * External check: the free-fermion engine against the exact engine (the doubled state vector,
 * DESIGN.md §3) on the periodic transverse-field Ising chain at L = 8 and L = 10, to 1e−10
 * (vs-exact-shared.ts). Quench h = 0.5 → 1.5 across the critical field of the free-fermion
 * solution (Pfeuty, Ann. Phys. 57, 79 (1970)). At L = 10 one β and two times keep the exact
 * engine's run (4^10 amplitudes) near 10 s of CPU on this machine kind.
 */
import { describe, expect, it } from 'vitest';
import { AGREEMENT, expectAgreement, runBoth } from './vs-exact-shared.js';

describe('free-fermion vs exact engine, periodic chain', () => {
  it('agrees at L = 8 on ln Z, E, C and every series (X per site, ZZ by distance, YY, XX, energies)', async () => {
    const { ff, exact } = await runBoth({
      lattice: { kind: 'chain', length: 8, boundary: 'periodic' },
      h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
      betas: [0.3, 2], times: { start: 0, stop: 3, count: 4 },
      observables: [
        { kind: 'site', pauli: 'X', perSite: true },
        { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' },
        { kind: 'pair', paulis: 'YY', pairs: 'nearest' },
        { kind: 'pair', paulis: 'XX', pairs: 'next-nearest', connected: true },
        { kind: 'energy', of: 'h0' },
        { kind: 'energy', of: 'h1' },
        { kind: 'structure-factor', paulis: 'ZZ', momenta: [[Math.PI, 0], [0.7, 0]] },
      ],
      tolerance: 1e-10,
    });
    expect(expectAgreement(ff, exact)).toBeLessThan(AGREEMENT);
  });

  it('agrees at L = 10 on ln Z, E, C, ⟨X_i⟩(t) and ⟨Z_iZ_j⟩(t) for every distance', async () => {
    const { ff, exact } = await runBoth({
      lattice: { kind: 'chain', length: 10, boundary: 'periodic' },
      h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
      betas: [0.5], times: { values: [0, 1.2] },
      observables: [
        { kind: 'site', pauli: 'X', perSite: true },
        { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' },
        { kind: 'energy', of: 'h1' },
      ],
      tolerance: 1e-10,
    });
    expect(expectAgreement(ff, exact)).toBeLessThan(AGREEMENT);
  });
});
