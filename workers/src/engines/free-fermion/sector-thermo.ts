/**
 * sectorThermo — ln Z, E, C of a Hamiltonian quadratic in Majoranas on each fermion-parity
 * sector (majorana-hamiltonian.ts), exactly from the single-particle energies ε_k ≥ 0 of the
 * Schur forms A_p = O_p(⊕ε_k J)O_pᵀ (skew-schur.ts), and the weights of the four Gaussian
 * components that observables are averaged over.
 *
 * One sector (H commutes with nothing special: open chains): H = Σ_k (ε_k/2)·n_k + c with
 * n_k = i c'_{2k}c'_{2k+1} = ±1 commuting (c' = Oᵀc), so with x_k = βε_k/2 and τ_k = tanh x_k
 *   ln Z = Σ_k ln 2cosh x_k − βc,  E = c − Σ_k (ε_k/2)τ_k,  C = β² Σ_k (ε_k/2)²(1 − τ_k²)
 * (Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); Pfeuty, Ann. Phys. 57, 79 (1970)).
 *
 * Two sectors (a ring): H = Σ_p Π_p H_p Π_p, Π_p = (1 + pP)/2, so
 *   Z = Σ_p Tr(Π_p e^{−βH_p}) = ½ Σ_p [Tr e^{−βH_p} + p·Tr(P e^{−βH_p})].
 * With P = i^L c_0⋯c_{2L−1} = det(O_p)·Π_k n_k (the top Majorana product transforms with det O),
 *   Tr(P e^{−βH_p}) = det(O_p)·Π_k(−2 sinh x_k)·e^{−βc_p},
 * so Z = Σ_p w_p, w_p = ½·Z_p⁺·(1 + q_p·e^{s_p}), Z_p⁺ = e^{−βc_p}Π 2cosh x_k,
 * q_p = p·(−1)^L·det O_p, s_p = Σ_k ln τ_k. (Derived here; the four terms are the
 * (periodic | antiperiodic) × (trace | trace with P) combinations.) Derivatives of ln w_p:
 *   −∂_β ln w_p = E_p = E_p⁺ − q e^s s'/f,            f = 1 + q e^s,
 *   ∂²_β ln w_p = V_p = V_p⁺ + q e^s (s'² + s''f)/f²,
 *   s' = Σ ε_k/sinh(βε_k),  s'' = −Σ ε_k² cosh(βε_k)/sinh²(βε_k)  (both finite as ε_k → 0),
 * and with π_p = w_p/Z: E = Σ π_p E_p, C = β²(Σ π_p V_p + Σ π_p (E_p − E)²).
 * f is formed as 1 + e^s or −expm1(s) so that a sector whose thermal weight nearly cancels
 * keeps full relative accuracy.
 *
 * Component weights (observables, gaussian-components.ts): ⟨O⟩ = Σ_p [u_p⟨O⟩_{Γ_p} + v_p⟨O⟩_{Γ̃_p}],
 * u_p = ½Z_p⁺/Z (ordinary thermal Gaussian), v_p = u_p·q_p·e^{s_p} (the "twisted" Gaussian
 * P e^{−βH_p}/Tr(P e^{−βH_p}), whose mode occupations are −coth x_k instead of −tanh x_k).
 * Cost: O(L) per call.
 */

/** Spectrum of one sector. */
export interface SectorSpectrum {
  /** Single-particle energies ε_k ≥ 0 (L of them). */
  readonly eps: Float64Array;
  /** det O of the Schur form. */
  readonly det: 1 | -1;
  /** Constant c_p of the sector's Hamiltonian. */
  readonly constant: number;
}

/** Weights of one sector's Gaussian components. */
export interface SectorWeights {
  /** u_p: weight of the thermal Gaussian. */
  readonly plain: number;
  /** v_p = u_p·q_p·e^{s_p}: weight of the twisted Gaussian (0 for a single sector). */
  readonly twisted: number;
  /** q_p = p·(−1)^L·det O_p (1 for a single sector). */
  readonly q: 1 | -1;
  /** π_p = w_p/Z. */
  readonly probability: number;
}

/** Thermodynamics at one β and the component weights. */
export interface SectorThermo {
  readonly lnZ: number;
  readonly energy: number;
  readonly heatCapacity: number;
  /** One entry per sector (index 0: p = +1, index 1: p = −1). */
  readonly sectors: readonly SectorWeights[];
}

/** ln(2 cosh x), stable for large |x|. */
export function lnTwoCosh(x: number): number {
  const a = Math.abs(x);
  return a + Math.log1p(Math.exp(-2 * a));
}

