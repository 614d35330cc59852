/**
 * planSeriesEngine — orders, cost and expected accuracy of the series engine for a spec, or a
 * refusal.
 *
 * Orders: the highest thermo order n ≤ options.maxThermoOrder and quench order K ≤
 * options.maxQuenchOrder whose estimated cost (series/estimate-series-cost.ts) fits half the
 * time budget each; at least MIN_THERMO_ORDER / MIN_QUENCH_ORDER or the plan refuses ('seconds').
 * Accuracy (a priori, before any coefficient is known): the geometric tail of a series with
 * radius PLAN_RADIUS_FACTOR/Λ in β and in t (Λ: largest local energy scale),
 *   ε ≈ 2·s·q^{K+1}/(1 − q),  q = (β_max + t_max)·Λ/PLAN_RADIUS_FACTOR,
 * with s = max(1, Λ) as the size of an observable. q ≥ 1, or ε above spec.tolerance, refuses
 * ('tolerance'): outside its window the engine does not run. The run itself reports the
 * estimates read from the actual coefficients with every value.
 * Branches: one branch with every β (the series are computed once and evaluated at each β).
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { estimateSeriesCost, type SeriesCostEstimate } from '../../series/estimate-series-cost.js';
import { localEnergyScale } from '../../series/evaluate-sweep-series.js';
import { buildLocalModel } from '../../series/local-terms.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';

/** Options of the series engine's plan (and run). */
export interface SeriesPlanOptions {
  /** Time budget of the series computation, seconds. @defaultValue 30 */
  budgetSeconds?: number;
  /** Highest thermo order tried. @defaultValue 12 */
  maxThermoOrder?: number;
  /** Highest quench (total) order tried. @defaultValue 8 */
  maxQuenchOrder?: number;
}

/** The plan together with the chosen orders. */
export interface SeriesEnginePlan {
  readonly plan: SweepPlan;
  readonly thermoOrder: number;
  readonly quenchOrder: number;
  readonly cost: SeriesCostEstimate | null;
}

/**
 * A-priori radius of the series in β and in t, in units of 1/Λ. The natural scale of a
 * high-temperature expansion; measured radii are larger (transverse-field Ising chain at
 * J = 2h: ≈ 3/Λ from the free-fermion singularity; square-lattice Ising ≈ 2/Λ near β_c).
 */
export const PLAN_RADIUS_FACTOR = 1;

export const MIN_THERMO_ORDER = 2;
export const MIN_QUENCH_ORDER = 1;

const REASON = 'high-temperature and short-time series by Pauli-string algebra (linked clusters on large lattices), resummed with Padé approximants';

/** Plans the series engine for a spec (see file header). Never throws on a valid spec. */
export function planSeriesEngine(spec: SweepSpec, name: string, options: SeriesPlanOptions = {}): SeriesEnginePlan {
  const { budgetSeconds = 30, maxThermoOrder = 12, maxQuenchOrder = 8 } = options;
  const betas = betaGrid(spec);
  const base: SweepPlan = {
    engine: name, reason: REASON, feasible: true, refusal: null, memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: [betas.map((_, b) => b)], sites: 0,
  };
  const refuse = (plan: SweepPlan, field: string, limit: number, estimate: number, message: string): SeriesEnginePlan => ({
    plan: { ...plan, feasible: false, refusal: { field, limit, estimate, message } },
    thermoOrder: 0, quenchOrder: 0, cost: null,
  });
  let scale: number;
  try {
    const graph = buildLattice(spec.lattice);
    base.sites = graph.sites;
    scale = localEnergyScale(buildLocalModel(spec.h0, graph), buildLocalModel(spec.h1, graph));
  } catch (e) {
    return refuse(base, 'spec', 0, 0, `the spec cannot be set up: ${(e as Error).message}`);
  }
  const times = timeGrid(spec);
  const tMax = times[times.length - 1];
  const bMax = betas[betas.length - 1];

  const fits = (n: number, K: number): SeriesCostEstimate | null => {
    try {
      const c = estimateSeriesCost(spec, n, K);
      return Number.isFinite(c.seconds) ? c : null;
    } catch {
      return null;
    }
  };
  let quenchOrder = maxQuenchOrder;
  let cost: SeriesCostEstimate | null = null;
  for (; quenchOrder >= MIN_QUENCH_ORDER; quenchOrder--) {
    cost = fits(MIN_THERMO_ORDER, quenchOrder);
    if (cost !== null && cost.seconds <= budgetSeconds / 2) break;
  }
  if (quenchOrder < MIN_QUENCH_ORDER) {
    return refuse(base, 'seconds', budgetSeconds, cost?.seconds ?? Infinity,
      `even order ${MIN_QUENCH_ORDER} of the quench series would exceed the series engine's budget of ${budgetSeconds} s`);
  }
  let thermoOrder = maxThermoOrder;
  for (; thermoOrder >= MIN_THERMO_ORDER; thermoOrder--) {
    cost = fits(thermoOrder, quenchOrder);
    if (cost !== null && cost.seconds <= budgetSeconds) break;
  }
  if (thermoOrder < MIN_THERMO_ORDER || cost === null) {
    return refuse(base, 'seconds', budgetSeconds, cost?.seconds ?? Infinity,
      `even order ${MIN_THERMO_ORDER} of the thermal series would exceed the series engine's budget of ${budgetSeconds} s`);
  }
  const planned: SweepPlan = {
    ...base,
    reason: `${REASON}; ${cost.method}, ln Z to β^${thermoOrder}, observables to total order ${quenchOrder} in (t, β)`,
    memoryBytes: cost.memoryBytes,
    seconds: cost.seconds,
    flops: cost.seconds * 1e9,
  };
  const q = ((bMax + tMax) * scale) / PLAN_RADIUS_FACTOR;
  const size = Math.max(1, scale);
  const accuracy = q >= 1 ? Infinity : (2 * size * q ** (quenchOrder + 1)) / (1 - q);
  if (!(accuracy <= spec.tolerance)) {
    return {
      ...refuse(planned, 'tolerance', spec.tolerance, accuracy,
        q >= 1
          ? `β_max + t_max = ${bMax + tMax} is outside the series window (estimated radius ${PLAN_RADIUS_FACTOR / scale} for local energy scale ${scale})`
          : `the series' estimated truncation error ${accuracy.toExponential(2)} at β_max = ${bMax}, t_max = ${tMax} exceeds the tolerance ${spec.tolerance}`),
      thermoOrder, quenchOrder, cost,
    };
  }
  return { plan: { ...planned, accuracy: Math.max(accuracy, spec.tolerance * 1e-3) }, thermoOrder, quenchOrder, cost };
}
