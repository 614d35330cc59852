/**
 * planSpectral — cost, memory and accuracy of the spectral engine for a spec, or a refusal.
 *
 * Everything is estimated from the block shapes (symmetry/sector-blocks.ts: sector dimensions
 * by character counting, so no 2^N tables are built here), with d the block sizes (H0 over its
 * blocks b, H1 over the joint blocks J; a block kept for its mirror image too is computed
 * once), K_J the measured operators (measurement-plan.ts) with a non-zero block J, c = the
 * stored entries per column (≤ terms + 1), B betas, T times; complex blocks | real blocks
 * (real sector characters and no imaginary Hamiltonian strings):
 *   decompositions  Σ (16·d³ | 6·d³) + (4·d³ | d³) (orthogonality) + 8·d²·c (residuals)
 *                   per block, H0 and H1
 *   quench basis    Σ_J (8·d_J³ | 2·d_J³) (mixing) + (4·d_J³ | d_J³)·(K_J + 1)
 *   per β           Σ_J (4·d_J³ | d_J³) (thermal overlap)
 *   per (β, t)      Σ_J (6 + 2·(K_J + 2) | 3 + K_J + 2)·d_J²   (phase rotation, then one packed
 *                   dot per operator plane, plus ⟨H1⟩ and the norm)
 * Seconds = flops / ASSUMED_FLOPS_PER_SECOND (measured with tests/bench/spectral on this
 * machine kind; the O(d³) stages dominate).
 * Memory: eigenvectors (16·Σd² for each Hamiltonian), mixing 16·Σd_J², packed matrices
 * 8·d(d+1) each (operators with a non-zero block, H̃1, Gram, thermal overlap), scratch of
 * SCRATCH_MATRICES dense matrices of the largest block, and TABLE_BYTES_PER_STATE·2^N of basis
 * tables.
 * Accuracy (a priori, checked against the a-posteriori figures in the unit tests): η ≈
 * ETA_PER_STATE·ε·d·a for the largest block d and a = Σ|w|, δ ≈ ε·d, fed to spectral-error.ts
 * at β_max and t_max, times the largest series weight W = Σ|w_linear| + 2Σ|w_quadratic|
 * (connected products ⟨A⟩⟨B⟩ contribute at most |w|·(|⟨A⟩|δB + |⟨B⟩|δA) ≤ 2|w|·δ).
 * Refusals: more than MAX_SPECTRAL_SITES sites ('lattice'), memory above MEMORY_BUDGET_BYTES
 * ('memory'), a priori error above the tolerance ('tolerance'), or a spec that cannot be set
 * up ('spec'). Branches: one branch with every β (the decompositions are shared).
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import type { PauliTermMask } from '../../physics/types.js';
import { popcount } from '../../physics/pauli-algebra.js';
import type { BlockShape, SymmetryMode } from '../../symmetry/index.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { refusePlan } from '../plan-refusal.js';
import { planSites } from '../plan-sites.js';
import { pauliError } from './spectral-error.js';
import { spectralSetup } from './spectral-setup.js';
import type { SpectralSetup } from './spectral-setup.js';

/**
 * Largest lattice the spectral engine takes: 2^20 states of basis tables (≈ 16 MiB). What fits
 * below that is decided by the memory budget from the block sizes (without symmetry blocks
 * 13 sites already exceed it).
 */
export const MAX_SPECTRAL_SITES = 20;
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
/** Bytes of basis tables per basis state (orbit tables, vector and partition tables). */
const TABLE_BYTES_PER_STATE = 40;

/** The plan's reason: what the engine does and over which blocks. */
function reasonOf(setup: SpectralSetup | null): string {
  const base = 'exact eigendecompositions of H0 and H1 in double precision; ⟨O(t)⟩ for all t from one decomposition';
  if (setup === null) return base;
  const j = setup.shapesJoint;
  const largest = j.reduce((m, b) => Math.max(m, b.size), 0);
  return `${base}; symmetry: ${setup.symmetry.label}; ${j.length} joint blocks, largest ${largest} states`;
}

