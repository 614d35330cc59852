/**
 * The figures of a sweep, as plain data that both renderers draw: the dashboard (uPlot, live)
 * and the SVG/PNG export (Observable Plot, in the page and in `betasweep plot`). Building the
 * figures in one place is what makes the page and the command line show the same thing.
 *
 * - One time-series figure per series label: x = time, one line per β coloured on the
 *   temperature scale, an error band where the errors are visible at plot scale, and the
 *   series cross-check (dashed, same colour) inside its trust window.
 * - One figure per thermodynamic quantity against β (per site): a neutral line through one
 *   marker per β in that β's colour, error bars where visible, and the series check.
 */
import type { ThermoRecord } from '../../shared-types/src/result.js';
import { CHECK_UNAVAILABLE, type CheckReportBody } from './check-report-body.js';
import { describeSeries } from './describe-series.js';
import { formatBeta, formatNumber } from './format-number.js';
import { temperatureColours } from './temperature-scale.js';

/**
 * An error band (or bar) is drawn when the largest error of a line exceeds this fraction of the
 * figure's y-range: about one pixel on a 500-pixel plot. Smaller errors would only thicken the
 * line, so they are left to the CSV and the data table.
 */
export const BAND_MIN_FRACTION = 2e-3;

/** Colour of the neutral line of a thermodynamics figure (the markers carry the β colours). */
export const TREND_COLOUR = '#4a4f57';

/** What the figures are built from: a finished result, or the points received so far. */
export interface PlotData {
  /** The sweep's label (figure titles do not repeat it; exports name it). */
  label: string;
  /** Canonical β grid (ascending). */
  betas: number[];
  /** Time grid (ascending). */
  times: number[];
  /** values[b][t], errors[b][t]; NaN where no point has arrived yet. */
  series: Array<{ label: string; values: number[][]; errors: number[][] }>;
  /** Thermodynamics per β received so far (any order). */
  thermo: ThermoRecord[];
}

/** One legend entry: a β with its colour. */
export interface LegendEntry {
  betaIndex: number;
  beta: number;
  /** "β = 0.5 (T = 2)". */
  name: string;
  colour: string;
}

/** One drawn line: a β's curve (series figures) or the quantity against β (thermo figures). */
export interface FigureLine {
  key: string;
  name: string;
  colour: string;
  /** The β of the line; null for the neutral line of a thermodynamics figure. */
  betaIndex: number | null;
  /** One value per x (NaN = missing). */
  y: number[];
  /** Lower and upper edge of the error band, or null when the errors are negligible. */
  lo: number[] | null;
  hi: number[] | null;
}

/** A marker of a thermodynamics figure: one β's value with its error bar (if visible). */
export interface FigureMarker {
  betaIndex: number;
  x: number;
  y: number;
  lo: number | null;
  hi: number | null;
  colour: string;
}

/** The series cross-check drawn over a figure. */
export interface FigureCheck {
  /** The series values inside the trust window (dashed), one per β (series figures) or one. */
  lines: Array<{ key: string; betaIndex: number | null; colour: string; x: number[]; y: number[]; lo: number[]; hi: number[] }>;
  /** The x-range the series can judge (the union over βs for series figures); null if nowhere. */
  window: { from: number; to: number } | null;
  /** Where the engine lies outside the series' error: drawn as crosses. */
  disagree: Array<{ x: number; y: number; betaIndex: number }>;
  /** Counts of this figure's comparisons. */
  summary: { agree: number; disagree: number; outsideWindow: number };
}

/** One figure, ready to draw. */
export interface Figure {
  /** Stable id: "series:X:avg", "thermo:energy". */
  id: string;
  kind: 'series' | 'thermo';
  title: string;
  xLabel: string;
  yLabel: string;
  x: number[];
  lines: FigureLine[];
  /** One entry per β of the sweep. */
  legend: LegendEntry[];
  /** Thermodynamics figures: one marker per β with a value. */
  markers: FigureMarker[];
  /** The overlay, or null (see `checkNote`). */
  check: FigureCheck | null;
  /** Why there is no overlay (e.g. "cross-check not available"), or a one-line summary of it. */
  checkNote: string;
}

/** The thermodynamic quantities drawn against β, per site. */
export const THERMO_QUANTITIES = [
  { key: 'energy', quantity: 'thermo:energy', title: 'Energy per site', yLabel: 'E/N' },
  { key: 'heatCapacity', quantity: 'thermo:heatCapacity', title: 'Heat capacity per site', yLabel: 'C/N' },
  { key: 'entropy', quantity: 'thermo:entropy', title: 'Entropy per site', yLabel: 'S/N' },
  { key: 'freeEnergy', quantity: 'thermo:freeEnergy', title: 'Free energy per site', yLabel: 'F/N' },
] as const;

type ThermoKey = (typeof THERMO_QUANTITIES)[number]['key'];

