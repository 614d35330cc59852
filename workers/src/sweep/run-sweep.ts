/**
 * The local sweep path: plan, then run every branch in this process, streaming records to
 * a sink as the engine computes them, and return the assembled result. The service runs
 * the same engine.runBranch per branch in its queue workers and assembles the same way.
 */
import { availableParallelism, totalmem } from 'node:os';
import type {
  SweepHeader, SweepPlan, SweepResult, SweepSpec,
} from '../../../shared-types/src/index.js';
import { runBranchesInThreads } from './threads/run-branches-in-threads.js';
import type { BranchSink } from '../engines/engine.js';
import { SweepRefusedError } from './errors/sweep-refused-error.js';
import { ResultAssembler } from './result-assembler.js';
import { selectEngine } from './select-engine.js';
import { sweepHeader } from './sweep-header.js';
import { specHash } from '../../../shared-types/src/index.js';

/** Where a running sweep sends its records. */
export interface SweepSink extends BranchSink {
  begin(header: SweepHeader): void;
  end(result: SweepResult): void;
}

/** Options of a local sweep. */
export interface RunSweepOptions {
  /** Receives every record as computed. @defaultValue none */
  sink?: Partial<SweepSink>;
  /** Aborts between steps. */
  signal?: AbortSignal;
  /** Called after each point with (points done, points in all). */
  onProgress?: (done: number, total: number) => void;
  /**
   * Worker threads for the branches. @defaultValue `localThreads(plan)`: one per core when the
   * sweep has several branches and is long enough to pay for thread start-up, within half the
   * machine's memory; 1 runs everything on the calling thread.
   */
  threads?: number;
}

/** Plans shorter than this (estimated seconds) run on the calling thread: start-up would dominate. */
export const MIN_THREADED_SECONDS = 2;

/** The default number of branch threads for a plan on this machine. */
export function localThreads(plan: SweepPlan): number {
  if (plan.branches.length < 2 || plan.seconds < MIN_THREADED_SECONDS) return 1;
  const byMemory = Math.floor((0.5 * totalmem()) / Math.max(1, plan.memoryBytes));
  return Math.max(1, Math.min(availableParallelism(), plan.branches.length, byMemory));
}

/** Runs a canonical, validated spec (see parseSweepSpec) and returns the result document. */
export async function runSweep(spec: SweepSpec, options: RunSweepOptions = {}): Promise<SweepResult> {
  const { sink = {}, signal, onProgress } = options;
  const { engine, plan } = selectEngine(spec);
  if (!plan.feasible) throw new SweepRefusedError(plan);
  const header = sweepHeader(spec, specHash(spec), engine, plan);
  const assembler = new ResultAssembler(spec, header);
  const startedAt = new Date();
  sink.begin?.(header);
  const tee: BranchSink = {
    thermo(r) { assembler.thermo(r); sink.thermo?.(r); },
    point(p) {
      assembler.point(p);
      sink.point?.(p);
      onProgress?.(assembler.points, assembler.expectedPoints);
    },
    diagnostics(d) { assembler.diagnostics(d); sink.diagnostics?.(d); },
  };
  const threads = options.threads ?? localThreads(plan);
  if (threads > 1) {
    await runBranchesInThreads(spec, engine.name, plan.branches, threads, tee, signal);
  } else {
    for (const branch of plan.branches) {
      signal?.throwIfAborted();
      await engine.runBranch(spec, branch, tee, { signal });
    }
  }
  const finishedAt = new Date();
  const result = assembler.finish({
    startedAt: startedAt.toISOString(),
    finishedAt: finishedAt.toISOString(),
    seconds: (finishedAt.getTime() - startedAt.getTime()) / 1000,
  });
  sink.end?.(result);
  return result;
}
