/**
 * TypicalEngine — the thermofield double with its auxiliary trace sampled by random-phase
 * vectors (canonical typicality: Sugiura & Shimizu, PRL 108, 240401 (2012); PRL 111, 010401
 * (2013)); DESIGN.md §2–3. Same pipeline as the exact engine, on 2^N instead of 4^N amplitudes.
 *
 * Why this is the doubled-state pipeline. The exact engine holds M(β) = e^{−βH0/2}·2^{−N/2}
 * (rows physical, columns auxiliary), evolves M(t) = U M U† (U = e^{−iH1t}, the generator
 * H1 ⊗ 1 − 1 ⊗ H1ᵀ) and reports Tr(M†OM)/Tr(M†M). Both traces run over the auxiliary index:
 * Tr(M(t)†OM(t)) = Tr(U M† U†OU M U†) = Tr(M† U†OU M) — the auxiliary half of the generator
 * only rotates the auxiliary basis, which a trace does not see (DESIGN.md: physical observables
 * do not depend on it). A trace over 2^N auxiliary states is estimated without bias by random
 * phases: Tr A = 2^N·E_r⟨r|A|r⟩. With A = M†U†OUM, ⟨r|A|r⟩ = ⟨ψ_r(t)|O|ψ_r(t)⟩ for the
 * physical vector ψ_r(t) = U e^{−βH0/2}|r⟩: the column of the doubled state along the auxiliary
 * direction r, evolved by H1 alone. So each sample is one 2^N vector, and
 *   Z = 2^N·E_r‖ψ_r(β)‖²,   ⟨O(t)⟩ = Σ_r⟨ψ_r(t)|O|ψ_r(t)⟩ / Σ_r⟨ψ_r(β)|ψ_r(β)⟩
 * (ratio estimator; its jackknife gives the error bar — estimate-typical.ts).
 *
 * A branch (β indices) runs in rounds: a pilot of PILOT_SAMPLES samples, then as many more as
 * the measured jackknife error says are needed for spec.tolerance (sample-count.ts), up to the
 * cap (plan-typical.ts); the cap may leave the error above the tolerance at low temperature,
 * and the diagnostics then say so (extra.met = false, extra.samples, extra.errorTarget).
 * Every sample walks the branch's β list in ascending β. Records are emitted once all rounds
 * are done: thermodynamics, then the points, then the diagnostics, per β.
 * Fan-out: runTypicalSamples / mergeTypicalSamples / estimateTypicalBeta do the same in pieces;
 * the service replays these rounds with sample blocks as queue jobs (sampling(), sampleRunner();
 * workers/src/queue/typical/), with the same decisions and the same final numbers.
 * Determinism: sample k uses the random phases of (spec.seed, k); the counts chosen depend
 * only on the (deterministic) measurements, so a branch's output is a function of the spec.
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { seriesLabels } from '../../observables/plan-series.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { estimateTypicalBeta } from './estimate-typical.js';
import type { TypicalBetaEstimate } from './estimate-typical.js';
import { mergeTypicalSamples } from './merge-typical-samples.js';
import { planTypical, typicalPlanDetails } from './plan-typical.js';
import { TypicalSampleRunner } from './run-typical-samples.js';
import { nextSampleCount, PILOT_SAMPLES } from './sample-count.js';
import { TRUNCATION_SHARE } from './typical-budget.js';

/** Options of the typical engine. */
export interface TypicalEngineOptions {
  /**
   * Most samples per β, below the plan's cap (tests and benchmarks use it to bound the work).
   * @defaultValue the plan's cap (MAX_TYPICAL_SAMPLES or what memory allows)
   */
  maxSamples?: number;
  /** Samples of the first round. @defaultValue PILOT_SAMPLES */
  pilotSamples?: number;
}

/** The fixed parts of the sample schedule: rounds start with `pilot` samples and never exceed `cap`. */
export interface TypicalSampling {
  readonly pilot: number;
  readonly cap: number;
}

/** The typical engine (name 'typical'). */
export class TypicalEngine implements Engine {
  readonly name = 'typical';
  readonly version = '0.1.0';
  readonly #maxSamples: number;
  readonly #pilot: number;

  constructor(options: TypicalEngineOptions = {}) {
    const { maxSamples = Infinity, pilotSamples = PILOT_SAMPLES } = options;
    if (!(maxSamples >= 2)) throw new RangeError(`maxSamples must be ≥ 2; got ${maxSamples}`);
    if (!Number.isInteger(pilotSamples) || pilotSamples < 2) throw new RangeError(`pilotSamples must be an integer ≥ 2; got ${pilotSamples}`);
    this.#maxSamples = maxSamples;
    this.#pilot = pilotSamples;
  }

  /** Samples, memory, cost and expected accuracy, or a refusal (plan-typical.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planTypical(spec, this.name);
  }

  /** Series labels in emission order (the observables layer's labels). */
  series(spec: SweepSpec): SeriesInfo[] {
    return seriesLabels(spec, buildLattice(spec.lattice));
  }

  /**
   * The sample schedule's fixed parts for a spec: the pilot round's size and the cap (the
   * service replays the same rounds from stored samples, queue/typical/sample-rounds.ts).
   * @throws RangeError when the cap leaves no room for a jackknife.
   */
  sampling(spec: SweepSpec): TypicalSampling {
    const cap = Math.floor(Math.min(this.#maxSamples, typicalPlanDetails(spec).cap));
    if (cap < 2) throw new RangeError(`the sample cap ${cap} leaves no room for a jackknife (memory budget)`);
    return { pilot: Math.min(this.#pilot, cap), cap };
  }

  /** A runner of sample ranges through the branch's β indices (the service's unit of fan-out). */
  sampleRunner(spec: SweepSpec, betaIndices: readonly number[]): Pick<TypicalSampleRunner, 'run' | 'order'> {
    return new TypicalSampleRunner(spec, betaIndices);
  }

  /** Runs the branch's β indices in rounds of samples (see file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const { signal, resumeFrom = {} } = options;
    const runner = new TypicalSampleRunner(spec, betaIndices);
    const order = runner.order;
    if (order.length === 0) return;
    const { pilot, cap } = this.sampling(spec);
    const errorTarget = spec.tolerance;
    const statTarget = (1 - TRUNCATION_SHARE) * errorTarget;

    let samples = await runner.run({ start: 0, count: pilot }, { signal });
    let count = pilot;
    let rounds = 1;
    let estimates: TypicalBetaEstimate[];
    for (;;) {
      estimates = order.map((b) => estimateTypicalBeta(runner.setup, samples, b, { errorTarget }));
      const worst = Math.max(...estimates.map((e) => e.statErrorMax));
      const next = nextSampleCount(count, worst, statTarget, cap);
      if (next <= count) break;
      const more = await runner.run({ start: count, count: next - count }, { signal });
      samples = mergeTypicalSamples([samples, more]);
      count = next;
      rounds += 1;
    }
    const extra = { sampleCap: cap, pilotSamples: pilot, rounds, tables: runner.setup.tables };
    for (const est of estimates) {
      const b = est.thermo.betaIndex;
      sink.thermo(est.thermo);
      const skipBelow = resumeFrom[b] ?? 0;
      for (const p of est.points) if (p.timeIndex >= skipBelow) sink.point(p);
      sink.diagnostics({ ...est.diagnostics, extra: { ...est.diagnostics.extra, ...extra } });
    }
  }
}
