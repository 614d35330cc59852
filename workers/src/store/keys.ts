/**
 * Redis key layout of the job store. Every key starts with a configurable prefix (default
 * `bsw:`). Per-sweep keys wrap the sweep id in braces (a Redis Cluster hash tag) so the Lua
 * scripts that touch several keys of one sweep stay on one slot.
 *
 * | key | type | holds |
 * |---|---|---|
 * | `{p}sweep:{id}` | hash | the sweep record (status, owner, spec, plan, header, timings) |
 * | `{p}sweep:{id}:branches` | hash | branch index → JSON branch state |
 * | `{p}sweep:{id}:progress` | hash | branch index → points written (counted once per point) |
 * | `{p}sweep:{id}:done` | set | indices of finished branches |
 * | `{p}sweep:{id}:points` | hash | `${betaIndex}:${timeIndex}` → JSON point (the idempotency key) |
 * | `{p}sweep:{id}:versions` | hash | `${kind}:${field}` → version of a re-writable record (sampled engines: samples merged) |
 * | `{p}sweep:{id}:samples` | hash | `${branchIndex}:${sample}` → one random sample's raw sums (binary; queue/typical/sample-codec.ts) |
 * | `{p}sweep:{id}:sample-counts` | hash | branch index → samples stored (counted once per sample) |
 * | `{p}sweep:{id}:thermo` | hash | β index → JSON thermodynamics |
 * | `{p}sweep:{id}:diag` | hash | β index → JSON diagnostics |
 * | `{p}sweep:{id}:checkpoints` | hash | branch index → the branch's latest engine checkpoint (binary; deleted when the sweep succeeds) |
 * | `{p}sweep:{id}:events` | stream | live events (status, branch, thermo, point, diagnostics) |
 * | `{p}sweep:{id}:result` | string | the final result document (JSON) |
 * | `{p}sweep:{id}:check` | string | the check report against the series (JSON), written after the result |
 * | `{p}sweep:{id}:finalize` | string | short-lived claim of the one process assembling the result |
 * | `{p}unqueued` | zset | sweep ids stored but not yet confirmed in the branch queue, by creation ms (the submit outbox) |
 * | `{p}owner:{o}:sweeps` | zset | sweep ids by creation time (ms × 1000 + a per-process sequence) |
 * | `{p}owner:{o}:active` | set | the owner's queued or running sweeps (the cap) |
 * | `{p}owner:{o}:spec:{hash}` | string | latest sweep id for this canonical spec (dedupe) |
 * | `{p}token:{tid}` | hash | token metadata (name, owner, SHA-256 of the secret, times) |
 * | `{p}token-hash:{sha}` | hash | id, name, owner of an active token, by the secret's SHA-256 (deleted on revoke) |
 * | `{p}token-name:{name}` | string | token id of the active token with this name |
 * | `{p}tokens` | zset | token ids by creation time |
 * | `{p}stream-token:{sha}` | string | JSON {owner, sweepId} of a short-lived event-stream token (EX) |
 * | `{p}worker:{wid}:handback` | string | set while worker `wid` hands its branches back (shutdown) |
 * | `{p}metrics:points` | string | points written, all sweeps (counter) |
 * | `{p}rl:tok:{tid}`, `{p}rl:ip:{addr}` | string | request counter of the current rate-limit window (PEXPIRE = window; services/api/src/gatekeeper.ts) |
 */

/** The default key prefix. */
export const DEFAULT_KEY_PREFIX = 'bsw:';

/** Every key of the store, built from one prefix. */
export interface StoreKeys {
  readonly prefix: string;
  sweep(id: string): string;
  branches(id: string): string;
  progress(id: string): string;
  done(id: string): string;
  points(id: string): string;
  /** Versions of re-writable records (sampled engines). */
  versions(id: string): string;
  /** Raw random samples of sampled engines, by `${branchIndex}:${sample}`. */
  samples(id: string): string;
  /** Samples stored per branch. */
  sampleCounts(id: string): string;
  thermo(id: string): string;
  diagnostics(id: string): string;
  /** Engine checkpoints by branch index (binary). */
  checkpoints(id: string): string;
  events(id: string): string;
  result(id: string): string;
  /** The check report (JSON). */
  check(id: string): string;
  finalize(id: string): string;
  /** All per-sweep keys (for retention and deletion). */
  allOfSweep(id: string): string[];
  /** Sweeps created whose branch jobs are not confirmed enqueued yet (the submit outbox). */
  unqueued(): string;
  ownerSweeps(owner: string): string;
  ownerActive(owner: string): string;
  ownerSpec(owner: string, specHash: string): string;
  token(id: string): string;
  tokenHash(sha: string): string;
  tokenName(name: string): string;
  tokens(): string;
  streamToken(sha: string): string;
  handback(workerId: string): string;
  pointsCounter(): string;
  rateLimitPrefix(): string;
}

/** Owners and token names are user text: keep keys printable and unambiguous. */
const safe = (s: string) => encodeURIComponent(s);

export function storeKeys(prefix: string = DEFAULT_KEY_PREFIX): StoreKeys {
  const sw = (id: string) => `${prefix}sweep:{${id}}`;
  const keys: StoreKeys = {
    prefix,
    sweep: sw,
    branches: (id) => `${sw(id)}:branches`,
    progress: (id) => `${sw(id)}:progress`,
    done: (id) => `${sw(id)}:done`,
    points: (id) => `${sw(id)}:points`,
    versions: (id) => `${sw(id)}:versions`,
    samples: (id) => `${sw(id)}:samples`,
    sampleCounts: (id) => `${sw(id)}:sample-counts`,
    thermo: (id) => `${sw(id)}:thermo`,
    diagnostics: (id) => `${sw(id)}:diag`,
    checkpoints: (id) => `${sw(id)}:checkpoints`,
    events: (id) => `${sw(id)}:events`,
    result: (id) => `${sw(id)}:result`,
    check: (id) => `${sw(id)}:check`,
    finalize: (id) => `${sw(id)}:finalize`,
    allOfSweep: (id) => [
      keys.sweep(id), keys.branches(id), keys.progress(id), keys.done(id), keys.points(id),
      keys.thermo(id), keys.diagnostics(id), keys.events(id), keys.result(id), keys.check(id),
      keys.checkpoints(id),
      keys.versions(id), keys.samples(id), keys.sampleCounts(id),
    ],
    unqueued: () => `${prefix}unqueued`,
    ownerSweeps: (o) => `${prefix}owner:${safe(o)}:sweeps`,
    ownerActive: (o) => `${prefix}owner:${safe(o)}:active`,
    ownerSpec: (o, h) => `${prefix}owner:${safe(o)}:spec:${h}`,
    token: (id) => `${prefix}token:${id}`,
    tokenHash: (sha) => `${prefix}token-hash:${sha}`,
    tokenName: (name) => `${prefix}token-name:${safe(name)}`,
    tokens: () => `${prefix}tokens`,
    streamToken: (sha) => `${prefix}stream-token:${sha}`,
    handback: (wid) => `${prefix}worker:${wid}:handback`,
    pointsCounter: () => `${prefix}metrics:points`,
    rateLimitPrefix: () => `${prefix}rl:`,
  };
  return keys;
}
