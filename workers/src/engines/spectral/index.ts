/**
 * The spectral engine: the public door of workers/src/engines/spectral.
 */
export { SpectralEngine } from './spectral-engine.js';
export type { SpectralEngineOptions } from './spectral-engine.js';
export {
  planSpectral, estimateCost, MAX_SPECTRAL_SITES, MEMORY_BUDGET_BYTES, ASSUMED_FLOPS_PER_SECOND, ETA_PER_STATE,
} from './plan-spectral.js';
export { buildSpectralBasis, spectralSetup } from './spectral-setup.js';
export type { SpectralBasis, SpectralSetup, SumFigures } from './spectral-setup.js';
export { decomposeBlocks } from './decompose-blocks.js';
export type { BlockEigen, Decomposition, DecomposeOptions } from './decompose-blocks.js';
export { thermoFromSpectrum } from './thermo-from-spectrum.js';
export { pauliError, propagatorError, ROUNDING_PER_STATE } from './spectral-error.js';
export { denseBlock } from './dense-block.js';
export { applyBlock } from './apply-block.js';
