/**
 * Matrix-free Pauli kernels: the public door of workers/src/kernels.
 * States are complex doubles interleaved (re, im) in Float64Arrays; site i = bit i.
 */
export { compileOperator, MAX_COMPILED_SITES } from './compile-operator.js';
export type { CompiledOperator, CompiledGroup, CompileOptions } from './compile-operator.js';
export { applyOperatorAffine } from './apply-operator.js';
export { applyDoubledAffine, MAX_DOUBLED_SITES } from './apply-doubled.js';
export { pauliExpectation } from './pauli-expectation.js';
export { axpyPairMulti, PAIR_CHUNK } from './axpy-pair-multi.js';
export { norm2sq, dotc, axpyComplex, scaleReal, scaleComplex, copyInto } from './complex-vector.js';
export { transposeSum } from './transpose-sum.js';
export { scaleSum } from './scale-sum.js';
export { parity, popcount } from './parity.js';
export { groupEntryRe, groupEntryIm, hasTable } from './group-entry.js';
