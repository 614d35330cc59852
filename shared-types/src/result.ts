/**
 * What a sweep produces: the plan, the streamed points, thermodynamics per β, diagnostics and
 * the final result document. Same shapes for the local CLI (a file) and the service (Redis).
 */
import { z } from 'zod';
import { SweepSpec } from './spec.js';

/** One measured series: a label such as "ZZ:nearest" and where it came from. */
export const SeriesInfo = z.object({
  /** Stable label, unique within a sweep, e.g. "Z:avg", "Z@3", "ZZ:nearest", "ZZ:d=1", "E:h0", "S_ZZ(3.1416,0)". */
  label: z.string(),
  /** Index into spec.observables. */
  observable: z.number().int().min(0),
}).strict().meta({ id: 'SeriesInfo' });
export type SeriesInfo = z.infer<typeof SeriesInfo>;

/**
 * One point of the quench: every series' value at (β index, time index), with its absolute
 * error estimate. `values[k]` and `errors[k]` belong to `series[k]` of the header.
 */
export const SweepPoint = z.object({
  /** Index into the header's (canonical, ascending) `betas`. */
  betaIndex: z.number().int().min(0),
  /** Index into the header's `times`. */
  timeIndex: z.number().int().min(0),
  /** One value per series, in header order. */
  values: z.array(z.number()),
  /** Absolute error estimate of each value (same length as `values`). */
  errors: z.array(z.number()),
  /**
   * Random samples the values rest on (the `typical` engine; absent for deterministic engines).
   * In the service a point is re-sent with a larger count as more samples are merged.
   */
  samples: z.number().int().min(1).optional(),
}).strict().refine((p) => p.values.length === p.errors.length, {
  path: ['errors'],
  params: { code: 'custom' },
  error: 'errors must have one entry per value',
}).meta({ id: 'SweepPoint' });
export type SweepPoint = z.infer<typeof SweepPoint>;

/** Thermodynamics at one β (before the quench). Extensive values are totals; `perSite` divides by N. */
export const ThermoRecord = z.object({
  /** Index into the header's `betas`. */
  betaIndex: z.number().int().min(0),
  /** The inverse temperature itself. */
  beta: z.number(),
  /** ln Z (Z = Tr e^{−βH0}). */
  lnZ: z.number(),
  /** E = ⟨H0⟩_β. */
  energy: z.number(),
  /** C = β²(⟨H0²⟩ − ⟨H0⟩²). */
  heatCapacity: z.number(),
  /** F = −ln Z / β; null at β = 0. */
  freeEnergy: z.number().nullable(),
  /** S = β(E − F) (= ln Z + βE, finite at β = 0). */
  entropy: z.number(),
  /** Absolute error estimates of the above, same keys. */
  errors: z.object({
    lnZ: z.number(), energy: z.number(), heatCapacity: z.number(),
    freeEnergy: z.number().nullable(), entropy: z.number(),
  }),
  /** Number of sites N. */
  sites: z.number().int().min(1),
}).strict().meta({ id: 'ThermoRecord' });
export type ThermoRecord = z.infer<typeof ThermoRecord>;

/** Health of one β branch's run: conservation checks and the propagator's own error bound. */
export const DiagnosticsRecord = z.object({
  /** Index into the header's `betas`. */
  betaIndex: z.number().int().min(0),
  /** max_t |⟨H1⟩(t) − ⟨H1⟩(0)| after the quench (should be ~0). */
  h1Drift: z.number(),
  /** max_t |‖ψ(t)‖/‖ψ(0)‖ − 1| during the real-time evolution. */
  normDrift: z.number(),
  /** ‖K|ψ(β)⟩‖/‖ψ(β)‖ when H1 = H0 (should be ~0), else null. */
  stationarityResidual: z.number().nullable(),
  /** Bound on the state error (2-norm, relative) accumulated by the propagators. */
  propagatorErrorBound: z.number(),
  /** Engine-specific figures (matvecs, Chebyshev orders, samples, truncation, …). */
  extra: z.record(z.string(), z.union([z.number(), z.string(), z.boolean(), z.null()])).default({}),
}).strict().meta({ id: 'DiagnosticsRecord' });
export type DiagnosticsRecord = z.infer<typeof DiagnosticsRecord>;

