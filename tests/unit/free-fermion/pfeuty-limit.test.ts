/**
 * External check: thermodynamic limit of the transverse-field Ising chain H = −J Σ Z_iZ_{i+1} −
 * h Σ X_i (Pauli units). Its single-particle energies are ε_k = 2√(J² + h² − 2Jh cos k)
 * (Pfeuty, Ann. Phys. 57, 79 (1970), whose spin-½ units S = σ/2 give the same spectrum up to
 * the factor 4 in the couplings; re-derived for our units from the Fourier transform of the
 * Majorana matrix A: A(k) couples a_k and b_k with −2h + 2J e^{−ik}), hence per site
 *   −βf = ln 2 + (1/π) ∫_0^π dk ln cosh(βε_k/2),   e = −(1/π) ∫_0^π dk (ε_k/2) tanh(βε_k/2).
 * Away from the critical point h = J the finite-size corrections are exponentially small:
 * a ring of L = 200 (both parity sectors) and the bulk of open chains (ln Z(400) − ln Z(200))/200
 * must match the integrals (adaptive Simpson quadrature to 1e−14, common practice) to 1e−10.
 * On the ring the parity-projected ("twisted") terms are of relative size Π_k tanh(βε_k/2),
 * which in the ordered phase h < J adds between the sectors instead of cancelling: at β = 3,
 * h = 0.5 it is ≈ e^{−4} for L = 200 (a real finite-size effect of 1e−4 per site), so the
 * ordered ring is compared only at β ≤ 1, where it is below e^{−50}.
 *
 * Also a large-L stability check: ⟨X_i⟩(t) at the centre of an open chain of L = 400 equals the
 * centre of L = 80 (the boundaries are ≥ 40 sites away; Lieb–Robinson: the quench signal moves at
 * ≤ max_k |dε_k/dk| = 2·min(J, h) = 2 sites per unit time, and thermal correlations decay on a
 * few sites at β = 1), i.e. rounding at n = 800 Majoranas stays near 1e−13.
 */
import { describe, expect, it } from 'vitest';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { runEngine, seriesIndex } from './run-engine.js';

const engine = new FreeFermionEngine();

/** Adaptive Simpson quadrature of f on [a, b] to absolute tolerance tol (common practice). */
function integrate(f: (x: number) => number, a: number, b: number, tol: number): number {
  const simpson = (fa: number, fm: number, fb: number, h: number) => (h / 6) * (fa + 4 * fm + fb);
  const rec = (a0: number, b0: number, fa: number, fm: number, fb: number, whole: number, eps: number, depth: number): number => {
    const m = (a0 + b0) / 2;
    const lm = (a0 + m) / 2;
    const rm = (m + b0) / 2;
    const flm = f(lm);
    const frm = f(rm);
    const left = simpson(fa, flm, fm, m - a0);
    const right = simpson(fm, frm, fb, b0 - m);
    if (depth > 40 || Math.abs(left + right - whole) <= 15 * eps) return left + right + (left + right - whole) / 15;
    return rec(a0, m, fa, flm, fm, left, eps / 2, depth + 1) + rec(m, b0, fm, frm, fb, right, eps / 2, depth + 1);
  };
  const fa = f(a), fb = f(b), fm = f((a + b) / 2);
  return rec(a, b, fa, fm, fb, simpson(fa, fm, fb, b - a), tol, 0);
}

const lnCosh = (x: number) => Math.abs(x) + Math.log1p(Math.exp(-2 * Math.abs(x))) - Math.LN2;

function pfeuty(J: number, h: number, beta: number): { lnZPerSite: number; energyPerSite: number } {
  const eps = (k: number) => 2 * Math.sqrt(J * J + h * h - 2 * J * h * Math.cos(k));
  return {
    lnZPerSite: Math.LN2 + integrate((k) => lnCosh((beta * eps(k)) / 2), 0, Math.PI, 1e-14) / Math.PI,
    energyPerSite: -integrate((k) => (eps(k) / 2) * Math.tanh((beta * eps(k)) / 2), 0, Math.PI, 1e-14) / Math.PI,
  };
}

const BETAS = [0.5, 1, 3];
/** β values where the ring of 200 sites is in its thermodynamic limit to 1e−10 per site. */
const RING_BETAS: Record<string, number[]> = { '0.5': [0.5, 1], '1.6': [0.5, 1, 3] };

