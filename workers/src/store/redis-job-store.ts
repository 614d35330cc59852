/**
 * The job store on Redis (see keys.ts for the layout). Writes that must be atomic with a
 * status check run as Lua scripts (lua/scripts.ts); ioredis re-loads them after a Redis
 * restart (NOSCRIPT), so the store survives a restart with AOF.
 */
import type { Redis } from 'ioredis';
import type { SweepHeader, SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import type { BranchControl, JobStore, ListOptions } from './job-store.js';
import { storeKeys, type StoreKeys } from './keys.js';
import { RedisCheckpoints } from './redis-checkpoints.js';
import { BRANCH_STATE, CREATE_SWEEP, STORED_COUNTS, SWEEP_STATE, TRANSITION, WRITE_RECORDS } from './lua/scripts.js';
import { newSweepId } from './new-sweep-id.js';
import { readSamplesRedis, writeSamplesRedis } from './redis-samples.js';
import { STORE_DEFAULTS, type StoreOptions } from './store-options.js';
import {
  BranchInfo, SweepCheckSummary, checkRecordVersion, isTerminal, type BranchProgress, type BranchRecord, type CreateSweepOutcome,
  type NewSweep, type StoredRecords, type StoredSample, type SweepPage, type SweepRecord, type SweepStatus,
} from './sweep-record.js';

type ScriptFn = (...args: (string | number)[]) => Promise<unknown>;
interface ScriptedRedis {
  bswCreateSweep: ScriptFn;
  bswWriteRecords: ScriptFn;
  bswTransition: ScriptFn;
  bswBranchState: ScriptFn;
  bswStoredCounts: ScriptFn;
  bswSweepState: ScriptFn;
}

const SCRIPTS: Array<[keyof ScriptedRedis, string]> = [
  ['bswCreateSweep', CREATE_SWEEP],
  ['bswWriteRecords', WRITE_RECORDS],
  ['bswTransition', TRANSITION],
  ['bswBranchState', BRANCH_STATE],
  ['bswStoredCounts', STORED_COUNTS],
  ['bswSweepState', SWEEP_STATE],
];

/** Sweep summary fields read for listings (no spec/plan/header parsing). */
const SUMMARY_FIELDS = ['id', 'owner', 'status', 'label', 'specHash', 'engine', 'createdAt', 'startedAt', 'finishedAt', 'error', 'pointsTotal', 'check'] as const;

/** A sweep as listed: the record without spec, plan, header and branches (with the check summary). */
export type SweepSummary = Omit<SweepRecord, 'spec' | 'plan' | 'header' | 'branches'>;

/** The check summary field of the record hash, or null when absent or unreadable. */
function parseCheck(text: string | null | undefined): SweepCheckSummary | null {
  if (!text) return null;
  try {
    const parsed = SweepCheckSummary.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** A flat [field, value, …] reply as an object. */
function pairsToRecord(flat: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i + 1 < flat.length; i += 2) out[flat[i]] = flat[i + 1];
  return out;
}

/** Branch states as stored (JSON) → parsed, remembered by text: a status poll re-reads the same few strings. */
const branchInfoByText = new Map<string, BranchInfo>();
function parseBranchInfo(text: string): BranchInfo {
  let info = branchInfoByText.get(text);
  if (!info) {
    const parsed = BranchInfo.safeParse(JSON.parse(text));
    info = parsed.success ? parsed.data : emptyBranch();
    if (branchInfoByText.size >= 4096) branchInfoByText.clear();
    branchInfoByText.set(text, info);
  }
  return { ...info };
}

/** Orders sweeps created in the same millisecond by one process (listing score = ms × 1000 + this). */
let createSeq = 0;

/** The raw answer of sweep_state (SWEEP_STATE_FN). */
export type SweepStateRaw = (string | null)[][];

/** One planned sweep_state read: its keys, mode, and the cached fixed part it relies on. */
export interface SweepStateRead {
  readonly keys: readonly [string, string, string];
  readonly full: '0' | '1';
  /** @internal the cached never-changing part ('0' mode), or null. */
  readonly fixed: FixedPart | null;
}

/** The part of a sweep record that never changes after creation. */
export interface FixedPart {
  rec: Record<string, string>;
  spec: SweepSpec;
  plan: SweepPlan;
  header: SweepHeader;
}

/** Records whose fixed part is kept parsed in memory. */
const FIXED_CACHE_SIZE = 1000;

const emptyBranch = (): BranchInfo => ({ state: 'queued', attempts: 0, worker: null, startedAt: null, finishedAt: null, error: null });

function encodeCursor(score: number, id: string): string {
  return Buffer.from(JSON.stringify([score, id])).toString('base64url');
}

/** Parses a listing cursor; null when it is malformed. */
export function decodeCursor(cursor: string): { score: number; id: string } | null {
  try {
    const v: unknown = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
    if (Array.isArray(v) && v.length === 2 && typeof v[0] === 'number' && Number.isFinite(v[0]) && typeof v[1] === 'string') {
      return { score: v[0], id: v[1] };
    }
  } catch { /* malformed */ }
  return null;
}

export class RedisJobStore implements JobStore {
  readonly keys: StoreKeys;
  readonly retentionSeconds: number;
  readonly streamMaxLen: number;
  private readonly scripts: ScriptedRedis;
  private readonly checkpoints: RedisCheckpoints;
  /** Parsed spec, plan and header by sweep id: written once at creation, read on every status poll. */
  private readonly fixed = new Map<string, FixedPart>();

  /** Uses (does not own) `redis`; scripts are defined on it once. */
  constructor(readonly redis: Redis, options: StoreOptions = {}) {
    const { prefix = STORE_DEFAULTS.prefix, retentionSeconds = STORE_DEFAULTS.retentionSeconds, streamMaxLen = STORE_DEFAULTS.streamMaxLen } = options;
    this.keys = storeKeys(prefix);
    this.retentionSeconds = retentionSeconds;
    this.streamMaxLen = streamMaxLen;
    const r = redis as unknown as Record<string, unknown>;
    for (const [name, lua] of SCRIPTS) {
      if (typeof r[name] !== 'function') redis.defineCommand(name, { lua });
    }
    this.scripts = redis as unknown as ScriptedRedis;
    this.checkpoints = new RedisCheckpoints(redis, this.keys);
  }

  async createSweep(input: NewSweep): Promise<CreateSweepOutcome> {
    const id = newSweepId();
    const k = this.keys;
    const now = new Date();
    const timeCount = input.header.times.length;
    const record: Record<string, string> = {
      id, owner: input.owner, status: 'queued', label: input.spec.label, specHash: input.specHash,
      engine: input.plan.engine, createdAt: now.toISOString(), startedAt: '', finishedAt: '', error: '',
      spec: JSON.stringify(input.spec), plan: JSON.stringify(input.plan), header: JSON.stringify(input.header),
      branchCount: String(input.plan.branches.length),
      pointsTotal: String(input.header.betas.length * timeCount),
    };
    const recordPairs = Object.entries(record).flat();
    const branchPairs = input.plan.branches.flatMap((_, i) => [String(i), JSON.stringify(emptyBranch())]);
    const recordKey = k.sweep(id);
    const [prefixPart, suffixPart] = [recordKey.slice(0, recordKey.indexOf(id)), recordKey.slice(recordKey.indexOf(id) + id.length)];
    const out = (await this.scripts.bswCreateSweep(
      7, recordKey, k.ownerSweeps(input.owner), k.ownerActive(input.owner), k.ownerSpec(input.owner, input.specHash),
      k.events(id), k.branches(id), k.unqueued(),
      id, input.fresh ? '1' : '0', input.maxActive ?? 0, now.getTime() * 1000 + (createSeq++ % 1000), prefixPart, suffixPart, this.streamMaxLen,
      JSON.stringify({ status: 'queued', at: record.createdAt }), recordPairs.length / 2, ...recordPairs, ...branchPairs,
    )) as [string, string];
    if (out[0] === 'capped') return { kind: 'capped', active: Number(out[1]) };
    return { kind: out[0] as 'created' | 'existing', id: out[1] };
  }

  async getSweep(id: string): Promise<SweepRecord | null> {
    const read = this.sweepStateRead(id);
    const raw = (await this.scripts.bswSweepState(3, ...read.keys, read.full)) as SweepStateRaw;
    return this.sweepFromState(id, raw, read);
  }

  /**
   * The keys and mode of one sweep_state call for `id` (SWEEP_STATE_FN): the whole record
   * unless its never-changing part is cached. Pass the same read to sweepFromState.
   */
  sweepStateRead(id: string): SweepStateRead {
    const k = this.keys;
    const fixed = this.fixed.get(id) ?? null;
    return { keys: [k.sweep(id), k.branches(id), k.progress(id)], full: fixed ? '0' : '1', fixed };
  }

  /** The record from a sweep_state answer (null when the sweep does not exist). */
  sweepFromState(id: string, raw: SweepStateRaw, read: SweepStateRead): SweepRecord | null {
    const [recRaw, branchesRaw, progressRaw] = raw;
    let rec: Record<string, string>;
    let fixed: FixedPart;
    if (read.fixed) {
      const [status, startedAt, finishedAt, error, check] = recRaw;
      if (!status) return null;
      fixed = read.fixed;
      rec = { ...fixed.rec, status, startedAt: startedAt ?? '', finishedAt: finishedAt ?? '', error: error ?? '', check: check ?? '' };
    } else {
      rec = pairsToRecord(recRaw as string[]);
      if (!rec.id) return null;
      fixed = {
        rec: { id: rec.id, owner: rec.owner, label: rec.label, specHash: rec.specHash, engine: rec.engine, createdAt: rec.createdAt, pointsTotal: rec.pointsTotal },
        spec: JSON.parse(rec.spec) as SweepSpec,
        plan: JSON.parse(rec.plan) as SweepPlan,
        header: JSON.parse(rec.header) as SweepHeader,
      };
      this.remember(id, fixed);
    }
    const [branches, progress] = [branchesRaw, progressRaw].map((r) => pairsToRecord((r ?? []) as string[]));
    const nt = fixed.header.times.length;
    const list: BranchProgress[] = fixed.plan.branches.map((betaIndices, index) => {
      const info = branches[index] ? parseBranchInfo(branches[index]) : emptyBranch();
      return { index, betaIndices, ...info, pointsDone: Number(progress[index] ?? 0), pointsTotal: betaIndices.length * nt };
    });
    return {
      ...this.summaryOf(rec, list.reduce((s, b) => s + b.pointsDone, 0)),
      spec: fixed.spec,
      plan: fixed.plan,
      header: fixed.header,
      branches: list,
      check: parseCheck(rec.check),
    };
  }

  /** Keeps the parsed never-changing part of a record (bounded; oldest dropped first). */
  private remember(id: string, fixed: FixedPart): void {
    this.fixed.set(id, fixed);
    if (this.fixed.size > FIXED_CACHE_SIZE) this.fixed.delete(this.fixed.keys().next().value as string);
  }

  private summaryOf(rec: Record<string, string>, pointsDone: number): SweepSummary {
    const orNull = (s: string | undefined) => (s ? s : null);
    return {
      id: rec.id, owner: rec.owner, status: rec.status as SweepStatus, label: rec.label ?? '', specHash: rec.specHash,
      engine: rec.engine, createdAt: rec.createdAt, startedAt: orNull(rec.startedAt), finishedAt: orNull(rec.finishedAt),
      error: orNull(rec.error), pointsDone, pointsTotal: Number(rec.pointsTotal ?? 0), check: parseCheck(rec.check),
    };
  }

  async markEnqueued(id: string): Promise<void> {
    await this.redis.zrem(this.keys.unqueued(), id);
  }

  async unqueuedSweeps(olderThanMs: number, limit = 100): Promise<string[]> {
    return this.redis.zrangebyscore(this.keys.unqueued(), '-inf', Date.now() - olderThanMs, 'LIMIT', 0, limit);
  }

  async getStatus(id: string): Promise<SweepStatus | null> {
    return (await this.redis.hget(this.keys.sweep(id), 'status')) as SweepStatus | null;
  }

  /** The owner's sweeps as summaries (cheaper than full records), newest first. */
  async listSummaries(owner: string, options: ListOptions = {}): Promise<{ items: SweepSummary[]; nextCursor: string | null }> {
    const { status, limit = 20 } = options;
    const k = this.keys;
    let after = options.cursor ? decodeCursor(options.cursor) : null;
    const items: SweepSummary[] = [];
    const batch = Math.max(limit * 2, 32);
    for (let rounds = 0; rounds < 50; rounds++) {
      const max = after ? String(after.score) : '+inf';
      const raw = await this.redis.zrange(k.ownerSweeps(owner), max, '-inf', 'BYSCORE', 'REV', 'LIMIT', 0, batch, 'WITHSCORES');
      if (raw.length === 0) return { items, nextCursor: null };
      const entries: Array<{ id: string; score: number }> = [];
      for (let i = 0; i < raw.length; i += 2) {
        const e = { id: raw[i], score: Number(raw[i + 1]) };
        // Ties at the cursor's score: REV order lists larger members first; skip those already returned.
        if (after && e.score === after.score && e.id >= after.id) continue;
        entries.push(e);
      }
      const pipe = this.redis.pipeline();
      for (const e of entries) {
        pipe.hmget(k.sweep(e.id), ...SUMMARY_FIELDS);
        pipe.hvals(k.progress(e.id));
      }
      const res = (await pipe.exec()) ?? [];
      const stale: string[] = [];
      for (let i = 0; i < entries.length; i++) {
        const vals = res[2 * i][1] as (string | null)[];
        const progress = (res[2 * i + 1][1] as string[]) ?? [];
        after = entries[i];
        if (!vals[0]) { stale.push(entries[i].id); continue; }
        const rec = Object.fromEntries(SUMMARY_FIELDS.map((f, j) => [f, vals[j] ?? ''])) as Record<string, string>;
        if (status && rec.status !== status) continue;
        items.push(this.summaryOf(rec, progress.reduce((s, v) => s + Number(v), 0)));
        if (items.length === limit) {
          if (stale.length) await this.redis.zrem(k.ownerSweeps(owner), ...stale);
          return { items, nextCursor: encodeCursor(after.score, after.id) };
        }
      }
      if (stale.length) await this.redis.zrem(k.ownerSweeps(owner), ...stale);
      if (raw.length / 2 < batch) return { items, nextCursor: null };
      if (entries.length === 0 && after) {
        // A whole batch of ties at one score, all already seen: step below that score.
        after = { score: after.score - 1, id: '\uffff' };
      }
    }
    return { items, nextCursor: after ? encodeCursor(after.score, after.id) : null };
  }

  async listSweeps(owner: string, options: ListOptions = {}): Promise<SweepPage> {
    const page = await this.listSummaries(owner, options);
    const items = (await Promise.all(page.items.map((s) => this.getSweep(s.id)))).filter((r): r is SweepRecord => r !== null);
    return { items, nextCursor: page.nextCursor };
  }

  async control(id: string, workerId?: string): Promise<BranchControl> {
    const pipe = this.redis.pipeline().hget(this.keys.sweep(id), 'status');
    if (workerId) pipe.exists(this.keys.handback(workerId));
    const res = (await pipe.exec()) ?? [];
    return { status: (res[0]?.[1] as SweepStatus | null) ?? null, handback: workerId ? res[1]?.[1] === 1 : false };
  }

  private async branchState(id: string, index: number, info: BranchInfo, mode: 'start' | 'update' | 'progress' | 'finish'): Promise<[number, number, number]> {
    const k = this.keys;
    const json = JSON.stringify(info);
    const event = JSON.stringify({ index, ...info });
    return (await this.scripts.bswBranchState(
      4, k.sweep(id), k.branches(id), k.events(id), k.done(id),
      index, json, this.streamMaxLen, event, mode, new Date().toISOString(),
    )) as [number, number, number];
  }

  async branchStarted(id: string, index: number, info: BranchInfo): Promise<boolean> {
    const [ok] = await this.branchState(id, index, info, 'start');
    return ok === 1;
  }

  async branchUpdated(id: string, index: number, info: BranchInfo): Promise<void> {
    await this.branchState(id, index, info, 'update');
  }

  async branchProgress(id: string, index: number, info: BranchInfo): Promise<boolean> {
    const [ok] = await this.branchState(id, index, info, 'progress');
    return ok === 1;
  }

  async branchFinished(id: string, index: number, info: BranchInfo): Promise<{ allDone: boolean }> {
    const [ok, done, total] = await this.branchState(id, index, info, 'finish');
    return { allDone: ok === 1 && done >= total };
  }

  async getBranch(id: string, index: number): Promise<BranchInfo | null> {
    const raw = await this.redis.hget(this.keys.branches(id), String(index));
    if (!raw) return null;
    const parsed = BranchInfo.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  }

  async storedPointCounts(id: string, betaIndices: number[], timeCount: number): Promise<Record<number, number>> {
    const counts = (await this.scripts.bswStoredCounts(1, this.keys.points(id), timeCount, ...betaIndices)) as number[];
    return Object.fromEntries(betaIndices.map((b, i) => [b, Number(counts[i])]));
  }

  async writeRecords(id: string, branchIndex: number, records: BranchRecord[]): Promise<number | null> {
    if (records.length === 0) return 0;
    const k = this.keys;
    const args: (string | number)[] = [];
    for (const r of records) {
      checkRecordVersion(r.version);
      const field = r.kind === 'point' ? `${r.betaIndex}:${r.timeIndex}` : String(r.betaIndex);
      args.push(r.kind, field, r.version ?? 0, r.json);
    }
    const n = (await this.scripts.bswWriteRecords(
      8, k.sweep(id), k.points(id), k.thermo(id), k.diagnostics(id), k.events(id), k.progress(id), k.pointsCounter(), k.versions(id),
      this.streamMaxLen, branchIndex, ...args,
    )) as number;
    return n < 0 ? null : n;
  }

  async writeSamples(id: string, branchIndex: number, samples: StoredSample[]): Promise<number | null> {
    return writeSamplesRedis(this.redis, this.keys, id, branchIndex, samples);
  }

  async readSamples(id: string, branchIndex: number, samples: number[]): Promise<Array<Buffer | null>> {
    return readSamplesRedis(this.redis, this.keys, id, branchIndex, samples);
  }

  async deleteSamples(id: string): Promise<void> {
    await this.redis.del(this.keys.samples(id), this.keys.sampleCounts(id));
  }

  async saveCheckpoint(id: string, branchIndex: number, data: Uint8Array): Promise<boolean> {
    return this.checkpoints.save(id, branchIndex, data);
  }

  async loadCheckpoint(id: string, branchIndex: number): Promise<Uint8Array | null> {
    return this.checkpoints.load(id, branchIndex);
  }

  async deleteCheckpoints(id: string): Promise<void> {
    await this.checkpoints.deleteAll(id);
  }

  async readRecords(id: string): Promise<StoredRecords> {
    const k = this.keys;
    const res = (await this.redis.multi().hvals(k.points(id)).hvals(k.thermo(id)).hvals(k.diagnostics(id)).exec()) ?? [];
    const [points, thermo, diagnostics] = res.map((r) => (r[1] ?? []) as string[]);
    return { points, thermo, diagnostics };
  }

  async claimFinalize(id: string, ttlMs: number): Promise<boolean> {
    return (await this.redis.set(this.keys.finalize(id), String(process.pid), 'PX', ttlMs, 'NX')) === 'OK';
  }

  async releaseFinalize(id: string): Promise<void> {
    await this.redis.del(this.keys.finalize(id));
  }

  private async transition(id: string, to: SweepStatus, from: SweepStatus[], extra: { error?: string; result?: string } = {}): Promise<boolean> {
    const k = this.keys;
    const now = new Date().toISOString();
    const terminal = isTerminal(to);
    const owner = terminal ? await this.redis.hget(k.sweep(id), 'owner') : null;
    const event = JSON.stringify({ status: to, at: now, ...(extra.error ? { error: extra.error } : {}) });
    const keys = [k.sweep(id), k.events(id), owner !== null ? k.ownerActive(owner) : `${k.prefix}none`, k.result(id),
      k.branches(id), k.progress(id), k.done(id), k.points(id), k.thermo(id), k.diagnostics(id),
      k.versions(id), k.samples(id), k.sampleCounts(id), k.checkpoints(id)];
    const changed = await this.scripts.bswTransition(
      keys.length, ...keys,
      to, from.join(','), now, this.retentionSeconds, extra.error ?? '', this.streamMaxLen, event, extra.result ?? '', terminal ? '1' : '0',
    );
    return changed === 1;
  }

  async completeSweep(id: string, resultJson: string): Promise<boolean> {
    return this.transition(id, 'succeeded', ['running', 'queued'], { result: resultJson });
  }

  async failSweep(id: string, message: string): Promise<boolean> {
    return this.transition(id, 'failed', ['queued', 'running'], { error: message.slice(0, 2000) });
  }

  async cancelSweep(id: string): Promise<boolean> {
    return this.transition(id, 'cancelled', ['queued', 'running']);
  }

  async getResultJson(id: string): Promise<string | null> {
    return this.redis.get(this.keys.result(id));
  }

  async storeCheck(id: string, reportJson: string, summary: SweepCheckSummary): Promise<boolean> {
    const k = this.keys;
    // The terminal transition set the record's expiry; the report lives exactly as long.
    const ttl = await this.redis.pttl(k.sweep(id));
    if (ttl === -2) return false;
    const pipe = this.redis.multi();
    if (ttl > 0) pipe.set(k.check(id), reportJson, 'PX', ttl);
    else pipe.set(k.check(id), reportJson);
    await pipe.hset(k.sweep(id), 'check', JSON.stringify(summary)).exec();
    return true;
  }

  async getCheckJson(id: string): Promise<string | null> {
    return this.redis.get(this.keys.check(id));
  }

  /**
   * Events of a sweep's stream after `afterId` (exclusive; '0' for all), oldest first.
   * With `blockMs`, waits up to that long for new ones (use a dedicated connection: XREAD BLOCK
   * holds it).
   */
  async readEvents(id: string, afterId: string, count: number, blockMs?: number, connection: Redis = this.redis): Promise<Array<{ id: string; type: string; data: string }>> {
    const key = this.keys.events(id);
    const reply = blockMs !== undefined
      ? await connection.xread('COUNT', count, 'BLOCK', blockMs, 'STREAMS', key, afterId)
      : await connection.xread('COUNT', count, 'STREAMS', key, afterId);
    if (!reply) return [];
    const out: Array<{ id: string; type: string; data: string }> = [];
    for (const [, entries] of reply) {
      for (const [eid, fields] of entries) {
        const f: Record<string, string> = {};
        for (let i = 0; i < fields.length; i += 2) f[fields[i]] = fields[i + 1];
        out.push({ id: eid, type: f.type ?? 'message', data: f.data ?? '' });
      }
    }
    return out;
  }

  /** The owner of a sweep, or null (cheap ownership check). */
  async ownerOf(id: string): Promise<string | null> {
    return this.redis.hget(this.keys.sweep(id), 'owner');
  }

  /** Points written across all sweeps (the metrics counter). */
  async pointsWritten(): Promise<number> {
    return Number((await this.redis.get(this.keys.pointsCounter())) ?? 0);
  }

  /** Asks the branches of worker `workerId` to hand their work back (or clears the request). */
  async setHandback(workerId: string, on: boolean, ttlSeconds = 600): Promise<void> {
    if (on) await this.redis.set(this.keys.handback(workerId), '1', 'EX', ttlSeconds);
    else await this.redis.del(this.keys.handback(workerId));
  }

  async close(): Promise<void> {
    /* the connection belongs to the caller */
  }
}
