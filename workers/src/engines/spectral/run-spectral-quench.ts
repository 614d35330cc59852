/**
 * runSpectralQuench — every grid time of one β from the quench basis (quench-basis.ts) and the
 * thermal overlaps ρ̃_J of that β (thermal-overlap.ts):
 *   f_k(t) = Σ_J μ_J·R′_J(t)·Õ_{k,J},   n(t) = Σ_J μ_J·R′_J(t)·G_J,   h(t) = Σ_J μ_J·R′_J(t)·H̃1_J,
 *   ⟨O_k⟩(t) = f_k(t)/n(t)   (the doubled-state ratio Tr(M†OM)/Tr(M†M) of DESIGN.md §2),
 * for the measured operators O_k of the measurement plan (measurement-plan.ts), with R′_J(t)
 * from phase-rotate.ts and packed planes (packed-planes.ts), μ_J the block's multiplicity (2
 * when it stands for its mirror-image sector too, symmetry/group-sectors.ts). n(t) = Tr(U ρ U†) with
 * U = V e^{−iΛt} Vᴴ is the squared norm of the doubled state; it is constant exactly when V is
 * exactly unitary, so its drift, and that of ⟨H1⟩ = h/n, measure the decomposition's real
 * defects rather than being assumed 0.
 * Error of ⟨O_k⟩: (Σ|w| of O_k)·pauliError (spectral-error.ts); series through evaluateSeries
 * on the plan's layout.
 *
 * Loop order: all f_k(t) of TIME_CHUNK times form a small matrix product R′ (times × packed
 * entries) · Õᵀ (packed entries × operators). It is blocked over segments of SEGMENT_ENTRIES
 * packed entries, so each operator segment is read from memory once per chunk of times, not
 * once per time (the per-time form was memory-bound).
 * Cost per time: Σ_J (≈ 6 + 2·(planes of the K_J non-zero operators + 4))·d_J²/2 flops.
 * The abort signal is checked before every chunk and every emitted point; the event loop gets a
 * turn when due (yield-if-due.ts).
 */
import { evaluateSeries } from '../../observables/expand-observables.js';
import type { MeasurementPlan } from './measurement-plan.js';
import { packedDot } from './packed-dot.js';
import type { PackedPlanes } from './packed-planes.js';
import { phaseRotate } from './phase-rotate.js';
import type { QuenchBlock } from './quench-basis.js';
import { pauliError } from './spectral-error.js';
import type { DecompositionFigures } from './spectral-error.js';
import { yieldIfDue } from './yield-if-due.js';

/** Times evaluated together: each operator segment is read once per chunk. */
export const TIME_CHUNK = 16;
/** Packed entries per segment and plane (2048 doubles = 16 KiB: an operator segment stays in L1). */
export const SEGMENT_ENTRIES = 2048;

/** The thermal overlap of one block in packed planes (im null when ρ̃ is real). */
export interface RhoPlanes {
  readonly re: Float64Array;
  readonly im: Float64Array | null;
}

/** Inputs of {@link runSpectralQuench}. */
export interface SpectralQuenchInput {
  readonly blocks: readonly QuenchBlock[];
  /** ρ̃_J of this β, one per block. */
  readonly rho: readonly RhoPlanes[];
  /** The measured operators, their weights and the layout over them. */
  readonly plan: MeasurementPlan;
  /** Ascending grid times. */
  readonly times: readonly number[];
  readonly beta: number;
  readonly h0: DecompositionFigures;
  readonly h1: DecompositionFigures;
  readonly largestBlock: number;
  /** max |E| over H1's eigenvalues (phase rounding). */
  readonly maxAbsEnergy1: number;
  readonly signal?: AbortSignal;
  /** Receives each time's series values and errors (buffers reused: copy them). */
  onPoint(timeIndex: number, values: Float64Array, errors: Float64Array): void;
}

/** Health figures of one β's quench. */
export interface SpectralQuenchReport {
  /** max_t |⟨H1⟩(t) − ⟨H1⟩(0)|. */
  readonly h1Drift: number;
  /** max_t |‖ψ(t)‖/‖ψ(0)‖ − 1|. */
  readonly normDrift: number;
  /** ⟨H1⟩ at t = 0. */
  readonly h1AtZero: number;
}

