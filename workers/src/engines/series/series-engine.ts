/**
 * SeriesEngine — the `series` engine (DESIGN.md §3): high-temperature and short-time series of
 * the spec's own lattice and Hamiltonians, computed once per branch
 * (series/compute-sweep-series.ts) and evaluated with truncation estimates at every β and t
 * (series/evaluate-sweep-series.ts). Same points, thermodynamics and diagnostics as the other
 * engines; every value carries its estimate. The plan refuses outside the series window
 * (plan-series-engine.ts).
 * Diagnostics: ⟨H1⟩ is conserved exactly by construction (ad_{H1} H1 = 0 term by term), so
 * h1Drift and normDrift are 0; propagatorErrorBound is the largest truncation estimate of the
 * branch; `extra` holds the orders, method, kind and work counters.
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { seriesLabels } from '../../observables/plan-series.js';
import { computeSweepSeries, type SweepSeries } from '../../series/compute-sweep-series.js';
import { localEnergyScale, seriesAt, thermoAt } from '../../series/evaluate-sweep-series.js';
import { buildLocalModel } from '../../series/local-terms.js';
import { expandSeriesObservables } from '../../series/series-observables.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { branchOrder } from '../branch-order.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { planSeriesEngine, type SeriesPlanOptions } from './plan-series-engine.js';

/** Options of the series engine. */
export interface SeriesEngineOptions extends SeriesPlanOptions {
  /** Force the thermo order (skips the plan's choice). */
  thermoOrder?: number;
  /** Force the quench order (skips the plan's choice). */
  quenchOrder?: number;
}

function abortError(signal: AbortSignal): Error {
  const reason = signal.reason;
  if (reason instanceof Error) return reason;
  const e = new Error('the series run was aborted');
  e.name = 'AbortError';
  return e;
}

/** The series engine (name 'series'). */
export class SeriesEngine implements Engine {
  readonly name = 'series';
  readonly version = '0.1.0';
  readonly #options: SeriesEngineOptions;

  constructor(options: SeriesEngineOptions = {}) {
    this.#options = options;
  }

  /** Orders, cost and accuracy, or a refusal (see plan-series-engine.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planSeriesEngine(spec, this.name, this.#options).plan;
  }

  /** Series labels in emission order (the observables layer's labels). */
  series(spec: SweepSpec): SeriesInfo[] {
    return seriesLabels(spec, buildLattice(spec.lattice));
  }

  /** Computes the series once, then emits every β of the branch (see file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const { signal, resumeFrom = {} } = options;
    const { betas, order } = branchOrder(spec, betaIndices);
    if (order.length === 0) return;
    if (signal?.aborted) throw abortError(signal);
    let thermoOrder = this.#options.thermoOrder;
    let quenchOrder = this.#options.quenchOrder;
    if (thermoOrder === undefined || quenchOrder === undefined) {
      const planned = planSeriesEngine(spec, this.name, this.#options);
      if (!planned.plan.feasible && planned.thermoOrder === 0) {
        throw new RangeError(`the series engine refuses this spec: ${planned.plan.refusal?.message ?? 'no plan'}`);
      }
      thermoOrder ??= planned.thermoOrder;
      quenchOrder ??= planned.quenchOrder;
    }
    const started = performance.now();
    let series: SweepSeries;
    try {
      series = computeSweepSeries(spec, { thermoOrder, quenchOrder, signal });
    } catch (e) {
      if (signal?.aborted) throw abortError(signal);
      throw e;
    }
    const graph = buildLattice(spec.lattice);
    const h0 = buildLocalModel(spec.h0, graph);
    const h1 = buildLocalModel(spec.h1, graph);
    const scale = localEnergyScale(h0, h1);
    const norms = expandSeriesObservables(spec, graph, h0, h1).combinations.map((c) =>
      Math.abs(c.constant) + c.linear.reduce((s, [, w]) => s + Math.abs(w), 0) + c.quadratic.reduce((s, [, , w]) => s + Math.abs(w), 0));
    const times = timeGrid(spec);
    for (const betaIndex of order) {
      if (signal?.aborted) throw abortError(signal);
      const beta = betas[betaIndex];
      const th = thermoAt(series, beta, scale);
      sink.thermo({
        betaIndex, beta,
        lnZ: th.lnZ.value, energy: th.energy.value, heatCapacity: th.heatCapacity.value,
        freeEnergy: th.freeEnergy?.value ?? null, entropy: th.entropy.value,
        errors: {
          lnZ: th.lnZ.error, energy: th.energy.error, heatCapacity: th.heatCapacity.error,
          freeEnergy: th.freeEnergy?.error ?? null, entropy: th.entropy.error,
        },
        sites: series.sites,
      });
      let worst = Math.max(th.lnZ.error, th.energy.error, th.heatCapacity.error, th.entropy.error);
      const skipBelow = resumeFrom[betaIndex] ?? 0;
      for (let ti = 0; ti < times.length; ti++) {
        if (signal?.aborted) throw abortError(signal);
        const est = seriesAt(series, beta, times[ti], scale, norms);
        for (const e of est) worst = Math.max(worst, e.error);
        if (ti < skipBelow) continue;
        sink.point({ betaIndex, timeIndex: ti, values: est.map((e) => e.value), errors: est.map((e) => e.error) });
        // Yield between points so an abort can land.
        if (ti % 64 === 63) await Promise.resolve();
      }
      sink.diagnostics({
        betaIndex,
        h1Drift: 0,
        normDrift: 0,
        stationarityResidual: null,
        propagatorErrorBound: worst,
        extra: {
          seriesKind: series.kind,
          seriesMethod: series.method,
          thermoOrder: series.thermoOrder,
          quenchOrder: series.quenchOrder,
          clusters: series.stats.clusters,
          clustersSolved: series.stats.solved,
          primitives: series.stats.primitives,
          distinctPrimitives: series.stats.distinctPrimitives,
          seriesSeconds: series.stats.seconds,
          branchSeconds: (performance.now() - started) / 1000,
        },
      });
    }
  }
}
