/**
 * The last step of a sweep: replay every stored record into a ResultAssembler (sampled engines:
 * re-estimate every branch from its stored samples instead), store the result document and move
 * the sweep to succeeded. Exactly one process does it (a claim key); replays are idempotent, so
 * a retry after a crash simply does it again.
 * The branches' engine checkpoints and raw samples are deleted once the result is stored.
 * Then, in the same (sandboxed) process and only in the one that moved the sweep to
 * succeeded, the check report against the series is computed within its budget and stored
 * (queue/sweep-check.ts); a failing check never fails the sweep.
 */
import type { DiagnosticsRecord, SweepPoint, SweepResult, ThermoRecord } from '../../../shared-types/src/index.js';
import type { JobStore, StoredRecords, SweepRecord } from '../store/index.js';
// The assembler file directly, not the sweep barrel: the barrel loads every engine, which a
// finalizing process does not need.
import { ResultAssembler } from '../sweep/result-assembler.js';
import { SweepIncompleteError } from './errors/sweep-incomplete-error.js';
import { storeSweepCheck, type SweepCheckOptions } from './sweep-check.js';

/** The records a result is assembled from (parsed). */
export interface FinalRecords {
  thermo: ThermoRecord[];
  points: SweepPoint[];
  diagnostics: DiagnosticsRecord[];
}

/**
 * Where the final records come from. The default replays the stored records; sampled engines
 * re-estimate from their stored samples (queue/typical/sampled-final-records.ts). May throw a
 * SweepIncompleteError.
 */
export type FinalRecordSource = (record: SweepRecord) => Promise<FinalRecords>;

/** How long a finalize claim lasts, ms (covers assembling a large result). */
export const FINALIZE_CLAIM_MS = 60_000;

/**
 * 'succeeded' when this call stored the result (and then its check, unless `check` is false);
 * 'skipped' when another process holds the claim or the sweep is not active.
 */
export async function finalizeSweep(
  store: JobStore, sweepId: string, check: SweepCheckOptions | false = {}, source?: FinalRecordSource,
): Promise<'succeeded' | 'skipped'> {
  if (!(await store.claimFinalize(sweepId, FINALIZE_CLAIM_MS))) return 'skipped';
  let result: SweepResult | null = null;
  try {
    const record = await store.getSweep(sweepId);
    if (!record || (record.status !== 'running' && record.status !== 'queued')) return 'skipped';
    const stored = source ? await source(record) : parseStored(await store.readRecords(sweepId));
    const assembler = new ResultAssembler(record.spec, record.header);
    for (const t of stored.thermo) assembler.thermo(t);
    for (const p of stored.points) assembler.point(p);
    for (const d of stored.diagnostics) assembler.diagnostics(d);
    if (!assembler.complete()) {
      const missing = assembler.missing();
      throw new SweepIncompleteError(
        `all branches reported done but ${missing.length} points are missing` +
        (missing.length ? ` (first: β index ${missing[0].betaIndex}, time index ${missing[0].timeIndex})` : '') +
        ` or thermodynamics/diagnostics records are incomplete`,
      );
    }
    const startedAt = record.startedAt ?? record.createdAt;
    const finishedAt = new Date();
    const assembled = assembler.finish({
      startedAt,
      finishedAt: finishedAt.toISOString(),
      seconds: (finishedAt.getTime() - Date.parse(startedAt)) / 1000,
    });
    if (!(await store.completeSweep(sweepId, JSON.stringify(assembled)))) return 'skipped';
    result = assembled;
    // Branch checkpoints are only for retries; a finished sweep has none left.
    await store.deleteCheckpoints(sweepId).catch(() => undefined);
    // So are the raw samples of sampled engines (the result holds their estimates).
    await store.deleteSamples(sweepId).catch(() => undefined);
  } finally {
    await store.releaseFinalize(sweepId);
  }
  if (check !== false && result !== null) {
    // The sweep has succeeded; a store error here leaves it without a check (GET …/check answers 409).
    await storeSweepCheck(store, sweepId, result, check).catch(() => undefined);
  }
  return 'succeeded';
}

function parseStored(stored: StoredRecords): FinalRecords {
  return {
    thermo: stored.thermo.map((t) => JSON.parse(t) as ThermoRecord),
    points: stored.points.map((p) => JSON.parse(p) as SweepPoint),
    diagnostics: stored.diagnostics.map((d) => JSON.parse(d) as DiagnosticsRecord),
  };
}
