/**
 * checkReport — cross-check of a finished sweep against the high-temperature and short-time
 * series of the same spec: per β (and time) and per quantity, the series value ± its
 * truncation estimate against the engine's value ± its error, with a verdict.
 *
 * Verdicts (pure function of the two values and errors):
 * - 'outside-window': the series estimate is infinite or above
 *   windowError·max(1, |series value|) — the series cannot judge here;
 * - 'agree':    |engine − series| ≤ sigma·(series error + engine error) + ROUNDING_FLOOR·max(1, |value|);
 * - 'disagree': otherwise. Any disagreement sets `flagged`.
 * Quantities: thermo:lnZ, thermo:energy, thermo:heatCapacity, thermo:entropy,
 * thermo:freeEnergy (β > 0) per β, and every series label at every (β, t) point.
 * The series are those of series/compute-sweep-series.ts for result.spec (or `options.series`).
 * Cost: the series computation (seconds for large lattices at high order) plus O(points·K²).
 */
import type { SweepResult } from '../../../shared-types/src/index.js';
import { buildLattice } from '../lattice/build-lattice.js';
import { computeSweepSeries, type SeriesKind, type SeriesMethod, type SweepSeries } from './compute-sweep-series.js';
import { localEnergyScale, seriesAt, thermoAt } from './evaluate-sweep-series.js';
import { buildLocalModel } from './local-terms.js';
import { expandSeriesObservables } from './series-observables.js';

/** Relative allowance for double rounding in the comparison. */
export const ROUNDING_FLOOR = 1e-12;

/** Verdict of one comparison. */
export type CheckVerdict = 'agree' | 'disagree' | 'outside-window';

/** One compared value. */
export interface CheckEntry {
  readonly betaIndex: number;
  readonly beta: number;
  /** null for thermodynamics. */
  readonly timeIndex: number | null;
  readonly time: number | null;
  /** "thermo:<field>" or a series label. */
  readonly quantity: string;
  readonly seriesValue: number;
  readonly seriesError: number;
  readonly engineValue: number;
  readonly engineError: number;
  readonly verdict: CheckVerdict;
}

/** The check report of one sweep. */
export interface CheckReport {
  readonly format: 'betasweep.check/1';
  readonly specHash: string;
  readonly engine: { readonly name: string; readonly version: string };
  readonly series: {
    readonly kind: SeriesKind;
    readonly method: SeriesMethod;
    readonly thermoOrder: number;
    readonly quenchOrder: number;
    readonly seconds: number;
  };
  readonly entries: readonly CheckEntry[];
  readonly summary: { readonly agree: number; readonly disagree: number; readonly outsideWindow: number };
  /** True when some value disagrees inside the series window. */
  readonly flagged: boolean;
}

/** Options of {@link checkReport}. */
export interface CheckReportOptions {
  /** Order of ln Z in β. @defaultValue 10 */
  thermoOrder?: number;
  /** Total order of the (t, β) series. @defaultValue 6 */
  quenchOrder?: number;
  /** Precomputed series of result.spec (skips the computation). */
  series?: SweepSeries;
  /** Agreement allows sigma·(sum of both errors). @defaultValue 1 */
  sigma?: number;
  /** Series estimates above this (relative to max(1, |value|)) are outside the window. @defaultValue 1e-3 */
  windowError?: number;
  /** Compare every time point or only the first. @defaultValue 'all' */
  times?: 'all' | 'first';
  signal?: AbortSignal;
}

/** The verdict rule of the file header. */
export function checkVerdict(
  seriesValue: number, seriesError: number, engineValue: number, engineError: number, sigma: number, windowError: number,
): CheckVerdict {
  const scale = Math.max(1, Math.abs(seriesValue));
  if (!Number.isFinite(seriesError) || !Number.isFinite(seriesValue) || seriesError > windowError * scale) return 'outside-window';
  const allowed = sigma * (seriesError + (Number.isFinite(engineError) ? engineError : Infinity)) + ROUNDING_FLOOR * scale;
  return Math.abs(engineValue - seriesValue) <= allowed ? 'agree' : 'disagree';
}

/**
 * Cross-checks a finished sweep (see file header).
 * @throws RangeError for invalid options or a result whose series do not match its spec.
 */
