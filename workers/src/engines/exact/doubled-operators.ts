/**
 * doubledOperators — the compiled operators of the exact engine and their spectral intervals.
 *
 *   imaginary time:  H0 ⊗ 1                        on [shift0 − ‖H0‖₁, shift0 + ‖H0‖₁]
 *   quench:          K = H1 ⊗ 1 − 1 ⊗ H1ᵀ          on [−2‖H1‖₁, 2‖H1‖₁]
 * where ‖H‖₁ = Σ|w| over non-identity Pauli terms (each Pauli string has norm 1). The identity
 * parts of H1 cancel in K, and spec(K) = {E_m − E_n} (DESIGN.md §2). The auxiliary operator is
 * passed to applyDoubledAffine as b = −H1ᵀ, since (1 ⊗ B)M = M·Bᵀ gives KM ↔ H1·M − M·H1.
 * Cost: compiling O(dim·T) per operator; tables 8·dim + 16·dim per distinct flip mask.
 */
import { compileOperator, scaleSum, transposeSum } from '../../kernels/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import type { SpectralInterval } from '../../propagators/index.js';
import { sameTerms } from '../../physics/same-terms.js';
import type { PauliSum } from '../../physics/types.js';

/**
 * Auxiliary half of the quench generator: 'transpose' (the physical choice, −1 ⊗ H1ᵀ) or
 * 'plain' (−1 ⊗ H1, wrong when H1 has an odd number of Y factors in some term; for tests
 * that show physical observables do not depend on it while stationarity breaks).
 */
export type AuxiliaryMode = 'transpose' | 'plain';

/** Compiled H0, H1 and the auxiliary operator, with the intervals the propagators need. */
export interface DoubledOperators {
  readonly sites: number;
  readonly dim: number;
  readonly h0: CompiledOperator;
  readonly h1: CompiledOperator;
  /** b of applyDoubledAffine for the quench: compile(−H1ᵀ) ('transpose') or compile(−H1) ('plain'). */
  readonly aux: CompiledOperator;
  readonly h0Interval: SpectralInterval;
  readonly quenchInterval: SpectralInterval;
  /** True when H1 and H0 have the same terms with the same weights (stationarity check applies). */
  readonly h1EqualsH0: boolean;
}

/** Compiles H0, H1 and the auxiliary operator (see file header). @throws RangeError if site counts differ. */
export function doubledOperators(h0: PauliSum, h1: PauliSum, auxiliary: AuxiliaryMode = 'transpose'): DoubledOperators {
  if (h0.sites !== h1.sites) throw new RangeError(`h0.sites (${h0.sites}) and h1.sites (${h1.sites}) must agree`);
  const c0 = compileOperator(h0);
  const c1 = compileOperator(h1);
  const aux = compileOperator(scaleSum(auxiliary === 'transpose' ? transposeSum(h1) : h1, -1));
  return {
    sites: h0.sites,
    dim: c0.dim,
    h0: c0,
    h1: c1,
    aux,
    h0Interval: { lo: c0.shift - c0.normBound, hi: c0.shift + c0.normBound },
    quenchInterval: { lo: -2 * c1.normBound, hi: 2 * c1.normBound },
    h1EqualsH0: sameTerms(h0, h1),
  };
}
