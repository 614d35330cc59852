/**
 * The one interface every engine implements (DESIGN.md §3). Engines are pure computation:
 * no I/O, no Redis, no HTTP. They plan a spec, then run one branch (a list of β indices in
 * ascending order) and report through callbacks as values are computed.
 */
import type {
  DiagnosticsRecord, SweepPlan, SweepPoint, SweepSpec, ThermoRecord, SeriesInfo,
} from '../../../shared-types/src/index.js';
import type { BranchCheckpoints } from './branch-checkpoints.js';

export type { BranchCheckpoints } from './branch-checkpoints.js';

/** Callbacks an engine calls while it runs a branch. */
export interface BranchSink {
  /** Thermodynamics at one β, before its quench starts. */
  thermo(record: ThermoRecord): void;
  /** One quench point (all series at one β and one time). */
  point(point: SweepPoint): void;
  /** End-of-β diagnostics. */
  diagnostics(record: DiagnosticsRecord): void;
}

/** Options of one branch run. */
export interface BranchOptions {
  /** Aborts the run between steps (checked at least once per time point). */
  signal?: AbortSignal;
  /** Skip points with timeIndex < resumeFrom[betaIndex] (still computed, not emitted). */
  resumeFrom?: Record<number, number>;
  /** Where the branch keeps resumable state between attempts (branch-checkpoints.ts); optional. */
  checkpoints?: BranchCheckpoints;
}

export interface Engine {
  readonly name: string;
  readonly version: string;
  /** Cost, accuracy and fan-out, or a refusal with the field, limit and estimate. Never throws on a valid spec. */
  plan(spec: SweepSpec): SweepPlan;
  /** The series (labels) this engine will emit for the spec, in order. */
  series(spec: SweepSpec): SeriesInfo[];
  /** Run the β indices of one branch, ascending. Rejects with an AbortError when the signal fires. */
  runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options?: BranchOptions): Promise<void>;
}
