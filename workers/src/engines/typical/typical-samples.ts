/**
 * The raw per-sample accumulators of the typical engine: everything the pooled ratio
 * estimators and their jackknife need, and nothing else. A set of samples can be split over
 * any number of branches and merged later (merge-typical-samples.ts); the estimates of a
 * merged set do not depend on how it was split.
 *
 * Per (sample r, β) with ψ_r(β) = e^{−βH0/2}|r⟩, ψ̂ = ψ/‖ψ‖ and ψ̂(t) = e^{−iH1t}ψ̂:
 *   lnWeight        ln‖ψ_r(β)‖² = ln⟨r|e^{−βH0}|r⟩        (Z ≈ 2^N·mean_r e^{lnWeight})
 *   energy          ⟨ψ̂|H0|ψ̂⟩
 *   energyVariance  ⟨ψ̂|(H0 − energy)²|ψ̂⟩                 (≥ 0; no cancellation)
 *   primitives      Re⟨ψ̂(t)|P_p|ψ̂(t)⟩/‖ψ̂(t)‖², times × primitives, row-major by time
 * plus the sample's own health figures.
 */

/** One sample at one β. */
export interface TypicalSampleRecord {
  /** Sample index k: the random vector is that of (spec.seed, k). */
  readonly sample: number;
  /** Index into the canonical β grid. */
  readonly betaIndex: number;
  /** ln⟨r|e^{−βH0}|r⟩ (‖r‖ = 1). */
  readonly lnWeight: number;
  /** ⟨ψ̂|H0|ψ̂⟩. */
  readonly energy: number;
  /** ⟨ψ̂|(H0 − energy)²|ψ̂⟩. */
  readonly energyVariance: number;
  /** Re⟨P_p⟩ at time index t in [t·primitives + p] (length times × primitives). */
  readonly primitives: Float64Array;
  /** Relative error estimate of ψ_r(β) from imaginary-time truncation and rounding (κ-scaled; typical-budget.ts). */
  readonly thermalError: number;
  /** Relative state error estimate δ(t) at each grid time (thermalError + real-time bounds so far). */
  readonly stateErrors: Float64Array;
  /** max_t |⟨H1⟩_r(t) − ⟨H1⟩_r(0)| (exactly conserved for each sample; rounding only). */
  readonly h1Drift: number;
  /** max_t |‖ψ̂(t)‖ − 1|. */
  readonly normDrift: number;
  /** Operator applications spent on this β (imaginary time from the branch's previous β, the quench, ⟨H0⟩, ⟨H1⟩). */
  readonly matvecs: number;
}

/** A set of samples of one spec (any β indices, any sample indices). */
export interface TypicalSamples {
  /** Physics hash of the spec the samples belong to. */
  readonly specHash: string;
  /** Number of primitives per time (checks the layout agrees on merge). */
  readonly primitives: number;
  /** Number of grid times per record. */
  readonly times: number;
  /** Records, sorted by (betaIndex, sample); at most one per (betaIndex, sample). */
  readonly records: readonly TypicalSampleRecord[];
}

/** A half-open range of sample indices [start, start + count). */
export interface SampleRange {
  readonly start: number;
  readonly count: number;
}
