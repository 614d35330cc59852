/**
 * MpsEngine — the doubled (thermofield-double) state as a purified MPS (DESIGN.md §2–3;
 * Verstraete, García-Ripoll & Cirac, PRL 93, 207204 (2004); Feiguin & White, PRB 72, 220401
 * (2005)), evolved by TEBD (Vidal, PRL 91, 147902 (2003)).
 *
 * Per branch (β indices, ascending, the thermal state carried from β to β):
 *   1. ψ(0) = |I⟩, bond dimension 1 (purified-mps.ts).
 *   2. Imaginary time to β: ⌈β/(2dt)⌉ Trotter steps of e^{−τH0} ⊗ 1, normalising after every
 *      update and keeping ln‖·‖ (ln Z); a copy is evolved with dt/2 for the Trotter estimate
 *      of the thermodynamics and of the initial values (step doubling).
 *   3. Checkpoint (options.checkpoint), thermodynamics (mps-thermo.ts), the stationarity
 *      residual ‖Kψ‖ when H1 = H0 (mpoSquareNorm with K = H1 ⊗ 1 − 1 ⊗ H1ᵀ).
 *   4. The quench under K = H1 ⊗ 1 − 1 ⊗ H1ᵀ (run-mps-quench.ts) on a copy when more β
 *      follow. The back-evolution of the auxiliary spins keeps the entanglement of the doubled
 *      state low (Karrasch, Bardarson & Moore, PRL 108, 227206 (2012)).
 * Settings (bond cap, truncation, order, dt): spec.mps, the rest derived (mps-settings.ts).
 * Reach: chains with nearest-neighbour terms in site order (plan-mps.ts).
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { seriesLabels } from '../../observables/plan-series.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { abortError } from './abort-error.js';
import { createGateWorkspace } from './apply-gate.js';
import type { AuxiliaryMode } from './bond-gates.js';
import { emptyStats, type EvolutionStats, type EvolveWorkspace } from './evolve-stages.js';
import { localMpo, type LegCopy } from './local-mpo.js';
import { createMoveWorkspace } from './move-center.js';
import { mpoSquareNorm } from './mpo-square-norm.js';
import { decodeCheckpoint, encodeCheckpoint } from './mps-checkpoint.js';
import { MpsMeasurement } from './mps-measurement.js';
import { isRefusal, mpsSetup } from './mps-setup.js';
import { mpsThermo } from './mps-thermo.js';
import { planMps } from './plan-mps.js';
import { cloneMps, identityPurification, type PurifiedMps } from './purified-mps.js';
import { runMpsQuench } from './run-mps-quench.js';
import { runChunked, stepsFor, TrotterPropagator } from './trotter-propagator.js';

/** Options of the mps engine. */
export interface MpsEngineOptions {
  /**
   * Auxiliary half of the quench generator: 'transpose' (−1 ⊗ H1ᵀ, DESIGN.md §2), 'plain'
   * (−1 ⊗ H1, wrong for H1 ≠ H1ᵀ), 'none' (H1 ⊗ 1 alone, no back-evolution) or 'echo'
   * (−1 ⊗ H0ᵀ: bond-gates.ts). Physical observables are the same in every mode; entanglement
   * (the bond dimension needed) and the stationarity check are not. 'plain' and 'none' are for
   * tests; 'echo' is an option under study (tests/unit/mps/mps-back-evolution.test.ts).
   * @defaultValue 'transpose'
   */
  auxiliary?: AuxiliaryMode;
}

/** A checkpoint of a branch: the β index it belongs to and the encoded state. */
export interface MpsCheckpoint {
  readonly betaIndex: number;
  /** mps-checkpoint.ts format. */
  readonly data: Float64Array;
}

/** Branch options of the mps engine. */
export interface MpsBranchOptions extends BranchOptions {
  /** Receives a checkpoint after the imaginary time has reached each β (before its quench). */
  checkpoint?: (c: MpsCheckpoint) => void;
  /** Resume from a checkpoint: βs below it are skipped, its β starts from the stored state. */
  resume?: MpsCheckpoint;
}

/** The mps engine (name 'mps'). */
export class MpsEngine implements Engine {
  readonly name = 'mps';
  readonly version = '0.1.0';
  readonly #auxiliary: AuxiliaryMode;

  constructor(options: MpsEngineOptions = {}) {
    const { auxiliary = 'transpose' } = options;
    this.#auxiliary = auxiliary;
  }

  /** Cost, memory and accuracy, or a refusal (plan-mps.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planMps(spec, this.name);
  }

  /** Series labels in emission order (the observables layer's labels; any lattice size). */
  series(spec: SweepSpec): SeriesInfo[] {
    const setup = mpsSetup(spec);
    if (isRefusal(setup)) throw new RangeError(`mps: ${setup.message}`);
    return seriesLabels(spec, setup.graph);
  }

