/**
 * The check report of a finished sweep, within a time budget: the series orders are the highest
 * the series planner (engines/series/plan-series-engine.ts, which uses the a-priori cost model of
 * series/estimate-series-cost.ts) fits into the budget, and the computation is cut off at the
 * deadline. A failure or a cut-off gives a report with an error note, never an exception: the
 * sweep has already succeeded and the check must not undo that.
 *
 * Runs in the sandboxed branch process that finalises the sweep (CPU work stays out of the
 * process that renews the queue's locks).
 */
import type { SweepResult } from '../../../shared-types/src/index.js';
// The files directly, not the barrels: a finalizing process needs no engine but the planner.
import { planSeriesEngine } from '../engines/series/plan-series-engine.js';
import { checkReport, type CheckReport } from '../series/check-report.js';
import type { JobStore, SweepCheckSummary } from '../store/index.js';

/** Budget of the check computation, seconds. */
export const CHECK_BUDGET_SECONDS = 10;
/** Highest orders the check tries (those of checkReport's defaults). */
export const CHECK_MAX_THERMO_ORDER = 10;
export const CHECK_MAX_QUENCH_ORDER = 6;

/** The stored check document: a CheckReport, or an empty one whose `error` says why. */
export type SweepCheckDocument =
  | (CheckReport & { readonly error: null })
  | (Omit<CheckReport, 'series'> & { readonly series: null; readonly error: string });

/** Options of {@link computeSweepCheck}. */
export interface SweepCheckOptions {
  /** Time budget, seconds (orders are planned for it, the run is cut off at it). @defaultValue CHECK_BUDGET_SECONDS */
  budgetSeconds?: number;
}

/**
 * An AbortSignal that reports aborted once `deadline` (epoch ms) has passed. The series code is
 * synchronous, so a timer could never fire while it runs; the signal reads the clock instead
 * each time the code polls it.
 */
function deadlineSignal(deadline: number, budgetSeconds: number): AbortSignal {
  const signal = new AbortController().signal;
  const expired = () => Date.now() >= deadline;
  const reason = () => new Error(`the check exceeded its budget of ${budgetSeconds} s`);
  Object.defineProperty(signal, 'aborted', { get: expired });
  Object.defineProperty(signal, 'reason', { get: () => (expired() ? reason() : undefined) });
  Object.defineProperty(signal, 'throwIfAborted', { value: () => { if (expired()) throw reason(); } });
  return signal;
}

/** The summary the sweep record keeps for a check document. */
export function summarizeCheck(doc: SweepCheckDocument): SweepCheckSummary {
  const counts = { ...doc.summary };
  if (doc.error !== null) return { verdict: 'error', flagged: false, counts, note: doc.error };
  const verdict = doc.flagged ? 'disagree' : counts.agree === 0 ? 'no-window' : 'agree';
  return { verdict, flagged: doc.flagged, counts, note: null };
}

/** Computes the check document of a result (see file header). Never throws. */
export function computeSweepCheck(result: SweepResult, options: SweepCheckOptions = {}): SweepCheckDocument {
  const { budgetSeconds = CHECK_BUDGET_SECONDS } = options;
  const start = Date.now();
  const failed = (message: string): SweepCheckDocument => ({
    format: 'betasweep.check/1', specHash: result.specHash, engine: result.engine, series: null,
    entries: [], summary: { agree: 0, disagree: 0, outsideWindow: 0 }, flagged: false, error: message,
  });
  try {
    const planned = planSeriesEngine(result.spec, 'series', {
      budgetSeconds, maxThermoOrder: CHECK_MAX_THERMO_ORDER, maxQuenchOrder: CHECK_MAX_QUENCH_ORDER,
    });
    if (planned.thermoOrder === 0 || planned.quenchOrder === 0) {
      return failed(`no series fits the check's budget of ${budgetSeconds} s: ${planned.plan.refusal?.message ?? planned.plan.reason}`);
    }
    const signal = deadlineSignal(start + budgetSeconds * 1000, budgetSeconds);
    const report = checkReport(result, { thermoOrder: planned.thermoOrder, quenchOrder: planned.quenchOrder, signal });
    return { ...report, error: null };
  } catch (err) {
    return failed(`the check could not be computed: ${(err as Error).message}`);
  }
}

/**
 * Computes and stores the check of a succeeded sweep, with its summary on the sweep record.
 * Returns the summary, or null when the store refused it (the sweep is gone). Store errors
 * propagate; computation errors become an 'error' report.
 */
export async function storeSweepCheck(store: JobStore, sweepId: string, result: SweepResult, options: SweepCheckOptions = {}): Promise<SweepCheckSummary | null> {
  const doc = computeSweepCheck(result, options);
  const summary = summarizeCheck(doc);
  return (await store.storeCheck(sweepId, JSON.stringify(doc), summary)) ? summary : null;
}
