/**
 * External check at N = 8: the open transverse-field Ising chain is free fermions
 * (Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); Pfeuty, Ann. Phys. 57, 79 (1970)),
 * via the shared reference tests/support/reference/free-fermion-ising.ts.
 */
import { describe, expect, it } from 'vitest';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { openTfimQuench } from '../../support/reference/free-fermion-ising.js';
import { collect, seriesOf, spec } from './collect.js';

describe('ExactEngine on the open Ising chain of 8 sites', () => {
  it('matches the free-fermion thermodynamics and ⟨X_j⟩(t), ⟨ZZ⟩(t) after a field quench', async () => {
    const engine = new ExactEngine();
    const L = 8, J = 1, h0 = 0.6, h1 = 1.4;
    const betas = [0.4, 1.5];
    const times = [0, 0.5, 1];
    const s = spec({
      lattice: { kind: 'chain', length: L },
      h0: { model: 'ising', J, hx: h0 }, h1: { model: 'ising', J, hx: h1 },
      betas, times: { values: times },
      observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'energy', of: 'h1' }],
    });
    const out = await collect(engine, s, [0, 1]);
    const xs = [...Array(L).keys()].map((j) => seriesOf(engine, s, `X@${j}`));
    const zz = seriesOf(engine, s, 'ZZ:nearest');
    for (const r of out.thermo) {
      const ref = openTfimQuench({ length: L, J, h0, h1, beta: r.beta, times });
      expect(Math.abs(r.lnZ - ref.thermo.lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-10);
      expect(Math.abs(r.energy - ref.thermo.energy)).toBeLessThanOrEqual(r.errors.energy + 1e-10);
      expect(Math.abs(r.heatCapacity - ref.thermo.heatCapacity)).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-10);
      for (const p of out.points.filter((q) => q.betaIndex === r.betaIndex)) {
        const t = p.timeIndex;
        xs.forEach((k, j) => expect(Math.abs(p.values[k] - ref.x[t][j])).toBeLessThanOrEqual(p.errors[k] + 1e-10));
        const zzRef = ref.zz[t].reduce((a, b) => a + b, 0) / (L - 1);
        expect(Math.abs(p.values[zz] - zzRef)).toBeLessThanOrEqual(p.errors[zz] + 1e-10);
      }
    }
    for (const d of out.diagnostics) {
      // |Δ⟨H1⟩| ≤ 2‖H1‖δ with ‖H1‖ ≤ Σ|w| = (L − 1)J + L·h1 (error-budget.ts).
      expect(d.h1Drift).toBeLessThanOrEqual(2 * ((L - 1) * J + L * h1) * d.propagatorErrorBound);
      expect(d.stationarityResidual).toBeNull();
    }
  });
});
