/**
 * Dense complex tensor kernels for the MPS engine (public door of workers/src/tensor): products,
 * the pivoted LQ, one-sided Jacobi, the truncated SVD and small matrix exponentials. Storage is
 * row-major, complex interleaved (re, im), throughout.
 */
export { complexGemm, complexGemmUnchecked } from './complex-gemm.js';
export { lqRowPivotedUnchecked, applyLqRowsUnchecked } from './lq-row-pivoted.js';
export { jacobiRowsUnchecked, MAX_JACOBI_SWEEPS } from './jacobi-rows.js';
export {
  truncatedSvd, truncatedSvdUnchecked, chooseRank, createSvdWorkspace, ensureSvdWorkspace,
  QR_SHARE, NEGLIGIBLE_WEIGHT,
} from './truncated-svd.js';
export type { SvdWorkspace, SvdReport, TruncationOptions } from './truncated-svd.js';
export { complexExpm, TAYLOR_DEGREE } from './complex-expm.js';