/** Runs the time loop of one β (see the file header). Rejects with an AbortError when aborted. */
export async function runSpectralQuench(input: SpectralQuenchInput): Promise<SpectralQuenchReport> {
  const { blocks, rho, plan, times, beta, signal } = input;
  const layout = plan.layout;
  const nOps = plan.operators.length;
  const width = nOps + 2; // operators, then n, then h
  let big = 0;
  for (const b of blocks) big = Math.max(big, b.size);
  const cap = Math.max(SEGMENT_ENTRIES, big);
  const rRe = new Float64Array(TIME_CHUNK * cap);
  const rIm = new Float64Array(TIME_CHUNK * cap);
  const phases = new Float64Array(TIME_CHUNK * 2 * big);
  const acc = new Float64Array(TIME_CHUNK * width);
  const prim = new Float64Array(nOps);
  const primErr = new Float64Array(nOps);
  const values = new Float64Array(layout.series.length);
  const errors = new Float64Array(layout.series.length);

  const addPlanes = (planes: PackedPlanes, slot: number, count: number, base: number, len: number, mult: number) => {
    if (planes.re !== null) {
      for (let tau = 0; tau < count; tau++) acc[tau * width + slot] += mult * packedDot(rRe, tau * cap, planes.re, base, len);
    }
    if (planes.im !== null) {
      for (let tau = 0; tau < count; tau++) acc[tau * width + slot] += mult * packedDot(rIm, tau * cap, planes.im, base, len);
    }
  };

  /** acc[τ·width + slot] ← f_k, n, h at times ts[first .. first + count). */
  const measureChunk = (ts: readonly number[], first: number, count: number, withOperators: boolean) => {
    acc.fill(0);
    for (let J = 0; J < blocks.length; J++) {
      const b = blocks[J];
      const d = b.size;
      for (let tau = 0; tau < count; tau++) {
        const t = ts[first + tau];
        const po = tau * 2 * big;
        for (let m = 0; m < d; m++) {
          const w = b.energies[m] * t;
          phases[po + 2 * m] = Math.cos(w);
          phases[po + 2 * m + 1] = Math.sin(w);
        }
      }
      for (let n0 = 0; n0 < d;) {
        const base = (n0 * (n0 + 1)) / 2;
        let n1 = n0 + 1;
        while (n1 < d && ((n1 + 1) * (n1 + 2)) / 2 - base <= cap) n1++;
        const len = (n1 * (n1 + 1)) / 2 - base;
        for (let tau = 0; tau < count; tau++) {
          phaseRotate(n0, n1, rho[J].re, rho[J].im, phases, tau * 2 * big, rRe, rIm, tau * cap);
        }
        if (withOperators) {
          for (let k = 0; k < nOps; k++) {
            const o = b.operators[k];
            if (o !== null) addPlanes(o, k, count, base, len, b.multiplicity);
          }
        }
        addPlanes(b.gram, nOps, count, base, len, b.multiplicity);
        addPlanes(b.h1, nOps + 1, count, base, len, b.multiplicity);
        n0 = n1;
      }
    }
  };

  measureChunk([0], 0, 1, false);
  const n0 = acc[nOps];
  const h1AtZero = acc[nOps + 1] / n0;
  let h1Drift = 0;
  let normDrift = 0;
  for (let first = 0; first < times.length; first += TIME_CHUNK) {
    await yieldIfDue(signal);
    const count = Math.min(TIME_CHUNK, times.length - first);
    measureChunk(times, first, count, true);
    for (let tau = 0; tau < count; tau++) {
      await yieldIfDue(signal);
      const ti = first + tau;
      const row = tau * width;
      const n = acc[row + nOps];
      const h = acc[row + nOps + 1];
      normDrift = Math.max(normDrift, Math.abs(Math.sqrt(n / n0) - 1));
      h1Drift = Math.max(h1Drift, Math.abs(h / n - h1AtZero));
      const e = pauliError(beta, times[ti], input.h0, input.h1, input.largestBlock, input.maxAbsEnergy1);
      for (let k = 0; k < nOps; k++) {
        prim[k] = acc[row + k] / n;
        primErr[k] = plan.weights[k] * e;
      }
      evaluateSeries(layout, prim, primErr, values, errors);
      input.onPoint(ti, values, errors);
    }
  }
  return { h1Drift, normDrift, h1AtZero };
}
