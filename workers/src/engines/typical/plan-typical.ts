/**
 * planTypical — samples, memory, work and expected accuracy of the typical engine, or a refusal.
 *
 * Samples per β: R(β) = max(MIN_SAMPLES, ⌈(σ₁(β)/σ*)²⌉) with σ₁ the plan-time estimate of one
 * sample's scatter (spread-estimate.ts; diagonal strings count as exact when H0 is diagonal and
 * so is the quench or every time is 0) and σ* = (1 − TRUNCATION_SHARE)·tolerance the
 * statistical target. Refusal (field 'tolerance') when σ₁/√cap > σ* at some β: by the estimate
 * even the cap cannot meet the tolerance. The run measures the scatter and may use fewer or
 * more samples (up to the cap); its diagnostics say whether the tolerance was met.
 * Accuracy (expected): max_β σ₁(β)/√R(β) + the truncation share — ≤ tolerance when feasible.
 *
 * Memory of one branch (one β, the plan's fan-out): 3 vectors of 16·2^N bytes (state + 2
 * Chebyshev work vectors) plus the widest quench block's outputs (quench-blocks.ts), the diagonals of H0 and H1 (8·2^N each), flip-group tables when
 * N ≤ TABLE_SITES_MAX (16·2^N each), and the per-sample records (8·times·primitives bytes each)
 * for the sample cap. The cap is MAX_TYPICAL_SAMPLES, lowered so the records fit the budget.
 * Refusals: N > MAX_TYPICAL_SITES (field 'lattice'), memory > TYPICAL_MEMORY_BUDGET_BYTES or a
 * cap below MIN_SAMPLES (field 'memory').
 *
 * Work per sample and β, in flops on 2^N entries (counted as the run schedules them):
 *   random phases 40, imaginary time m_i·(apply H0 + 8), energy and variance 2·apply H0 + 8,
 *   quench: per block K_max·(apply H1 + 8) + 8 per axpy pass (quenchBlocks, the run's own
 *   schedule), ⟨H1⟩ once per block + 1, per grid time 2 + measurement: 4 + 4·strings per flip
 *   group, and for the diagonal strings 4 + 1.5·N (Walsh–Hadamard) or 16 per string;
 *   apply H = 4 (diagonal) + per flip group 8 (tabulated) or 8 + 4·terms (on the fly).
 * These are "flop units" calibrated so that ASSUMED_FLOPS_PER_SECOND = 1e9 matched the measured
 * passes on this 2-core machine under load (apply with and without tables, axpy, measurement);
 * seconds = flops / ASSUMED_FLOPS_PER_SECOND, one core.
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { chebyshevExpSeries, MAX_IMAGINARY_TIME_TAU } from '../../propagators/index.js';
import { pauliBatch, WHT_MIN_STRINGS_PER_SITE } from './measure-pauli-batch.js';
import { applyPasses, maxBlockTimes, quenchBlocks } from './quench-blocks.js';
import { quenchCalls } from './run-sample.js';
import {
  MAX_TYPICAL_SAMPLES, MIN_SAMPLES, samplesFor,
} from './sample-count.js';
import { sampleSpreadEstimate } from './spread-estimate.js';
import { TRUNCATION_SHARE, typicalBudget } from './typical-budget.js';
import { measuredPrimitives, typicalLayout } from './typical-layout.js';
import type { TypicalLayout } from './typical-layout.js';
import { MAX_TYPICAL_SITES, usesTables } from './typical-setup.js';

/** Peak memory one branch may use. */
export const TYPICAL_MEMORY_BUDGET_BYTES = 16 * 2 ** 30;
/** Rough single-core throughput assumed for the time estimate, flop/s. */
export const ASSUMED_FLOPS_PER_SECOND = 1e9;

const REASON = 'random-phase vectors sample the auxiliary trace of the thermofield double (canonical typicality) on 2^N vectors; '
  + 'ratio estimators with jackknife error bars (1σ) plus propagator truncation';

/** The planned samples of one β. */
export interface TypicalSchedule {
  readonly betaIndex: number;
  readonly beta: number;
  /** Estimated one-sample scatter σ₁ of the worst series. */
  readonly spread: number;
  /** Planned samples R(β) (≤ cap when feasible). */
  readonly samples: number;
  /** Expected statistical error σ₁/√R. */
  readonly expectedError: number;
}

