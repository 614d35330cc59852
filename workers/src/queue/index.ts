/** Public door of the branch queue: producer, worker, processor core and job schemas. */
export { BRANCH_QUEUE, branchJobId, queuePrefix } from './queue-names.js';
export { BranchJobData, BranchJobResult, type BranchEnqueuer } from './branch-job.js';
export { SweepQueue, type SweepQueueOptions, type QueueDepth } from './sweep-queue.js';
export { startBranchWorker, type BranchWorkerOptions, type BranchWorkerHandle } from './start-branch-worker.js';
export {
  runStoredBranch, defaultEngineResolver, DEFAULT_CHECKPOINT_SECONDS, type RunStoredBranchOptions, type EngineResolver,
} from './run-stored-branch.js';
export { createBranchProcessor, type BranchProcessorOptions } from './create-branch-processor.js';
export { finalizeSweep, FINALIZE_CLAIM_MS, type FinalRecords, type FinalRecordSource } from './finalize-sweep.js';
export { isSampledEngine, SampledBranch, runSampledJob, type SampledEngine } from './typical/index.js';
export {
  computeSweepCheck, storeSweepCheck, summarizeCheck, CHECK_BUDGET_SECONDS, CHECK_MAX_THERMO_ORDER, CHECK_MAX_QUENCH_ORDER,
  type SweepCheckDocument, type SweepCheckOptions,
} from './sweep-check.js';
export { reconcileUnqueued, startUnqueuedReconciler, type ReconcileOptions, type ReconcileReport } from './reconcile-unqueued.js';
export { StoreSink, type StoreSinkOptions } from './store-sink.js';
export { SANDBOX_ENV, readSandboxEnv, type SandboxConfig } from './sandbox-env.js';
export { BranchJobInvalidError } from './errors/branch-job-invalid-error.js';
export { BranchAbortedError } from './errors/branch-aborted-error.js';
export { SweepIncompleteError } from './errors/sweep-incomplete-error.js';
