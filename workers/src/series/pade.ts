/**
 * padeApproximant — the [L/M] Padé approximant P_L(x)/Q_M(x) (Q(0) = 1) of a power series
 * Σ c_k x^k, matching c_0..c_{L+M}.
 *
 * Formula (G. A. Baker Jr. and P. Graves-Morris, "Padé Approximants", 2nd ed., CUP 1996, §1.1):
 * the denominator solves Σ_{j=1}^{M} q_j c_{L+i−j} = −c_{L+i} for i = 1..M (c_k = 0 for k < 0),
 * then p_i = Σ_{j=0}^{min(i,M)} q_j c_{i−j}, i = 0..L. The M×M system is solved by Gaussian
 * elimination with partial pivoting; a pivot below SINGULAR_PIVOT·(largest entry) means the
 * approximant does not exist (degenerate table entry) and null is returned.
 * Cost: O(M³ + L·M) flops.
 */

/** Relative pivot size below which the Padé system is treated as singular. */
export const SINGULAR_PIVOT = 1e-13;

/** An [L/M] approximant: numerator p[0..L], denominator q[0..M] with q[0] = 1. */
export interface PadeApproximant {
  readonly L: number;
  readonly M: number;
  readonly p: Float64Array;
  readonly q: Float64Array;
}

/**
 * The [L/M] approximant of c, or null if the linear system is singular.
 * @throws RangeError if L or M is negative or c has fewer than L+M+1 coefficients.
 */
export function padeApproximant(c: ArrayLike<number>, L: number, M: number): PadeApproximant | null {
  if (!Number.isInteger(L) || !Number.isInteger(M) || L < 0 || M < 0) throw new RangeError(`L and M must be non-negative integers; got [${L}/${M}]`);
  if (c.length < L + M + 1) throw new RangeError(`[${L}/${M}] needs ${L + M + 1} coefficients; got ${c.length}`);
  const coef = (k: number) => (k < 0 ? 0 : c[k]);
  const q = new Float64Array(M + 1);
  q[0] = 1;
  if (M > 0) {
    const a = new Float64Array(M * M);
    const rhs = new Float64Array(M);
    let scale = 0;
    for (let i = 0; i < M; i++) {
      for (let j = 0; j < M; j++) {
        a[i * M + j] = coef(L + i + 1 - (j + 1));
        scale = Math.max(scale, Math.abs(a[i * M + j]));
      }
      rhs[i] = -coef(L + i + 1);
    }
    if (scale === 0) return null;
    for (let col = 0; col < M; col++) {
      let piv = col;
      for (let r = col + 1; r < M; r++) if (Math.abs(a[r * M + col]) > Math.abs(a[piv * M + col])) piv = r;
      if (Math.abs(a[piv * M + col]) <= SINGULAR_PIVOT * scale) return null;
      if (piv !== col) {
        for (let j = 0; j < M; j++) {
          const t = a[col * M + j]; a[col * M + j] = a[piv * M + j]; a[piv * M + j] = t;
        }
        const t = rhs[col]; rhs[col] = rhs[piv]; rhs[piv] = t;
      }
      for (let r = col + 1; r < M; r++) {
        const f = a[r * M + col] / a[col * M + col];
        if (f === 0) continue;
        for (let j = col; j < M; j++) a[r * M + j] -= f * a[col * M + j];
        rhs[r] -= f * rhs[col];
      }
    }
    for (let i = M - 1; i >= 0; i--) {
      let s = rhs[i];
      for (let j = i + 1; j < M; j++) s -= a[i * M + j] * q[j + 1];
      q[i + 1] = s / a[i * M + i];
    }
  }
  const p = new Float64Array(L + 1);
  for (let i = 0; i <= L; i++) {
    let s = 0;
    for (let j = 0; j <= Math.min(i, M); j++) s += q[j] * coef(i - j);
    p[i] = s;
  }
  return { L, M, p, q };
}

/** P(x)/Q(x) of an approximant. */
export function evaluatePade(a: PadeApproximant, x: number): number {
  let num = 0;
  for (let k = a.L; k >= 0; k--) num = num * x + a.p[k];
  let den = 0;
  for (let k = a.M; k >= 0; k--) den = den * x + a.q[k];
  return num / den;
}

/** Q(x) of an approximant. */
export function padeDenominator(a: PadeApproximant, x: number): number {
  let den = 0;
  for (let k = a.M; k >= 0; k--) den = den * x + a.q[k];
  return den;
}
