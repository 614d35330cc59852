/**
 * The job store: where sweeps, their branch states, points, thermodynamics, diagnostics and
 * results live. The service uses Redis ({@link RedisJobStore}); the same branch code runs
 * against the in-memory store without Redis ({@link MemoryJobStore}).
 *
 * Every write a branch makes is idempotent: a point is keyed by `${betaIndex}:${timeIndex}`
 * and the first write wins (for sampled engines: the highest version, the number of samples
 * merged), so a retried branch or a zombie process never duplicates or regresses one.
 */
import type {
  BranchInfo, BranchRecord, CreateSweepOutcome, NewSweep, StoredRecords, StoredSample, SweepCheckSummary, SweepPage, SweepRecord,
  SweepStatus,
} from './sweep-record.js';

/** Options of a sweep listing. */
export interface ListOptions {
  /** Only sweeps in this status. @defaultValue all */
  status?: SweepStatus;
  /** Opaque cursor from a previous page. */
  cursor?: string;
  /** Page size. @defaultValue 20 */
  limit?: number;
}

/** What a running branch polls between steps. */
export interface BranchControl {
  /** Current sweep status, or null when the sweep no longer exists. */
  status: SweepStatus | null;
  /** True when the worker that runs the branch is handing its work back (shutdown). */
  handback: boolean;
}

export interface JobStore {
  /** Creates a sweep, or returns the owner's existing sweep for the same spec, or refuses over the cap. */
  createSweep(input: NewSweep): Promise<CreateSweepOutcome>;
  /** The full record with per-branch progress, or null. */
  getSweep(id: string): Promise<SweepRecord | null>;
  /**
   * Confirms that a created sweep's branch jobs are in the queue (removes it from the submit
   * outbox). Until then {@link unqueuedSweeps} lists it, so a crash between storing a sweep
   * and enqueueing its branches is repaired by the reconciler (queue/reconcile-unqueued.ts).
   */
  markEnqueued(id: string): Promise<void>;
  /** Ids in the submit outbox created at least `olderThanMs` ago, oldest first (at most `limit`). */
  unqueuedSweeps(olderThanMs: number, limit?: number): Promise<string[]>;
  /** The status alone (cheap), or null. */
  getStatus(id: string): Promise<SweepStatus | null>;
  /** The owner's sweeps, newest first. */
  listSweeps(owner: string, options?: ListOptions): Promise<SweepPage>;
  /** Status plus the worker's hand-back flag, polled by running branches. */
  control(id: string, workerId?: string): Promise<BranchControl>;
  /**
   * Records that a branch attempt started (moves a queued sweep to running).
   * Returns false when the sweep is missing or already terminal: do not run.
   */
  branchStarted(id: string, index: number, info: BranchInfo): Promise<boolean>;
  /** Updates a branch's state without finishing it (e.g. retrying after an error). */
  branchUpdated(id: string, index: number, info: BranchInfo): Promise<void>;
  /**
   * Reports a running branch's progress (sampled engines: samples stored), unless the branch is
   * already finished. False when it was finished (nothing changed).
   */
  branchProgress(id: string, index: number, info: BranchInfo): Promise<boolean>;
  /** Marks a branch done; `allDone` when every branch of the sweep is done. */
  branchFinished(id: string, index: number, info: BranchInfo): Promise<{ allDone: boolean }>;
  /** The branch's stored state, or null. */
  getBranch(id: string, index: number): Promise<BranchInfo | null>;
  /** Per β index: how many leading time points (0, 1, … without gaps) are stored. */
  storedPointCounts(id: string, betaIndices: number[], timeCount: number): Promise<Record<number, number>>;
  /**
   * Writes records idempotently: version 0 (the default) — the first write of a key wins;
   * version v > 0 — replaces a stored record of a lower version, else ignored (see BranchRecord).
   * Every stored record is appended to the event stream. Returns how many points were new
   * (first write of their key), or null when the sweep is no longer queued or running (the
   * writer should stop).
   */
  writeRecords(id: string, branchIndex: number, records: BranchRecord[]): Promise<number | null>;
  /**
   * Stores raw random samples of a branch (sampled engines), each once: a sample index already
   * stored is left as it is and not counted again. Returns the branch's stored sample count
   * after the write (an empty list just reads it), or null when the sweep is no longer queued
   * or running.
   */
  writeSamples(id: string, branchIndex: number, samples: StoredSample[]): Promise<number | null>;
  /** The stored bytes of the given samples of a branch, null where none is stored. */
  readSamples(id: string, branchIndex: number, samples: number[]): Promise<Array<Buffer | null>>;
  /** Deletes every stored sample of the sweep (after its result is stored). */
  deleteSamples(id: string): Promise<void>;
  /**
   * Stores (replaces) a branch's engine checkpoint (opaque bytes). False, and nothing stored,
   * when the sweep is no longer queued or running.
   */
  saveCheckpoint(id: string, branchIndex: number, data: Uint8Array): Promise<boolean>;
  /** The branch's latest checkpoint, or null. */
  loadCheckpoint(id: string, branchIndex: number): Promise<Uint8Array | null>;
  /** Deletes every checkpoint of the sweep (when it succeeds). */
  deleteCheckpoints(id: string): Promise<void>;
  /** Every stored point, thermodynamics and diagnostics record (JSON), for the final assembly. */
  readRecords(id: string): Promise<StoredRecords>;
  /** Claims the right to assemble the result (one process wins). */
  claimFinalize(id: string, ttlMs: number): Promise<boolean>;
  releaseFinalize(id: string): Promise<void>;
  /** Stores the result and moves the sweep to succeeded. False if it was not running. */
  completeSweep(id: string, resultJson: string): Promise<boolean>;
  /** Moves a queued or running sweep to failed with a reason. False if it was already terminal. */
  failSweep(id: string, message: string): Promise<boolean>;
  /** Moves a queued or running sweep to cancelled. False if it was already terminal or missing. */
  cancelSweep(id: string): Promise<boolean>;
  /** The result document as stored (JSON text), or null. */
  getResultJson(id: string): Promise<string | null>;
  /**
   * Stores a succeeded sweep's check report and sets its summary on the sweep record (kept as
   * long as the result). False when the sweep no longer exists.
   */
  storeCheck(id: string, reportJson: string, summary: SweepCheckSummary): Promise<boolean>;
  /** The check report as stored (JSON text), or null (not computed yet, or expired). */
  getCheckJson(id: string): Promise<string | null>;
  /** Releases connections. */
  close(): Promise<void>;
}