/** An engine's plan for a spec: what it will cost and deliver, or why it refuses. */
export const SweepPlan = z.object({
  /** The engine that planned (never `auto`: auto names the engine it picked). */
  engine: z.string(),
  /** Why this engine (meaningful for `auto`). */
  reason: z.string(),
  /** False: the engine refuses the spec (see `refusal`). */
  feasible: z.boolean(),
  /** Set when not feasible: which limit, and the estimate that broke it. */
  refusal: z.object({ field: z.string(), limit: z.number(), estimate: z.number(), message: z.string() }).nullable(),
  /** Peak memory estimate of one branch, bytes. */
  memoryBytes: z.number(),
  /** Estimated floating-point work of the whole sweep, flops. */
  flops: z.number(),
  /** Estimated wall time on one core, seconds. */
  seconds: z.number(),
  /** Accuracy the engine will deliver (absolute, on every observable). */
  accuracy: z.number(),
  /** How the sweep fans out: each branch is a list of β indices (run in ascending β). */
  branches: z.array(z.array(z.number().int().min(0))),
  /** Number of sites N of the lattice. */
  sites: z.number().int(),
}).strict().meta({ id: 'SweepPlan' });
export type SweepPlan = z.infer<typeof SweepPlan>;

/** Header written before the first point. */
export const SweepHeader = z.object({
  /** Physics hash of the spec (canonical-spec.ts). */
  specHash: z.string(),
  /** Engine name and version that computes the points. */
  engine: z.object({ name: z.string(), version: z.string() }),
  /** The canonical β grid (ascending, no repeats); `betaIndex` points into it. */
  betas: z.array(z.number()),
  /** The canonical time grid (ascending); `timeIndex` points into it. */
  times: z.array(z.number()),
  /** The measured series, in the order of every point's `values`. */
  series: z.array(SeriesInfo),
  /** The plan the run follows. */
  plan: SweepPlan,
}).strict().meta({ id: 'SweepHeader' });
export type SweepHeader = z.infer<typeof SweepHeader>;

/** The final result document (local `run --out`, and `GET /v1/sweeps/{id}/result`). */
export const SweepResult = z.object({
  /** Format tag and version of this document. */
  format: z.literal('betasweep.result/1'),
  /** The canonical spec that was run (label included). */
  spec: SweepSpec,
  /** Physics hash of `spec`. */
  specHash: z.string(),
  /** Engine name and version. */
  engine: z.object({ name: z.string(), version: z.string() }),
  /** The plan the run followed. */
  plan: SweepPlan,
  /** The β grid (ascending, no repeats). */
  betas: z.array(z.number()),
  /** The time grid (ascending). */
  times: z.array(z.number()),
  /** Every series with its full table of values and error estimates. */
  series: z.array(z.object({
    /** As in {@link SeriesInfo}. */
    label: z.string(),
    /** Index into spec.observables. */
    observable: z.number().int(),
    /** values[b][t], errors[b][t]: β index b, time index t. */
    values: z.array(z.array(z.number())),
    errors: z.array(z.array(z.number())),
  })),
  /** Thermodynamics per β. */
  thermo: z.array(ThermoRecord),
  /** Run health per β. */
  diagnostics: z.array(DiagnosticsRecord),
  /** Wall-clock times (ISO 8601) and the elapsed seconds. */
  timing: z.object({ startedAt: z.string(), finishedAt: z.string(), seconds: z.number() }),
}).strict().meta({ id: 'SweepResult' });
export type SweepResult = z.infer<typeof SweepResult>;
