/**
 * The exact engine: the public door of workers/src/engines/exact.
 */
export { ExactEngine } from './exact-engine.js';
export type { ExactEngineOptions } from './exact-engine.js';
export { planExact, MAX_EXACT_SITES, MEMORY_BUDGET_BYTES, ASSUMED_FLOPS_PER_SECOND } from './plan-exact.js';
export { doubledOperators } from './doubled-operators.js';
export type { AuxiliaryMode, DoubledOperators } from './doubled-operators.js';
export { runQuench } from './run-quench.js';
export type { QuenchInput, QuenchReport } from './run-quench.js';
export { thermoAtBeta } from './thermo-at-beta.js';
export { errorBudget } from './error-budget.js';
