/** Real dense linear algebra (public door of workers/src/linalg): products, skew Schur form, Pfaffians. */
export { gemm, gemmUnchecked } from './gemm.js';
export type { GemmArgs } from './gemm.js';
export { skewTridiagonalize, skewTridiagonalizeUnchecked } from './skew-tridiagonalize.js';
export type { SkewTridiagonalOut } from './skew-tridiagonalize.js';
export { applyHouseholderQ } from './apply-householder-q.js';
export { bidiagonalSvd } from './bidiagonal-svd.js';
export type { BidiagonalSvdReport } from './bidiagonal-svd.js';
export { skewSchur } from './skew-schur.js';
export type { SkewSchur } from './skew-schur.js';
export { pfaffian, pfaffianInPlace } from './pfaffian.js';
export type { LogPfaffian } from './pfaffian.js';
export { rotateModePairs } from './rotate-mode-pairs.js';
export { skewExp } from './skew-exp.js';
export { orthogonalityDefect, DEFECT_PROBES } from './orthogonality-defect.js';
