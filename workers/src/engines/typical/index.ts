/**
 * The typical engine: the public door of workers/src/engines/typical. The engine class for
 * the registry, and the lower-level pieces the service needs to fan samples out as branches:
 * runTypicalSamples (raw per-sample accumulators), mergeTypicalSamples, estimateTypicalBeta
 * (values and jackknife errors from any set of samples), and the plan's sample schedule.
 */
export { TypicalEngine } from './typical-engine.js';
export type { TypicalEngineOptions, TypicalSampling } from './typical-engine.js';
export {
  planTypical, typicalPlanDetails, TYPICAL_MEMORY_BUDGET_BYTES, ASSUMED_FLOPS_PER_SECOND,
} from './plan-typical.js';
export type { TypicalPlanDetails, TypicalSchedule } from './plan-typical.js';
export { runTypicalSamples, TypicalSampleRunner, betaOrder } from './run-typical-samples.js';
export type { TypicalSamplesOptions, TypicalRunnerOptions } from './run-typical-samples.js';
export { narrowIntervals, boundIntervals, IntervalMissError } from './typical-intervals.js';
export type { NarrowedIntervals } from './typical-intervals.js';
export { mergeTypicalSamples } from './merge-typical-samples.js';
export { estimateTypicalBeta, recordsAt } from './estimate-typical.js';
export type { TypicalBetaEstimate, EstimateOptions } from './estimate-typical.js';
export type { TypicalSampleRecord, TypicalSamples, SampleRange } from './typical-samples.js';
export { typicalLayout } from './typical-layout.js';
export type { TypicalLayout } from './typical-layout.js';
export { typicalSetup, usesTables, MAX_TYPICAL_SITES, TABLE_SITES_MAX } from './typical-setup.js';
export type { TypicalSetup } from './typical-setup.js';
export {
  PILOT_SAMPLES, MIN_SAMPLES, MAX_TYPICAL_SAMPLES, SAMPLE_SAFETY, nextSampleCount, samplesFor,
} from './sample-count.js';
export { TRUNCATION_SHARE } from './typical-budget.js';
export { jackknifeRatio } from './jackknife-ratio.js';
export type { JackknifeResult, RatioFunction } from './jackknife-ratio.js';
export { measurePauliBatch, pauliBatch, WHT_MIN_STRINGS_PER_SITE } from './measure-pauli-batch.js';
export type { PauliBatch, PauliBatchGroup } from './measure-pauli-batch.js';
export { fillRandomPhaseVector } from '../../random/index.js';
export { propagateToTimes, offsetSeries } from './propagate-to-times.js';
export type { MultiTimeReport } from './propagate-to-times.js';
export {
  quenchBlocks, maxBlockTimes, applyPasses, MAX_BLOCK_TIMES, BLOCK_MEMORY_BYTES,
} from './quench-blocks.js';
export type { QuenchBlock } from './quench-blocks.js';
export { renyi2Estimate, sampleSpreadEstimate, twoLevelRenyi2 } from './spread-estimate.js';