/** Plan of the spectral engine (see file header). Never throws on a valid spec. */
export function planSpectral(spec: SweepSpec, mode: SymmetryMode, name = 'spectral'): SweepPlan {
  const betas = betaGrid(spec);
  const base = {
    engine: name, reason: reasonOf(null), memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: [betas.map((_, b) => b)],
  };
  const checked = planSites(spec, base, MAX_SPECTRAL_SITES, 'the spectral engine diagonalises 2^N × 2^N blocks');
  if (!checked.ok) return checked.plan;
  const { sites } = checked;
  let setup: SpectralSetup;
  try {
    setup = spectralSetup(spec, mode);
  } catch (e) {
    return refusePlan(base, sites, 'spec', 0, 0, `the spec cannot be set up: ${(e as Error).message}`);
  }
  const times = timeGrid(spec);
  const cost = estimateCost(setup, betas.length, times.length);
  base.reason = reasonOf(setup);
  if (cost.memoryBytes > MEMORY_BUDGET_BYTES) {
    return refusePlan({ ...base, memoryBytes: cost.memoryBytes, flops: cost.flops, seconds: cost.flops / ASSUMED_FLOPS_PER_SECOND },
      sites, 'memory', MEMORY_BUDGET_BYTES, cost.memoryBytes,
      `one branch needs about ${cost.memoryBytes} bytes (largest block ${cost.largestBlock} states), above the budget of ${MEMORY_BUDGET_BYTES} bytes`);
  }
  const accuracy = aPrioriAccuracy(setup, betas[betas.length - 1], times[times.length - 1], cost.largestBlock);
  const planned = { ...base, memoryBytes: cost.memoryBytes, flops: cost.flops, seconds: cost.flops / ASSUMED_FLOPS_PER_SECOND, accuracy };
  if (accuracy > spec.tolerance) {
    return refusePlan(planned, sites, 'tolerance', spec.tolerance, accuracy,
      `the a-priori error estimate ${accuracy.toExponential(2)} (rounding through β_max and t_max) exceeds the tolerance ${spec.tolerance}`);
  }
  return { ...planned, feasible: true, refusal: null, sites };
}

/** Work, memory and the largest block of a setup (see file header). */
export function estimateCost(setup: SpectralSetup, betas: number, times: number): { flops: number; memoryBytes: number; largestBlock: number } {
  const { shapes0, shapesJoint, fig0, fig1, measure, same, sites } = setup;
  let flops = 0;
  let memory = TABLE_BYTES_PER_STATE * 2 ** sites;
  let largest = 0;
  const decompose = (shapes: readonly BlockShape[], realTerms: boolean, terms: number) => {
    for (const b of shapes) {
      const d = b.size;
      const real = realTerms && b.realCharacters;
      largest = Math.max(largest, d);
      flops += (real ? 7 : 20) * d ** 3 + 8 * d * d * Math.min(terms + 1, d);
      memory += (real ? 24 : 16) * d * d;
    }
  };
  decompose(shapes0, fig0.real, setup.h0.terms.length);
  if (!same) decompose(shapesJoint, fig1.real, setup.h1.terms.length);
  for (const b of shapesJoint) {
    const d = b.size;
    const real = fig0.real && fig1.real && b.realCharacters;
    const q = real ? 0.25 : 1; // real products cost a quarter of complex ones
    let nonzero = 0;
    for (const op of measure.operators) if (mayTouch(op.terms, b, sites)) nonzero++;
    const packed = 8 * d * (d + 1);
    flops += q * (8 * d ** 3 + 4 * d ** 3 * (nonzero + 1));
    flops += betas * q * 4 * d ** 3;
    flops += betas * times * (real ? 3 + nonzero + 2 : 6 + 2 * (nonzero + 2)) * d * d;
    memory += (real ? 8 : 16) * d * d + packed * (nonzero + 3);
  }
  memory += SCRATCH_MATRICES * 16 * largest * largest;
  return { flops, memoryBytes: memory, largestBlock: largest };
}

/**
 * Whether an operator can have entries inside a block: in a block of fixed magnetisation M a
 * string flipping f sites keeps M only if f is even with f/2 ≤ M ≤ N − f/2; without
 * magnetisation every operator is counted.
 */
function mayTouch(terms: readonly PauliTermMask[], b: BlockShape, sites: number): boolean {
  if (b.magnetisation === null) return true;
  const m = b.magnetisation;
  return terms.some((t) => {
    const f = popcount(t.x);
    return f % 2 === 0 && f / 2 <= m && f / 2 <= sites - m;
  });
}

/** A-priori accuracy of every series (see file header). */
function aPrioriAccuracy(setup: SpectralSetup, betaMax: number, tMax: number, largest: number): number {
  const eps = Number.EPSILON;
  const fig = (a: number) => ({ backwardError: ETA_PER_STATE * eps * largest * Math.max(a, 1), orthogonality: eps * largest });
  const f0 = fig(setup.fig0.normBound);
  const f1 = fig(setup.fig1.normBound);
  const e1 = Math.abs(setup.fig1.shift) + setup.fig1.normBound;
  let weight = 1;
  for (const s of setup.layout.series) {
    let w = 0;
    for (const [, c] of s.linear) w += Math.abs(c);
    for (const [, , c] of s.quadratic) w += 2 * Math.abs(c);
    weight = Math.max(weight, w);
  }
  return weight * pauliError(betaMax, tMax, f0, f1, largest, e1);
}
