/**
 * FreeFermionEngine — thermal states and quenches of Hamiltonians quadratic under the
 * Jordan–Wigner map (transverse-field Ising and XY-type chains, open or periodic), exactly up to
 * rounding, for chains of thousands of sites (Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961);
 * Pfeuty, Ann. Phys. 57, 79 (1970)). DESIGN.md §3 engine `free-fermion`.
 *
 * The thermofield double needs no explicit doubling here: with M = e^{−βH0/2} and
 * M(t) = U M U†, ⟨O⟩ = Tr(M†OM)/Tr(M†M) = Tr(e^{−βH0} U†OU)/Z (DESIGN.md §2), i.e. the
 * Heisenberg-picture thermal average that Gaussian states give in closed form.
 *
 * Per branch (β indices, ascending):
 *   1. Majorana forms of H0, H1 (majorana-hamiltonian.ts), refusing anything not quadratic;
 *      Schur forms per fermion-parity sector and W = O1ᵀO0 (sector-modes.ts).
 *   2. Per β: ln Z, E, C, F, S from the mode energies (sector-thermo.ts); the Gaussian
 *      components (gaussian-components.ts).
 *   3. Per grid time: every measured Pauli string by Wick/Pfaffians (primitive-evaluator.ts),
 *      series by the observables layer's weights (free-fermion-layout.ts).
 * Errors are rounding ESTIMATES (error-model.ts), not bounds. Diagnostics: h1Drift is the
 * largest change of ⟨H1⟩(t); normDrift reports the orthogonality defect of O1 (the evolution
 * F(t) = O1E(t) is orthogonal exactly up to it); stationarityResidual (H1 = H0) is the largest
 * change of any measured string over the grid; propagatorErrorBound is the covariance-entry
 * error estimate at the last time.
 * Memory and work: plan-free-fermion.ts.
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { seriesLabels } from '../../observables/plan-series.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { branchOrder } from '../branch-order.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { pointEmitter } from '../point-emitter.js';
import { thermoRecord } from '../thermo-record.js';
import { entryError, thermoErrors } from './error-model.js';
import { evaluateLayout, freeFermionLayout } from './free-fermion-layout.js';
import { freeFermionModel, isModelRefusal } from './free-fermion-model.js';
import { gaussianComponents } from './gaussian-components.js';
import { planFreeFermion } from './plan-free-fermion.js';
import { PrimitiveEvaluator } from './primitive-evaluator.js';
import { primitiveForms } from './primitive-forms.js';
import { sectorModes } from './sector-modes.js';
import { sectorThermo } from './sector-thermo.js';

function abortError(signal: AbortSignal): Error {
  const reason: unknown = signal.reason;
  if (reason instanceof Error && reason.name === 'AbortError') return reason;
  const e = new Error('the branch was aborted');
  e.name = 'AbortError';
  return e;
}

/** Gives the event loop a turn (so an abort can arrive) between grid times. */
function yieldTurn(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}

/** The free-fermion engine (name 'free-fermion'). */
export class FreeFermionEngine implements Engine {
  readonly name = 'free-fermion';
  readonly version = '0.1.0';

  /** Cost, memory and accuracy, or a refusal (see plan-free-fermion.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planFreeFermion(spec, this.name);
  }

  /** Series labels in emission order (the observables layer's labels; they depend on the lattice only). */
  series(spec: SweepSpec): SeriesInfo[] {
    return seriesLabels(spec, buildLattice(spec.lattice));
  }

