/** Public door of the job store (Redis and in-memory) and the token store. */
export { DEFAULT_KEY_PREFIX, storeKeys, type StoreKeys } from './keys.js';
export type { JobStore, ListOptions, BranchControl } from './job-store.js';
export { RedisJobStore, decodeCursor, type SweepSummary, type SweepStateRaw, type SweepStateRead } from './redis-job-store.js';
export { MemoryJobStore } from './memory-job-store.js';
export { TokenStore, hashToken, TOKEN_NAME_PATTERN, type TokenInfo } from './token-store.js';
export { newSweepId, SWEEP_ID_PATTERN } from './new-sweep-id.js';
export { STORE_DEFAULTS, type StoreOptions } from './store-options.js';
export { connectRedis } from './connect-redis.js';
export {
  SweepStatus, BranchState, BranchInfo, BranchProgress, SweepRecord, TERMINAL_STATUSES, isTerminal,
  SweepCheckSummary, CheckSummaryVerdict,
  checkRecordVersion,
  type NewSweep, type CreateSweepOutcome, type BranchRecord, type SweepPage, type StoredRecords, type StoredSample,
} from './sweep-record.js';
export { SWEEP_STATE_FN } from './lua/scripts.js';
