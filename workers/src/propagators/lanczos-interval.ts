/**
 * lanczosInterval — a tight interval for the spectrum of a Hermitian Op, estimated from the
 * extremal Ritz values of a Lanczos run and widened by a margin; never wider than a rigorous
 * bound the caller supplies (for a Pauli sum: shift ± Σ|w|).
 *
 * Method (Lanczos 1950; Golub & Van Loan, Matrix Computations, 4th ed., §10.1): from a unit
 * start vector v_1 (seeded random phases), β_0 = 0,
 *   w = Op·v_j − β_{j−1}·v_{j−1},  α_j = Re⟨v_j|w⟩,  w ← w − α_j·v_j,  β_j = ‖w‖,  v_{j+1} = w/β_j,
 * giving the real tridiagonal T_k (α on the diagonal, β off it). Every CHECK_EVERY steps T_k is
 * diagonalised (hermitianTridiagonalQl); with T_k·s = θ·s, the Ritz value θ has the residual
 * bound ρ = β_k·|s_k| (an eigenvalue of Op lies within ρ of θ). The run stops when both extremal
 * residuals are ≤ RESIDUAL_TARGET·(θ_max − θ_min), when β_k vanishes (an invariant subspace:
 * the extremes are exact) or after maxSteps.
 * No reorthogonalisation: in floating point it only produces repeated copies of converged Ritz
 * values (Paige 1976), which does not move the extremes.
 *
 * Result: [θ_min − ρ_min − m, θ_max + ρ_max + m], m = margin·(θ_max − θ_min), intersected with
 * the rigorous bound. This is an ESTIMATE (common practice for Chebyshev methods, e.g. Zhou &
 * Li, Linear Algebra Appl. 435, 480 (2011), from memory): θ_min ≥ λ_min always, but nothing
 * guarantees that Lanczos has found the extreme eigenvalue rather than one inside. Callers must
 * be able to detect a miss (a Chebyshev series evaluated outside [−1, 1] grows like
 * (|x| + √(x²−1))^k, so a real-time output loses its unit norm) and fall back to the bound.
 * `groundBound` = θ_min is a rigorous upper bound on λ_min (a Rayleigh quotient), up to rounding.
 *
 * Cost: ≤ maxSteps applications of Op, 5 vector passes per step, and an O(k²) tridiagonal
 * eigenproblem every CHECK_EVERY steps. Memory: 2 vectors of the state's length (the caller's).
 * Deterministic: the start vector depends on `seed` only.
 */
import { hermitianTridiagonalQl } from '../linalg/hermitian-tridiagonal-ql.js';
import { fillRandomPhaseVector } from '../random/index.js';
import type { AffineApply, SpectralInterval } from './types.js';

/** Stop when both extremal Ritz residual bounds are at most this fraction of the Ritz spread. */
export const RESIDUAL_TARGET = 1e-4;
/** Default widening on each side, as a fraction of the Ritz spread θ_max − θ_min. */
export const DEFAULT_MARGIN = 0.01;
/** Default most Lanczos steps. */
export const DEFAULT_LANCZOS_STEPS = 120;
/** Steps between convergence checks. */
export const CHECK_EVERY = 10;

/** Options of {@link lanczosInterval}. */
export interface LanczosIntervalOptions {
  /** Most Lanczos steps (applications of Op). @defaultValue DEFAULT_LANCZOS_STEPS */
  maxSteps?: number;
  /** Widening on each side as a fraction of the Ritz spread. @defaultValue DEFAULT_MARGIN */
  margin?: number;
  /** Seed of the start vector's phases. @defaultValue 0x5eed */
  seed?: number;
}

/** What the estimate found. */
export interface LanczosIntervalReport {
  /** The interval to use: the widened Ritz interval within the rigorous bound. */
  readonly interval: SpectralInterval;
  /** Extremal Ritz values θ_min, θ_max. */
  readonly ritz: SpectralInterval;
  /** Residual bounds ρ_min, ρ_max of the extremal Ritz values. */
  readonly residuals: readonly [number, number];
  /** θ_min: an upper bound on the lowest eigenvalue (a Rayleigh quotient). */
  readonly groundBound: number;
  /** Lanczos steps taken (= applications of Op). */
  readonly steps: number;
  /** Whether the stopping test was met (else maxSteps ran out; the interval is still widened by ρ). */
  readonly converged: boolean;
}

/**
 * Estimates the spectral interval of Op (see file header). `v` and `w` are scratch vectors of
 * 2·dim doubles (complex interleaved), overwritten.
 * @throws RangeError on a bad bound, dim, buffer or option.
 */