/** ln tanh x for x ≥ 0 (−∞ at 0), accurate also when tanh x is within rounding of 1. */
export function lnTanh(x: number): number {
  if (x <= 0) return -Infinity;
  if (x < 0.5) return Math.log(Math.tanh(x));
  const e = Math.exp(-2 * x);
  return Math.log1p(-e) - Math.log1p(e);
}

/** ε/sinh(βε), → 1/β as βε → 0 (β > 0). */
function epsOverSinh(eps: number, beta: number): number {
  const x = beta * eps;
  if (x < 1e-4) return (1 - (x * x) / 6) / beta;
  return eps / Math.sinh(x);
}

/** ε² cosh(βε)/sinh²(βε), → 1/β² as βε → 0 (β > 0). */
function epsSqCoshOverSinhSq(eps: number, beta: number): number {
  const x = beta * eps;
  if (x < 1e-4) return (1 + (x * x) / 6) / (beta * beta);
  if (x > 700) return 0;
  const s = Math.sinh(x);
  return (eps * eps * Math.cosh(x)) / (s * s);
}

/**
 * Thermodynamics at β ≥ 0 of one sector (spectra.length = 1) or of the two parity sectors
 * (spectra = [p = +1, p = −1]) on `sites` sites.
 * @throws RangeError if β is negative or not finite, or spectra has neither 1 nor 2 entries.
 */
export function sectorThermo(spectra: readonly SectorSpectrum[], beta: number, sites: number): SectorThermo {
  if (!(beta >= 0) || !Number.isFinite(beta)) throw new RangeError(`sectorThermo: β must be finite and ≥ 0; got ${beta}`);
  if (spectra.length !== 1 && spectra.length !== 2) throw new RangeError(`sectorThermo: 1 or 2 sector spectra expected; got ${spectra.length}`);
  const parts = spectra.map((sp) => {
    let a = -beta * sp.constant;
    let ePlus = sp.constant;
    let vPlus = 0;
    let s = 0;
    for (const eps of sp.eps) {
      const x = 0.5 * beta * eps;
      const tau = Math.tanh(x);
      a += lnTwoCosh(x);
      ePlus -= 0.5 * eps * tau;
      vPlus += 0.25 * eps * eps * (1 - tau * tau);
      s += lnTanh(x);
    }
    return { a, ePlus, vPlus, s, sp };
  });
  if (spectra.length === 1) {
    const [p] = parts;
    return {
      lnZ: p.a, energy: p.ePlus, heatCapacity: beta * beta * p.vPlus,
      sectors: [{ plain: 1, twisted: 0, q: 1, probability: 1 }],
    };
  }
  const sign = sites % 2 === 0 ? 1 : -1;
  const rows = parts.map((p, idx) => {
    const parity = idx === 0 ? 1 : -1;
    const q = (parity * sign * p.sp.det) as 1 | -1;
    const es = Math.exp(p.s);
    const f = q === 1 ? 1 + es : -Math.expm1(p.s);
    const lnF = q === 1 ? Math.log1p(es) : Math.log(f);
    const lnW = p.a - Math.LN2 + lnF;
    let g = 0;
    let gPrime = 0;
    if (es > 0 && f > 0 && beta > 0) {
      let s1 = 0;
      let s2 = 0;
      for (const eps of p.sp.eps) {
        s1 += epsOverSinh(eps, beta);
        s2 -= epsSqCoshOverSinhSq(eps, beta);
      }
      g = (q * es * s1) / f;
      gPrime = (q * es * (s1 * s1 + s2 * f)) / (f * f);
    }
    return { ...p, q, es, f, lnW, energy: p.ePlus - g, variance: p.vPlus + gPrime };
  });
  const top = Math.max(rows[0].lnW, rows[1].lnW);
  const lnZ = top + Math.log(Math.exp(rows[0].lnW - top) + Math.exp(rows[1].lnW - top));
  let energy = 0;
  const prob = rows.map((r) => (r.f > 0 ? Math.exp(r.lnW - lnZ) : 0));
  rows.forEach((r, k) => { if (prob[k] > 0) energy += prob[k] * r.energy; });
  let variance = 0;
  rows.forEach((r, k) => {
    if (prob[k] > 0) variance += prob[k] * (r.variance + (r.energy - energy) ** 2);
  });
  const sectors = rows.map((r, k) => {
    const plain = Math.exp(r.a - Math.LN2 - lnZ);
    return { plain, twisted: plain * r.q * r.es, q: r.q, probability: prob[k] };
  });
  return { lnZ, energy, heatCapacity: beta * beta * variance, sectors };
}
