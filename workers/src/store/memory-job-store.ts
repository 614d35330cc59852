/**
 * An in-process job store with the same semantics as the Redis one (idempotent point keys,
 * status guards, dedupe and cap). It lets the branch runner work without Redis — in the
 * local CLI path and in the portable tests.
 */
import type { SweepHeader, SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import type { BranchControl, JobStore, ListOptions } from './job-store.js';
import { newSweepId } from './new-sweep-id.js';
import {
  checkRecordVersion, checkSampleIndex, isTerminal, type BranchInfo, type BranchRecord, type CreateSweepOutcome, type NewSweep,
  type StoredRecords, type StoredSample, type SweepCheckSummary, type SweepPage, type SweepRecord, type SweepStatus,
} from './sweep-record.js';
import { writeVersioned } from './versioned-write.js';

interface MemorySweep {
  id: string;
  owner: string;
  status: SweepStatus;
  specHash: string;
  createdAt: string;
  createdMs: number;
  seq: number;
  startedAt: string | null;
  finishedAt: string | null;
  error: string | null;
  spec: SweepSpec;
  plan: SweepPlan;
  header: SweepHeader;
  branches: BranchInfo[];
  progress: number[];
  done: Set<number>;
  points: Map<string, string>;
  thermo: Map<number, string>;
  diagnostics: Map<number, string>;
  /** Versions of re-writable records, by `${kind}:${key}`. */
  versions: Map<string, number>;
  /** Raw samples by `${branchIndex}:${sample}`, and the count per branch. */
  samples: Map<string, Buffer>;
  sampleCounts: Map<number, number>;
  result: string | null;
  check: { json: string; summary: SweepCheckSummary } | null;
  /** Engine checkpoints by branch index. */
  checkpoints: Map<number, Uint8Array>;
  finalizeUntil: number;
}

export class MemoryJobStore implements JobStore {
  private readonly sweeps = new Map<string, MemorySweep>();
  private readonly dedupe = new Map<string, string>();
  private readonly handbacks = new Set<string>();
  /** The submit outbox: sweep id → creation ms, until its branches are confirmed enqueued. */
  private readonly unqueued = new Map<string, number>();
  private seq = 0;

  async createSweep(input: NewSweep): Promise<CreateSweepOutcome> {
    const dedupeKey = `${input.owner}\u0000${input.specHash}`;
    if (!input.fresh) {
      const existing = this.sweeps.get(this.dedupe.get(dedupeKey) ?? '');
      if (existing && existing.status !== 'failed' && existing.status !== 'cancelled') return { kind: 'existing', id: existing.id };
    }
    const active = [...this.sweeps.values()].filter((s) => s.owner === input.owner && !isTerminal(s.status)).length;
    if ((input.maxActive ?? 0) > 0 && active >= (input.maxActive ?? 0)) return { kind: 'capped', active };
    const id = newSweepId();
    const now = new Date();
    this.sweeps.set(id, {
      id, owner: input.owner, status: 'queued', specHash: input.specHash, createdAt: now.toISOString(),
      createdMs: now.getTime(), seq: this.seq++, startedAt: null, finishedAt: null, error: null,
      spec: input.spec, plan: input.plan, header: input.header,
      branches: input.plan.branches.map(() => ({ state: 'queued', attempts: 0, worker: null, startedAt: null, finishedAt: null, error: null })),
      progress: input.plan.branches.map(() => 0), done: new Set(), points: new Map(), thermo: new Map(), diagnostics: new Map(),
      versions: new Map(), samples: new Map(), sampleCounts: new Map(),
      result: null, check: null, finalizeUntil: 0, checkpoints: new Map(),
    });
    this.dedupe.set(dedupeKey, id);
    this.unqueued.set(id, now.getTime());
    return { kind: 'created', id };
  }

  async markEnqueued(id: string): Promise<void> {
    this.unqueued.delete(id);
  }

  async unqueuedSweeps(olderThanMs: number, limit = 100): Promise<string[]> {
    const cutoff = Date.now() - olderThanMs;
    return [...this.unqueued].filter(([, ms]) => ms <= cutoff).sort((a, b) => a[1] - b[1]).slice(0, limit).map(([id]) => id);
  }

  private view(s: MemorySweep): SweepRecord {
    const nt = s.header.times.length;
    const branches = s.plan.branches.map((betaIndices, index) => ({
      index, betaIndices, ...s.branches[index], pointsDone: s.progress[index], pointsTotal: betaIndices.length * nt,
    }));
    return {
      id: s.id, owner: s.owner, status: s.status, label: s.spec.label, specHash: s.specHash, engine: s.plan.engine,
      createdAt: s.createdAt, startedAt: s.startedAt, finishedAt: s.finishedAt, error: s.error,
      spec: s.spec, plan: s.plan, header: s.header, branches,
      pointsDone: s.points.size, pointsTotal: s.header.betas.length * nt,
      check: s.check?.summary ?? null,
    };
  }

  async getSweep(id: string): Promise<SweepRecord | null> {
    const s = this.sweeps.get(id);
    return s ? structuredClone(this.view(s)) : null;
  }

  async getStatus(id: string): Promise<SweepStatus | null> {
    return this.sweeps.get(id)?.status ?? null;
  }

  async listSweeps(owner: string, options: ListOptions = {}): Promise<SweepPage> {
    const { status, limit = 20 } = options;
    const all = [...this.sweeps.values()]
      .filter((s) => s.owner === owner && (!status || s.status === status))
      .sort((a, b) => b.seq - a.seq);
    const start = options.cursor ? Number(options.cursor) : 0;
    const page = all.slice(start, start + limit);
    return { items: page.map((s) => structuredClone(this.view(s))), nextCursor: start + limit < all.length ? String(start + limit) : null };
  }

  async control(id: string, workerId?: string): Promise<BranchControl> {
    return { status: this.sweeps.get(id)?.status ?? null, handback: workerId ? this.handbacks.has(workerId) : false };
  }

  /** Asks worker `workerId`'s branches to hand back (or clears it). */
  setHandback(workerId: string, on: boolean): void {
    if (on) this.handbacks.add(workerId);
    else this.handbacks.delete(workerId);
  }

  async branchStarted(id: string, index: number, info: BranchInfo): Promise<boolean> {
    const s = this.sweeps.get(id);
    if (!s || isTerminal(s.status)) return false;
    if (s.status === 'queued') {
      s.status = 'running';
      s.startedAt = new Date().toISOString();
    }
    s.branches[index] = { ...info };
    return true;
  }

  async branchUpdated(id: string, index: number, info: BranchInfo): Promise<void> {
    const s = this.sweeps.get(id);
    if (s) s.branches[index] = { ...info };
  }

  async branchProgress(id: string, index: number, info: BranchInfo): Promise<boolean> {
    const s = this.sweeps.get(id);
    if (!s || s.done.has(index)) return false;
    s.branches[index] = { ...info };
    return true;
  }

  async branchFinished(id: string, index: number, info: BranchInfo): Promise<{ allDone: boolean }> {
    const s = this.sweeps.get(id);
    if (!s) return { allDone: false };
    s.branches[index] = { ...info };
    s.done.add(index);
    return { allDone: s.done.size >= s.plan.branches.length };
  }

  async getBranch(id: string, index: number): Promise<BranchInfo | null> {
    const b = this.sweeps.get(id)?.branches[index];
    return b ? { ...b } : null;
  }

  async storedPointCounts(id: string, betaIndices: number[], timeCount: number): Promise<Record<number, number>> {
    const s = this.sweeps.get(id);
    const out: Record<number, number> = {};
    for (const b of betaIndices) {
      let t = 0;
      while (s && t < timeCount && s.points.has(`${b}:${t}`)) t++;
      out[b] = t;
    }
    return out;
  }

  async writeRecords(id: string, branchIndex: number, records: BranchRecord[]): Promise<number | null> {
    const s = this.sweeps.get(id);
    if (!s || isTerminal(s.status)) return null;
    let n = 0;
    for (const r of records) checkRecordVersion(r.version);
    for (const r of records) {
      if (r.kind === 'point') {
        const key = `${r.betaIndex}:${r.timeIndex}`;
        if (writeVersioned(s.points, s.versions, key, `point:${key}`, r.json, r.version) === 'fresh') {
          s.progress[branchIndex]++;
          n++;
        }
      } else {
        const map = r.kind === 'thermo' ? s.thermo : s.diagnostics;
        writeVersioned(map, s.versions, r.betaIndex, `${r.kind}:${r.betaIndex}`, r.json, r.version);
      }
    }
    return n;
  }

  async writeSamples(id: string, branchIndex: number, samples: StoredSample[]): Promise<number | null> {
    const s = this.sweeps.get(id);
    if (!s || isTerminal(s.status)) return null;
    for (const { sample } of samples) checkSampleIndex(sample);
    for (const { sample, data } of samples) {
      const key = `${branchIndex}:${sample}`;
      if (s.samples.has(key)) continue;
      s.samples.set(key, Buffer.from(data));
      s.sampleCounts.set(branchIndex, (s.sampleCounts.get(branchIndex) ?? 0) + 1);
    }
    return s.sampleCounts.get(branchIndex) ?? 0;
  }

  async readSamples(id: string, branchIndex: number, samples: number[]): Promise<Array<Buffer | null>> {
    const s = this.sweeps.get(id);
    return samples.map((k) => {
      const data = s?.samples.get(`${branchIndex}:${k}`);
      return data ? Buffer.from(data) : null;
    });
  }

  async deleteSamples(id: string): Promise<void> {
    const s = this.sweeps.get(id);
    s?.samples.clear();
    s?.sampleCounts.clear();
  }

  async saveCheckpoint(id: string, branchIndex: number, data: Uint8Array): Promise<boolean> {
    const s = this.sweeps.get(id);
    if (!s || isTerminal(s.status)) return false;
    s.checkpoints.set(branchIndex, data.slice());
    return true;
  }

  async loadCheckpoint(id: string, branchIndex: number): Promise<Uint8Array | null> {
    return this.sweeps.get(id)?.checkpoints.get(branchIndex)?.slice() ?? null;
  }

  async deleteCheckpoints(id: string): Promise<void> {
    this.sweeps.get(id)?.checkpoints.clear();
  }

  async readRecords(id: string): Promise<StoredRecords> {
    const s = this.sweeps.get(id);
    return { points: [...(s?.points.values() ?? [])], thermo: [...(s?.thermo.values() ?? [])], diagnostics: [...(s?.diagnostics.values() ?? [])] };
  }

  async claimFinalize(id: string, ttlMs: number): Promise<boolean> {
    const s = this.sweeps.get(id);
    if (!s || s.finalizeUntil > Date.now()) return false;
    s.finalizeUntil = Date.now() + ttlMs;
    return true;
  }

  async releaseFinalize(id: string): Promise<void> {
    const s = this.sweeps.get(id);
    if (s) s.finalizeUntil = 0;
  }

  private finish(id: string, to: SweepStatus, error: string | null): MemorySweep | null {
    const s = this.sweeps.get(id);
    if (!s || isTerminal(s.status)) return null;
    s.status = to;
    s.finishedAt = new Date().toISOString();
    s.error = error;
    return s;
  }

  async completeSweep(id: string, resultJson: string): Promise<boolean> {
    const s = this.finish(id, 'succeeded', null);
    if (s) s.result = resultJson;
    return s !== null;
  }

  async failSweep(id: string, message: string): Promise<boolean> {
    return this.finish(id, 'failed', message) !== null;
  }

  async cancelSweep(id: string): Promise<boolean> {
    return this.finish(id, 'cancelled', null) !== null;
  }

  async getResultJson(id: string): Promise<string | null> {
    return this.sweeps.get(id)?.result ?? null;
  }

  async storeCheck(id: string, reportJson: string, summary: SweepCheckSummary): Promise<boolean> {
    const s = this.sweeps.get(id);
    if (!s) return false;
    s.check = { json: reportJson, summary };
    return true;
  }

  async getCheckJson(id: string): Promise<string | null> {
    return this.sweeps.get(id)?.check?.json ?? null;
  }

  async close(): Promise<void> {}
}