  /** Runs the branch's β indices in ascending β (see the file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: MpsBranchOptions = {}): Promise<void> {
    const { signal, resumeFrom = {}, checkpoint, resume } = options;
    const setup = mpsSetup(spec);
    if (isRefusal(setup)) throw new RangeError(`mps: ${setup.message} (field ${setup.field})`);
    const { betas, settings, graph } = setup;
    for (const b of betaIndices) {
      if (!Number.isInteger(b) || b < 0 || b >= betas.length) {
        throw new RangeError(`betaIndices: ${b} is not an index of the β grid (0..${betas.length - 1})`);
      }
    }
    let order = [...new Set(betaIndices)].sort((p, q) => betas[p] - betas[q]);
    if (order.length === 0) return;
    const L = graph.sites;
    const truncation = { maxBond: settings.maxBond, maxWeight: settings.truncation };
    const imag = new TrotterPropagator(setup.m0, { kind: 'imaginary' }, settings.order, truncation);
    const real = new TrotterPropagator(setup.m1, { kind: 'real', auxiliary: this.#auxiliary }, settings.order, truncation, setup.m0);
    const move = createMoveWorkspace();
    const ws: EvolveWorkspace = { gate: createGateWorkspace(), move };
    const measurement = new MpsMeasurement(setup.strings, L, move);
    // The generator actually used: H1 ⊗ 1 plus the auxiliary part of the mode ('none': none).
    const kCopies: LegCopy[] = [{ leg: 'physical', sign: 1, transposed: false }];
    if (this.#auxiliary !== 'none') kCopies.push({ leg: 'auxiliary', sign: -1, transposed: this.#auxiliary !== 'plain' });
    const kMpo = setup.h1EqualsH0 ? localMpo(setup.h1Terms, L, kCopies) : null;

    let state: PurifiedMps = identityPurification(L);
    let half: PurifiedMps = identityPurification(L);
    let stats: EvolutionStats = emptyStats();
    let halfStats: EvolutionStats = emptyStats();
    let currentBeta = 0;
    if (resume !== undefined) {
      const c = decodeCheckpoint(resume.data);
      if (!order.includes(c.betaIndex) || c.betaIndex !== resume.betaIndex) {
        throw new RangeError(`resume: the checkpoint's β index ${c.betaIndex} is not one of this branch's (${order.join(', ')})`);
      }
      if (c.state.sites !== L) throw new RangeError(`resume: the checkpoint has ${c.state.sites} sites, the lattice ${L}`);
      order = order.filter((b) => betas[b] >= betas[c.betaIndex]);
      ({ state, half, stats, halfStats } = c);
      currentBeta = c.beta;
    }
    const values = new Float64Array(setup.strings.length);
    const halfValues = new Float64Array(setup.strings.length);
    const factor = 1 / (1 - 2 ** -settings.order);

    for (let k = 0; k < order.length; k++) {
      await new Promise<void>((resolve) => setImmediate(resolve));
      if (signal?.aborted) throw abortError(signal);
      const betaIndex = order[k];
      const beta = betas[betaIndex];
      const span = (beta - currentBeta) / 2;
      const n = stepsFor(span, settings.dt);
      if (n > 0) {
        await runChunked(imag, state, n, span / n, ws, stats, signal, abortError);
        await runChunked(imag, half, 2 * n, span / (2 * n), ws, halfStats, signal, abortError);
        currentBeta = beta;
      }
      checkpoint?.({ betaIndex, data: encodeCheckpoint({ betaIndex, beta, state, stats, half, halfStats }) });
      const maxImagThermal = measurement.measure(state, values);
      measurement.measure(half, halfValues);
      let thermalTrotter = 0;
      for (let p = 0; p < setup.layout.primitives.length; p++) {
        thermalTrotter = Math.max(thermalTrotter, factor * Math.abs(values[p] - halfValues[p]));
      }
      sink.thermo(mpsThermo(setup, beta, betaIndex, { state, values, lnNorm: stats.lnNorm },
        { state: half, values: halfValues, lnNorm: halfStats.lnNorm }, settings.order, stats.discardedSum));
      const stationarityResidual = kMpo === null ? null : Math.sqrt(Math.max(0, mpoSquareNorm(state, kMpo)));

      const last = k === order.length - 1;
      const quenchState = last ? state : cloneMps(state);
      const skipBelow = resumeFrom[betaIndex] ?? 0;
      const q = await runMpsQuench({
        setup, prop: real, measurement, ws, state: quenchState, dt: settings.dt,
        thermalDiscarded: stats.discardedSum, thermalGates: stats.gates, thermalTrotter, signal,
        onPoint(timeIndex, v, e) {
          if (timeIndex < skipBelow) return;
          sink.point({ betaIndex, timeIndex, values: Array.from(v), errors: Array.from(e) });
        },
      });
      sink.diagnostics({
        betaIndex,
        h1Drift: q.h1Drift,
        normDrift: q.normDrift,
        stationarityResidual,
        propagatorErrorBound: stats.discardedRootSum + q.stats.discardedRootSum + q.trotterEstimate,
        extra: {
          maxBond: Math.max(stats.maxBond, q.stats.maxBond),
          maxDiscardedWeight: Math.max(stats.maxDiscarded, q.stats.maxDiscarded),
          discardedWeightSum: stats.discardedSum + q.stats.discardedSum,
          truncationErrorBound: stats.discardedRootSum + q.stats.discardedRootSum,
          trotterErrorEstimate: q.trotterEstimate,
          trotterThermalEstimate: thermalTrotter,
          trotterRatePerTime: q.trotterRate,
          trotterOrder: settings.order,
          dt: settings.dt,
          bondCap: settings.maxBond,
          truncationPerUpdate: settings.truncation,
          imaginaryUpdates: stats.gates,
          realUpdates: q.stats.gates,
          maxImag: Math.max(q.maxImag, maxImagThermal),
          auxiliary: this.#auxiliary,
          settingsDerived: settings.derived.join(','),
          bondByTime: q.bondByTime.join(','),
          discardedByTime: q.discardedByTime.map((x) => x.toExponential(2)).join(','),
        },
      });
    }
  }
}
