/**
 * resumSeries — the value of a truncated power series f(x) = Σ_{k≤N} c_k x^k at x ≥ 0 with an
 * estimate of its truncation error, from the partial sum or from Padé approximants.
 *
 * 1. Structure: the stride s = gcd{k ≥ 1 : c_k ≠ 0} (e.g. 2 for even series); work in
 *    u = x^s with b_j = c_{sj}.
 * 2. Radius of convergence in u from the last coefficients: the smallest of the root test
 *    |b_j|^{−1/j} over the last ROOT_TERMS non-zero ones (Cauchy–Hadamard) and, for the last two,
 *    the ratio test max(|b_{j−1}/b_j|, |b_{j−2}/b_j|^{1/2}) (common practice for series analysis,
 *    e.g. Guttmann in "Phase Transitions and Critical Phenomena" vol. 13, 1989); the two-step
 *    ratio keeps a small b_{j−1} (weak odd orders) from faking a tiny radius.
 * 3. Partial sum with a geometric tail: with q = u/R < 1 and t the largest of the last
 *    ROOT_TERMS non-zero terms |b_j u^j| carried to the last order by q^{J−j},
 *    error ≈ (TAIL_SAFETY + SHORT_SERIES_SAFETY/k) · t · q/(1 − q), k the number of non-zero
 *    coefficients; q ≥ 1 → the sum is outside its window.
 * 4. Padé approximants [L/M] with L + M ∈ {J, J−1}, 1 ≤ M, |L − M| ≤ 2 (pade.ts), dropped when
 *    Q has a zero on [0, u] or is nearly zero there; the spread of the survivors estimates the
 *    error (PADE_SAFETY × spread, and inside the radius at least PADE_FLOOR × the partial sum's
 *    tail: agreement among approximants is not proof). Used when it beats the partial sum, or beyond the radius up
 *    to PADE_REACH·R when at least MIN_PADE_AGREE approximants survive. Approximants are counted
 *    once per reduced degree pair [l/m] (trailing coefficients below ZERO_RELATIVE dropped): when
 *    coefficients vanish by structure (an odd λ-series of a quench double series) whole blocks of
 *    the Padé table are one rational function, whose copies would fake a spread of ~1e-13.
 * 5. Rounding: Σ rounding_k x^k is added to every error.
 * Every returned value carries an error; `inWindow` is false when the error is infinite.
 * Cost: O(N⁴) at most (a few small Padé solves).
 */
import { evaluatePade, padeApproximant, padeDenominator } from './pade.js';

/**
 * Factor applied to the geometric tail estimate of a partial sum, for long series; a series with
 * only k non-zero coefficients gets TAIL_SAFETY + SHORT_SERIES_SAFETY/k (a radius read from a
 * few coefficients misses late growth: seen on 2×3 clusters at order 5, where the 6th
 * coefficient jumped 3.5× above the trend).
 */
export const TAIL_SAFETY = 2;
/** Extra safety for short series (see TAIL_SAFETY). */
export const SHORT_SERIES_SAFETY = 8;
/** Factor applied to the spread of Padé approximants. */
export const PADE_SAFETY = 2;
/** Within the radius a Padé error is at least this fraction of the partial sum's tail estimate. */
export const PADE_FLOOR = 0.1;
/** Padé approximants are trusted up to this multiple of the estimated radius. */
export const PADE_REACH = 2;
/** Padé approximants that must survive before a value beyond the radius is reported. */
export const MIN_PADE_AGREE = 3;
/** Non-zero coefficients (from the end) that enter the root test. */
export const ROOT_TERMS = 3;
/** A coefficient is structural zero when below this fraction of its neighbours' geometric mean. */
export const ZERO_RELATIVE = 1e-9;

/** Options of {@link resumSeries}. */
export interface ResumOptions {
  /** Rounding bound per coefficient (adds Σ rounding_k x^k to the error). */
  rounding?: ArrayLike<number>;
  /**
   * Radius (in x) to assume when the coefficients cannot give one (fewer than two non-zero
   * coefficients beyond c_0). @defaultValue Infinity (then the error of an all-zero tail is 0)
   */
  fallbackRadius?: number;
  /** Size of the next coefficients to assume with `fallbackRadius` (x-scale 1). @defaultValue 1 */
  fallbackScale?: number;
  /** Allow Padé approximants. @defaultValue true */
  pade?: boolean;
}