/** Options of {@link buildFigures}. */
export interface BuildFiguresOptions {
  /** The cross-check report, or null when there is none. */
  check?: CheckReportBody | null;
  /** Shown instead of the overlay when `check` is null. @defaultValue "cross-check not available" */
  checkUnavailableNote?: string;
}

/** Every figure of `data`: one per series, then the thermodynamics (when any arrived). */
export function buildFigures(data: PlotData, options: BuildFiguresOptions = {}): Figure[] {
  const { check = null, checkUnavailableNote = CHECK_UNAVAILABLE } = options;
  const colours = temperatureColours(data.betas);
  const legend: LegendEntry[] = data.betas.map((beta, b) => ({ betaIndex: b, beta, name: formatBeta(beta), colour: colours[b] }));
  const figures: Figure[] = data.series.map((s) => seriesFigure(data, s, legend, check, checkUnavailableNote));
  if (data.thermo.length > 0) {
    for (const q of THERMO_QUANTITIES) figures.push(thermoFigure(data, q, legend, check, checkUnavailableNote));
  }
  return figures;
}

const finite = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

function yRange(values: Iterable<number>): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(hi >= lo)) return 0;
  // A flat line still has a scale: its own magnitude (or 1 at zero).
  return hi - lo || Math.max(Math.abs(hi), 1) * 0.1;
}

function seriesFigure(
  data: PlotData, s: PlotData['series'][number], legend: LegendEntry[], check: CheckReportBody | null, unavailable: string,
): Figure {
  const name = describeSeries(s.label);
  const range = yRange(s.values.flat());
  const lines: FigureLine[] = legend.map((l) => {
    const y = data.times.map((_, t) => s.values[l.betaIndex]?.[t] ?? NaN);
    const err = data.times.map((_, t) => s.errors[l.betaIndex]?.[t] ?? NaN);
    const maxErr = Math.max(0, ...err.filter(Number.isFinite));
    const band = range > 0 && maxErr > BAND_MIN_FRACTION * range;
    return {
      key: `b${l.betaIndex}`,
      name: l.name,
      colour: l.colour,
      betaIndex: l.betaIndex,
      y,
      lo: band ? y.map((v, t) => v - (err[t] || 0)) : null,
      hi: band ? y.map((v, t) => v + (err[t] || 0)) : null,
    };
  });
  const figure: Figure = {
    id: `series:${s.label}`,
    kind: 'series',
    title: `${name} after the quench`,
    xLabel: 'time t',
    yLabel: name,
    x: data.times.slice(),
    lines,
    legend,
    markers: [],
    check: null,
    checkNote: unavailable,
  };
  if (check) attachSeriesCheck(figure, s.label, data, check);
  return figure;
}

/**
 * The overlay of one series figure. The dashed line of a β is drawn where the series can judge
 * (verdict not `outside-window`) and broken elsewhere; the shaded trust window is the span of
 * those times over every β. Disagreements are marked wherever they occur.
 */
function attachSeriesCheck(figure: Figure, label: string, data: PlotData, check: CheckReportBody): void {
  const entries = check.entries.filter((e) => e.quantity === label && e.timeIndex !== null);
  const summary = countVerdicts(entries);
  const lines: FigureCheck['lines'] = [];
  const disagree: FigureCheck['disagree'] = [];
  let from = Infinity;
  let to = -Infinity;
  for (const l of figure.legend) {
    const own = entries.filter((e) => e.betaIndex === l.betaIndex).sort((a, b) => a.timeIndex! - b.timeIndex!);
    const x: number[] = [];
    const y: number[] = [];
    const lo: number[] = [];
    const hi: number[] = [];
    let inside = 0;
    for (const e of own) {
      const t = data.times[e.timeIndex!] ?? e.time ?? NaN;
      x.push(t);
      if (e.verdict === 'outside-window' || !finite(e.seriesValue)) {
        // A gap: the dashed line shows exactly where the series can judge.
        y.push(NaN);
        lo.push(NaN);
        hi.push(NaN);
        continue;
      }
      inside++;
      const err = finite(e.seriesError) ? e.seriesError : 0;
      y.push(e.seriesValue);
      lo.push(e.seriesValue - err);
      hi.push(e.seriesValue + err);
      from = Math.min(from, t);
      to = Math.max(to, t);
      if (e.verdict === 'disagree') {
        const engine = finite(e.engineValue) ? e.engineValue : figure.lines[l.betaIndex]?.y[e.timeIndex!] ?? NaN;
        disagree.push({ x: t, y: engine, betaIndex: l.betaIndex });
      }
    }
    if (inside === 0) continue;
    lines.push({ key: `check-b${l.betaIndex}`, betaIndex: l.betaIndex, colour: l.colour, x, y, lo, hi });
  }
  figure.check = { lines, window: from <= to ? { from, to } : null, disagree, summary };
  figure.checkNote = checkSummaryNote(summary, figure.check.window, 't');
}

