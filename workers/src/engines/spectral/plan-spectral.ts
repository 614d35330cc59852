/**
 * planSpectral — cost, memory and accuracy of the spectral engine for a spec, or a refusal.
 *
 * Work (flops), with d the block sizes (H0 over its blocks b, H1 over the joint blocks J),
 * K_J the measured operators (measurement-plan.ts) with a non-zero block J, G the flip groups
 * of H, B betas, T times; complex blocks | real blocks (H0 and H1 without imaginary entries):
 *   decompositions  Σ (16·d³ | 6·d³) + (4·d³ | d³) (orthogonality) + 8·d²·(G + 1) (residuals)
 *                   per block, H0 and H1
 *   quench basis    Σ_J (8·d_J³ | 2·d_J³) (mixing) + (4·d_J³ | d_J³)·(K_J + 1)
 *   per β           Σ_J (4·d_J³ | d_J³) (thermal overlap)
 *   per (β, t)      Σ_J (6 + 2·(K_J + 2) | 3 + K_J + 2)·d_J²   (phase rotation, then one packed
 *                   dot per operator plane, plus ⟨H1⟩ and the norm)
 * Seconds = flops / ASSUMED_FLOPS_PER_SECOND (measured with tests/bench/spectral on this
 * machine kind; the O(d³) stages dominate).
 * Memory: eigenvectors (16·Σd² for each Hamiltonian), mixing 16·Σd_J², packed matrices
 * 8·d(d+1) each (operators with a non-zero block, H̃1, Gram, thermal overlap), and scratch of
 * SCRATCH_MATRICES dense matrices of the largest block.
 * Accuracy (a priori, checked against the a-posteriori figures in the unit tests): η ≈
 * ETA_PER_STATE·ε·d·a for the largest block d and a = Σ|w|, δ ≈ ε·d, fed to spectral-error.ts
 * at β_max and t_max, times the largest series weight W = Σ|w_linear| + 2Σ|w_quadratic|
 * (connected products ⟨A⟩⟨B⟩ contribute at most |w|·(|⟨A⟩|δB + |⟨B⟩|δA) ≤ 2|w|·δ).
 * Refusals: more than MAX_SPECTRAL_SITES sites ('lattice'), memory above MEMORY_BUDGET_BYTES
 * ('memory'), a priori error above the tolerance ('tolerance'), or a spec that cannot be set
 * up ('spec'). Branches: one branch with every β (the decompositions are shared).
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import type { BasisPartition, SymmetryMode } from '../../symmetry/index.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { pauliError } from './spectral-error.js';
import { touchesBlock } from './transform-operator.js';
import { spectralSetup } from './spectral-setup.js';
import type { SpectralSetup } from './spectral-setup.js';

/** Largest lattice the spectral engine takes (2^13 = 8192 states: one dense block is 1 GiB). */
export const MAX_SPECTRAL_SITES = 13;
/** Peak memory one branch may use. */
export const MEMORY_BUDGET_BYTES = 4 * 2 ** 30;
/** Single-core throughput assumed for the time estimate, flop/s (dense complex kernels in JS). */
export const ASSUMED_FLOPS_PER_SECOND = 1e9;
/** A-priori backward error per state of the largest block, in units of ε·a. */
export const ETA_PER_STATE = 4;
/**
 * Dense complex scratch matrices (16·d² bytes each) of the largest block held at the peak:
 * decomposeBlocks holds the dense block, a product scratch and the eigen workspace (3n² doubles)
 * ≈ 3.5 of them.
 */
const SCRATCH_MATRICES = 4;

const REASON = 'exact eigendecompositions of H0 and H1 in double precision over conserved-magnetisation blocks; ⟨O(t)⟩ for all t from one decomposition';

