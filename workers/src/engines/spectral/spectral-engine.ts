/**
 * SpectralEngine — exact finite-temperature quenches of small lattices from dense
 * eigendecompositions of H0 and H1 (name 'spectral'; DESIGN.md §2–3).
 *
 * One branch runs every β (the decompositions are shared):
 *   1. Blocks: a symmetry-adapted basis for the lattice translations and reflection H0 and H1
 *      share (momentum and parity sectors), split by conserved magnetisation; H0 over its own
 *      blocks, H1 over the blocks common to both (spectral-setup.ts, workers/src/symmetry);
 *      symmetry 'none' uses the whole 2^N space.
 *   2. H0 = ⊕ W·Λ0·Wᴴ and H1 = ⊕ V·Λ1·Vᴴ by hermitianEigen per block, with residuals and
 *      orthogonality → backward errors η0, η1 (decompose-blocks.ts). One decomposition when
 *      H1 = H0 term by term.
 *   3. Quench basis: X = WᴴV, Õ = VᴴOV per measured operator (a series' whole linear part, or
 *      one primitive, group-averaged: measurement-plan.ts), VᴴH1V, VᴴV (quench-basis.ts).
 *   4. Per β: ln Z, E, C, F, S from Λ0 (thermo-from-spectrum.ts); ρ̃ = Xᴴ diag(p) X
 *      (thermal-overlap.ts); then for all t: ⟨P⟩(t) = Σ_mn ρ̃_nm Õ_mn e^{i(E_m−E_n)t}
 *      normalised by the doubled-state norm (run-spectral-quench.ts). M(t) = U M U† with
 *      U = e^{−iH1t} is implied: the auxiliary generator −1 ⊗ H1ᵀ leaves physical observables
 *      unchanged, so no transpose is needed here.
 * Diagnostics per β: h1Drift and normDrift measured from VᴴH1V and VᴴV (not assumed 0);
 * stationarityResidual (H1 = H0 only) is the proxy ‖[H0, M]‖_F/‖M‖_F ≤ 2·√(Σ_k p_k r_k²) for
 * M = W diag(√p) Wᴴ, from HW = WΛ + R (the exact engine measures ‖Kψ‖/‖ψ‖ on its state; here
 * the representation is stationary by construction up to these residuals);
 * propagatorErrorBound = η1·t_max + 2δ1 (spectral-error.ts).
 * A sector kept for its mirror image too (multiplicity 2) counts twice in the spectrum and in
 * every trace. extra reports the symmetries used and dropped and the block sizes.
 * Limits: plan-spectral.ts (sites, memory budget). The decomposition itself is not
 * interruptible inside a block (the signal is checked between blocks and at every time point).
 */
