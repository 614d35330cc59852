/**
 * thermoAtBeta — thermodynamics from the normalised doubled state ψ(β) ∝ (e^{−βH0/2} ⊗ 1)|I⟩.
 *
 *   ln Z = N ln 2 + 2·lnNorm      (lnNorm = ln‖(e^{−βH0/2} ⊗ 1)|I⟩‖ with |I⟩ normalised; DESIGN.md §2)
 *   E = ⟨ψ|H0 ⊗ 1|ψ⟩,  C = β²·‖(H0 − E)ψ‖²  (variance computed about E: no cancellation)
 *   F = −ln Z/β (null at β = 0),  S = ln Z + βE
 * Error bounds from the state's relative error δ (see error-budget.ts), with a = ‖H0 − shift‖ ≤ Σ|w|:
 *   |ΔE| ≤ 2aδ;  |ΔVar| ≤ δa² (⟨H'²⟩, H'² ∈ [0, a²]) + 4a²δ (E'²) = 5a²δ;  |Δ ln Z| ≤ −2 ln(1 − δ);
 *   |ΔF| = |Δ ln Z|/β;  |ΔS| ≤ |Δ ln Z| + β|ΔE|  (F, S and their errors assembled by thermo-record.ts).
 * Cost: 2 applications of H0 ⊗ 1; uses one work vector.
 */
import type { ThermoRecord } from '../../../../shared-types/src/index.js';
import { applyDoubledAffine, dotc, norm2sq } from '../../kernels/index.js';
import { thermoRecord } from '../thermo-record.js';
import type { DoubledOperators } from './doubled-operators.js';

/** Inputs of {@link thermoAtBeta}. */
export interface ThermoInput {
  readonly ops: DoubledOperators;
  /** ψ(β), any norm (it is divided out). */
  readonly state: Float64Array;
  /** Scratch vector of the state's length. */
  readonly work: Float64Array;
  readonly beta: number;
  readonly betaIndex: number;
  /** ln‖(e^{−βH0/2} ⊗ 1)|I⟩‖ (|I⟩ normalised). */
  readonly lnNorm: number;
  /** Relative 2-norm error bound δ of the state. */
  readonly stateError: number;
}

/** The {@link ThermoRecord} at one β (see the file header for formulas and error bounds). */
export function thermoAtBeta(input: ThermoInput): ThermoRecord {
  const { ops, state, work, beta, betaIndex, lnNorm, stateError: d } = input;
  const n2 = norm2sq(state);
  const dot = new Float64Array(2);
  applyDoubledAffine(ops.h0, null, state, work, 1, 0, 0);
  dotc(state, work, dot);
  const energy = dot[0] / n2;
  applyDoubledAffine(ops.h0, null, state, work, 1, -energy, 0);
  dotc(state, work, dot);
  const mean = dot[0] / n2; // ≈ 0; removes the residual first moment exactly
  const variance = Math.max(0, norm2sq(work) / n2 - mean * mean);
  const lnZ = ops.sites * Math.LN2 + 2 * lnNorm;
  const a = ops.h0.normBound;
  const eLnZ = d < 1 ? -2 * Math.log1p(-d) : Infinity;
  const eE = 2 * a * d;
  return thermoRecord({
    betaIndex, beta, sites: ops.sites, lnZ, energy, heatCapacity: beta * beta * variance,
    errors: { lnZ: eLnZ, energy: eE, heatCapacity: beta * beta * 5 * a * a * d },
  });
}
