/**
 * mpsDiagnostics — the end-of-β diagnostics record of the mps engine: drifts, the
 * stationarity residual, the error estimates (truncation: Σ√w over the imaginary and real
 * updates, a rigorous bound on the state error; Trotter: step doubling, an estimate), bond
 * dimensions and discarded weights by time, the settings used, and what this run itself did
 * (where it resumed from and how many imaginary- and real-time updates it computed), so a
 * resumed branch shows that the finished work was not repeated.
 */
import type { DiagnosticsRecord } from '../../../../shared-types/src/index.js';
import type { AuxiliaryMode } from './bond-gates.js';
import type { ThermalSummary } from './mps-checkpoint.js';
import type { MpsRunSettings } from './mps-settings.js';
import type { MpsQuenchReport } from './run-mps-quench.js';

/** What one run did for one β (besides the physics). */
export interface MpsRunInfo {
  /** 'start', 'thermal' (imaginary time restored) or 'quench:t=K' (points 0..K−1 restored). */
  readonly resumedFrom: string;
  /** Why a loaded checkpoint was not used ('' when none was, or it was). */
  readonly checkpointIgnored: string;
  /** Imaginary-time updates computed by this run for this β (state and half-step copy). */
  readonly imaginaryUpdatesRun: number;
  /** Real-time updates computed by this run for this β. */
  readonly realUpdatesRun: number;
  /** Checkpoints saved by this run for this β. */
  readonly checkpointsSaved: number;
}

/** The diagnostics record of one β. */
export function mpsDiagnostics(
  betaIndex: number, thermal: ThermalSummary, q: MpsQuenchReport, settings: MpsRunSettings,
  auxiliary: AuxiliaryMode, run: MpsRunInfo,
): DiagnosticsRecord {
  const stats = thermal.stats;
  return {
    betaIndex,
    h1Drift: q.h1Drift,
    normDrift: q.normDrift,
    stationarityResidual: thermal.stationarityResidual,
    propagatorErrorBound: stats.discardedRootSum + q.stats.discardedRootSum + q.trotterEstimate,
    extra: {
      maxBond: Math.max(stats.maxBond, q.stats.maxBond),
      maxDiscardedWeight: Math.max(stats.maxDiscarded, q.stats.maxDiscarded),
      discardedWeightSum: stats.discardedSum + q.stats.discardedSum,
      truncationErrorBound: stats.discardedRootSum + q.stats.discardedRootSum,
      trotterErrorEstimate: q.trotterEstimate,
      trotterThermalEstimate: thermal.trotter,
      trotterRatePerTime: q.trotterRate,
      trotterOrder: settings.order,
      dt: settings.dt,
      bondCap: settings.maxBond,
      truncationPerUpdate: settings.truncation,
      imaginaryUpdates: stats.gates,
      realUpdates: q.stats.gates,
      maxImag: Math.max(q.maxImag, thermal.maxImag),
      auxiliary,
      settingsDerived: settings.derived.join(','),
      bondByTime: q.bondByTime.join(','),
      discardedByTime: q.discardedByTime.map((x) => x.toExponential(2)).join(','),
      resumedFrom: run.resumedFrom,
      checkpointIgnored: run.checkpointIgnored,
      imaginaryUpdatesRun: run.imaginaryUpdatesRun,
      realUpdatesRun: run.realUpdatesRun,
      checkpointsSaved: run.checkpointsSaved,
    },
  };
}