  /** Runs the branch's β indices in ascending β (see the file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const { signal, resumeFrom } = options;
    const { betas, order } = branchOrder(spec, betaIndices);
    if (order.length === 0) return;
    if (signal?.aborted) throw abortError(signal);
    const model = freeFermionModel(spec);
    if (isModelRefusal(model)) throw new RangeError(`free-fermion: ${model.message}`);
    const { sites, graph } = model;
    const n = 2 * sites;
    const layout = freeFermionLayout(spec, graph, model.h0Terms, model.h1Terms);
    const forms = primitiveForms(layout.primitives, sites, model.sectors);
    const times = timeGrid(spec);
    const started = performance.now();
    const sectors = sectorModes(model.h0, model.h1);
    const decompositionSeconds = (performance.now() - started) / 1000;
    const evaluator = new PrimitiveEvaluator(sectors, forms);
    const rMax = evaluator.maxOrder / 2;
    const health = {
      defect0: Math.max(...sectors.map((s) => s.h0.defect)),
      defect1: Math.max(...sectors.map((s) => s.h1.defect)),
      residual0: Math.max(...sectors.map((s) => s.h0.residual * Math.max(1, s.h0.norm))),
      residual1: Math.max(...sectors.map((s) => s.h1.residual * Math.max(1, s.h1.norm))),
      norm0: Math.max(...sectors.map((s) => s.h0.norm)),
    };
    const gap0 = Math.min(...sectors.flatMap((s) => Array.from(s.h0.schur.eps)));
    const h1EqualsH0 = sameTerms(model.h0Terms, model.h1Terms);
    const np = layout.primitives.length;
    const values = new Float64Array(np);
    const sysErrors = new Float64Array(np);
    const rndErrors = new Float64Array(np);
    const ns = layout.series.length;
    const outValues = new Float64Array(ns);
    const outErrors = new Float64Array(ns);
    const h1Value = new Float64Array(1);
    const h1Error = new Float64Array(1);

    for (const betaIndex of order) {
      if (signal?.aborted) throw abortError(signal);
      const beta = betas[betaIndex];
      const thermo = sectorThermo(sectors.map((s) => ({ eps: s.h0.schur.eps, det: s.h0.schur.det, constant: s.constant0 })), beta, sites);
      const te = thermoErrors(sites, health.residual0, health.norm0, beta);
      sink.thermo(thermoRecord({
        betaIndex, beta, sites, lnZ: thermo.lnZ, energy: thermo.energy, heatCapacity: thermo.heatCapacity,
        errors: { lnZ: te.lnZ, energy: te.energy, heatCapacity: te.heatCapacity },
      }));
      const set = gaussianComponents(sectors, thermo, beta, rMax);
      const emit = pointEmitter(sink, betaIndex, resumeFrom);
      let h1Start = 0;
      let h1Drift = 0;
      let stationarity = 0;
      let lastEntryError = 0;
      const first = new Float64Array(np);
      for (let k = 0; k < times.length; k++) {
        if (signal?.aborted) throw abortError(signal);
        await yieldTurn();
        if (signal?.aborted) throw abortError(signal);
        const t = times[k];
        const entry = entryError({ n, ...health, beta, t });
        lastEntryError = entry.systematic + entry.random;
        evaluator.evaluate(t, set, entry, values, sysErrors, rndErrors);
        evaluateLayout([layout.h1Energy], values, sysErrors, rndErrors, h1Value, h1Error);
        if (k === 0) {
          h1Start = h1Value[0];
          first.set(values);
        } else {
          h1Drift = Math.max(h1Drift, Math.abs(h1Value[0] - h1Start));
          if (h1EqualsH0) for (let p = 0; p < np; p++) stationarity = Math.max(stationarity, Math.abs(values[p] - first[p]));
        }
        evaluateLayout(layout.series, values, sysErrors, rndErrors, outValues, outErrors);
        emit(k, outValues, outErrors);
      }
      sink.diagnostics({
        betaIndex,
        h1Drift,
        normDrift: health.defect1,
        stationarityResidual: h1EqualsH0 ? stationarity : null,
        propagatorErrorBound: lastEntryError,
        extra: {
          sectors: sectors.length,
          chiral: sectors.every((sec) => sec.h0.chiral !== null && sec.h1.chiral !== null),
          components: set.components.length,
          twistedComponents: set.components.filter((c) => c.twisted).length,
          borderedModes: set.components.reduce((s, c) => s + c.borderTau.length, 0),
          majoranaRows: evaluator.rows.length,
          maxPfaffianOrder: evaluator.maxOrder,
          schurResidualH0: health.residual0,
          schurResidualH1: health.residual1,
          orthogonalityDefectH0: health.defect0,
          orthogonalityDefectH1: health.defect1,
          smallestModeEnergyH0: gap0,
          decompositionSeconds,
          errorsAre: 'rounding estimates',
        },
      });
    }
  }
}

function sameTerms(a: readonly { word: string; weight: number }[], b: readonly { word: string; weight: number }[]): boolean {
  if (a.length !== b.length) return false;
  const m = new Map(a.map((t) => [t.word, t.weight]));
  return b.every((t) => m.get(t.word) === t.weight);
}
