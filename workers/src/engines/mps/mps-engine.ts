/**
 * MpsEngine — the doubled (thermofield-double) state as a purified MPS (DESIGN.md §2–3;
 * Verstraete, García-Ripoll & Cirac, PRL 93, 207204 (2004); Feiguin & White, PRB 72, 220401
 * (2005)), evolved by TEBD (Vidal, PRL 91, 147902 (2003)).
 *
 * Per branch (β indices, ascending, the thermal state carried from β to β; run-mps-branch.ts):
 *   1. ψ(0) = |I⟩, bond dimension 1 (purified-mps.ts).
 *   2. Imaginary time to β: ⌈β/(2dt)⌉ Trotter steps of e^{−τH0} ⊗ 1, normalising after every
 *      update and keeping ln‖·‖ (ln Z); a copy is evolved with dt/2 for the Trotter estimate
 *      of the thermodynamics and of the initial values (step doubling).
 *   3. A checkpoint through `options.checkpoints` (mps-checkpoint.ts), thermodynamics
 *      (mps-thermo.ts), the stationarity residual ‖Kψ‖ when H1 = H0 (mpoSquareNorm with
 *      K = H1 ⊗ 1 − 1 ⊗ H1ᵀ).
 *   4. The quench under K = H1 ⊗ 1 − 1 ⊗ H1ᵀ (run-mps-quench.ts) on a copy when more β
 *      follow, with periodic checkpoints. The back-evolution of the auxiliary spins keeps the
 *      entanglement of the doubled state low (Karrasch, Bardarson & Moore, PRL 108, 227206 (2012)).
 * A retried branch resumes from its checkpoint (mps-resume.ts).
 * Settings (bond cap, truncation, order, dt): spec.mps, the rest derived (mps-settings.ts).
 * Reach: chains and ladders ordered as a chain, with one- and two-site terms; bonds longer
 * than one chain step are applied through swap gates (plan-mps.ts, chain-order.ts).
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { seriesLabels } from '../../observables/plan-series.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import type { AuxiliaryMode } from './bond-gates.js';
import { isRefusal, mpsSetup } from './mps-setup.js';
import { planMps } from './plan-mps.js';
import { runMpsBranch } from './run-mps-branch.js';

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

/** The mps engine (name 'mps'). */
export class MpsEngine implements Engine {
  readonly name = 'mps';
  readonly version = '0.2.0';
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

  /** Runs the branch's β indices in ascending β (see the file header and run-mps-branch.ts). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const setup = mpsSetup(spec);
    if (isRefusal(setup)) throw new RangeError(`mps: ${setup.message} (field ${setup.field})`);
    const { betas } = setup;
    for (const b of betaIndices) {
      if (!Number.isInteger(b) || b < 0 || b >= betas.length) {
        throw new RangeError(`betaIndices: ${b} is not an index of the β grid (0..${betas.length - 1})`);
      }
    }
    const order = [...new Set(betaIndices)].sort((p, q) => betas[p] - betas[q]);
    if (order.length === 0) return;
    await runMpsBranch({ setup, auxiliary: this.#auxiliary, order, sink, options });
  }
}
