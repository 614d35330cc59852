/**
 * runMpsQuench — the real-time part of one β: evolves the thermal purified MPS under
 * K = H1 ⊗ 1 − 1 ⊗ H1ᵀ over an ascending time grid and measures every string at each grid time.
 *
 * Steps: each grid interval Δ is covered by n = ⌈Δ/dt⌉ Trotter steps of Δ/n.
 * Trotter estimate by step doubling on the first interval (Richardson; e.g. Hairer, Nørsett &
 * Wanner, Solving ODEs I, §II.4): after c = min(n, CHECK_STEPS) steps of τ, a copy of the
 * initial state is evolved by 2c steps of τ/2 and D = max_P |⟨P⟩_τ − ⟨P⟩_{τ/2}|; the error of
 * the τ run there is D/(1 − 2^{−p}), and it is extrapolated linearly in time:
 * ε_Trotter(t) = ε_thermal + t·D/((1 − 2^{−p})·c·τ) (an estimate, not a bound).
 * Truncation estimate: 2·√(Σ relative discarded weights) since β = 0 (imaginary + real time),
 * treating the truncation errors as orthogonal; the rigorous bound Σ√w is in the diagnostics.
 * Error of every primitive = truncation + Trotter + ROUNDING_PER_GATE·(updates + L) (rounding of
 * the updates and of the contraction), capped at 2.
 * The abort signal is checked, and the event loop given a turn, before every grid time and
 * every CHUNK_STEPS Trotter steps.
 * Resuming (mps-checkpoint.ts): `afterPoint` receives, after each grid time but the last, a
 * snapshot of the running values ({@link QuenchProgress}); given back as `resume` with the
 * state as it was then, the loop continues at the next grid time exactly as the uninterrupted
 * run would (same steps, same gauge: the state is not measured again before it evolves).
 */
import { evaluateSeries } from '../../observables/evaluate-series.js';
import type { ObservableLayout } from '../../observables/observable-layout.js';
import { abortError } from './abort-error.js';
import { emptyStats, type EvolutionStats, type EvolveWorkspace } from './evolve-stages.js';
import { sumOf, type MpsMeasurement } from './mps-measurement.js';
import type { MpsSetup } from './mps-setup.js';
import { cloneMps, maxBond, type PurifiedMps } from './purified-mps.js';
import { runChunked, stepsFor, type TrotterPropagator } from './trotter-propagator.js';

/** Steps of the first interval used for the step-doubling Trotter estimate. */
export const CHECK_STEPS = 4;
/** Rounding allowance per two-site update (relative). */
export const ROUNDING_PER_GATE = 1e-15;

/** Inputs of {@link runMpsQuench}. */
export interface MpsQuenchInput {
  readonly setup: MpsSetup;
  readonly prop: TrotterPropagator;
  readonly measurement: MpsMeasurement;
  readonly ws: EvolveWorkspace;
  /** The thermal state (normalised); evolved in place. */
  readonly state: PurifiedMps;
  readonly dt: number;
  /** Σ relative discarded weight and updates of the imaginary-time evolution. */
  readonly thermalDiscarded: number;
  readonly thermalGates: number;
  /** Trotter estimate of the thermal state's primitives. */
  readonly thermalTrotter: number;
  readonly signal?: AbortSignal;
  /** Continue from a snapshot; `state` is the quench state saved with it. */
  readonly resume?: QuenchProgress;
  /** Series values and errors at each grid time (buffers reused: copy them). */
  onPoint(timeIndex: number, values: Float64Array, errors: Float64Array): void;
  /** Awaited after each grid time but the last (e.g. to save a checkpoint); `snapshot()` copies the running values. */
  afterPoint?(timeIndex: number, snapshot: () => QuenchProgress): Promise<void>;
}

/** The running values of a quench after the points 0..nextTimeIndex−1 (see the file header). */
export interface QuenchProgress {
  readonly nextTimeIndex: number;
  /** Totals of the real-time updates so far. */
  readonly stats: EvolutionStats;
  /** ⟨H1⟩ at t = 0 and the largest drift from it so far. */
  readonly h1At0: number;
  readonly h1Drift: number;
  /** Trotter error growth per unit time (null until the first interval is done). */
  readonly rate: number | null;
  readonly trotter: number;
  readonly maxImag: number;
  readonly bondByTime: readonly number[];
  readonly discardedByTime: readonly number[];
}

/** What the quench did. */
export interface MpsQuenchReport {
  readonly stats: EvolutionStats;
  readonly h1Drift: number;
  /** |1 − ‖ψ‖| of the unrenormalised state (weight lost to truncation). */
  readonly normDrift: number;
  /** Trotter error growth per unit time (step doubling). */
  readonly trotterRate: number;
  /** Trotter estimate at the last grid time. */
  readonly trotterEstimate: number;
  readonly maxImag: number;
  /** Largest bond dimension at each grid time. */
  readonly bondByTime: number[];
  /** Σ discarded weight (imaginary + real) at each grid time. */
  readonly discardedByTime: number[];
}

