/**
 * runSample — one random-phase sample through a branch's β list and each β's quench.
 *
 *   ψ(0) = |r_k⟩ (random phases of (seed, k)),
 *   ψ(β) = e^{−βH0/2}|r⟩ by propagateImaginaryTime from the previous β (ln‖ψ‖² accumulated),
 *   at each β: ⟨H0⟩, ⟨(H0 − ⟨H0⟩)²⟩ on ψ̂(β); then ψ̂(t) = e^{−iH1t}ψ̂(β) at the grid times, a
 *   block of grid times at a time from one Chebyshev recurrence (propagateToTimes, blocks from
 *   quenchBlocks; a single span longer than τ = MAX_REAL_TIME_TAU goes through propagateRealTime's
 *   sub-steps instead), every primitive measured at every grid time (measurePauliBatch), and ⟨H1⟩
 *   at the first grid time and at the end of every block (per-sample drift check: exactly
 *   conserved by the unitary evolution).
 * Interval checks (the intervals may be Lanczos estimates, typical-intervals.ts): every output's
 * |‖ψ̂(t)‖ − 1| must stay within twice its truncation-plus-rounding bound (+ normSlack(dim)), and
 * ⟨H0⟩ inside the H0 interval; otherwise IntervalMissError (the runner redoes the sample on
 * the rigorous bounds). With a correct interval neither check can fail.
 * A copy of ψ(β) is kept while more β follow. The abort signal is checked, and the event loop
 * given a turn, before every block (so at least every MAX_BLOCK_TIMES grid times, not at every
 * grid time: a block is one synchronous recurrence).
 *
 * Error estimates per sample (typical-budget.ts): δ_β = κ·Σ(imaginary bounds) + rounding;
 * δ(t) = δ_β + (1 + δ_β)·(Σ bounds of earlier blocks + this output's bound + rounding) (unitary
 * steps do not amplify errors).
 * Memory: the buffers passed in (state, 2 work, the block outputs, an optional thermal copy);
 * no 2^N allocation.
 */
import { applyOperatorAffine, dotc, norm2sq } from '../../kernels/index.js';
import { MAX_REAL_TIME_TAU, propagateImaginaryTime, propagateRealTime } from '../../propagators/index.js';
import type { AffineApply } from '../../propagators/index.js';
import { measurePauliBatch } from './measure-pauli-batch.js';
import { propagateToTimes } from './propagate-to-times.js';
import type { MultiTimeReport } from './propagate-to-times.js';
import type { QuenchBlock } from './quench-blocks.js';
import { fillRandomPhaseVector } from '../../random/index.js';
import { ROUNDING_PER_MATVEC } from './typical-budget.js';
import type { TypicalBudget } from './typical-budget.js';
import type { TypicalSampleRecord } from './typical-samples.js';
import type { TypicalSetup } from './typical-setup.js';
import { IntervalMissError } from './typical-intervals.js';

/** Least absolute slack of the norm check. */
export const NORM_SLACK = 1e-12;

/**
 * Slack of the norm check on vectors of `dim` amplitudes: ‖ψ‖² is a plain sum of 2·dim squares,
 * whose rounding is at most 2·dim·ε relative (the worst-case bound of recursive summation;
 * Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §4.2, from memory); two such
 * sums meet here (ψ̂'s normalisation and the check), so 4·dim·ε: 5.8e-11 at N = 16, 1.5e-8 at
 * N = 24; and at least NORM_SLACK. A missed interval grows the norm exponentially, far above.
 */
export function normSlack(dim: number): number {
  return Math.max(NORM_SLACK, 4 * dim * Number.EPSILON);
}

/** The 2^N work vectors of one sample. */
export interface SampleBuffers {
  readonly state: Float64Array;
  readonly work: readonly [Float64Array, Float64Array];
  /** Outputs of one quench block (as many as the largest block). */
  readonly block: readonly Float64Array[];
  /** Copy of ψ(β) while later β follow; null for single-β branches. */
  readonly thermal: Float64Array | null;
}

