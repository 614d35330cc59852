/**
 * estimateTypicalBeta — the reported numbers at one β from a set of samples: thermodynamics,
 * every series at every grid time, and the diagnostics, each value with its error.
 *
 * Estimators (pooled ratios over the R samples r with weights w_r = ⟨r|e^{−βH0}|r⟩; the common
 * factor e^{max lnWeight} is divided out, it cancels in every ratio and is restored in ln Z):
 *   ln Z   = N ln 2 + ln((1/R) Σ_r w_r)                     (Tr A = 2^N·E⟨r|A|r⟩)
 *   E      = Σ_r w_r e_r / Σ_r w_r
 *   C      = β²·[Σ w v / Σ w + Σ w (e − E)² / Σ w]          (= β²(⟨H0²⟩ − E²), no cancellation)
 *   F      = −ln Z/β,  S = ln Z + βE
 *   ⟨P⟩(t) = Σ_r w_r p_r(t) / Σ_r w_r  and each series c + Σ w⟨P⟩ + Σ w⟨A⟩⟨B⟩ of these.
 * (Sugiura & Shimizu, PRL 108, 240401 (2012); PRL 111, 010401 (2013): thermal averages as
 * ratios of random-vector matrix elements.) Every output is a function of the pooled means, so
 * it is jackknifed as a whole (jackknife-ratio.ts): the reported value is the bias-corrected
 * jackknife estimate, and the reported error is
 *   error = σ_J (jackknife standard error, ONE standard deviation) + truncation bound,
 * the truncation bound from the samples' largest state-error estimate δ (at that time): 2δ per
 * primitive through evaluateSeries for the series, thermoTruncation for thermodynamics.
 *
 * Diagnostics: per-sample ⟨H1⟩ drift and norm drift (maxima over samples), no stationarity
 * residual (null: with H1 = H0 a single sample is not stationary; only the trace is), the
 * largest state-error estimate, and in `extra`: samples, errorTarget, met, statErrorMax,
 * effectiveSamples = (Σw)²/Σw² (how many samples effectively carry the weight), matvecs.
 */
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../../shared-types/src/index.js';
import { evaluateSeries } from '../../observables/expand-observables.js';
import { jackknifeRatio } from './jackknife-ratio.js';
import { thermoTruncation } from './typical-budget.js';
import type { TypicalLayout } from './typical-layout.js';
import type { TypicalSampleRecord, TypicalSamples } from './typical-samples.js';

/** Reported in place of an infinite error (JSON has no Infinity). */
const NO_INFORMATION = Number.MAX_VALUE;

/** What one β's estimate reports. */
export interface TypicalBetaEstimate {
  readonly thermo: ThermoRecord;
  /** One point per grid time, ascending time index. */
  readonly points: SweepPoint[];
  readonly diagnostics: DiagnosticsRecord;
  /** Number of samples used. */
  readonly samples: number;
  /** Largest jackknife σ over all series and times (statistical part only). */
  readonly statErrorMax: number;
  /** Largest reported series error (σ + truncation) over all series and times. */
  readonly errorMax: number;
}

/** Options of {@link estimateTypicalBeta}. */
export interface EstimateOptions {
  /** The error asked of every series value (spec.tolerance); sets `met` in the diagnostics. */
  readonly errorTarget: number;
  /** Extra diagnostics merged into `extra` (e.g. the sample cap, rounds). @defaultValue {} */
  readonly extra?: Record<string, number | string | boolean | null>;
}

/** The records of one β, sorted by sample. */
export function recordsAt(samples: TypicalSamples, betaIndex: number): TypicalSampleRecord[] {
  return samples.records.filter((r) => r.betaIndex === betaIndex).sort((a, b) => a.sample - b.sample);
}

const finite = (x: number) => (Number.isFinite(x) ? x : NO_INFORMATION);

/**
 * Estimates at β index `betaIndex` from the samples recorded there (see file header).
 * @throws RangeError when fewer than 2 samples are recorded at that β or the samples do not fit the layout.
 */