describe('thermodynamic limit of the transverse-field chain (Pfeuty 1970)', () => {
  for (const h of [0.5, 1.6]) {
    it(`gives ln Z/L and E/L of a ring of 200 sites equal to the integrals at h = ${h}`, async () => {
      const L = 200;
      const betas = RING_BETAS[String(h)];
      const run = await runEngine(engine, {
        lattice: { kind: 'chain', length: L, boundary: 'periodic' },
        h0: { model: 'ising', J: 1, hx: h }, h1: { model: 'ising', J: 1, hx: h },
        betas, times: { values: [0] },
        observables: [{ kind: 'site', pauli: 'X', sites: [0] }],
        tolerance: 1e-9,
      });
      betas.forEach((beta, b) => {
        const want = pfeuty(1, h, beta);
        expect(Math.abs(run.thermo[b].lnZ / L - want.lnZPerSite), `ln Z/L at β = ${beta}`).toBeLessThan(1e-10);
        expect(Math.abs(run.thermo[b].energy / L - want.energyPerSite), `E/L at β = ${beta}`).toBeLessThan(1e-10);
      });
    });
  }

  it('gives the bulk free energy of open chains, (ln Z(400) − ln Z(200))/200, equal to the integral', async () => {
    const lnZ = async (L: number) => (await runEngine(engine, {
      lattice: { kind: 'chain', length: L, boundary: 'open' },
      h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 0.5 },
      betas: BETAS, times: { values: [0] },
      observables: [{ kind: 'site', pauli: 'X', sites: [0] }],
      tolerance: 1e-9,
    })).thermo.map((r) => r.lnZ);
    const [a, b] = [await lnZ(200), await lnZ(400)];
    BETAS.forEach((beta, k) => {
      expect(Math.abs((b[k] - a[k]) / 200 - pfeuty(1, 0.5, beta).lnZPerSite), `β = ${beta}`).toBeLessThan(1e-10);
    });
  });

  it('gives the ordered ring its parity-doublet excess ln Z − L·(−βf) = ln(1 + e^{−cL}), and none in the disordered phase', async () => {
    // Derived here: Z = ½Σ_p Z_p⁺(1 + q_p Π_k tanh(βε_k/2)); both sectors have Z_p⁺ ≈ e^{−βLf}
    // and Π tanh ≈ e^{−cL}, c = −(1/π)∫_0^π ln tanh(βε_k/2) dk (exponentially accurate Riemann
    // sums). In the ordered phase q₊ = q₋ = +1 (the excess adds: the near-degenerate doublet);
    // in the disordered phase q₊ = −q₋ and it cancels. A sign error in q flips ln(1 + x) to ln(1 − x).
    for (const [h, beta, ordered] of [[0.5, 3, true], [0.5, 5, true], [1.6, 3, false]] as const) {
      const L = 200;
      const run = await runEngine(engine, {
        lattice: { kind: 'chain', length: L, boundary: 'periodic' },
        h0: { model: 'ising', J: 1, hx: h }, h1: { model: 'ising', J: 1, hx: h },
        betas: [beta], times: { values: [0] },
        observables: [{ kind: 'site', pauli: 'X', sites: [0] }],
        tolerance: 1e-9,
      });
      const eps = (k: number) => 2 * Math.sqrt(1 + h * h - 2 * h * Math.cos(k));
      const c = -integrate((k) => Math.log(Math.tanh((beta * eps(k)) / 2)), 0, Math.PI, 1e-14) / Math.PI;
      const excess = run.thermo[0].lnZ - L * pfeuty(1, h, beta).lnZPerSite;
      const want = ordered ? Math.log1p(Math.exp(-c * L)) : 0;
      expect(Math.abs(excess - want), `h = ${h}, β = ${beta}`).toBeLessThan(1e-9);
      if (ordered) expect(excess).toBeGreaterThan(1e-2);
    }
  });

  it('detects a wrong dispersion (the comparison can fail): h and J swapped in the sign of cos k', () => {
    const right = pfeuty(1, 0.5, 1).energyPerSite;
    const eps = (k: number) => 2 * Math.sqrt(1 + 0.25 + 2 * 0.5 * Math.cos(k) + 0.3);
    const wrong = -integrate((k) => (eps(k) / 2) * Math.tanh(eps(k) / 2), 0, Math.PI, 1e-14) / Math.PI;
    expect(Math.abs(right - wrong)).toBeGreaterThan(1e-3);
  });
});

describe('large-L rounding stability', () => {
  it('gives the same bulk ⟨X_i⟩(t) and ⟨Z_iZ_i+1⟩(t) at the centre of L = 400 and L = 80 open chains', async () => {
    const centre = async (L: number) => {
      const c = L / 2;
      const run = await runEngine(engine, {
        lattice: { kind: 'chain', length: L, boundary: 'open' },
        h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
        betas: [1], times: { values: [0, 0.5, 1, 2] },
        observables: [{ kind: 'site', pauli: 'X', sites: [c], perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: [[c, c + 1]], perPair: true }],
        tolerance: 1e-9,
      });
      return run.values[0].map((row) => [row[seriesIndex(run, `X@${c}`)], row[seriesIndex(run, `ZZ@${c}-${c + 1}`)]]);
    };
    const small = await centre(80);
    const large = await centre(400);
    let worst = 0;
    small.forEach((row, t) => row.forEach((v, k) => { worst = Math.max(worst, Math.abs(v - large[t][k])); }));
    // Boundary effects are below 1e−20 here; what remains is rounding at n = 800.
    expect(worst).toBeLessThan(1e-12);
    expect(Math.abs(small[3][0] - small[0][0])).toBeGreaterThan(1e-2); // the quench does move ⟨X⟩
  });
});