/**
 * Buffers for vectors of `dim` entries: `blockVectors` block outputs, and the thermal copy when
 * `keepThermal` (branches of several β); `work` reuses two vectors already allocated.
 */
export function allocateSampleBuffers(
  dim: number, keepThermal: boolean, blockVectors: number, work?: readonly [Float64Array, Float64Array],
): SampleBuffers {
  const length = 2 * dim;
  return {
    state: new Float64Array(length),
    work: work ?? [new Float64Array(length), new Float64Array(length)],
    block: Array.from({ length: blockVectors }, () => new Float64Array(length)),
    thermal: keepThermal ? new Float64Array(length) : null,
  };
}

/** Error thrown when the abort signal fires (name 'AbortError'). */
export function abortError(signal: AbortSignal): Error {
  const e = new Error('the branch was aborted', { cause: signal.reason });
  e.name = 'AbortError';
  return e;
}

/** Inputs of {@link runSample}. */
export interface SampleInput {
  readonly setup: TypicalSetup;
  readonly budget: TypicalBudget;
  /** β indices, ascending in β, distinct. */
  readonly order: readonly number[];
  /** Sample index k. */
  readonly sample: number;
  readonly buffers: SampleBuffers;
  /** The quench's blocks over the grid (quenchBlocks), at most buffers.block.length times each. */
  readonly blocks: readonly QuenchBlock[];
  /** Truncation tolerance of each block output. */
  readonly blockTolerance: number;
  readonly signal?: AbortSignal;
}

/** Number of real-time propagator calls of a quench over an ascending grid starting at t = 0. */
export function quenchCalls(times: readonly number[]): number {
  let calls = 0;
  let prev = 0;
  for (const t of times) {
    if (t > prev) calls += 1;
    prev = t;
  }
  return Math.max(calls, 1);
}

