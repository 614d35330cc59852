/**
 * A BranchSink that writes to a JobStore. Engines call the sink synchronously; records are
 * buffered and written in batches on a short timer (or when a batch fills), one batch at a
 * time, so points reach the store while the engine computes the next ones.
 */
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../shared-types/src/index.js';
import type { BranchSink } from '../engines/engine.js';
import type { BranchRecord, JobStore } from '../store/index.js';

/** Options of a {@link StoreSink}. */
export interface StoreSinkOptions {
  /** Longest a record waits in the buffer, ms. @defaultValue 20 */
  flushMs?: number;
  /** Records per write. @defaultValue 256 */
  maxBatch?: number;
  /** Called once when the store refuses writes (the sweep is no longer queued or running). */
  onRejected?: () => void;
}

export class StoreSink implements BranchSink {
  /** Points this sink stored that were not stored before. */
  written = 0;
  private buffer: BranchRecord[] = [];
  private chain: Promise<void> = Promise.resolve();
  private timer: NodeJS.Timeout | null = null;
  private rejected = false;
  private failure: unknown = null;
  private readonly flushMs: number;
  private readonly maxBatch: number;

  constructor(
    private readonly store: JobStore,
    private readonly sweepId: string,
    private readonly branchIndex: number,
    private readonly options: StoreSinkOptions = {},
  ) {
    this.flushMs = options.flushMs ?? 20;
    this.maxBatch = options.maxBatch ?? 256;
  }

  thermo(record: ThermoRecord): void {
    this.push({ kind: 'thermo', betaIndex: record.betaIndex, json: JSON.stringify(record) });
  }

  point(point: SweepPoint): void {
    this.push({ kind: 'point', betaIndex: point.betaIndex, timeIndex: point.timeIndex, json: JSON.stringify(point) });
  }

  diagnostics(record: DiagnosticsRecord): void {
    this.push({ kind: 'diagnostics', betaIndex: record.betaIndex, json: JSON.stringify(record) });
  }

  /** Writes everything buffered and waits for all writes; rethrows a store error. */
  async drain(): Promise<void> {
    this.flush();
    await this.chain;
    if (this.failure) throw this.failure;
  }

  /** Drops anything not yet written (after an abort) and stops accepting records. */
  discard(): void {
    this.rejected = true;
    this.buffer = [];
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  private push(record: BranchRecord): void {
    if (this.rejected || this.failure) return;
    this.buffer.push(record);
    if (this.buffer.length >= this.maxBatch) this.flush();
    else if (!this.timer) this.timer = setTimeout(() => this.flush(), this.flushMs);
  }

  private flush(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.buffer.length === 0) return;
    const batch = this.buffer;
    this.buffer = [];
    this.chain = this.chain.then(() => this.write(batch));
  }

  private async write(batch: BranchRecord[]): Promise<void> {
    if (this.rejected || this.failure) return;
    try {
      const n = await this.store.writeRecords(this.sweepId, this.branchIndex, batch);
      if (n === null) {
        this.rejected = true;
        this.options.onRejected?.();
      } else {
        this.written += n;
      }
    } catch (err) {
      this.failure = err;
    }
  }
}
