/**
 * Values with truncation estimates from a {@link SweepSeries}: thermodynamics at β and every
 * reported series at (β, t).
 *
 * Thermodynamics from the ln Z coefficients c_k (ln Z = Σ c_k β^k):
 *   E = −∂_β ln Z = Σ_k −(k+1) c_{k+1} β^k,   C = β² ∂²_β ln Z = Σ_k k(k−1) c_k β^k,
 *   S = ln Z + βE = Σ_k (1 − k) c_k β^k,       F = −ln Z/β (error = error(ln Z)/β),
 * each resummed as its own series (resum-series.ts).
 * Observables: the double series Σ_{k+m≤K} c_{k,m} t^k β^m is read as a series in a scale
 * factor λ (t → λt, β → λβ) with coefficients d_j = Σ_{k+m=j} c_{k,m} t^k β^m and evaluated at
 * λ = 1, so its truncation estimate covers the total order K.
 * A label that vanishes by symmetry (symmetry-zeros.ts) is reported as exactly 0.
 * When a series has too few non-zero coefficients to read its radius, the radius in β or t is
 * taken as FALLBACK_RADIUS_FACTOR / Λ, with Λ the largest local energy scale
 * (max over sites of Σ |w| of the terms touching the site, over H0 and H1).
 * Cost: O(K² + n²) per value plus small Padé solves.
 */
import type { SweepSeries } from './compute-sweep-series.js';
import type { LocalModel } from './local-terms.js';
import { resumSeries, type SeriesEstimate } from './resum-series.js';

/** Radius assumed in units of 1/Λ when coefficients cannot give one. */
export const FALLBACK_RADIUS_FACTOR = 0.25;

/** Thermodynamics at one β with error estimates (totals, as in ThermoRecord). */
export interface ThermoEstimate {
  readonly beta: number;
  readonly lnZ: SeriesEstimate;
  readonly energy: SeriesEstimate;
  readonly heatCapacity: SeriesEstimate;
  readonly entropy: SeriesEstimate;
  /** null at β = 0. */
  readonly freeEnergy: { value: number; error: number } | null;
}

/** Largest Σ|w| of the terms touching one site, over both models (Λ in the file header). */
export function localEnergyScale(...models: LocalModel[]): number {
  let best = 0;
  for (const m of models) {
    const acc = new Float64Array(m.sites);
    for (const t of m.terms) for (const s of t.sites) acc[s] += Math.abs(t.weight);
    for (let s = 0; s < m.sites; s++) best = Math.max(best, acc[s]);
  }
  return best;
}

/** Thermodynamics at β (see file header); `scale` = Λ for the fallback radius. */
export function thermoAt(series: SweepSeries, beta: number, scale: number): ThermoEstimate {
  const c = series.lnZ;
  const n = c.length - 1;
  const rc = series.lnZRounding;
  const fallbackRadius = scale > 0 ? FALLBACK_RADIUS_FACTOR / scale : Infinity;
  const opts = (rounding: Float64Array) => ({ rounding, fallbackRadius, fallbackScale: series.sites * scale });
  const e = new Float64Array(Math.max(1, n));
  const er = new Float64Array(Math.max(1, n));
  for (let k = 0; k < n; k++) { e[k] = -(k + 1) * c[k + 1]; er[k] = (k + 1) * rc[k + 1]; }
  const cap = new Float64Array(n + 1);
  const capr = new Float64Array(n + 1);
  const ent = new Float64Array(n + 1);
  const entr = new Float64Array(n + 1);
  for (let k = 0; k <= n; k++) {
    cap[k] = k * (k - 1) * c[k];
    capr[k] = k * (k - 1) * rc[k];
    ent[k] = (1 - k) * c[k];
    entr[k] = Math.abs(1 - k) * rc[k];
  }
  const lnZ = resumSeries(c, beta, opts(rc));
  return {
    beta,
    lnZ,
    energy: resumSeries(e, beta, opts(er)),
    heatCapacity: resumSeries(cap, beta, opts(capr)),
    entropy: resumSeries(ent, beta, opts(entr)),
    freeEnergy: beta > 0 ? { value: -lnZ.value / beta, error: lnZ.error / beta } : null,
  };
}

/** The λ-series coefficients d_j of a flat double series at (t, β), and their rounding. */
export function scaledCoefficients(
  flat: Float64Array, rounding: Float64Array | null, order: number, t: number, beta: number,
): { d: Float64Array; r: Float64Array } {
  const K = order;
  const d = new Float64Array(K + 1);
  const r = new Float64Array(K + 1);
  for (let k = 0; k <= K; k++) {
    for (let m = 0; m <= K - k; m++) {
      const w = t ** k * beta ** m;
      d[k + m] += flat[k * (K + 1) + m] * w;
      if (rounding) r[k + m] += rounding[k * (K + 1) + m] * w;
    }
  }
  return { d, r };
}

/**
 * Every label's value at (β, t) with its error estimate, in series order.
 * `norms[i]` bounds |value| of label i (Σ|w| of its combination; the fallback scale).
 */
export function seriesAt(series: SweepSeries, beta: number, t: number, scale: number, norms?: ArrayLike<number>): SeriesEstimate[] {
  const x = Math.max(beta, t);
  const fallbackRadius = x > 0 && scale > 0 ? FALLBACK_RADIUS_FACTOR / (scale * x) : Infinity;
  return series.series.map((s, i) => {
    if (s.exactZero === 'all' || (s.exactZero === 'static' && t === 0)) {
      return { value: 0, error: 0, method: 'partial-sum', radius: Infinity, inWindow: true };
    }
    const { d, r } = scaledCoefficients(s.coefficients, s.rounding, series.quenchOrder, t, beta);
    return resumSeries(d, 1, { rounding: r, fallbackRadius, fallbackScale: norms ? norms[i] : 1 });
  });
}
