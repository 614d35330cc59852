/** The free-fermion engine: the public door of workers/src/engines/free-fermion. */
export { FreeFermionEngine } from './free-fermion-engine.js';
export { planFreeFermion, MEMORY_BUDGET_BYTES, WORK_BUDGET_FLOPS, ASSUMED_FLOPS_PER_SECOND } from './plan-free-fermion.js';
export { freeFermionModel, isModelRefusal, MAX_FREE_FERMION_SITES } from './free-fermion-model.js';
export type { FreeFermionModel, ModelRefusal } from './free-fermion-model.js';
export { pauliToMajorana, timesParity, monomialIndices, pfaffianSign } from './jordan-wigner.js';
export type { MajoranaMonomial } from './jordan-wigner.js';
export { majoranaHamiltonian, isNotQuadratic, sectorForm, denseLowerTriangle } from './majorana-hamiltonian.js';
export type { MajoranaHamiltonian, MajoranaEntry, NotQuadratic } from './majorana-hamiltonian.js';
export { siteTerms } from '../../physics/site-terms.js';
export type { SiteTerm } from '../../physics/site-terms.js';
export { sectorThermo, lnTwoCosh, lnTanh } from './sector-thermo.js';
export type { SectorSpectrum, SectorThermo, SectorWeights } from './sector-thermo.js';
export { sectorModes, schurResidual } from './sector-modes.js';
export type { SectorModes, CheckedSchur } from './sector-modes.js';
export { logTwistedBounds } from './twisted-bound.js';
export { freeFermionLayout, evaluateLayout } from './free-fermion-layout.js';
export type { FactorLayout, FactorPrimitive } from './free-fermion-layout.js';
