/**
 * External check: the leading high-temperature behaviour of the exact engine's thermodynamics.
 * With moments μ_k = Tr(H^k)/2^N (μ_1 = 0 for the traceless Ising Hamiltonian), the cumulant
 * expansion of ln Tr e^{−βH} gives (common practice; textbook high-temperature series):
 *   ln Z = N ln 2 + β²μ₂/2 − β³μ₃/6 + O(β⁴),
 *   E = ⟨H⟩_β = −βμ₂ + β²μ₃/2 − β³(μ₄ − 3μ₂²)/6 + O(β⁴),
 *   C = β²(μ₂ − βμ₃ + O(β²)).
 * For the transverse-field Ising preset H = −J Σ⟨ij⟩ Z_iZ_j − hx Σ X_i − hz Σ Z_i, distinct Pauli
 * strings are trace-orthogonal, so μ₂ = N_bonds J² + N(hx² + hz²) exactly (common practice), and
 * the only products of three terms proportional to 1 are (Z_iZ_j)(Z_i)(Z_j): μ₃ = −6 J hz² N_bonds.
 * The moments are also computed here from a dense 2^N matrix built independently of the engine.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult } from '../../shared-types/src/index.js';
import { squareBonds } from '../support/reference/classical-ising-count.js';
import { runReferenceSweep } from '../support/reference/run-reference-sweep.js';

const LX = 3, LY = 3, N = LX * LY, J = 1, HX = 0.5, HZ = 0.3;
const BONDS = squareBonds(LX, LY, [false, false]);
const BETAS = [2.5e-3, 5e-3, 1e-2];

/** μ_2, μ_3, μ_4 of the Ising Hamiltonian from a dense real 2^N matrix (site i = bit i). */
function denseMoments(): { mu2: number; mu3: number; mu4: number } {
  const dim = 2 ** N;
  const h = new Float64Array(dim * dim);
  for (let s = 0; s < dim; s++) {
    const spin = (i: number) => (((s >> i) & 1) ? -1 : 1);
    let diag = 0;
    for (const [i, j] of BONDS) diag -= J * spin(i) * spin(j);
    for (let i = 0; i < N; i++) { diag -= HZ * spin(i); h[(s ^ (1 << i)) * dim + s] -= HX; }
    h[s * dim + s] += diag;
  }
  const h2 = new Float64Array(dim * dim);
  for (let i = 0; i < dim; i++) {
    for (let k = 0; k < dim; k++) {
      const a = h[i * dim + k];
      if (a === 0) continue;
      for (let j = 0; j < dim; j++) h2[i * dim + j] += a * h[k * dim + j];
    }
  }
  // H is real symmetric: Tr(H³) = Σ (H²)_ij H_ij, Tr(H⁴) = Σ (H²)_ij².
  let t2 = 0, t3 = 0, t4 = 0;
  for (let i = 0; i < dim; i++) t2 += h2[i * dim + i];
  for (let q = 0; q < dim * dim; q++) { t3 += h2[q] * h[q]; t4 += h2[q] * h2[q]; }
  return { mu2: t2 / dim, mu3: t3 / dim, mu4: t4 / dim };
}

let result: SweepResult;
const moments = denseMoments();

describe('the Pauli-trace moments of the Ising preset (reference)', () => {
  it('gives Tr(H²)/2^N = N_bonds J² + N(hx² + hz²) and Tr(H³)/2^N = −6 J hz² N_bonds', () => {
    expect(BONDS.length).toBe(12);
    const mu2 = BONDS.length * J * J + N * (HX * HX + HZ * HZ);
    // Sums of 512 entries of size ≲ 40: rounding ≲ 1e-12 relative.
    expect(Math.abs(moments.mu2 - mu2) / mu2).toBeLessThan(1e-12);
    expect(Math.abs(moments.mu3 - -6 * J * HZ * HZ * BONDS.length)).toBeLessThan(1e-11);
  });
});

describe('the exact engine at high temperature (3 × 3 open square Ising, hx = 0.5, hz = 0.3)', () => {
  beforeAll(async () => {
    result = await runReferenceSweep({
      lattice: { kind: 'square', size: [LX, LY], boundary: ['open', 'open'] },
      h0: { model: 'ising', J, hx: HX, hz: HZ },
      h1: { model: 'ising', J, hx: HX, hz: HZ },
      betas: BETAS,
      times: { values: [0] },
      observables: [{ kind: 'energy', of: 'h0' }],
      engine: 'exact',
    });
  }, 120_000);

  it('has ⟨H⟩_β = −β Tr(H²)/2^N + O(β²), the remainder falling linearly in β', () => {
    const { mu2, mu3, mu4 } = moments;
    const kappa4 = mu4 - 3 * mu2 * mu2;
    const remainders = result.thermo.map((rec) => {
      const beta = rec.beta;
      // Leading term: within 1 % of E itself at these β (the O(β²) term is β|μ₃|/(2μ₂) ≲ 0.2 % of it).
      expect(Math.abs(rec.energy / beta + mu2) / mu2).toBeLessThan(1e-2);
      const r = rec.energy / beta + mu2;
      // r(β)/β → μ₃/2; the next term is −β κ₄/6. Allow twice that (higher orders are O(β²)),
      // plus the engine's own energy error amplified by 1/β².
      const allowance = 2 * beta * Math.abs(kappa4) / 6 + rec.errors.energy / (beta * beta) + 1e-6;
      expect(Math.abs(r / beta - mu3 / 2)).toBeLessThan(allowance);
      return r;
    });
    // Linear fall: halving β halves the remainder (ratio 2 up to O(β) corrections, here ≲ 2 %).
    expect(Math.abs(remainders[1] / remainders[0] - 2)).toBeLessThan(0.05);
    expect(Math.abs(remainders[2] / remainders[1] - 2)).toBeLessThan(0.05);
  });

  it('has ln Z = N ln 2 + β²μ₂/2 − β³μ₃/6 + O(β⁴) and C = β²μ₂ + O(β³)', () => {
    const { mu2, mu3, mu4 } = moments;
    for (const rec of result.thermo) {
      const beta = rec.beta;
      const lnZ = N * Math.LN2 + (beta * beta * mu2) / 2 - (beta ** 3 * mu3) / 6;
      // Next term β⁴κ₄/24 (≈ 1e-7 at β = 1e-2); allow twice it plus rounding of ln Z ≈ 6.
      expect(Math.abs(rec.lnZ - lnZ)).toBeLessThan(2 * beta ** 4 * Math.abs(mu4 - 3 * mu2 * mu2) / 24 + 1e-12);
      // C/β² = μ₂ − βμ₃ + O(β²): allow twice the β² scale of κ₄/2.
      expect(Math.abs(rec.heatCapacity / (beta * beta) - (mu2 - beta * mu3))).toBeLessThan(beta * beta * Math.abs(mu4 - 3 * mu2 * mu2) + 1e-6);
    }
  });
});