export function lanczosInterval(
  apply: AffineApply, dim: number, bound: SpectralInterval, v: Float64Array, w: Float64Array,
  options: LanczosIntervalOptions = {},
): LanczosIntervalReport {
  const { maxSteps = DEFAULT_LANCZOS_STEPS, margin = DEFAULT_MARGIN, seed = 0x5eed } = options;
  if (!Number.isFinite(bound.lo) || !Number.isFinite(bound.hi) || bound.lo > bound.hi) {
    throw new RangeError(`bound must be finite with lo ≤ hi; got [${bound.lo}, ${bound.hi}]`);
  }
  if (!Number.isInteger(dim) || dim < 1) throw new RangeError(`dim must be a positive integer; got ${dim}`);
  if (v.length !== 2 * dim || w.length !== 2 * dim || v === w) throw new RangeError(`v and w must be distinct vectors of ${2 * dim} doubles`);
  if (!Number.isInteger(maxSteps) || maxSteps < 1) throw new RangeError(`maxSteps must be an integer ≥ 1; got ${maxSteps}`);
  if (!(margin >= 0) || !Number.isFinite(margin)) throw new RangeError(`margin must be finite and ≥ 0; got ${margin}`);
  if (bound.hi === bound.lo || dim === 1) {
    // Op is a multiple of 1 (a point bound, or a 1-dimensional space): nothing to tighten.
    return { interval: { ...bound }, ritz: { ...bound }, residuals: [0, 0], groundBound: bound.hi, steps: 0, converged: true };
  }

  fillRandomPhaseVector(v, dim, seed >>> 0, 0);
  w.fill(0);
  const steps = Math.min(maxSteps, dim);
  const alpha = new Float64Array(steps);
  const beta = new Float64Array(steps);
  let cur = v, prev = w;
  let k = 0;
  let ritz = { lo: 0, hi: 0, rLo: 0, rHi: 0 };
  let converged = false;
  while (k < steps) {
    // prev ← Op·cur − β_{k−1}·prev  (prev holds v_{k−1}, or zeros at k = 0)
    apply(cur, prev, 1, 0, k === 0 ? 0 : -beta[k - 1]);
    let a = 0;
    for (let i = 0; i < cur.length; i++) a += cur[i] * prev[i];
    let b2 = 0;
    for (let i = 0; i < cur.length; i++) {
      const x = prev[i] - a * cur[i];
      prev[i] = x;
      b2 += x * x;
    }
    alpha[k] = a;
    beta[k] = Math.sqrt(b2);
    k += 1;
    const invariant = beta[k - 1] <= 1e-14 * Math.max(Math.abs(bound.lo), Math.abs(bound.hi), 1);
    if (invariant || k === steps || k % CHECK_EVERY === 0) {
      ritz = extremalRitz(alpha, beta, k, invariant);
      const spread = ritz.hi - ritz.lo;
      if (invariant || Math.max(ritz.rLo, ritz.rHi) <= RESIDUAL_TARGET * spread) { converged = true; break; }
      if (k === steps) break;
    }
    const inv = 1 / beta[k - 1];
    for (let i = 0; i < prev.length; i++) prev[i] *= inv;
    const t = prev; prev = cur; cur = t;
  }
  const m = margin * (ritz.hi - ritz.lo);
  const lo = Math.max(bound.lo, ritz.lo - ritz.rLo - m);
  const hi = Math.min(bound.hi, ritz.hi + ritz.rHi + m);
  return {
    interval: lo <= hi ? { lo, hi } : { ...bound },
    ritz: { lo: ritz.lo, hi: ritz.hi },
    residuals: [ritz.rLo, ritz.rHi],
    groundBound: Math.min(bound.hi, ritz.lo),
    steps: k,
    converged,
  };
}

/** Extremal eigenvalues of T_k and their residual bounds β_k·|s_k|. */
function extremalRitz(alpha: Float64Array, beta: Float64Array, k: number, invariant: boolean) {
  const d = alpha.slice(0, k);
  const e = beta.slice(0, Math.max(0, k - 1));
  const z = new Float64Array(k * k);
  for (let i = 0; i < k; i++) z[i * k + i] = 1;
  if (hermitianTridiagonalQl(k, d, e, z) !== 0) throw new Error('the Lanczos tridiagonal eigenproblem did not converge');
  const bk = invariant ? 0 : beta[k - 1];
  // Column-major Z: the last component of eigenvector j is z[j·k + k − 1].
  return { lo: d[0], hi: d[k - 1], rLo: bk * Math.abs(z[k - 1]), rHi: bk * Math.abs(z[(k - 1) * k + k - 1]) };
}
