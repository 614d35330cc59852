/**
 * propagateToTimes — e^{−i·s_j·Op}ψ for several offsets s_1 ≤ … ≤ s_B from ONE Chebyshev
 * recurrence: the vectors T_k(X)ψ do not depend on the time, only the coefficients do.
 *
 * Formula (Tal-Ezer & Kosloff, J. Chem. Phys. 81, 3967 (1984); the coefficients are those of
 * chebyshevExpSeries 'real'): with centre c, half-width a of an interval containing the
 * spectrum and X = (Op − c)/a,
 *   e^{−isOp}ψ = e^{−isc}·Σ_{k≤K(s)} c_k(s·a)·T_k(X)ψ,   c_0 = J_0(τ), c_k = 2(−i)^k J_k(τ),
 * T_{k+1}ψ = 2X·T_kψ − T_{k−1}ψ. Offset j receives the terms k ≤ K_j of its own truncated series,
 * so its error is that series' tail bound ε_j ≤ tolerance (relative 2-norm: ‖T_k(X)‖ ≤ 1), as
 * for a one-step propagateRealTime call. Rounding is not included.
 *
 * Cost: K_max = max_j K_j applications of Op and Σ_j (K_j + 1) complex axpys (one read-modify-
 * write pass each), against Σ_j K(s_j − s_{j−1}) applications when stepping from time to time —
 * the gain when an application costs many passes (one per flip group) and the steps are short.
 * Memory: ψ (overwritten: it holds T_k during the recurrence), one work vector, the B outputs.
 */
import { axpyPairMulti, scaleComplex } from '../../kernels/index.js';
import { chebyshevExpSeries } from '../../propagators/index.js';
import type { AffineApply, ChebyshevSeries, SpectralInterval } from '../../propagators/index.js';

/** What one multi-time propagation did. */
export interface MultiTimeReport {
  /** Applications of Op (K_max). */
  matvecs: number;
  /** Complex axpy terms (Σ_j (K_j + 1); two per output per pass of axpyPairMulti). */
  axpys: number;
  /** Truncation bound ε_j of each output (relative 2-norm). */
  errorBounds: number[];
  /** Order K_j of each output's series. */
  orders: number[];
}

/** The series of e^{−iτx} for each offset (τ = s·a), with the tolerance of each. */
export function offsetSeries(offsets: readonly number[], halfWidth: number, tolerance: number): ChebyshevSeries[] {
  return offsets.map((s) => chebyshevExpSeries('real', s * halfWidth, tolerance));
}

/**
 * outs[j] ← e^{−i·offsets[j]·Op}·ψ for every j (see file header). ψ is overwritten.
 * @throws RangeError on a bad interval, negative or unsorted offsets, or buffers of the wrong length.
 */
export function propagateToTimes(
  apply: AffineApply,
  interval: SpectralInterval,
  offsets: readonly number[],
  psi: Float64Array,
  work: Float64Array,
  outs: readonly Float64Array[],
  tolerance: number,
): MultiTimeReport {
  const { lo, hi } = interval;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo > hi) throw new RangeError(`interval must be finite with lo ≤ hi; got [${lo}, ${hi}]`);
  if (!(tolerance > 0)) throw new RangeError(`tolerance must be positive; got ${tolerance}`);
  if (outs.length < offsets.length) throw new RangeError(`outs must hold ${offsets.length} vectors; got ${outs.length}`);
  offsets.forEach((s, j) => {
    if (!(s >= 0) || !Number.isFinite(s) || (j > 0 && s < offsets[j - 1])) throw new RangeError(`offsets must be finite, ≥ 0 and ascending; offsets[${j}] = ${s}`);
    if (outs[j].length !== psi.length || outs[j] === psi || outs[j] === work) throw new RangeError(`outs[${j}] must be a distinct vector of psi's length ${psi.length}`);
  });
  if (work.length !== psi.length || work === psi) throw new RangeError(`work must be a distinct vector of psi's length ${psi.length}`);

  const centre = (lo + hi) / 2;
  const halfWidth = (hi - lo) / 2;
  const B = offsets.length;
  const report: MultiTimeReport = { matvecs: 0, axpys: 0, errorBounds: new Array<number>(B).fill(0), orders: new Array<number>(B).fill(0) };
  if (B === 0) return report;
  if (halfWidth === 0) {
    for (let j = 0; j < B; j++) {
      outs[j].set(psi);
      scaleComplex(outs[j], Math.cos(offsets[j] * centre), -Math.sin(offsets[j] * centre));
    }
    return report;
  }
  const series = offsetSeries(offsets, halfWidth, tolerance);
  let kMax = 0;
  series.forEach((s, j) => {
    report.errorBounds[j] = s.tailBound;
    report.orders[j] = s.order;
    kMax = Math.max(kMax, s.order);
  });
  // Two orders per pass over the outputs (axpyPairMulti): (0, 1) overwrites, then (2, 3), (4, 5), …
  const coef = new Float64Array(4 * B);
  const active: Float64Array[] = new Array<Float64Array>(B);
  const pass = (ka: number, x0: Float64Array, kb: number, x1: Float64Array | null, overwrite: boolean): void => {
    let m = 0;
    for (let j = 0; j < B; j++) {
      const { order, coefficients: c } = series[j];
      if (!overwrite && order < ka) continue;
      coef[4 * m] = c[2 * ka];
      coef[4 * m + 1] = c[2 * ka + 1];
      const second = x1 !== null && kb <= order;
      coef[4 * m + 2] = second ? c[2 * kb] : 0;
      coef[4 * m + 3] = second ? c[2 * kb + 1] : 0;
      active[m++] = outs[j];
      report.axpys += second ? 2 : 1;
    }
    if (m > 0) axpyPairMulti(active, m, coef, x0, x1, overwrite);
  };
  if (kMax === 0) {
    pass(0, psi, -1, null, true);
  } else {
    const inv = 1 / halfWidth;
    apply(psi, work, inv, -centre * inv, 0); // T_1ψ
    report.matvecs += 1;
    pass(0, psi, 1, work, true);
    let prev = psi;
    let cur = work;
    for (let k = 2; k <= kMax; k++) {
      apply(cur, prev, 2 * inv, -2 * centre * inv, -1); // prev ← T_kψ
      report.matvecs += 1;
      const t = prev; prev = cur; cur = t;
      if ((k & 1) === 1) pass(k - 1, prev, k, cur, false);
    }
    if ((kMax & 1) === 0) pass(kMax, cur, -1, null, false);
  }
  for (let j = 0; j < B; j++) {
    const s = offsets[j];
    if (s * centre !== 0) scaleComplex(outs[j], Math.cos(s * centre), -Math.sin(s * centre));
  }
  return report;
}
