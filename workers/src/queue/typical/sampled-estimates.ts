/**
 * Estimates of a sampled branch from a set of stored samples: the records the typical engine
 * emits (thermodynamics, one point per grid time, diagnostics — engines/typical/
 * estimate-typical.ts), with the engine's own diagnostics extras, so that the estimate from the
 * final set of samples is the local run's, record for record.
 */
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../../shared-types/src/index.js';
import { estimateTypicalBeta, usesTables } from '../../engines/typical/index.js';
import type { TypicalLayout, TypicalSamples } from '../../engines/typical/index.js';
import type { BranchRecord } from '../../store/index.js';

/** The records of one branch's β indices. */
export interface BranchEstimates {
  readonly thermo: ThermoRecord[];
  readonly points: SweepPoint[];
  readonly diagnostics: DiagnosticsRecord[];
}

/** What the engine adds to each β's diagnostics (typical-engine.ts runBranch). */
export interface SamplingExtras {
  readonly cap: number;
  readonly pilot: number;
  /** Rounds the samples span. */
  readonly rounds: number;
}

/**
 * The records of `order` (the branch's β indices, ascending in β) from `samples` (≥ 2 samples
 * at each β), with the jackknife errors of that set.
 */
export function estimateBranch(
  layout: TypicalLayout, samples: TypicalSamples, order: readonly number[], errorTarget: number, sampling: SamplingExtras,
): BranchEstimates {
  const out: BranchEstimates = { thermo: [], points: [], diagnostics: [] };
  const extra = { sampleCap: sampling.cap, pilotSamples: sampling.pilot, rounds: sampling.rounds, tables: usesTables(layout.sites) };
  for (const b of order) {
    const est = estimateTypicalBeta(layout, samples, b, { errorTarget });
    out.thermo.push(est.thermo);
    out.points.push(...est.points);
    out.diagnostics.push({ ...est.diagnostics, extra: { ...est.diagnostics.extra, ...extra } });
  }
  return out;
}

/** The largest jackknife σ over the branch's β indices (the engine's round decision input). */
export function worstStatError(layout: TypicalLayout, samples: TypicalSamples, order: readonly number[], errorTarget: number): number {
  return Math.max(...order.map((b) => estimateTypicalBeta(layout, samples, b, { errorTarget }).statErrorMax));
}

/** The estimates as store records of one version (the number of samples they rest on). */
export function versionedRecords(est: BranchEstimates, version: number): BranchRecord[] {
  return [
    ...est.thermo.map((r): BranchRecord => ({ kind: 'thermo', betaIndex: r.betaIndex, json: JSON.stringify(r), version })),
    ...est.points.map((p): BranchRecord => ({ kind: 'point', betaIndex: p.betaIndex, timeIndex: p.timeIndex, json: JSON.stringify(p), version })),
    ...est.diagnostics.map((d): BranchRecord => ({ kind: 'diagnostics', betaIndex: d.betaIndex, json: JSON.stringify(d), version })),
  ];
}