/** Plan of the spectral engine (see file header). Never throws on a valid spec. */
export function planSpectral(spec: SweepSpec, mode: SymmetryMode, name = 'spectral'): SweepPlan {
  const betas = betaGrid(spec);
  const base = {
    engine: name, reason: REASON, memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: [betas.map((_, b) => b)],
  };
  let sites: number;
  try {
    sites = buildLattice(spec.lattice).sites;
  } catch (e) {
    return refuse(base, 0, 'lattice', 0, 0, `the lattice cannot be built: ${(e as Error).message}`);
  }
  if (sites > MAX_SPECTRAL_SITES) {
    return refuse(base, sites, 'lattice', MAX_SPECTRAL_SITES, sites,
      `the spectral engine diagonalises 2^N × 2^N blocks and is limited to ${MAX_SPECTRAL_SITES} sites; this lattice has ${sites}`);
  }
  let setup: SpectralSetup;
  try {
    setup = spectralSetup(spec, mode);
  } catch (e) {
    return refuse(base, sites, 'spec', 0, 0, `the spec cannot be set up: ${(e as Error).message}`);
  }
  const times = timeGrid(spec);
  const cost = estimateCost(setup, betas.length, times.length);
  if (cost.memoryBytes > MEMORY_BUDGET_BYTES) {
    return refuse({ ...base, memoryBytes: cost.memoryBytes, flops: cost.flops, seconds: cost.flops / ASSUMED_FLOPS_PER_SECOND },
      sites, 'memory', MEMORY_BUDGET_BYTES, cost.memoryBytes,
      `one branch needs about ${cost.memoryBytes} bytes (largest block ${cost.largestBlock} states), above the budget of ${MEMORY_BUDGET_BYTES} bytes`);
  }
  const accuracy = aPrioriAccuracy(setup, betas[betas.length - 1], times[times.length - 1], cost.largestBlock);
  const planned = { ...base, memoryBytes: cost.memoryBytes, flops: cost.flops, seconds: cost.flops / ASSUMED_FLOPS_PER_SECOND, accuracy };
  if (accuracy > spec.tolerance) {
    return refuse(planned, sites, 'tolerance', spec.tolerance, accuracy,
      `the a-priori error estimate ${accuracy.toExponential(2)} (rounding through β_max and t_max) exceeds the tolerance ${spec.tolerance}`);
  }
  return { ...planned, feasible: true, refusal: null, sites };
}

/** Work, memory and the largest block of a setup (see file header). */
export function estimateCost(setup: SpectralSetup, betas: number, times: number): { flops: number; memoryBytes: number; largestBlock: number } {
  const { op0, op1, joint, partition0, measure, same } = setup;
  let flops = 0;
  let memory = 0;
  let largest = 0;
  const isReal = (op: CompiledOperator) => op.groups.every((g) => g.real);
  const decompose = (op: CompiledOperator, p: BasisPartition) => {
    const real = isReal(op);
    for (const b of p.blocks) {
      const d = b.length;
      largest = Math.max(largest, d);
      flops += (real ? 7 : 20) * d ** 3 + 8 * d * d * (op.groups.length + 1);
      memory += (real ? 24 : 16) * d * d;
    }
  };
  const real = isReal(op0) && isReal(op1);
  const q = real ? 0.25 : 1; // real products cost a quarter of complex ones
  decompose(op0, partition0);
  if (!same) decompose(op1, joint);
  for (let J = 0; J < joint.blocks.length; J++) {
    const states = joint.blocks[J];
    const d = states.length;
    let nonzero = 0;
    for (const op of measure.operators) if (touchesBlock(op, joint, J)) nonzero++;
    const packed = 8 * d * (d + 1);
    flops += q * (8 * d ** 3 + 4 * d ** 3 * (nonzero + 1));
    flops += betas * q * 4 * d ** 3;
    flops += betas * times * (real ? 3 + nonzero + 2 : 6 + 2 * (nonzero + 2)) * d * d;
    memory += (real ? 8 : 16) * d * d + packed * (nonzero + 3);
  }
  memory += SCRATCH_MATRICES * 16 * largest * largest;
  return { flops, memoryBytes: memory, largestBlock: largest };
}

/** A-priori accuracy of every series (see file header). */
function aPrioriAccuracy(setup: SpectralSetup, betaMax: number, tMax: number, largest: number): number {
  const eps = Number.EPSILON;
  const fig = (a: number) => ({ backwardError: ETA_PER_STATE * eps * largest * Math.max(a, 1), orthogonality: eps * largest });
  const f0 = fig(setup.op0.normBound);
  const f1 = fig(setup.op1.normBound);
  const e1 = Math.abs(setup.op1.shift) + setup.op1.normBound;
  let weight = 1;
  for (const s of setup.layout.series) {
    let w = 0;
    for (const [, c] of s.linear) w += Math.abs(c);
    for (const [, , c] of s.quadratic) w += 2 * Math.abs(c);
    weight = Math.max(weight, w);
  }
  return weight * pauliError(betaMax, tMax, f0, f1, largest, e1);
}

function refuse(
  base: Omit<SweepPlan, 'feasible' | 'refusal' | 'sites'>,
  sites: number, field: string, limit: number, estimate: number, message: string,
): SweepPlan {
  return { ...base, feasible: false, refusal: { field, limit, estimate, message }, sites };
}
