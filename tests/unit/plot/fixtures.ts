/** Invented data for the figure tests (not physics: shapes chosen to exercise the drawing). */
import type { ThermoRecord } from '../../../shared-types/src/result.js';
import type { CheckReportBody, PlotData } from '../../../services/plot/index.js';

export const BETAS = [0, 0.5, 2];
export const TIMES = [0, 0.5, 1, 1.5];

function thermo(b: number, beta: number): ThermoRecord {
  return {
    betaIndex: b, beta, lnZ: 4 - beta, energy: beta === 0 ? 0 : -4 * beta, heatCapacity: beta, freeEnergy: beta === 0 ? null : -(4 - beta) / beta,
    entropy: 4 - 2 * beta, errors: { lnZ: 1e-12, energy: 1e-12, heatCapacity: 1e-12, freeEnergy: beta === 0 ? null : 1e-12, entropy: 1e-12 }, sites: 4,
  };
}

/** Three β, four times; X:avg with negligible errors, ZZ:nearest with visible ones. */
export function plotData(): PlotData {
  const grid = (f: (b: number, t: number) => number) => BETAS.map((beta, b) => TIMES.map((t) => f(b, t)));
  return {
    label: 'fixture',
    betas: BETAS.slice(),
    times: TIMES.slice(),
    series: [
      { label: 'X:avg', values: grid((b, t) => 0.1 * (b + 1) + 0.05 * Math.cos(t)), errors: grid(() => 1e-12) },
      { label: 'ZZ:nearest~conn', values: grid((b, t) => 0.3 * b - 0.1 * t), errors: grid(() => 0.02) },
    ],
    thermo: BETAS.map((beta, b) => thermo(b, beta)),
  };
}

/**
 * A check report for {@link plotData}: X:avg is in the window at β index 0 (all times, one
 * disagreement at t index 1) and β index 1 (first two times); β index 2 is outside. Energy:
 * β indices 0 and 1 agree, 2 is outside.
 */
export function checkReport(): CheckReportBody {
  const data = plotData();
  const entries: CheckReportBody['entries'] = [];
  for (let b = 0; b < BETAS.length; b++) {
    for (let t = 0; t < TIMES.length; t++) {
      const inside = b === 0 || (b === 1 && t < 2);
      const verdict = !inside ? 'outside-window' : b === 0 && t === 1 ? 'disagree' : 'agree';
      const v = data.series[0].values[b][t];
      entries.push({
        betaIndex: b, beta: BETAS[b], timeIndex: t, time: TIMES[t], quantity: 'X:avg',
        seriesValue: inside ? v + (verdict === 'disagree' ? 0.01 : 0) : 123, seriesError: inside ? 1e-4 : null,
        engineValue: v, engineError: 1e-12, verdict,
      });
    }
    entries.push({
      betaIndex: b, beta: BETAS[b], timeIndex: null, time: null, quantity: 'thermo:energy',
      seriesValue: b === 0 ? 0 : -4 * BETAS[b], seriesError: b < 2 ? 1e-6 : null, engineValue: b === 0 ? 0 : -4 * BETAS[b], engineError: 1e-12,
      verdict: b < 2 ? 'agree' : 'outside-window',
    });
  }
  return { format: 'betasweep.check/1', entries, summary: { agree: 0, disagree: 1, outsideWindow: 0 }, flagged: true, series: { kind: 'finite', method: 'whole' } };
}
