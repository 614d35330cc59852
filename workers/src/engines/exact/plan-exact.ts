/**
 * planExact — cost, memory and accuracy of the exact engine for a spec, or a refusal.
 *
 * Memory (one branch of one β, the plan's fan-out): 3 doubled-state vectors of 16·4^N bytes
 * (state + 2 Chebyshev work vectors; a branch of several β keeps a 4th, the thermal copy) plus
 * the compiled tables (8·2^N + 16·2^N per flip-mask group, per operator). Budget:
 * MEMORY_BUDGET_BYTES. Sites: at most MAX_EXACT_SITES.
 * Work: operator applications × their cost, counted exactly as runBranch will schedule them
 * (same tolerances, same Chebyshev orders), plus the measurements at every grid time:
 *   apply (A⊗1 + 1⊗B): (3 + 8(G_A + G_B))·4^N flops (kernel header) + 8·4^N for the Chebyshev axpy,
 *   one Pauli expectation: ≈ 10·4^N flops.
 * Seconds = flops / ASSUMED_FLOPS_PER_SECOND (a rough one-core figure for these memory-bound
 * passes: a 10-site Ising quench ran at ≈ 2.4 Gflop/s by this count on a shared 2-core box).
 * Accuracy: spec.tolerance, unless the rounding allowance alone (error-budget.ts) would exceed
 * half of it — then the plan refuses (field 'tolerance').
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { expandObservables } from '../../observables/expand-observables.js';
import { buildHamiltonian } from '../../physics/build-hamiltonian.js';
import {
  chebyshevExpSeries, MAX_IMAGINARY_TIME_TAU, MAX_REAL_TIME_TAU,
} from '../../propagators/index.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { refusePlan } from '../plan-refusal.js';
import { planSites } from '../plan-sites.js';
import { doubledOperators } from './doubled-operators.js';
import type { DoubledOperators } from './doubled-operators.js';
import { errorBudget, imaginaryTarget, quenchCalls, ROUNDING_PER_MATVEC } from './error-budget.js';
import type { ErrorBudget } from './error-budget.js';

/** Largest lattice the exact engine runs (4^12 amplitudes = 268 MB per vector). */
export const MAX_EXACT_SITES = 12;
/** Peak memory one branch may use. */
export const MEMORY_BUDGET_BYTES = 4 * 2 ** 30;
/** Rough single-core throughput assumed for the time estimate, flop/s. */
export const ASSUMED_FLOPS_PER_SECOND = 2e9;
/** Doubled-state vectors held by a one-β branch (state + 2 work). */
export const VECTORS_PER_BRANCH = 3;
/** Distinct real-time step lengths costed exactly before the plan quantises them. */
const DISTINCT_STEPS_EXACT = 64;

const REASON = 'the doubled state vector (4^N amplitudes), matrix-free Pauli kernels, Chebyshev propagators with truncation bounds';

