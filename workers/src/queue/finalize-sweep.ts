/**
 * The last step of a sweep: replay every stored record into a ResultAssembler, store the
 * result document and move the sweep to succeeded. Exactly one process does it (a claim
 * key); replays are idempotent, so a retry after a crash simply does it again.
 * Then, in the same (sandboxed) process and only in the one that moved the sweep to
 * succeeded, the check report against the series is computed within its budget and stored
 * (queue/sweep-check.ts); a failing check never fails the sweep.
 */
import type { DiagnosticsRecord, SweepPoint, SweepResult, ThermoRecord } from '../../../shared-types/src/index.js';
import type { JobStore } from '../store/index.js';
// The assembler file directly, not the sweep barrel: the barrel loads every engine, which a
// finalizing process does not need.
import { ResultAssembler } from '../sweep/result-assembler.js';
import { SweepIncompleteError } from './errors/sweep-incomplete-error.js';
import { storeSweepCheck, type SweepCheckOptions } from './sweep-check.js';

/** How long a finalize claim lasts, ms (covers assembling a large result). */
export const FINALIZE_CLAIM_MS = 60_000;

/**
 * 'succeeded' when this call stored the result (and then its check, unless `check` is false);
 * 'skipped' when another process holds the claim or the sweep is not active.
 */
export async function finalizeSweep(store: JobStore, sweepId: string, check: SweepCheckOptions | false = {}): Promise<'succeeded' | 'skipped'> {
  if (!(await store.claimFinalize(sweepId, FINALIZE_CLAIM_MS))) return 'skipped';
  let result: SweepResult | null = null;
  try {
    const record = await store.getSweep(sweepId);
    if (!record || (record.status !== 'running' && record.status !== 'queued')) return 'skipped';
    const stored = await store.readRecords(sweepId);
    const assembler = new ResultAssembler(record.spec, record.header);
    for (const t of stored.thermo) assembler.thermo(JSON.parse(t) as ThermoRecord);
    for (const p of stored.points) assembler.point(JSON.parse(p) as SweepPoint);
    for (const d of stored.diagnostics) assembler.diagnostics(JSON.parse(d) as DiagnosticsRecord);
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
  } finally {
    await store.releaseFinalize(sweepId);
  }
  if (check !== false && result !== null) {
    // The sweep has succeeded; a store error here leaves it without a check (GET …/check answers 409).
    await storeSweepCheck(store, sweepId, result, check).catch(() => undefined);
  }
  return 'succeeded';
}