/** Samples, cap and cost of a spec, before the feasibility decision. */
export interface TypicalPlanDetails {
  readonly layout: TypicalLayout;
  readonly schedule: TypicalSchedule[];
  /** Most samples per β (MAX_TYPICAL_SAMPLES or what the memory budget allows). */
  readonly cap: number;
  readonly memoryBytes: number;
  /** Flops of one sample at each β (index = β index). */
  readonly sampleFlops: number[];
}

/** Samples, cap, memory and cost (see file header). @throws RangeError when the spec cannot be set up. */
export function typicalPlanDetails(spec: SweepSpec): TypicalPlanDetails {
  const layout = typicalLayout(spec);
  const n = layout.sites;
  const dim = 2 ** n;
  const tables = usesTables(n);
  // Counted from the terms: compiling would allocate the 2^N diagonals.
  const op0 = compileLight(layout.h0);
  const op1 = compileLight(layout.h1);
  const groupTables = tables ? 16 * dim * (op0.groups + op1.groups) : 0;
  const realTolerance = typicalBudget(layout.layout, spec.tolerance, n, layout.h0NormBound, layout.betas).realTolerance;
  const blocks = quenchBlocks(layout.times, op1.normBound, applyPasses(op1.diagonal, op1.groups, op1.termsPerGroup, tables),
    realTolerance / quenchCalls(layout.times), maxBlockTimes(dim));
  const widest = blocks.reduce((a, b) => Math.max(a, b.count), 1);
  const vectors = (3 + widest) * 16 * dim;
  const diagonals = (op0.diagonal ? 8 * dim : 0) + (op1.diagonal ? 8 * dim : 0);
  const perRecord = 8 * layout.times.length * layout.layout.primitives.length + 256;
  const fixed = vectors + diagonals + groupTables;
  const cap = Math.max(0, Math.min(MAX_TYPICAL_SAMPLES, Math.floor((TYPICAL_MEMORY_BUDGET_BYTES - fixed) / perRecord)));
  const memoryBytes = fixed + Math.max(cap, MIN_SAMPLES) * perRecord;

  const target = (1 - TRUNCATION_SHARE) * spec.tolerance;
  const diagonalExact = op0.groups === 0 && (op1.groups === 0 || layout.times.every((t) => t === 0));
  const schedule = layout.betas.map((beta, betaIndex): TypicalSchedule => {
    const spread = sampleSpreadEstimate(layout.layout, beta, n, layout.h0SecondMoment, diagonalExact);
    const samples = Math.max(MIN_SAMPLES, samplesFor(spread, target));
    return { betaIndex, beta, spread, samples, expectedError: spread / Math.sqrt(Math.min(samples, Math.max(cap, 1))) };
  });

  const prims = layout.layout.primitives;
  const batch = pauliBatch(Array.from(measuredPrimitives(layout.layout), (p) => prims[p]), 2 ** Math.min(n, 30));
  let measure = 0;
  for (const g of batch.groups) {
    const m = g.zMasks.length;
    if (g.x !== 0) measure += 4 + 4 * m;
    else measure += m > 1 && m > WHT_MIN_STRINGS_PER_SITE * n ? 4 + 1.5 * n : 16 * m;
  }
  const apply0 = applyCost(op0, tables);
  const apply1 = applyCost(op1, tables);
  let realMatvecs = 0;
  let axpys = 0;
  for (const b of blocks) { realMatvecs += b.matvecs; axpys += b.axpys; }
  const quench = realMatvecs * (apply1 + 8) + 8 * axpys + (blocks.length + 1) * (apply1 + 8) + layout.times.length * (measure + 2);
  const sampleFlops = layout.betas.map((beta) => {
    const budget = typicalBudget(layout.layout, spec.tolerance, n, layout.h0NormBound, [beta]);
    const imag = imaginaryTimeMatvecs(op0.normBound, beta, budget.imaginaryTolerance);
    return dim * (40 + imag * (apply0 + 8) + 2 * apply0 + 8 + quench);
  });
  return { layout, schedule, cap, memoryBytes, sampleFlops };
}

