/**
 * The mps engine: the public door of workers/src/engines/mps (purified MPS + TEBD for chains).
 */
export { MpsEngine } from './mps-engine.js';
export type { MpsEngineOptions } from './mps-engine.js';
export { planMps, MEMORY_BUDGET_BYTES as MPS_MEMORY_BUDGET_BYTES } from './plan-mps.js';
export { mpsSettings, DEFAULT_MAX_BOND, trotterEstimate } from './mps-settings.js';
export type { MpsRunSettings } from './mps-settings.js';
export { identityPurification, cloneMps, serializeMps, deserializeMps, maxBond } from './purified-mps.js';
export type { PurifiedMps } from './purified-mps.js';
export { encodeCheckpoint, decodeCheckpoint, CHECKPOINT_FORMAT } from './mps-checkpoint.js';
export type { MpsCheckpointState } from './mps-checkpoint.js';
export { trotterStages, TRIPLE_JUMP_INNER, TRIPLE_JUMP_OUTER } from './trotter-schedule.js';
export type { TrotterOrder, TrotterStage } from './trotter-schedule.js';
export type { AuxiliaryMode } from './bond-gates.js';
