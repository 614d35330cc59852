/**
 * External check: the typical engine on the open transverse-field Ising chain, L = 16, against
 * the free-fermion solution (Jordan–Wigner; Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961);
 * Pfeuty, Ann. Phys. 57, 79 (1970)) in tests/support/reference/free-fermion-ising.ts (checked
 * against dense diagonalisation in free-fermion-reference.test.ts).
 *
 * Setting: H0 = −Σ Z_iZ_{i+1} − 0.5 Σ X_i, quench to H1 = −Σ Z_iZ_{i+1} − 1.5 Σ X_i, β ∈ {0.5, 1},
 * t ∈ {0, 0.5, 1}; ⟨X⟩ averaged and on the middle site, ⟨ZZ⟩ on nearest bonds, ln Z, E, C.
 * L = 16 (2^16 amplitudes per sample) keeps this file near half a minute on a loaded 2-core
 * machine; L = 20 runs in the benchmark (tests/bench/typical/typical.bench.ts) instead.
 *
 * Statistics: 16 samples (the engine's cap here), so each error bar is a jackknife estimate
 * with 15 degrees of freedom: a fair value lies beyond 3σ with probability ≈ 0.9 % and beyond
 * 4σ with ≈ 0.1 % (Student t). Over these 24 values: every one within 4σ (≈ 3 % chance of a
 * false failure), at most 2 beyond 3σ (expected 0.2), RMS z-score in [0.4, 1.6] (error bars
 * off by a factor 2.5 either way fail it). Seed 1 (the default), chosen before running.
 */
import { describe, expect, it } from 'vitest';
import { TypicalEngine } from '../../workers/src/engines/typical/index.js';
import { openTfimQuench } from '../support/reference/free-fermion-ising.js';
import { collect, spec } from '../unit/exact/collect.js';

const L = 16, J = 1, H0 = 0.5, H1 = 1.5;
const TIMES = [0, 0.5, 1];
const CAP = 16;

describe('the typical engine on the open transverse-field Ising chain (free-fermion reference)', () => {
  it('matches ln Z, E, C and ⟨X⟩(t), ⟨X_8⟩(t), ⟨ZZ⟩(t) after the quench 0.5 → 1.5 within its error bars', async () => {
    const s = spec({
      lattice: { kind: 'chain', length: L, boundary: 'open' },
      h0: { model: 'ising', J, hx: H0 }, h1: { model: 'ising', J, hx: H1 },
      betas: [0.5, 1], times: { values: TIMES },
      observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'site', pauli: 'X', sites: [L / 2] }],
      tolerance: 2e-3,
      seed: 1,
    });
    const engine = new TypicalEngine({ maxSamples: CAP });
    const out = await collect(engine, s, [0, 1]);
    const zs: Array<{ what: string; z: number }> = [];
    for (const b of [0, 1]) {
      const beta = s.betas[b];
      const ref = openTfimQuench({ length: L, J, h0: H0, h1: H1, beta, times: TIMES });
      const t = out.thermo.find((r) => r.betaIndex === b)!;
      for (const key of ['lnZ', 'energy', 'heatCapacity'] as const) {
        zs.push({ what: `β=${beta} ${key}`, z: (t[key] - ref.thermo[key]) / t.errors[key] });
      }
      for (const p of out.points.filter((q) => q.betaIndex === b)) {
        const ti = p.timeIndex;
        const want = [
          ref.x[ti].reduce((a, v) => a + v, 0) / L,
          ref.zz[ti].reduce((a, v) => a + v, 0) / (L - 1),
          ref.x[ti][L / 2],
        ];
        want.forEach((w, k) => zs.push({ what: `β=${beta} t=${TIMES[ti]} series ${k}`, z: (p.values[k] - w) / p.errors[k] }));
      }
      // The diagnostics tell the truth about the tolerance: met exactly when every error is within it.
      const d = out.diagnostics.find((x) => x.betaIndex === b)!;
      const worst = Math.max(...out.points.filter((q) => q.betaIndex === b).flatMap((q) => q.errors));
      expect(d.extra.met).toBe(worst <= s.tolerance);
      expect(d.extra.samples).toBe(CAP);
      // ⟨H1⟩ is conserved by each sample's evolution up to 2δ‖H1‖, ‖H1‖ ≤ 15 + 16·1.5 = 39.
      expect(d.h1Drift).toBeLessThan(2 * d.propagatorErrorBound * 39 + 1e-12);
    }
    expect(zs).toHaveLength(24);
    for (const { what, z } of zs) expect(Math.abs(z), what).toBeLessThan(4);
    const beyond3 = zs.filter((x) => Math.abs(x.z) > 3);
    expect(beyond3.length, beyond3.map((x) => `${x.what}: ${x.z.toFixed(2)}`).join('; ')).toBeLessThanOrEqual(2);
    const rms = Math.sqrt(zs.reduce((a, x) => a + x.z * x.z, 0) / zs.length);
    expect(rms).toBeGreaterThan(0.4);
    expect(rms).toBeLessThan(1.6);
  });
});