/** Plan of the typical engine (see file header). Never throws on a valid spec. */
export function planTypical(spec: SweepSpec, name = 'typical'): SweepPlan {
  const base = {
    engine: name, reason: REASON, memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: betaGrid(spec).map((_, b) => [b]),
  };
  let sites = 0;
  let details: TypicalPlanDetails;
  try {
    sites = buildLattice(spec.lattice).sites;
  } catch (e) {
    return refuse(base, 0, 'lattice', 0, 0, `the lattice cannot be built: ${(e as Error).message}`);
  }
  try {
    if (sites > MAX_TYPICAL_SITES) {
      return refuse(base, sites, 'lattice', MAX_TYPICAL_SITES, sites,
        `the typical engine holds 2^N amplitudes per vector and is limited to ${MAX_TYPICAL_SITES} sites; this lattice has ${sites}`);
    }
    details = typicalPlanDetails(spec);
  } catch (e) {
    return refuse(base, sites, 'spec', 0, 0, `the spec cannot be set up: ${(e as Error).message}`);
  }
  const { schedule, cap, memoryBytes, sampleFlops } = details;
  if (memoryBytes > TYPICAL_MEMORY_BUDGET_BYTES || cap < MIN_SAMPLES) {
    return refuse({ ...base, memoryBytes }, sites, 'memory', TYPICAL_MEMORY_BUDGET_BYTES, memoryBytes,
      `one branch needs ${memoryBytes} bytes for its vectors and ${MIN_SAMPLES} samples' records, above the budget of ${TYPICAL_MEMORY_BUDGET_BYTES} bytes`);
  }
  let flops = 0;
  for (const s of schedule) flops += Math.min(s.samples, cap) * sampleFlops[s.betaIndex];
  const seconds = flops / ASSUMED_FLOPS_PER_SECOND;
  const statTarget = (1 - TRUNCATION_SHARE) * spec.tolerance;
  const worst = schedule.reduce((a, s) => (s.spread > a.spread ? s : a), schedule[0]);
  if (worst.spread / Math.sqrt(cap) > statTarget) {
    const atCap = worst.spread / Math.sqrt(cap);
    return refuse({ ...base, memoryBytes, flops, seconds, accuracy: atCap }, sites, 'tolerance', spec.tolerance, atCap,
      `at β = ${worst.beta} one sample scatters by ~${worst.spread.toPrecision(3)} (estimate), so even ${cap} samples give ~${atCap.toPrecision(3)}, above the tolerance ${spec.tolerance}`);
  }
  const expected = Math.max(...schedule.map((s) => s.expectedError));
  const samplesText = schedule.map((s) => s.samples).join(', ');
  return {
    ...base,
    reason: `${REASON}; planned samples per β (estimate): [${samplesText}], cap ${cap}`,
    feasible: true,
    refusal: null,
    memoryBytes,
    flops,
    seconds,
    accuracy: expected + TRUNCATION_SHARE * spec.tolerance,
    sites,
  };
}

/** Flip-group count, diagonal presence and Σ|w| of a Pauli sum, without 2^N tables. */
interface LightOperator {
  readonly groups: number;
  readonly termsPerGroup: number;
  readonly diagonal: boolean;
  readonly normBound: number;
}

function compileLight(sum: TypicalLayout['h0']): LightOperator {
  const byX = new Map<number, number>();
  let diagonal = false;
  let normBound = 0;
  for (const t of sum.terms) {
    if (t.weight === 0) continue;
    if (t.x === 0) diagonal = true;
    else byX.set(t.x, (byX.get(t.x) ?? 0) + 1);
    if (t.x !== 0 || t.z !== 0) normBound += Math.abs(t.weight);
  }
  let terms = 0;
  for (const c of byX.values()) terms += c;
  return { groups: byX.size, termsPerGroup: byX.size ? terms / byX.size : 0, diagonal, normBound };
}

function applyCost(op: LightOperator, tables: boolean): number {
  return (op.diagonal ? 4 : 0) + op.groups * (tables ? 8 : 8 + 4 * op.termsPerGroup);
}

/** Operator applications of imaginary time 0 → β/2 (as propagateImaginaryTime schedules them). */
export function imaginaryTimeMatvecs(normBound: number, beta: number, tolerance: number): number {
  const tauTotal = (beta / 2) * normBound;
  if (tauTotal === 0) return 0;
  const steps = Math.max(1, Math.ceil(tauTotal / MAX_IMAGINARY_TIME_TAU));
  const tau = tauTotal / steps;
  return steps * chebyshevExpSeries('imaginary', tau, tolerance / (steps * Math.exp(2 * tau))).order;
}

function refuse(
  base: Omit<SweepPlan, 'feasible' | 'refusal' | 'sites'>,
  sites: number, field: string, limit: number, estimate: number, message: string,
): SweepPlan {
  return { ...base, feasible: false, refusal: { field, limit, estimate, message }, sites };
}
