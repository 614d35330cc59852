/**
 * External check of the spectral engine's symmetry blocks: the ground-state energy of the
 * periodic transverse-field Ising ring H = −J Σ Z_i Z_i+1 − h Σ X_i from its free-fermion
 * solution (Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); Pfeuty, Ann. Phys. 57, 79
 * (1970)): in the paramagnetic phase h > J the ground state has even fermion parity, whose
 * modes take the antiperiodic momenta k = π(2n+1)/N, and
 *   E0 = −Σ_k √(J² + h² − 2Jh·cos k).
 * The ring of 12 runs with translation and inversion blocks (no magnetisation symmetry here).
 * At β = 30 the thermal energy is E0 up to e^{−β·Δ} with the gap Δ ≈ 2(h − J) = 2.4, i.e.
 * ~1e−31: the tolerance 1e-10 covers only the eigensolver's rounding (~1e-14 observed).
 * F = −ln Z/β tends to E0 as well, up to −ln(degeneracy)/β with a non-degenerate ground state.
 */
import { describe, expect, it } from 'vitest';
import { SpectralEngine } from '../../workers/src/engines/spectral/index.js';
import { collect, spec } from '../unit/exact/collect.js';

describe('spectral engine on the periodic transverse-field Ising ring (Pfeuty 1970)', () => {
  it('reaches the free-fermion ground-state energy at low temperature, using translation and inversion blocks', async () => {
    const n = 12;
    const J = 0.9;
    const h = 2.1;
    const s = spec({
      lattice: { kind: 'chain', length: n, boundary: 'periodic' },
      h0: { model: 'ising', J, hx: h }, h1: { model: 'ising', J, hx: h },
      betas: [30], times: { values: [0] }, observables: [{ kind: 'energy', of: 'h0' }],
    });
    let e0 = 0;
    for (let m = 0; m < n; m++) e0 -= Math.sqrt(J * J + h * h - 2 * J * h * Math.cos((Math.PI * (2 * m + 1)) / n));
    const out = await collect(new SpectralEngine(), s, [0]);
    const t = out.thermo[0];
    expect(Math.abs(t.energy - e0)).toBeLessThanOrEqual(1e-10);
    expect(Math.abs(t.freeEnergy! - e0)).toBeLessThanOrEqual(1e-10);
    expect(Math.abs(out.points[0].values[0] - e0)).toBeLessThanOrEqual(1e-10);
    const x = out.diagnostics[0].extra;
    expect(x.symmetry).toBe('translation a1 (order 12) + reflection inversion');
    expect(x.largestBlock).toBeLessThan(400); // 4096 states in blocks of ≈ 4096/12
  });
});