/** Plan of the exact engine (see file header). Never throws on a valid spec. */
export function planExact(spec: SweepSpec, name = 'exact'): SweepPlan {
  const betas = betaGrid(spec);
  const base = {
    engine: name, reason: REASON, memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: betas.map((_, b) => [b]),
  };
  const checked = planSites(spec, base, MAX_EXACT_SITES, 'the exact engine holds 4^N amplitudes');
  if (!checked.ok) return checked.plan;
  const { sites } = checked;
  const vectorBytes = 16 * 4 ** sites;
  let ops: DoubledOperators;
  let budget: ErrorBudget;
  let primitives: number;
  try {
    const graph = buildLattice(spec.lattice);
    const h0 = buildHamiltonian(spec.h0, graph);
    const h1 = buildHamiltonian(spec.h1, graph);
    const layout = expandObservables(spec, graph, h0, h1);
    ops = doubledOperators(h0, h1);
    budget = errorBudget(layout, spec.tolerance, sites);
    primitives = layout.primitives.length;
  } catch (e) {
    return refusePlan(base, sites, 'spec', 0, 0, `the spec cannot be set up: ${(e as Error).message}`);
  }
  const tables = [ops.h0, ops.h1, ops.aux].reduce((s, op) => s + tableBytes(op), 0);
  const memoryBytes = VECTORS_PER_BRANCH * vectorBytes + tables;
  if (memoryBytes > MEMORY_BUDGET_BYTES) {
    return refusePlan({ ...base, memoryBytes }, sites, 'memory', MEMORY_BUDGET_BYTES, memoryBytes,
      `one branch needs ${memoryBytes} bytes, above the budget of ${MEMORY_BUDGET_BYTES} bytes`);
  }

  const times = timeGrid(spec);
  const amps = 4 ** sites;
  const costImag = (3 + 8 * groupCount(ops.h0)) * amps + 8 * amps;
  const costReal = (3 + 8 * (groupCount(ops.h1) + groupCount(ops.aux))) * amps + 8 * amps;
  const costPoint = primitives * 10 * amps + (3 + 8 * groupCount(ops.h1)) * amps + 2 * amps;
  const realMatvecs = realTimeMatvecs(ops, times, budget.real / quenchCalls(times));
  let flops = 0;
  let worstRounding = 0;
  for (const beta of betas) {
    const target = imaginaryTarget(budget, spec.tolerance, ops.h0.normBound, [beta]);
    const imag = imaginaryTimeMatvecs(ops, beta, target / budget.kappa);
    const real = beta === 0 ? 0 : realMatvecs; // |I⟩ is stationary: measured, not propagated
    flops += imag * costImag + real * costReal + times.length * costPoint;
    worstRounding = Math.max(worstRounding, ROUNDING_PER_MATVEC * (imag + real));
  }
  const floor = 4 * budget.weight * worstRounding;
  if (floor > spec.tolerance / 2) {
    return refusePlan({ ...base, memoryBytes, flops, seconds: flops / ASSUMED_FLOPS_PER_SECOND }, sites, 'tolerance',
      spec.tolerance, floor,
      `the rounding allowance of ~${floor.toExponential(2)} (${Math.round(worstRounding / ROUNDING_PER_MATVEC)} operator applications) exceeds half the tolerance ${spec.tolerance}`);
  }
  return {
    ...base, feasible: true, refusal: null, memoryBytes, flops,
    seconds: flops / ASSUMED_FLOPS_PER_SECOND, sites,
  };
}

/** Operator applications of imaginary time from 0 to β (as propagateImaginaryTime schedules them). */
export function imaginaryTimeMatvecs(ops: DoubledOperators, beta: number, tolerance: number): number {
  const halfWidth = (ops.h0Interval.hi - ops.h0Interval.lo) / 2;
  const tauTotal = (beta / 2) * halfWidth;
  if (tauTotal === 0) return 0;
  const steps = Math.max(1, Math.ceil(tauTotal / MAX_IMAGINARY_TIME_TAU));
  const tau = tauTotal / steps;
  return steps * chebyshevExpSeries('imaginary', tau, tolerance / (steps * Math.exp(2 * tau))).order;
}

/** Operator applications of one quench over the grid (as propagateRealTime schedules them). */
export function realTimeMatvecs(ops: DoubledOperators, times: readonly number[], callTolerance: number): number {
  const halfWidth = (ops.quenchInterval.hi - ops.quenchInterval.lo) / 2;
  if (halfWidth === 0) return 0;
  const spans = new Map<number, number>();
  let prev = 0;
  for (const t of times) {
    if (t > prev) spans.set(t - prev, (spans.get(t - prev) ?? 0) + 1);
    prev = t;
  }
  const quantise = spans.size > DISTINCT_STEPS_EXACT;
  let total = 0;
  for (const [dt, count] of spans) {
    let tauTotal = dt * halfWidth;
    if (quantise) tauTotal = 1.05 ** Math.ceil(Math.log(tauTotal) / Math.log(1.05)); // round up
    const steps = Math.max(1, Math.ceil(tauTotal / MAX_REAL_TIME_TAU));
    total += count * steps * chebyshevExpSeries('real', tauTotal / steps, callTolerance / steps).order;
  }
  return total;
}

function groupCount(op: CompiledOperator): number {
  return op.groups.length + (op.diagonal === null ? 0 : 0.5);
}

function tableBytes(op: CompiledOperator): number {
  return (op.diagonal === null ? 0 : 8 * op.dim) + 16 * op.dim * op.groups.length;
}