import type { SeriesInfo, SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { seriesLabels } from '../../observables/plan-series.js';
import { blockSector, SYMMETRY_MODES } from '../../symmetry/index.js';
import type { SymmetryMode } from '../../symmetry/index.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { branchOrder } from '../branch-order.js';
import type { BranchOptions, BranchSink, Engine } from '../engine.js';
import { pointEmitter } from '../point-emitter.js';
import { decomposeBlocks } from './decompose-blocks.js';
import { MAX_SPECTRAL_SITES, planSpectral } from './plan-spectral.js';
import { buildQuenchBasis } from './quench-basis.js';
import type { QuenchBlock } from './quench-basis.js';
import { runSpectralQuench } from './run-spectral-quench.js';
import type { RhoPlanes } from './run-spectral-quench.js';
import { packedLength } from './packed-planes.js';
import { propagatorError } from './spectral-error.js';
import type { DecompositionFigures } from './spectral-error.js';
import { buildSpectralBasis, spectralSetup } from './spectral-setup.js';
import type { SpectralSetup } from './spectral-setup.js';
import { blockSizeSummary } from './block-size-summary.js';
import { thermalOverlap } from './thermal-overlap.js';
import { thermalOverlapReal } from './thermal-overlap-real.js';
import { thermoFromSpectrum } from './thermo-from-spectrum.js';
import { yieldIfDue } from './yield-if-due.js';

/** Options of the spectral engine. */
export interface SpectralEngineOptions {
  /**
   * Symmetries that may split the basis into blocks (each used only where H0 and H1 have it,
   * decided from their terms): 'all' (magnetisation, translations, one reflection),
   * 'translations' (no reflection), 'magnetisation' (conserved Σ_i Z_i only) or 'none' (the
   * whole space; for checks).
   * @defaultValue 'all'
   */
  symmetry?: SymmetryMode;
}

/** What a branch keeps after the decompositions (their eigenvectors are released). */
interface Prepared {
  /** H0's eigenvalues, blocks of multiplicity 2 repeated at the end. */
  readonly energies0: Float64Array;
  readonly residuals0: Float64Array;
  readonly fig0: DecompositionFigures;
  readonly fig1: DecompositionFigures;
  readonly blocks: QuenchBlock[];
  readonly largestBlock: number;
  readonly maxAbsEnergy1: number;
  readonly extra: Record<string, number | string | boolean>;
}

/** The spectral engine (name 'spectral'). */
export class SpectralEngine implements Engine {
  readonly name = 'spectral';
  readonly version = '0.2.0';
  readonly #symmetry: SymmetryMode;

  constructor(options: SpectralEngineOptions = {}) {
    const { symmetry = 'all' } = options;
    if (!SYMMETRY_MODES.includes(symmetry)) {
      throw new RangeError(`options.symmetry must be one of ${SYMMETRY_MODES.join(', ')}; got ${String(symmetry)}`);
    }
    this.#symmetry = symmetry;
  }

  /** Cost, memory and accuracy, or a refusal (see plan-spectral.ts). */
  plan(spec: SweepSpec): SweepPlan {
    return planSpectral(spec, this.#symmetry, this.name);
  }

  /** Series labels in emission order (the observables layer's labels). */
  series(spec: SweepSpec): SeriesInfo[] {
    return seriesLabels(spec, buildLattice(spec.lattice));
  }

  /** Runs the branch's β indices in ascending β (see the file header). */
  async runBranch(spec: SweepSpec, betaIndices: number[], sink: BranchSink, options: BranchOptions = {}): Promise<void> {
    const { signal, resumeFrom } = options;
    const { betas, order } = branchOrder(spec, betaIndices);
    if (order.length === 0) return;
    const graph = buildLattice(spec.lattice);
    if (graph.sites > MAX_SPECTRAL_SITES) {
      throw new RangeError(`the spectral engine is limited to ${MAX_SPECTRAL_SITES} sites; this lattice has ${graph.sites}`);
    }
    await yieldIfDue(signal);
    const setup = spectralSetup(spec, this.#symmetry, graph);
    const times = timeGrid(spec);
    const prep = await prepare(setup, signal);
    const { blocks, energies0, residuals0, fig0, fig1 } = prep;
    const weights = new Float64Array(energies0.length);
    const rho: RhoPlanes[] = blocks.map((b) => ({
      re: new Float64Array(packedLength(b.size)), im: b.real ? null : new Float64Array(packedLength(b.size)),
    }));
    const scratch = new Float64Array(2 * prep.largestBlock * prep.largestBlock);
    const packed = new Float64Array(prep.largestBlock * (prep.largestBlock + 1));
    const tMax = times[times.length - 1];

    for (const betaIndex of order) {
      await yieldIfDue(signal);
      const beta = betas[betaIndex];
      sink.thermo(thermoFromSpectrum({
        energies: energies0, beta, betaIndex, sites: setup.sites, backwardError: fig0.backwardError, weights,
      }));
      blocks.forEach((b, J) => {
        (b.real ? thermalOverlapReal : thermalOverlap)(b.size, b.mixing, b.rowIndex, weights, scratch, packed);
        const { re, im } = rho[J];
        for (let k = 0; k < re.length; k++) re[k] = packed[2 * k];
        if (im !== null) for (let k = 0; k < im.length; k++) im[k] = packed[2 * k + 1];
      });
      let stationarityResidual: number | null = null;
      if (setup.same) {
        let s = 0;
        for (let k = 0; k < weights.length; k++) s += weights[k] * residuals0[k] ** 2;
        stationarityResidual = 2 * Math.sqrt(s);
      }
      const report = await runSpectralQuench({
        blocks, rho, plan: setup.measure, times, beta, h0: fig0, h1: fig1,
        largestBlock: prep.largestBlock, maxAbsEnergy1: prep.maxAbsEnergy1, signal,
        onPoint: pointEmitter(sink, betaIndex, resumeFrom),
      });
      sink.diagnostics({
        betaIndex,
        h1Drift: report.h1Drift,
        normDrift: report.normDrift,
        stationarityResidual,
        propagatorErrorBound: propagatorError(tMax, fig1),
        extra: { ...prep.extra, h1AtZero: report.h1AtZero },
      });
    }
  }
}

/** Decomposes H0 and H1 and builds the quench basis; the eigenvectors are dropped on return. */
async function prepare(setup: SpectralSetup, signal: AbortSignal | undefined): Promise<Prepared> {
  const t0 = performance.now();
  const { basis, partition0, joint } = buildSpectralBasis(setup);
  const tBasis = performance.now();
  const dec0 = await decomposeBlocks(setup.h0.terms, basis, partition0, { signal, keepGram: setup.same });
  const dec1 = setup.same ? dec0 : await decomposeBlocks(setup.h1.terms, basis, joint, { signal, keepGram: true });
  const t1 = performance.now();
  // Every block once, then the blocks of multiplicity 2 again (their mirror-image sectors).
  const mult = dec0.blocks.map((_, b) => blockSector(basis, partition0, b).multiplicity);
  let total = 0;
  dec0.blocks.forEach((b, k) => { total += mult[k] * b.values.length; });
  const energies0 = new Float64Array(total);
  const residuals0 = new Float64Array(total);
  const offsets = new Int32Array(dec0.blocks.length);
  let at = 0;
  for (let copy = 1; copy <= 2; copy++) {
    dec0.blocks.forEach((b, k) => {
      if (mult[k] < copy) return;
      if (copy === 1) offsets[k] = at;
      energies0.set(b.values, at);
      residuals0.set(b.residuals, at);
      at += b.values.length;
    });
  }
  let maxAbsEnergy1 = 0;
  for (const b of dec1.blocks) for (const e of b.values) maxAbsEnergy1 = Math.max(maxAbsEnergy1, Math.abs(e));
  const blocks = await buildQuenchBasis({
    h0: dec0, h0Offsets: offsets, h1: dec1, basis, h1Terms: setup.h1.terms, operators: setup.measure.operators, signal,
  });
  const t2 = performance.now();
  const sym = setup.symmetry;
  return {
    energies0,
    residuals0,
    fig0: { backwardError: dec0.backwardError, orthogonality: dec0.orthogonality },
    fig1: { backwardError: dec1.backwardError, orthogonality: dec1.orthogonality },
    blocks,
    largestBlock: Math.max(dec0.largestBlock, dec1.largestBlock),
    maxAbsEnergy1,
    extra: {
      symmetry: sym.label,
      symmetryDropped: sym.rejected.join('; '),
      sectors: sym.sectors.length,
      groupOrder: sym.group.elements.length,
      basisVectors: basis.count,
      h0Blocks: dec0.blocks.length,
      jointBlocks: blocks.length,
      mirroredBlocks: blocks.filter((b) => b.multiplicity > 1).length,
      largestBlock: Math.max(dec0.largestBlock, dec1.largestBlock),
      jointBlockSizes: blockSizeSummary(blocks.map((b) => b.size)),
      realBlocks: dec0.realBlocks + (setup.same ? 0 : dec1.realBlocks),
      realQuenchBlocks: blocks.filter((b) => b.real).length,
      h0BackwardError: dec0.backwardError,
      h1BackwardError: dec1.backwardError,
      h0Orthogonality: dec0.orthogonality,
      h1Orthogonality: dec1.orthogonality,
      h0MaxResidual: dec0.maxResidual,
      h1MaxResidual: dec1.maxResidual,
      sharedDecomposition: setup.same,
      measuredOperators: setup.measure.operators.length,
      measurementMode: setup.measure.mode,
      basisSeconds: (tBasis - t0) / 1000,
      decomposeSeconds: (t1 - tBasis) / 1000,
      quenchBasisSeconds: (t2 - t1) / 1000,
    },
  };
}
