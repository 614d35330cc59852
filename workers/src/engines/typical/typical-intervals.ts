/**
 * narrowIntervals — the typical engine's Chebyshev intervals narrowed from the rigorous Σ|w|
 * bounds to Lanczos estimates (propagators/lanczos-interval.ts), and the bounds to fall back on.
 *
 * Why: every Chebyshev cost scales with the half-width a. Σ|w| overestimates a many-body
 * spectrum's radius (a 4 × 4 transverse-field Ising torus at hx = 2.5: Σ|w| = 72, spectrum
 * ±45.1), and imaginary time pays twice: its sub-steps are capped by the rounding factor
 * e^{Δ_j(g − lo)}, which the estimate also shrinks (g = the Ritz value θ_min, lo just below it).
 * Measured on that torus (4 β up to 2, 100 times, 16 samples; tests/bench/typical): 29 504 → 12 864
 * applications in all, 461 → 201 per sample and β.
 *
 * Safety: the estimate is not a bound. runSample checks every real-time output's norm against
 * its truncation bound (a missed H1 interval breaks unitarity) and ⟨H0⟩ against the H0
 * interval, and throws IntervalMissError; the runner then redoes that sample on the bounds.
 * Deterministic: the Lanczos start vector is fixed, so every process narrows a spec the same way
 * (the service's sample blocks and `betasweep run` agree bit for bit).
 *
 * Cost: ≤ 2·DEFAULT_LANCZOS_STEPS applications (typically 20–40 each), once per spec and
 * process: the result is cached by spec hash (CACHE_SIZE entries; a sandboxed worker process
 * runs many sample blocks of one sweep). Memory: the two scratch vectors passed in.
 */
import { applyOperatorAffine } from '../../kernels/index.js';
import { lanczosInterval } from '../../propagators/index.js';
import type { LanczosIntervalReport } from '../../propagators/index.js';
import type { TypicalSetup } from './typical-setup.js';

/** Specs whose narrowed intervals a process keeps. */
export const CACHE_SIZE = 8;

/** The Lanczos reports of H0 and H1. */
export interface NarrowedIntervals {
  readonly h0: LanczosIntervalReport;
  readonly h1: LanczosIntervalReport;
}

const cache = new Map<string, NarrowedIntervals>();

/** Thrown by a sample whose results show that a narrowed interval missed part of the spectrum. */
export class IntervalMissError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'IntervalMissError';
  }
}

/**
 * The setup with narrowed h0Interval, h1Interval and h0Ground, plus the reports; `v` and `w` are
 * scratch vectors of 2·dim doubles (overwritten only when the spec is not cached).
 */
export function narrowIntervals(setup: TypicalSetup, v: Float64Array, w: Float64Array): { setup: TypicalSetup; reports: NarrowedIntervals } {
  const key = `${setup.specHash}|${setup.sites}`;
  let reports = cache.get(key);
  if (reports === undefined) {
    const { dim, h0Op, h1Op } = setup;
    reports = {
      h0: lanczosInterval((i, o, a, b, g) => applyOperatorAffine(h0Op, 1, i, o, a, b, g), dim, setup.h0Bound, v, w),
      h1: lanczosInterval((i, o, a, b, g) => applyOperatorAffine(h1Op, 1, i, o, a, b, g), dim, setup.h1Bound, v, w),
    };
    cache.set(key, reports);
    if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  }
  const h0Interval = reports.h0.interval;
  return {
    setup: {
      ...setup,
      h0Interval,
      h1Interval: reports.h1.interval,
      h0Ground: Math.min(h0Interval.hi, Math.max(h0Interval.lo, reports.h0.groundBound)),
    },
    reports,
  };
}

/** The setup on its rigorous bounds (the fallback after an IntervalMissError). */
export function boundIntervals(setup: TypicalSetup): TypicalSetup {
  return { ...setup, h0Interval: setup.h0Bound, h1Interval: setup.h1Bound, h0Ground: setup.h0Bound.hi };
}
