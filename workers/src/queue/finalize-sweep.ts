/**
 * The last step of a sweep: replay every stored record into a ResultAssembler, store the
 * result document and move the sweep to succeeded. Exactly one process does it (a claim
 * key); replays are idempotent, so a retry after a crash simply does it again.
 */
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../shared-types/src/index.js';
import type { JobStore } from '../store/index.js';
// The assembler file directly, not the sweep barrel: the barrel loads every engine, which a
// finalizing process does not need.
import { ResultAssembler } from '../sweep/result-assembler.js';
import { SweepIncompleteError } from './errors/sweep-incomplete-error.js';

/** How long a finalize claim lasts, ms (covers assembling a large result). */
export const FINALIZE_CLAIM_MS = 60_000;

/** 'succeeded' when this call stored the result; 'skipped' when another process holds the claim or the sweep is not active. */
export async function finalizeSweep(store: JobStore, sweepId: string): Promise<'succeeded' | 'skipped'> {
  if (!(await store.claimFinalize(sweepId, FINALIZE_CLAIM_MS))) return 'skipped';
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
    const result = assembler.finish({
      startedAt,
      finishedAt: finishedAt.toISOString(),
      seconds: (finishedAt.getTime() - Date.parse(startedAt)) / 1000,
    });
    return (await store.completeSweep(sweepId, JSON.stringify(result))) ? 'succeeded' : 'skipped';
  } finally {
    await store.releaseFinalize(sweepId);
  }
}
