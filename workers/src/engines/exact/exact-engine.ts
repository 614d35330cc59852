/**
 * ExactEngine — the doubled (thermofield-double) state as a full 4^N vector (DESIGN.md §2–3).
 *
 * Per branch (β indices, run in ascending β, carrying the state from β to β):
 *   1. ψ(0) = |I⟩ = 2^{−N/2}·Σ_s |s⟩|s̃⟩ (M = 2^{−N/2}·1).
 *   2. ψ(β) ∝ (e^{−βH0/2} ⊗ 1)|I⟩ by propagateImaginaryTime on H0 ⊗ 1 from the previous β;
 *      ln‖·‖ is accumulated, so ln Z = N ln 2 + 2 ln‖·‖ (thermoAtBeta).
 *   3. Stationarity residual ‖Kψ‖/‖ψ‖ when H1 = H0 term by term.
 *   4. The quench (runQuench) on the state; a copy of ψ(β) is kept when more β follow. At β = 0
 *      the state |I⟩ is exactly stationary (K|I⟩ ↔ H1 − H1 = 0) and is measured, not propagated.
 * Error bounds: error-budget.ts (split of spec.tolerance), propagators' headers (derivations).
 * Memory: 3 vectors of 16·4^N bytes (4 when the branch has several β).
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { applyDoubledAffine, norm2sq } from '../../kernels/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { expandObservables } from '../../observables/expand-observables.js';
import { seriesLabels } from '../../observables/plan-series.js';
import { buildHamiltonian } from '../../physics/build-hamiltonian.js';
import { propagateImaginaryTime } from '../../propagators/index.js';
import type { AffineApply } from '../../propagators/index.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { abortError } from '../abort-error.js';
import { branchOrder } from '../branch-order.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { pointEmitter } from '../point-emitter.js';
import { doubledOperators } from './doubled-operators.js';
import type { AuxiliaryMode } from './doubled-operators.js';
import { errorBudget, imaginaryTarget, quenchCalls, ROUNDING_PER_MATVEC } from './error-budget.js';
import { MAX_EXACT_SITES, planExact } from './plan-exact.js';
import { runQuench } from './run-quench.js';
import { thermoAtBeta } from './thermo-at-beta.js';

/** Options of the exact engine. */
export interface ExactEngineOptions {
  /**
   * Auxiliary half of the quench generator. 'plain' (−1 ⊗ H1 instead of −1 ⊗ H1ᵀ) is for tests
   * only: physical observables are unchanged, the stationarity check breaks when H1 has Y terms.
   * @defaultValue 'transpose'
   */
  auxiliary?: AuxiliaryMode;
}

/** The exact engine (name 'exact'). */
export class ExactEngine implements Engine {
  readonly name = 'exact';
  readonly version = '0.1.0';
  readonly #auxiliary: AuxiliaryMode;

  constructor(options: ExactEngineOptions = {}) {
    const { auxiliary = 'transpose' } = options;
    this.#auxiliary = auxiliary;
  }

  /** Cost, memory and accuracy, or a refusal (see plan-exact.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planExact(spec, this.name);
  }

  /** Series labels in emission order (the observables layer's labels). */
  series(spec: SweepSpec): SeriesInfo[] {
    return seriesLabels(spec, buildLattice(spec.lattice));
  }

  /** Runs the branch's β indices in ascending β (see file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const { signal, resumeFrom } = options;
    const { betas, order } = branchOrder(spec, betaIndices);
    if (order.length === 0) return;
    const graph = buildLattice(spec.lattice);
    if (graph.sites > MAX_EXACT_SITES) {
      throw new RangeError(`the exact engine is limited to ${MAX_EXACT_SITES} sites; this lattice has ${graph.sites}`);
    }
    const h0 = buildHamiltonian(spec.h0, graph);
    const h1 = buildHamiltonian(spec.h1, graph);
    const layout = expandObservables(spec, graph, h0, h1);
    const ops = doubledOperators(h0, h1, this.#auxiliary);
    const budget = errorBudget(layout, spec.tolerance, graph.sites);
    const times = timeGrid(spec);
    const stepTolerance = budget.real / quenchCalls(times);

    const dim = ops.dim;
    const length = 2 * dim * dim;
    const state = new Float64Array(length);
    const work: [Float64Array, Float64Array] = [new Float64Array(length), new Float64Array(length)];
    const thermal = order.length > 1 ? new Float64Array(length) : null;
    const amp = 2 ** (-graph.sites / 2);
    for (let r = 0; r < dim; r++) state[2 * (r + dim * r)] = amp;

    const applyH0: AffineApply = (i, o, al, be, ga) => applyDoubledAffine(ops.h0, null, i, o, al, be, ga);
    const applyK: AffineApply = (i, o, al, be, ga) => applyDoubledAffine(ops.h1, ops.aux, i, o, al, be, ga);
    const betaMax = betas[order[order.length - 1]];
    const thermalTarget = imaginaryTarget(budget, spec.tolerance, ops.h0.normBound, order.map((b) => betas[b]));
    let currentBeta = 0;
    let lnNorm = 0;
    let imagBound = 0;
    let imagMatvecs = 0;
    let imagOrderMax = 0;

    for (let k = 0; k < order.length; k++) {
      if (signal?.aborted) throw abortError(signal);
      const betaIndex = order[k];
      const beta = betas[betaIndex];
      const delta = (beta - currentBeta) / 2;
      if (delta > 0) {
        const tolerance = (thermalTarget / budget.kappa) * (delta / (betaMax / 2));
        const rep = propagateImaginaryTime(applyH0, ops.h0Interval, delta, state, work, { tolerance });
        lnNorm += rep.lnNormGrowth;
        imagBound += rep.errorBound;
        imagMatvecs += rep.matvecs;
        imagOrderMax = Math.max(imagOrderMax, rep.order);
        currentBeta = beta;
      }
      const x = budget.kappa * imagBound + ROUNDING_PER_MATVEC * imagMatvecs;
      const thermalError = x < 1 ? x / (1 - x) : Infinity;
      sink.thermo(thermoAtBeta({ ops, state, work: work[0], beta, betaIndex, lnNorm, stateError: thermalError }));

      let stationarityResidual: number | null = null;
      if (ops.h1EqualsH0) {
        applyK(state, work[0], 1, 0, 0);
        stationarityResidual = Math.sqrt(norm2sq(work[0]) / norm2sq(state));
      }
      const last = k === order.length - 1;
      if (thermal !== null && !last) thermal.set(state);
      const quench = await runQuench({
        ops, layout, times, state, work, stepTolerance, initialError: thermalError, signal,
        stationary: beta === 0 && this.#auxiliary === 'transpose',
        onPoint: pointEmitter(sink, betaIndex, resumeFrom),
      });
      sink.diagnostics({
        betaIndex,
        h1Drift: quench.h1Drift,
        normDrift: quench.normDrift,
        stationarityResidual,
        propagatorErrorBound: quench.errorBound,
        extra: {
          matvecs: imagMatvecs + quench.matvecs,
          quenchMatvecs: quench.matvecs,
          imaginaryMatvecs: imagMatvecs,
          chebyshevOrderMax: Math.max(quench.orderMax, imagOrderMax),
          thermalStateErrorBound: thermalError,
          maxImag: quench.maxImag,
          auxiliary: this.#auxiliary,
        },
      });
      if (thermal !== null && !last) state.set(thermal);
    }
  }
}
