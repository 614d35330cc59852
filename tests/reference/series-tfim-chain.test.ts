/**
 * External check: the high-temperature series of ln Z per site of the infinite
 * transverse-field Ising chain, computed by the series code's linked clusters, against the
 * Taylor expansion of the exact free-fermion free energy (Pfeuty, Ann. Phys. 57, 79 (1970);
 * Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961)), coefficient by coefficient.
 *
 * Pauli units (DESIGN.md §2): H = −J Σ Z_iZ_{i+1} − h Σ X_i. After Jordan–Wigner,
 * H = Σ_k ε_k (η_k†η_k − 1/2) with ε_k = 2√(J² + h² − 2Jh cos k) (limits: J = 0 gives the
 * single-spin gap 2h; h = 0 the domain-wall pair cost per fermion 2J), so
 *   ln Z/N = ln 2 + (1/π) ∫_0^π dk ln cosh(β ε_k/2),
 * and with ln cosh y = Σ_n ℓ_n y^{2n},
 *   [β^{2n}] ln Z/N = ℓ_n · (1/π) ∫_0^π (J² + h² − 2Jh cos k)^n dk,
 * odd orders vanishing. ℓ_n is computed here from the series of cosh by the logarithm
 * recursion, and the k-integral by the midpoint rule, exact for polynomials in cos k of degree
 * below twice the number of points. The Pauli-unit form is first checked numerically against
 * ln Z of a dense 8-site ring, which agrees with the infinite chain up to order β^7 (the first
 * cluster that wraps the ring has 8 sites), so the difference must fall like β^8.
 *
 * Also: the series engine on an open 30-site chain (the linked-cluster route) after a field
 * quench, against the free-fermion solution of the open chain (tests/support/reference/
 * free-fermion-ising.ts, same sources): thermodynamics, ⟨X⟩ and ⟨Z_iZ_{i+1}⟩ averaged, within
 * the series' own estimates.
 */
import { describe, expect, it } from 'vitest';
import type { SweepPoint, SweepSpec, ThermoRecord } from '../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../shared-types/src/index.js';
import { SeriesEngine } from '../../workers/src/engines/series/index.js';
import { infiniteLatticeLnZ } from '../../workers/src/series/index.js';
import { openTfimQuench } from '../support/reference/free-fermion-ising.js';

/** ln Z/N = ln 2 + (1/π)∫ ln cosh(β√(J²+h²−2Jh cos k)) dk by the midpoint rule. */
function pfeutyLnZPerSite(J: number, h: number, beta: number, points = 2000): number {
  let s = 0;
  for (let j = 0; j < points; j++) {
    const k = (Math.PI * (j + 0.5)) / points;
    s += Math.log(Math.cosh(beta * Math.sqrt(J * J + h * h - 2 * J * h * Math.cos(k))));
  }
  return Math.LN2 + s / points;
}

/** ℓ_n of ln cosh y = Σ ℓ_n y^{2n}, n = 0..nMax (log of Σ y^{2n}/(2n)! in the variable y²). */
function lnCoshCoefficients(nMax: number): number[] {
  const a: number[] = [];
  let f = 1;
  for (let n = 0; n <= nMax; n++) {
    if (n > 0) f *= (2 * n - 1) * (2 * n);
    a.push(1 / f);
  }
  const l = new Array<number>(nMax + 1).fill(0);
  for (let n = 1; n <= nMax; n++) {
    let s = 0;
    for (let k = 1; k < n; k++) s += k * l[k] * a[n - k];
    l[n] = a[n] - s / n;
  }
  return l;
}

/** Coefficients of β^0..β^order of ln Z/N from the free-fermion form. */
function pfeutyCoefficients(J: number, h: number, order: number): number[] {
  const l = lnCoshCoefficients(Math.floor(order / 2));
  const M = 64;
  const out = new Array<number>(order + 1).fill(0);
  out[0] = Math.LN2;
  for (let n = 1; 2 * n <= order; n++) {
    let s = 0;
    for (let j = 0; j < M; j++) s += (J * J + h * h - 2 * J * h * Math.cos((Math.PI * (j + 0.5)) / M)) ** n;
    out[2 * n] = l[n] * (s / M);
  }
  return out;
}

/** ln Tr e^{−βH} of the periodic 8-site ring from dense real matrix moments (Σ_k (−β)^k Tr H^k / k!). */
function denseRingLnZ(J: number, h: number, beta: number): number {
  const n = 8;
  const dim = 2 ** n;
  const H = new Float64Array(dim * dim);
  for (let s = 0; s < dim; s++) {
    const spin = (i: number) => (((s >> i) & 1) ? -1 : 1);
    let diag = 0;
    for (let i = 0; i < n; i++) diag -= J * spin(i) * spin((i + 1) % n);
    H[s * dim + s] = diag;
    for (let i = 0; i < n; i++) H[(s ^ (1 << i)) * dim + s] -= h;
  }
  // Accumulate Tr(e^{−βH}) = Σ_k Tr((−βH)^k)/k! with P_k = (−βH)^k/k! formed densely.
  let P = new Float64Array(dim * dim);
  for (let i = 0; i < dim; i++) P[i * dim + i] = 1;
  let trace = dim;
  for (let k = 1; k <= 40; k++) {
    const next = new Float64Array(dim * dim);
    for (let i = 0; i < dim; i++) {
      for (let m = 0; m < dim; m++) {
        const a = P[i * dim + m];
        if (a === 0) continue;
        const f = (-beta * a) / k;
        for (let j = 0; j < dim; j++) next[i * dim + j] += f * H[m * dim + j];
      }
    }
    P = next;
    let t = 0;
    let size = 0;
    for (let i = 0; i < dim; i++) t += P[i * dim + i];
    for (let q = 0; q < P.length; q++) size = Math.max(size, Math.abs(P[q]));
    trace += t;
    // Stop once every entry of (−βH)^k/k! is below 1e−20 (odd traces vanish exactly).
    if (size < 1e-20) break;
  }
  return Math.log(trace);
}