/** A resummed value with its error estimate. */
export interface SeriesEstimate {
  readonly value: number;
  /** Absolute error estimate (Infinity outside the window). */
  readonly error: number;
  readonly method: 'partial-sum' | 'pade';
  /** Estimated radius of convergence in x. */
  readonly radius: number;
  readonly inWindow: boolean;
}

/** Stride and radius (in x) of a coefficient list (see file header, steps 1–2). */
export function seriesShape(c: ArrayLike<number>): { stride: number; radius: number; nonzero: number } {
  const N = c.length - 1;
  const nz: number[] = [];
  for (let k = 1; k <= N; k++) {
    const v = Math.abs(c[k]);
    if (v === 0 || !Number.isFinite(v)) continue;
    const left = k > 1 ? Math.abs(c[k - 1]) : 0;
    const right = k < N ? Math.abs(c[k + 1]) : 0;
    const ref = left > 0 && right > 0 ? Math.sqrt(left * right) : Math.max(left, right);
    if (ref > 0 && v < ZERO_RELATIVE * ref) continue;
    nz.push(k);
  }
  if (nz.length === 0) return { stride: 1, radius: Infinity, nonzero: 0 };
  let s = 0;
  for (const k of nz) s = gcd(s, k);
  const js = nz.map((k) => k / s);
  const b = (j: number) => Math.abs(c[j * s]);
  // Root test on the last ROOT_TERMS non-zero coefficients: robust when small coefficients
  // alternate with large ones (a weak field's odd orders), and conservative when the
  // coefficients carry an extensive prefactor (|c_k|^{−1/k} then underestimates R).
  let radiusU = Infinity;
  for (const j of js.slice(-ROOT_TERMS)) radiusU = Math.min(radiusU, b(j) ** (-1 / j));
  // Ratio test on the last two coefficients, each against the larger of its one- and two-step
  // ratios (|b_{j−1}/b_j| alone fails when b_{j−1} is anomalously small); b_0 is left out.
  for (const j of js.slice(-2)) {
    let rj = 0;
    for (let d = 1; d <= 2; d++) if (j - d >= 1 && b(j - d) > 0) rj = Math.max(rj, (b(j - d) / b(j)) ** (1 / d));
    if (rj > 0) radiusU = Math.min(radiusU, rj);
  }
  return { stride: s, radius: radiusU ** (1 / s), nonzero: nz.length };
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

/**
 * Value and error estimate of Σ c_k x^k at x (see file header).
 * @throws RangeError if x is negative or not finite, or c is empty.
 */
export function resumSeries(c: ArrayLike<number>, x: number, options: ResumOptions = {}): SeriesEstimate {
  const { rounding, fallbackRadius = Infinity, fallbackScale = 1, pade = true } = options;
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`x must be finite and ≥ 0; got ${String(x)}`);
  if (c.length === 0) throw new RangeError('resumSeries: no coefficients');
  const N = c.length - 1;
  let round = 0;
  if (rounding) for (let k = 0; k < rounding.length && k <= N; k++) round += Math.abs(rounding[k]) * x ** k;
  let sum = 0;
  for (let k = N; k >= 0; k--) sum = sum * x + c[k];
  if (x === 0) return { value: c[0], error: round, method: 'partial-sum', radius: seriesShape(c).radius, inWindow: true };

  const shape = seriesShape(c);
  if (shape.nonzero < 2) {
    // Too few coefficients to read a radius: assume the fallback radius. With no non-zero
    // coefficient beyond c_0 the first possible correction is of order N + 1.
    const q = x / fallbackRadius;
    let error: number;
    if (q >= 1) error = Infinity;
    else if (shape.nonzero === 0) error = TAIL_SAFETY * fallbackScale * q ** (N + 1) / (1 - q);
    else {
      const k = lastNonzero(c);
      error = TAIL_SAFETY * Math.abs(c[k]) * x ** k * q / (1 - q);
    }
    error += round;
    return { value: sum, error, method: 'partial-sum', radius: fallbackRadius, inWindow: Number.isFinite(error) };
  }
  const s = shape.stride;
  const J = Math.floor(N / s);
  const b = new Float64Array(J + 1);
  for (let j = 0; j <= J; j++) b[j] = c[j * s];
  const u = x ** s;
  const Ru = shape.radius ** s;
  const q = u / Ru;
  let lastJ = J;
  while (lastJ > 0 && b[lastJ] === 0) lastJ--;
  // Size of the last term, taken as the largest of the last ROOT_TERMS non-zero terms carried
  // to order lastJ with the ratio q (a small last coefficient must not hide a large trend).
  let tMax = 0;
  let seen = 0;
  for (let j = lastJ; j > 0 && seen < ROOT_TERMS; j--) {
    if (b[j] === 0) continue;
    seen++;
    tMax = Math.max(tMax, Math.abs(b[j]) * u ** j * q ** (lastJ - j));
  }
  const safety = TAIL_SAFETY + SHORT_SERIES_SAFETY / shape.nonzero;
  const tail = q < 1 ? safety * tMax * q / (1 - q) : Infinity;

  let best: SeriesEstimate = { value: sum, error: tail + round, method: 'partial-sum', radius: shape.radius, inWindow: Number.isFinite(tail) };
  if (!pade || J < 3) return best;
  const values: Array<{ v: number; order: number; offDiag: number }> = [];
  const reduced = new Set<string>();
  for (let total = J; total >= J - 1; total--) {
    for (let M = 1; M <= total; M++) {
      const L = total - M;
      if (Math.abs(L - M) > 2) continue;
      const a = padeApproximant(b, L, M);
      if (a === null || !denominatorClear(a, u)) continue;
      // Coefficients that vanish by structure (e.g. an odd series) make blocks of the Padé table
      // equal to one reduced approximant: count each reduced [l/m] once, or their agreement
      // would look like convergence.
      const key = `${effectiveDegree(a.p)}/${effectiveDegree(a.q)}`;
      if (reduced.has(key)) continue;
      const v = evaluatePade(a, u);
      if (Number.isFinite(v)) {
        reduced.add(key);
        values.push({ v, order: total, offDiag: Math.abs(L - M) });
      }
    }
  }
  if (values.length < 2) return best;
  values.sort((p, r) => r.order - p.order || p.offDiag - r.offDiag);
  const v0 = values[0].v;
  let spread = 0;
  for (const e of values) spread = Math.max(spread, Math.abs(e.v - v0));
  const padeError = Math.max(PADE_SAFETY * spread, Number.isFinite(tail) ? PADE_FLOOR * tail : 0) + round;
  const usable = q < 1 || (q < PADE_REACH ** s && values.length >= MIN_PADE_AGREE);
  if (usable && padeError < best.error) {
    best = { value: v0, error: padeError, method: 'pade', radius: shape.radius, inWindow: true };
  }
  return best;
}

/** Degree of a polynomial with coefficients below ZERO_RELATIVE × the largest treated as zero. */
function effectiveDegree(p: Float64Array): number {
  let big = 0;
  for (const v of p) big = Math.max(big, Math.abs(v));
  let d = p.length - 1;
  while (d > 0 && !(Math.abs(p[d]) > ZERO_RELATIVE * big)) d--;
  return d;
}

function lastNonzero(c: ArrayLike<number>): number {
  for (let k = c.length - 1; k > 0; k--) if (c[k] !== 0) return k;
  return 0;
}

/** Denominator free of zeros on [0, u] (sampled) and not small there. */
function denominatorClear(a: { M: number; q: Float64Array; L: number; p: Float64Array }, u: number): boolean {
  const SAMPLES = 64;
  for (let i = 0; i <= SAMPLES; i++) {
    const d = padeDenominator(a, (u * i) / SAMPLES * 1.05);
    if (!(d > 0.05)) return false;
  }
  return true;
}