/** Runs the quench (see the file header). Rejects with an AbortError when the signal fires. */
export async function runMpsQuench(input: MpsQuenchInput): Promise<MpsQuenchReport> {
  const { setup, prop, measurement, ws, state, dt, signal } = input;
  const { layout, times } = setup;
  const ns = layout.series.length;
  const np = layout.primitives.length;
  const values = new Float64Array(measurement.count);
  const check = new Float64Array(measurement.count);
  const primErrors = new Float64Array(np);
  const seriesValues = new Float64Array(ns);
  const seriesErrors = new Float64Array(ns);
  // evaluateSeries reads only the primitive count and the series of its layout argument.
  const seriesLayout: ObservableLayout = { primitives: layout.primitives.map(() => ({ x: 0, z: 0 })), series: layout.series };
  const factor = 1 / (1 - 2 ** -prop.order);
  const r = input.resume;
  if (r !== undefined && !(r.nextTimeIndex >= 1 && r.nextTimeIndex < times.length)) {
    throw new RangeError(`runMpsQuench: resume at time index ${r.nextTimeIndex} is not inside the grid (1..${times.length - 1})`);
  }
  const stats = r ? { ...r.stats } : emptyStats();
  // A resumed state was measured before it was saved: measuring again would move its centre.
  let maxImag = r ? r.maxImag : measurement.measure(state, values);
  const h1At0 = r ? r.h1At0 : sumOf(setup.energy1, values);
  let h1Drift = r ? r.h1Drift : 0;
  let rate: number | null = r ? r.rate : null;
  let trotter = r ? r.trotter : input.thermalTrotter;
  const bondByTime: number[] = r ? [...r.bondByTime] : [];
  const discardedByTime: number[] = r ? [...r.discardedByTime] : [];
  const start = r ? r.nextTimeIndex : 0;
  let prev = start > 0 ? times[start - 1] : 0;
  for (let ti = start; ti < times.length; ti++) {
    await new Promise<void>((resolve) => setImmediate(resolve));
    if (signal?.aborted) throw abortError(signal);
    const span = times[ti] - prev;
    const n = stepsFor(span, dt);
    if (n > 0) {
      const tau = span / n;
      if (rate === null) {
        const c = Math.min(n, CHECK_STEPS);
        const copy = cloneMps(state);
        prop.run(state, c, tau, ws, stats);
        measurement.measure(state, values);
        prop.run(copy, 2 * c, tau / 2, ws, emptyStats());
        measurement.measure(copy, check);
        let d = 0;
        for (let k = 0; k < values.length; k++) d = Math.max(d, Math.abs(values[k] - check[k]));
        rate = (d * factor) / (c * tau);
        await runChunked(prop, state, n - c, tau, ws, stats, signal, abortError);
      } else {
        await runChunked(prop, state, n, tau, ws, stats, signal, abortError);
      }
      maxImag = Math.max(maxImag, measurement.measure(state, values));
    } else if (ti > 0 || prev !== 0) {
      maxImag = Math.max(maxImag, measurement.measure(state, values));
    }
    prev = times[ti];
    h1Drift = Math.max(h1Drift, Math.abs(sumOf(setup.energy1, values) - h1At0));
    trotter = input.thermalTrotter + (rate ?? 0) * times[ti];
    const truncation = 2 * Math.sqrt(input.thermalDiscarded + stats.discardedSum);
    const err = Math.min(2, truncation + trotter + ROUNDING_PER_GATE * (input.thermalGates + stats.gates + setup.graph.sites));
    primErrors.fill(err);
    evaluateSeries(seriesLayout, values, primErrors, seriesValues, seriesErrors);
    bondByTime.push(maxBond(state));
    discardedByTime.push(input.thermalDiscarded + stats.discardedSum);
    input.onPoint(ti, seriesValues, seriesErrors);
    if (input.afterPoint !== undefined && ti < times.length - 1) {
      await input.afterPoint(ti, () => ({
        nextTimeIndex: ti + 1, stats: { ...stats }, h1At0, h1Drift, rate, trotter, maxImag,
        bondByTime: [...bondByTime], discardedByTime: [...discardedByTime],
      }));
    }
  }
  return {
    stats, h1Drift, normDrift: -Math.expm1(-0.5 * stats.discardedSum), trotterRate: rate ?? 0,
    trotterEstimate: trotter, maxImag, bondByTime, discardedByTime,
  };
}
