/**
 * Chebyshev propagators with truncation-error bounds: the public door of workers/src/propagators.
 * The operator comes in as an affine callback (out ← α·Op·in + β·in + γ·out), so the same code
 * drives the single-vector and the doubled-state kernels.
 */
export { besselJSequence } from './bessel-j-sequence.js';
export { scaledBesselISequence } from './scaled-bessel-i-sequence.js';
export { chebyshevExpSeries, seriesRemainderBound } from './chebyshev-exp-series.js';
export type { ChebyshevSeries, ExpSeriesKind } from './chebyshev-exp-series.js';
export { chebyshevSum } from './chebyshev-sum.js';
export { propagateRealTime, MAX_REAL_TIME_TAU } from './propagate-real-time.js';
export type { RealTimeOptions } from './propagate-real-time.js';
export { propagateImaginaryTime, MAX_IMAGINARY_TIME_TAU } from './propagate-imaginary-time.js';
export type { ImaginaryTimeOptions } from './propagate-imaginary-time.js';
export type { AffineApply, SpectralInterval, PropagationReport, ImaginaryPropagationReport } from './types.js';
export { lanczosInterval, DEFAULT_LANCZOS_STEPS, DEFAULT_MARGIN } from './lanczos-interval.js';
export type { LanczosIntervalOptions, LanczosIntervalReport } from './lanczos-interval.js';
