/**
 * planMps — cost, memory and accuracy of the mps engine for a spec, or a refusal.
 *
 * Reach: chains, ladders and explicit bond lists lined up as a chain (chain-order.ts), with
 * one- and two-site terms; two-site terms more than one chain step apart go through swap gates
 * (apply-long-gate.ts). Refused: two-dimensional lattices (field 'lattice.kind') and terms on
 * more than two sites (field 'h0'/'h1', naming the term). Fan-out: one branch per β.
 * Bond dimension used for the estimates: χ = min(maxBond, 4^⌊L/2⌋) — the cap, so the estimates
 * are upper bounds when the entanglement stays below it.
 * Memory: MPS_COPIES states (thermal, half-step check of the imaginary time, quench copy,
 * step-doubling copy) of ≤ L·4·χ²·16 bytes, plus WORKSPACE_PER_CHI2·χ² bytes of gate and SVD
 * scratch. Budget MEMORY_BUDGET_BYTES (refusal field 'memory').
 * Work (flops): updates × UPDATE_FLOPS·χ³ (θ, the truncated SVD of a 4χ × 4χ matrix and the
 * centre moves; ≈ 950·χ³ counted on a χ = 64 TEBD θ), the updates counted per Trotter layer
 * (a long bond of span r costs 2(r − 1) swaps + 1 gate; trotter-schedule.ts updatesFor),
 * imaginary time run three times over (the state and the half-step check), measurements
 * (Σ string spans + L)·64·χ³ per grid time, the energy variance ≈ L·MPO_ENTRY_PAIRS·64·χ³ per β.
 * Seconds = flops / ASSUMED_FLOPS_PER_SECOND. An upper estimate: the L = 64, t ≤ 5 bench
 * (tests/bench/mps) reaches the cap only from t ≈ 2 and took ~4× less than planned (830–1030 s
 * against 3100–4200 s for β = 0.5–2, on a shared machine at load 1–4).
 * Accuracy: max(tolerance, a-priori Trotter estimate (mps-settings.ts) + 2·√(updates·truncation)).
 * When that exceeds the tolerance the plan stays feasible and says so in `reason`: the run
 * reports its measured error estimates with every point.
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import { updatesFor } from './trotter-schedule.js';
import { layerCosts } from './bond-model.js';
import { isRefusal, mpsSetup } from './mps-setup.js';
import { stepsFor } from './trotter-propagator.js';

/** Peak memory one branch may use. */
export const MEMORY_BUDGET_BYTES = 2 * 2 ** 30;
/** States held at once by a branch. */
export const MPS_COPIES = 4;
/** Gate and SVD scratch, bytes per χ². */
export const WORKSPACE_PER_CHI2 = 1200;
/** Flops of one two-site update per χ³ (measured ≈ 950 at χ = 64, LQ cap 1.5χ; rounded up). */
export const UPDATE_FLOPS = 1000;
/** Entry pairs of a nearest-neighbour MPO contraction per site (variance). */
export const MPO_ENTRY_PAIRS = 40;
/**
 * Rough single-core throughput assumed for the time estimate, flop/s (the SVD ran at 5–8
 * Gflop/s by its own count on an idle core here, 1–3 under load; the whole update is slower).
 */
export const ASSUMED_FLOPS_PER_SECOND = 2e9;

const REASON = 'purified MPS (local dimension 4), TEBD with H0 ⊗ 1 then H1 ⊗ 1 − 1 ⊗ H1ᵀ, truncated SVD';

/** Plan of the mps engine (see the file header). Never throws on a valid spec. */
export function planMps(spec: SweepSpec, name = 'mps'): SweepPlan {
  const base = { engine: name, reason: REASON, memoryBytes: 0, flops: 0, seconds: 0, accuracy: spec.tolerance, branches: [] as number[][] };
  const setup = mpsSetup(spec);
  if (isRefusal(setup)) {
    return { ...base, feasible: false, refusal: { field: setup.field, limit: 0, estimate: 0, message: setup.message }, sites: 0 };
  }
  const { graph, settings, betas, times } = setup;
  const L = graph.sites;
  const branches = betas.map((_, b) => [b]);
  const chi = Math.min(settings.maxBond, 4 ** Math.min(Math.floor(L / 2), 15));
  const chi2 = chi * chi;
  const chi3 = chi2 * chi;
  const memoryBytes = MPS_COPIES * L * 4 * chi2 * 16 + WORKSPACE_PER_CHI2 * chi2;
  if (memoryBytes > MEMORY_BUDGET_BYTES) {
    return {
      ...base, branches, memoryBytes, feasible: false, sites: L,
      refusal: {
        field: 'mps.maxBond', limit: MEMORY_BUDGET_BYTES, estimate: memoryBytes,
        message: `bond cap ${settings.maxBond} on ${L} sites needs ~${memoryBytes} bytes per branch, above the budget of ${MEMORY_BUDGET_BYTES}; lower mps.maxBond`,
      },
    };
  }
  const costs0 = layerCosts(setup.m0);
  const costs1 = layerCosts(setup.m1);
  let realSteps = 0;
  let prev = 0;
  for (const t of times) {
    realSteps += stepsFor(t - prev, settings.dt);
    prev = t;
  }
  realSteps += 8; // step-doubling check (2 × 4 half steps)
  let spans = L;
  for (const p of setup.strings) spans += p.factors[p.factors.length - 1].site - p.factors[0].site + 1;
  const pointFlops = spans * 64 * chi3;
  let flops = 0;
  for (const beta of betas) {
    const imagSteps = stepsFor(beta / 2, settings.dt);
    const updates = updatesFor(settings.order, imagSteps, costs0) + updatesFor(settings.order, 2 * imagSteps, costs0)
      + updatesFor(settings.order, realSteps, costs1);
    flops += updates * UPDATE_FLOPS * chi3;
    flops += times.length * pointFlops + 2 * L * MPO_ENTRY_PAIRS * 64 * chi3;
  }
  const truncationEstimate = 2 * Math.sqrt(settings.updates * settings.truncation);
  const estimate = settings.trotterEstimate + truncationEstimate;
  const accuracy = Math.max(spec.tolerance, estimate);
  const derived = settings.derived.length ? `; derived from the tolerance: ${settings.derived.join(', ')}` : '';
  const warn = estimate > spec.tolerance
    ? `; a-priori error estimate ${estimate.toExponential(1)} exceeds the tolerance (Trotter ${settings.trotterEstimate.toExponential(1)}, truncation ${truncationEstimate.toExponential(1)}): every point carries its measured estimate`
    : '';
  return {
    ...base,
    reason: `${REASON}; sites in ${setup.order.name}${setup.m0.long.length + setup.m1.long.length > 0 ? ', longer bonds through swap gates' : ''}; χ ≤ ${settings.maxBond}, order ${settings.order}, dt ${settings.dt.toPrecision(3)}, truncation ${settings.truncation.toExponential(1)}${derived}${warn}`,
    feasible: true, refusal: null, memoryBytes, flops, seconds: flops / ASSUMED_FLOPS_PER_SECOND,
    accuracy, branches, sites: L,
  };
}
