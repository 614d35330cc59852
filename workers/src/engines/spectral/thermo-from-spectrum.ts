/**
 * thermoFromSpectrum — thermodynamics at β straight from the eigenvalues E_k of H0:
 *   ln Z = −β·E_min + ln Σ_k e^{−β(E_k − E_min)}      (shifted: no overflow at any β)
 *   p_k = e^{−β(E_k − E_min)} / Σ,   E = Σ p_k E_k,   Var = Σ p_k (E_k − E)²   (two passes)
 *   C = β²·Var,   F = −ln Z/β (null at β = 0),   S = ln Z + β·E.
 * These equal the doubled-state definitions of DESIGN.md §2: Z(β) = Tr e^{−βH0} is
 * 2^N‖(e^{−βH0/2} ⊗ 1)|I⟩‖².
 *
 * Errors. The eigenvalues are exact for H0 + E with ‖E‖ ≤ η (decompose-blocks.ts), so each
 * moves by at most η (Weyl). To first order in η, with m₁ = Σ p|E_k − E| ≤ σ = √Var:
 *   |Δ ln Z| ≤ β·η,   |ΔE| ≤ η·(1 + β·m₁),   |ΔVar| ≤ η·(2σ + 2β·Var)
 * (from ∂E/∂E_k = p_k(1 − β(E_k − E)) and ∂Var/∂E_k = p_k(2(E_k − E) − β((E_k − E)² − Var))),
 * plus the summation rounding n·ε·Σ|terms| of n-term sums (Higham, Accuracy and Stability of
 * Numerical Algorithms, 2nd ed., §4.2). F and S inherit: |ΔF| = |Δ ln Z|/β,
 * |ΔS| ≤ |Δ ln Z| + β|ΔE| (thermo-record.ts).
 * Cost: O(n) with n = 2^N eigenvalues; writes the normalised weights into `weights`.
 */
import type { ThermoRecord } from '../../../../shared-types/src/index.js';
import { thermoRecord } from '../thermo-record.js';

/** Inputs of {@link thermoFromSpectrum}. */
export interface SpectrumThermoInput {
  /** All eigenvalues of H0 (any order; every block concatenated). */
  readonly energies: Float64Array;
  readonly beta: number;
  readonly betaIndex: number;
  readonly sites: number;
  /** Backward error η of the decomposition. */
  readonly backwardError: number;
  /** Receives p_k (same order as energies); length ≥ energies.length. */
  readonly weights: Float64Array;
}

/** The ThermoRecord at β and the weights p_k (see the file header). */
export function thermoFromSpectrum(input: SpectrumThermoInput): ThermoRecord {
  const { energies, beta, betaIndex, sites, backwardError: eta, weights } = input;
  const n = energies.length;
  let emin = Infinity;
  let emaxAbs = 0;
  for (let k = 0; k < n; k++) {
    emin = Math.min(emin, energies[k]);
    emaxAbs = Math.max(emaxAbs, Math.abs(energies[k]));
  }
  let sum = 0;
  for (let k = 0; k < n; k++) {
    const w = Math.exp(-beta * (energies[k] - emin));
    weights[k] = w;
    sum += w;
  }
  const inv = 1 / sum;
  let energy = 0;
  for (let k = 0; k < n; k++) {
    weights[k] *= inv;
    energy += weights[k] * energies[k];
  }
  let variance = 0;
  let m1 = 0;
  let spread = 0;
  for (let k = 0; k < n; k++) {
    const dev = energies[k] - energy;
    variance += weights[k] * dev * dev;
    m1 += weights[k] * Math.abs(dev);
    spread = Math.max(spread, Math.abs(dev));
  }
  const lnZ = -beta * emin + Math.log(sum);
  const eps = Number.EPSILON;
  const sigma = Math.sqrt(variance);
  const eLnZ = beta * eta + eps * (n + Math.abs(beta * emin) + Math.abs(lnZ));
  const eE = eta * (1 + beta * m1) + n * eps * emaxAbs;
  const eVar = eta * (2 * sigma + 2 * beta * variance) + n * eps * spread * spread;
  return thermoRecord({
    betaIndex, beta, sites, lnZ, energy, heatCapacity: beta * beta * variance,
    errors: { lnZ: eLnZ, energy: eE, heatCapacity: beta * beta * eVar },
  });
}