export function estimateTypicalBeta(
  layout: TypicalLayout, samples: TypicalSamples, betaIndex: number, options: EstimateOptions,
): TypicalBetaEstimate {
  const { errorTarget, extra = {} } = options;
  const recs = recordsAt(samples, betaIndex);
  const R = recs.length;
  if (R < 2) throw new RangeError(`at least 2 samples are needed at β index ${betaIndex} for a jackknife; have ${R}`);
  const np = layout.layout.primitives.length;
  const nt = layout.times.length;
  if (samples.primitives !== np || samples.times !== nt) {
    throw new RangeError(`the samples hold ${samples.primitives} primitives × ${samples.times} times; the layout needs ${np} × ${nt}`);
  }
  const beta = layout.betas[betaIndex];
  const N = layout.sites;

  let lnShift = -Infinity;
  for (const r of recs) lnShift = Math.max(lnShift, r.lnWeight);
  const w = Float64Array.from(recs, (r) => Math.exp(r.lnWeight - lnShift));
  let sw = 0, sw2 = 0;
  for (const x of w) { sw += x; sw2 += x * x; }
  let delta = 0;
  let thermalDelta = 0;
  for (const r of recs) {
    for (const d of r.stateErrors) delta = Math.max(delta, d);
    thermalDelta = Math.max(thermalDelta, r.thermalError);
  }

  // Thermodynamics: x_r = [e_r − Ē, (e_r − Ē)², v_r] about the plain pooled energy Ē.
  let eRef = 0;
  recs.forEach((r, k) => { eRef += w[k] * r.energy; });
  eRef /= sw;
  const tv = new Float64Array(3 * R);
  recs.forEach((r, k) => {
    const d = r.energy - eRef;
    tv[3 * k] = d;
    tv[3 * k + 1] = d * d;
    tv[3 * k + 2] = r.energyVariance;
  });
  const base = N * Math.LN2 + lnShift;
  const jt = jackknifeRatio(w, tv, 3, R, (m, wMean, out) => {
    const lnZ = base + Math.log(wMean);
    const energy = eRef + m[0];
    const variance = Math.max(0, m[2] + m[1] - m[0] * m[0]);
    out[0] = lnZ;
    out[1] = energy;
    out[2] = beta * beta * variance;
    out[3] = beta === 0 ? 0 : -lnZ / beta;
    out[4] = lnZ + beta * energy;
  }, 5);
  const tt = thermoTruncation(thermalDelta, beta, layout.h0NormBound);
  const thermo: ThermoRecord = {
    betaIndex,
    beta,
    lnZ: jt.estimate[0],
    energy: jt.estimate[1],
    heatCapacity: jt.estimate[2],
    freeEnergy: beta === 0 ? null : jt.estimate[3],
    entropy: jt.estimate[4],
    errors: {
      lnZ: finite(jt.stdError[0] + tt.lnZ),
      energy: finite(jt.stdError[1] + tt.energy),
      heatCapacity: finite(jt.stdError[2] + tt.heatCapacity),
      freeEnergy: beta === 0 ? null : finite(jt.stdError[3] + (tt.freeEnergy ?? 0)),
      entropy: finite(jt.stdError[4] + tt.entropy),
    },
    sites: N,
  };

  // Series at every time.
  const ns = layout.layout.series.length;
  const values = new Float64Array(R * np);
  const zeros = new Float64Array(np);
  const scratch = new Float64Array(ns);
  const primErrors = new Float64Array(np);
  const truncation = new Float64Array(ns);
  const points: SweepPoint[] = [];
  let statErrorMax = 0;
  let errorMax = 0;
  for (let t = 0; t < nt; t++) {
    let deltaT = 0;
    for (const r of recs) deltaT = Math.max(deltaT, r.stateErrors[t]);
    primErrors.fill(Math.min(2 * deltaT, 2));
    recs.forEach((r, k) => values.set(r.primitives.subarray(t * np, (t + 1) * np), k * np));
    const js = jackknifeRatio(w, values, np, R, (m, _w, out) => evaluateSeries(layout.layout, m, zeros, out, scratch), ns);
    const plainPrims = new Float64Array(np);
    for (let p = 0; p < np; p++) {
      let s = 0;
      for (let k = 0; k < R; k++) s += w[k] * values[k * np + p];
      plainPrims[p] = s / sw;
    }
    evaluateSeries(layout.layout, plainPrims, primErrors, scratch, truncation);
    const errs: number[] = [];
    for (let k = 0; k < ns; k++) {
      const e = finite(js.stdError[k] + truncation[k]);
      statErrorMax = Math.max(statErrorMax, js.stdError[k]);
      errorMax = Math.max(errorMax, e);
      errs.push(e);
    }
    points.push({ betaIndex, timeIndex: t, values: Array.from(js.estimate), errors: errs, samples: R });
  }

  let h1Drift = 0, normDrift = 0, matvecs = 0;
  for (const r of recs) {
    h1Drift = Math.max(h1Drift, r.h1Drift);
    normDrift = Math.max(normDrift, r.normDrift);
    matvecs += r.matvecs;
  }
  const diagnostics: DiagnosticsRecord = {
    betaIndex,
    h1Drift,
    normDrift,
    stationarityResidual: null,
    propagatorErrorBound: delta,
    extra: {
      samples: R,
      errorTarget,
      met: errorMax <= errorTarget,
      statErrorMax: finite(statErrorMax),
      errorMeaning: 'jackknife standard error (1 sigma) + propagator truncation estimate',
      effectiveSamples: (sw * sw) / sw2,
      thermalStateErrorEstimate: thermalDelta,
      matvecs,
      ...extra,
    },
  };
  return { thermo, points, diagnostics, samples: R, statErrorMax: finite(statErrorMax), errorMax };
}