const chainSpec = (J: number, h: number) => ({
  lattice: { kind: 'chain', length: 40, boundary: 'periodic' },
  h0: { model: 'ising', J, hx: h, hz: 0 },
  h1: { model: 'ising', J, hx: h, hz: 0 },
}) as unknown as SweepSpec;

describe('transverse-field Ising chain, ln Z per site (Pfeuty 1970)', () => {
  it('has the Pauli-unit free-fermion form: a dense 8-site ring differs from it only at order β^8', () => {
    const J = 1, h = 0.7;
    const d1 = denseRingLnZ(J, h, 0.1) / 8 - pfeutyLnZPerSite(J, h, 0.1);
    const d2 = denseRingLnZ(J, h, 0.05) / 8 - pfeutyLnZPerSite(J, h, 0.05);
    expect(Math.abs(d1)).toBeLessThan(1e-7);
    // Halving β divides a β^8 difference by 256 (a β^2 or β^4 slip would give 4 or 16).
    expect(Math.abs(d1 / d2)).toBeGreaterThan(150);
    expect(Math.abs(d1 / d2)).toBeLessThan(400);
  });

  for (const [J, h, order] of [[1, 0.7, 14], [0.8, 1.25, 12]] as const) {
    it(`matches the Taylor coefficients through β^${order} for J = ${J}, h = ${h}`, () => {
      const series = infiniteLatticeLnZ(chainSpec(J, h), order, order);
      const exact = pfeutyCoefficients(J, h, order);
      expect(series[0] + Math.LN2).toBeCloseTo(exact[0], 15);
      for (let k = 1; k <= order; k++) {
        // Relative 1e−9: cumulants of ≤ 14-site clusters lose ~5 digits to cancellation.
        expect(Math.abs(series[k] - exact[k])).toBeLessThan(1e-9 * Math.max(1, Math.abs(exact[k])));
      }
      // The test is not vacuous: the high orders are far from zero.
      expect(Math.abs(exact[order])).toBeGreaterThan(1e-3);
    });
  }
});

describe('open 30-site chain after a field quench (free fermions: Lieb–Schultz–Mattis 1961, Pfeuty 1970)', () => {
  it('agrees with the free-fermion values within the series estimates at small β and t', async () => {
    const L = 30, J = 1, h0 = 0.6, h1 = 1.4;
    const betas = [0.05, 0.15];
    const times = [0, 0.1, 0.2];
    const spec = SweepSpecSchema.parse({
      lattice: { kind: 'chain', length: L, boundary: 'open' },
      h0: { model: 'ising', J, hx: h0, hz: 0 }, h1: { model: 'ising', J, hx: h1, hz: 0 },
      betas, times: { values: times },
      observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
      tolerance: 1e-3,
    });
    const thermo: ThermoRecord[] = [];
    const points: SweepPoint[] = [];
    await new SeriesEngine({ thermoOrder: 10, quenchOrder: 8 }).runBranch(spec, [0, 1], {
      thermo: (r) => thermo.push(r), point: (p) => points.push(p), diagnostics: () => {},
    });
    for (const [b, beta] of betas.entries()) {
      const ref = openTfimQuench({ length: L, J, h0, h1, beta, times });
      const r = thermo.find((x) => x.betaIndex === b)!;
      // Free-fermion reference: Jacobi eigen-solver, ~1e−12 (its own tests).
      expect(Math.abs(r.lnZ - ref.thermo.lnZ)).toBeLessThanOrEqual(r.errors.lnZ + 1e-10);
      expect(Math.abs(r.energy - ref.thermo.energy)).toBeLessThanOrEqual(r.errors.energy + 1e-10);
      expect(Math.abs(r.heatCapacity - ref.thermo.heatCapacity)).toBeLessThanOrEqual(r.errors.heatCapacity + 1e-10);
      for (const [t] of times.entries()) {
        const p = points.find((q) => q.betaIndex === b && q.timeIndex === t)!;
        const x = ref.x[t].reduce((a, v) => a + v, 0) / L;
        const zz = ref.zz[t].reduce((a, v) => a + v, 0) / (L - 1);
        expect(Math.abs(p.values[0] - x)).toBeLessThanOrEqual(p.errors[0] + 1e-10);
        expect(Math.abs(p.values[1] - zz)).toBeLessThanOrEqual(p.errors[1] + 1e-10);
        expect(p.errors[0]).toBeLessThan(1e-3);
      }
    }
  });
});
