/** Physics core: Pauli words, Pauli-string algebra and Hamiltonians (public door of workers/src/physics). */
export type { PauliString, PauliTermMask, PauliSum, LatticeGraph } from './types.js';
export { parsePauliWord, formatPauliWord, pauliFactors, MAX_MASK_SITE } from './pauli-word.js';
export type { PauliFactor } from './pauli-word.js';
export {
  popcount, multiplyPauli, pauliCommutes, transposeSign, pauliKey, pauliFromKey, IDENTITY,
  createComplexSum, addComplexTerm, addComplexSums, scaleComplexSum, multiplyComplexSums, commutator,
  transposeComplexSum, simplifyComplexSum, isHermitian, fromPauliSum, toPauliSum,
} from './pauli-algebra.js';
export type { PauliProduct, ComplexPauliTerm, ComplexPauliSum } from './pauli-algebra.js';
export { buildHamiltonian, MAX_MASK_SITES, CANCEL_RTOL } from './build-hamiltonian.js';
export { sameTerms } from './same-terms.js';
