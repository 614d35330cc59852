/**
 * Shared types of the Chebyshev propagators: the operator as an affine callback, its spectral
 * interval, and what a propagation reports.
 */

/**
 * The operator Op as the kernels provide it: out ← α·Op·in + β·in + γ·out (real α, β, γ;
 * `input` and `out` are distinct buffers of the state's length; when γ = 0, `out` is overwritten).
 */
export type AffineApply = (input: Float64Array, out: Float64Array, alpha: number, beta: number, gamma: number) => void;

/** A closed interval [lo, hi] that contains the whole spectrum of a Hermitian Op. */
export interface SpectralInterval {
  readonly lo: number;
  readonly hi: number;
}

/** What one propagation did. */
export interface PropagationReport {
  /** Highest Chebyshev degree used by any sub-step. */
  order: number;
  /** Bound on the truncation error (meaning per propagator; see its doc). */
  errorBound: number;
  /** Number of Op applications. */
  matvecs: number;
  /** Number of sub-steps the interval was split into. */
  steps: number;
}

/** Imaginary-time report: also the logarithmic norm growth. */
export interface ImaginaryPropagationReport extends PropagationReport {
  /** ln(‖e^{−Δ·Op}ψ_in‖ / ‖ψ_in‖); ψ itself is returned normalised to 1. */
  lnNormGrowth: number;
}