/** Runs one sample (see file header); one record per β of `order`, in that order. */
export async function runSample(input: SampleInput): Promise<TypicalSampleRecord[]> {
  const { setup, budget, order, sample, buffers, blocks, blockTolerance, signal } = input;
  const { state, work, thermal, block } = buffers;
  if (order.length > 1 && thermal === null) throw new RangeError('buffers.thermal is needed for a branch of several β');
  const { dim, betas, times, batch, measured } = setup;
  const np = setup.layout.primitives.length;
  const nm = batch.count;
  const applyH0: AffineApply = (i, o, al, be, ga) => applyOperatorAffine(setup.h0Op, 1, i, o, al, be, ga);
  const applyH1: AffineApply = (i, o, al, be, ga) => applyOperatorAffine(setup.h1Op, 1, i, o, al, be, ga);
  const betaMax = betas[order[order.length - 1]];
  const values = new Float64Array(nm);
  const slack = normSlack(dim);
  const pair = new Float64Array(2);

  fillRandomPhaseVector(state, dim, setup.seed, sample);
  let currentBeta = 0;
  let lnWeight = 0;
  let imagBound = 0;
  let imagMatvecs = 0;
  let imagReported = 0;
  const records: TypicalSampleRecord[] = [];

  for (let k = 0; k < order.length; k++) {
    if (signal?.aborted) throw abortError(signal);
    const betaIndex = order[k];
    const beta = betas[betaIndex];
    const delta = (beta - currentBeta) / 2;
    if (delta > 0) {
      const tolerance = budget.imaginaryTolerance * (delta / (betaMax / 2));
      const rep = propagateImaginaryTime(applyH0, setup.h0Interval, delta, state, work, { tolerance, groundBound: setup.h0Ground });
      lnWeight += 2 * rep.lnNormGrowth;
      imagBound += rep.errorBound;
      imagMatvecs += rep.matvecs;
      currentBeta = beta;
    }
    const x = budget.kappa * imagBound + ROUNDING_PER_MATVEC * imagMatvecs;
    const thermalError = x < 1 ? x / (1 - x) : Number.MAX_VALUE;

    // Energy and variance about it (the second pass subtracts the residual first moment).
    const n2 = norm2sq(state);
    applyH0(state, work[0], 1, 0, 0);
    dotc(state, work[0], pair);
    const energy = pair[0] / n2;
    applyH0(state, work[0], 1, -energy, 0);
    dotc(state, work[0], pair);
    const mean = pair[0] / n2;
    const energyVariance = Math.max(0, norm2sq(work[0]) / n2 - mean * mean);
    if (!(energy >= setup.h0Interval.lo && energy <= setup.h0Interval.hi)) {
      throw new IntervalMissError(`⟨H0⟩ = ${energy} at β = ${beta} lies outside H0's interval [${setup.h0Interval.lo}, ${setup.h0Interval.hi}]`);
    }

    const last = k === order.length - 1;
    if (thermal !== null && !last) thermal.set(state);

    const primitives = new Float64Array(times.length * np);
    const stateErrors = new Float64Array(times.length);
    let realBound = 0;
    let realMatvecs = 0;
    let h1AtZero = Number.NaN;
    let h1Drift = 0;
    let normDrift = 0;
    const energyH1 = (v: Float64Array, n2: number): number => {
      applyH1(v, work[1], 1, 0, 0);
      dotc(v, work[1], pair);
      realMatvecs += 1;
      return pair[0] / n2;
    };
    for (const blk of blocks) {
      await new Promise<void>((resolve) => setImmediate(resolve));
      if (signal?.aborted) throw abortError(signal);
      if (blk.count > block.length) throw new RangeError(`a block of ${blk.count} times needs ${blk.count} output vectors; have ${block.length}`);
      const offsets = [];
      for (let j = 0; j < blk.count; j++) offsets.push(times[blk.start + j] - blk.from);
      const halfWidth = (setup.h1Interval.hi - setup.h1Interval.lo) / 2;
      let rep: MultiTimeReport;
      if (blk.count === 1 && offsets[0] * halfWidth > MAX_REAL_TIME_TAU) {
        // One long span: sub-stepped by propagateRealTime (short Bessel recurrences).
        const one = propagateRealTime(applyH1, setup.h1Interval, offsets[0], state, work, { tolerance: blockTolerance });
        block[0].set(state);
        rep = { matvecs: one.matvecs, axpys: one.matvecs, errorBounds: [one.errorBound], orders: [one.matvecs] };
      } else {
        rep = propagateToTimes(applyH1, setup.h1Interval, offsets, state, work[0], block, blockTolerance);
      }
      realMatvecs += rep.matvecs;
      for (let j = 0; j < blk.count; j++) {
        const ti = blk.start + j;
        const v = block[j];
        const own = rep.errorBounds[j] + ROUNDING_PER_MATVEC * rep.orders[j];
        stateErrors[ti] = thermalError + (1 + thermalError) * (realBound + own);
        const m2 = norm2sq(v);
        const drift = Math.abs(Math.sqrt(m2) - 1);
        if (!(drift <= 2 * (realBound + own) + slack)) {
          throw new IntervalMissError(`‖ψ(t)‖ − 1 = ${drift} at t = ${times[ti]} exceeds the truncation bound ${realBound + own}: H1's interval [${setup.h1Interval.lo}, ${setup.h1Interval.hi}] misses part of its spectrum`);
        }
        normDrift = Math.max(normDrift, drift);
        if (ti === 0) h1AtZero = energyH1(v, m2);
        measurePauliBatch(batch, v, values, work[1]);
        const row = ti * np;
        for (let m = 0; m < nm; m++) primitives[row + measured[m]] = values[m] / m2;
      }
      const end = blk.count - 1;
      realBound += rep.errorBounds[end] + ROUNDING_PER_MATVEC * rep.orders[end];
      state.set(block[end]);
      const e = energyH1(state, norm2sq(state));
      h1Drift = Math.max(h1Drift, Math.abs(e - h1AtZero));
    }
    records.push({
      sample,
      betaIndex,
      lnWeight,
      energy,
      energyVariance,
      primitives,
      thermalError,
      stateErrors,
      h1Drift,
      normDrift,
      matvecs: imagMatvecs - imagReported + realMatvecs + 2,
    });
    imagReported = imagMatvecs;
    if (thermal !== null && !last) state.set(thermal);
  }
  return records;
}
