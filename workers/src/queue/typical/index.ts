/**
 * The public door of workers/src/queue/typical: a sampled engine's (`typical`) branches as
 * sample-block jobs — the job runner, the rounds replayed from stored samples, the block split,
 * the stored sample format and the estimates from a set of stored samples.
 */
export { runSampledJob, type SampledJobOptions } from './run-sampled-job.js';
export { settleSampledBranch, type SettleInput, type SettleOutcome } from './settle-sampled-branch.js';
export { isSampledEngine, SampledBranch, type SampledEngine } from './sampled-branch.js';
export { sampledFinalRecords } from './sampled-final-records.js';
export {
  replayRounds, sampleBlocks, roundsReached, TARGET_BLOCK_SECONDS, MIN_BLOCKS_PER_ROUND, MAX_BLOCKS_PER_ROUND, MIN_SPLIT_SECONDS,
  type RoundReplay, type ReplayInput,
} from './sample-rounds.js';
export { encodeSample, decodeSample, SAMPLE_FORMAT, type SampleShape } from './sample-codec.js';
export { estimateBranch, worstStatError, versionedRecords, type BranchEstimates, type SamplingExtras } from './sampled-estimates.js';