function thermoFigure(
  data: PlotData, q: (typeof THERMO_QUANTITIES)[number], legend: LegendEntry[], check: CheckReportBody | null, unavailable: string,
): Figure {
  const byBeta = new Map(data.thermo.map((r) => [r.betaIndex, r]));
  const value = (r: ThermoRecord | undefined): number => {
    if (!r) return NaN;
    const v = r[q.key as ThermoKey];
    return v === null || v === undefined ? NaN : v / r.sites;
  };
  const error = (r: ThermoRecord | undefined): number => {
    if (!r) return NaN;
    const e = r.errors[q.key as ThermoKey];
    return e === null || e === undefined ? NaN : e / r.sites;
  };
  const y = data.betas.map((_, b) => value(byBeta.get(b)));
  const err = data.betas.map((_, b) => error(byBeta.get(b)));
  const range = yRange(y);
  const bars = range > 0 && Math.max(0, ...err.filter(Number.isFinite)) > BAND_MIN_FRACTION * range;
  const markers: FigureMarker[] = [];
  for (const l of legend) {
    const v = y[l.betaIndex];
    if (!Number.isFinite(v)) continue;
    const e = err[l.betaIndex];
    markers.push({
      betaIndex: l.betaIndex, x: l.beta, y: v, colour: l.colour,
      lo: bars && Number.isFinite(e) ? v - e : null, hi: bars && Number.isFinite(e) ? v + e : null,
    });
  }
  const figure: Figure = {
    id: `thermo:${q.key}`,
    kind: 'thermo',
    title: `${q.title} against β`,
    xLabel: 'inverse temperature β',
    yLabel: q.yLabel,
    x: data.betas.slice(),
    lines: [{ key: 'trend', name: q.yLabel, colour: TREND_COLOUR, betaIndex: null, y, lo: null, hi: null }],
    legend,
    markers,
    check: null,
    checkNote: unavailable,
  };
  if (check) {
    const entries = check.entries.filter((e) => e.quantity === q.quantity && e.timeIndex === null)
      .sort((a, b) => a.betaIndex - b.betaIndex);
    const sites = data.thermo[0]?.sites ?? 1;
    const x: number[] = [];
    const cy: number[] = [];
    const lo: number[] = [];
    const hi: number[] = [];
    const disagree: FigureCheck['disagree'] = [];
    let from = Infinity;
    let to = -Infinity;
    for (const e of entries) {
      const b = data.betas[e.betaIndex] ?? e.beta;
      x.push(b);
      if (e.verdict === 'outside-window' || !finite(e.seriesValue)) {
        cy.push(NaN);
        lo.push(NaN);
        hi.push(NaN);
        continue;
      }
      const err = finite(e.seriesError) ? e.seriesError : 0;
      cy.push(e.seriesValue / sites);
      lo.push((e.seriesValue - err) / sites);
      hi.push((e.seriesValue + err) / sites);
      from = Math.min(from, b);
      to = Math.max(to, b);
      if (e.verdict === 'disagree') disagree.push({ x: b, y: y[e.betaIndex], betaIndex: e.betaIndex });
    }
    const summary = countVerdicts(entries);
    const window = from <= to ? { from, to } : null;
    figure.check = {
      lines: window ? [{ key: 'check', betaIndex: null, colour: TREND_COLOUR, x, y: cy, lo, hi }] : [],
      window,
      disagree,
      summary,
    };
    figure.checkNote = checkSummaryNote(summary, figure.check.window, 'β');
  }
  return figure;
}

function countVerdicts(entries: CheckReportBody['entries']): FigureCheck['summary'] {
  const s = { agree: 0, disagree: 0, outsideWindow: 0 };
  for (const e of entries) {
    if (e.verdict === 'agree') s.agree++;
    else if (e.verdict === 'disagree') s.disagree++;
    else s.outsideWindow++;
  }
  return s;
}

function checkSummaryNote(s: FigureCheck['summary'], window: FigureCheck['window'], axis: string): string {
  const where = window ? `trusted for ${axis} in [${formatNumber(window.from)}, ${formatNumber(window.to)}]` : 'trusted nowhere on this grid';
  const total = s.agree + s.disagree + s.outsideWindow;
  if (total === 0) return 'series check: no comparisons for this figure';
  return `series check ${where}: ${s.agree} agree, ${s.disagree} disagree, ${s.outsideWindow} outside the window`;
}

/** The data of a finished result document, for {@link buildFigures}. */
export function plotDataFromResult(result: {
  spec: { label?: string }; betas: number[]; times: number[];
  series: Array<{ label: string; values: number[][]; errors: number[][] }>; thermo: ThermoRecord[];
}): PlotData {
  return {
    label: result.spec.label ?? '',
    betas: result.betas,
    times: result.times,
    series: result.series.map((s) => ({ label: s.label, values: s.values, errors: s.errors })),
    thermo: result.thermo,
  };
}