export function checkReport(result: SweepResult, options: CheckReportOptions = {}): CheckReport {
  const { thermoOrder = 10, quenchOrder = 6, sigma = 1, windowError = 1e-3, times = 'all', signal } = options;
  if (!(sigma > 0)) throw new RangeError(`sigma must be > 0; got ${String(sigma)}`);
  if (!(windowError > 0)) throw new RangeError(`windowError must be > 0; got ${String(windowError)}`);
  const spec = result.spec;
  const series = options.series ?? computeSweepSeries(spec, { thermoOrder, quenchOrder, signal });
  const graph = buildLattice(spec.lattice);
  const h0 = buildLocalModel(spec.h0, graph);
  const h1 = buildLocalModel(spec.h1, graph);
  const scale = localEnergyScale(h0, h1);
  const combos = expandSeriesObservables(spec, graph, h0, h1).combinations;
  const norms = combos.map((c) => Math.abs(c.constant) + c.linear.reduce((s, [, w]) => s + Math.abs(w), 0)
    + c.quadratic.reduce((s, [, , w]) => s + Math.abs(w), 0));
  const byLabel = new Map(series.series.map((s, i) => [s.label, i]));
  for (const s of result.series) {
    if (!byLabel.has(s.label)) throw new RangeError(`result series "${s.label}" is not a series of its spec`);
  }

  const entries: CheckEntry[] = [];
  const push = (e: Omit<CheckEntry, 'verdict'>) =>
    entries.push({ ...e, verdict: checkVerdict(e.seriesValue, e.seriesError, e.engineValue, e.engineError, sigma, windowError) });

  for (const rec of result.thermo) {
    const th = thermoAt(series, rec.beta, scale);
    const base = { betaIndex: rec.betaIndex, beta: rec.beta, timeIndex: null, time: null };
    push({ ...base, quantity: 'thermo:lnZ', seriesValue: th.lnZ.value, seriesError: th.lnZ.error, engineValue: rec.lnZ, engineError: rec.errors.lnZ });
    push({ ...base, quantity: 'thermo:energy', seriesValue: th.energy.value, seriesError: th.energy.error, engineValue: rec.energy, engineError: rec.errors.energy });
    push({ ...base, quantity: 'thermo:heatCapacity', seriesValue: th.heatCapacity.value, seriesError: th.heatCapacity.error, engineValue: rec.heatCapacity, engineError: rec.errors.heatCapacity });
    push({ ...base, quantity: 'thermo:entropy', seriesValue: th.entropy.value, seriesError: th.entropy.error, engineValue: rec.entropy, engineError: rec.errors.entropy });
    if (th.freeEnergy !== null && rec.freeEnergy !== null) {
      push({ ...base, quantity: 'thermo:freeEnergy', seriesValue: th.freeEnergy.value, seriesError: th.freeEnergy.error, engineValue: rec.freeEnergy, engineError: rec.errors.freeEnergy ?? Infinity });
    }
  }
  const nTimes = times === 'first' ? Math.min(1, result.times.length) : result.times.length;
  for (let b = 0; b < result.betas.length; b++) {
    for (let t = 0; t < nTimes; t++) {
      signal?.throwIfAborted();
      const est = seriesAt(series, result.betas[b], result.times[t], scale, norms);
      for (const s of result.series) {
        const v = s.values[b]?.[t];
        if (v === undefined || !Number.isFinite(v)) continue;
        const i = byLabel.get(s.label)!;
        push({
          betaIndex: b, beta: result.betas[b], timeIndex: t, time: result.times[t], quantity: s.label,
          seriesValue: est[i].value, seriesError: est[i].error, engineValue: v, engineError: s.errors[b]?.[t] ?? Infinity,
        });
      }
    }
  }
  const summary = { agree: 0, disagree: 0, outsideWindow: 0 };
  for (const e of entries) {
    if (e.verdict === 'agree') summary.agree++;
    else if (e.verdict === 'disagree') summary.disagree++;
    else summary.outsideWindow++;
  }
  return {
    format: 'betasweep.check/1',
    specHash: result.specHash,
    engine: result.engine,
    series: { kind: series.kind, method: series.method, thermoOrder: series.thermoOrder, quenchOrder: series.quenchOrder, seconds: series.stats.seconds },
    entries,
    summary,
    flagged: summary.disagree > 0,
  };
}
