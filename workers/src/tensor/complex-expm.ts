/**
 * complexExpm — exp(A) of a small dense complex n×n matrix (row-major, interleaved), by scaling
 * and squaring with a truncated Taylor series:
 *
 *   exp(A) = (T_d(A/2^s))^(2^s),  s the least integer with ‖A‖₁/2^s ≤ 1/2,
 *   T_d(X) = Σ_{k=0}^{d} X^k/k!,  d = TAYLOR_DEGREE = 18.
 *
 * Truncation: ‖X‖₁ ≤ 1/2 gives a remainder ≤ (1/2)^19/19!·e^{1/2} < 3e−23 (relative to ‖T‖ ≥
 * e^{−1/2}), far below rounding; the scheme is the classical one of Moler & Van Loan, SIAM
 * Rev. 45, 3 (2003) ("method 3"), with a fixed high degree instead of a Padé table because the
 * matrices here are 4×4 or 16×16 gate generators with ‖A‖ ≲ 10.
 * Cost: (d + s)·8·n³ flops. Accuracy: ≈ (s + d)·n·ε·‖exp(A)‖ for the normal (Hermitian or
 * skew-Hermitian) generators used here; squaring may amplify errors for highly non-normal A.
 * Allocates its scratch (intended for setting up gates, not for inner loops).
 */

/** Taylor degree after scaling. */
export const TAYLOR_DEGREE = 18;

/**
 * exp(a) into `out` (both n×n complex row-major; `out` must not alias `a`).
 * @throws RangeError if n is not a positive integer, a buffer is short, or an entry is not finite.
 */
export function complexExpm(n: number, a: Float64Array, out: Float64Array): void {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`complexExpm: n must be a positive integer; got ${n}`);
  const len = 2 * n * n;
  if (a.length < len) throw new RangeError(`complexExpm: a has ${a.length} doubles, needs ${len}`);
  if (out.length < len) throw new RangeError(`complexExpm: out has ${out.length} doubles, needs ${len}`);
  let norm1 = 0;
  for (let j = 0; j < n; j++) {
    let col = 0;
    for (let i = 0; i < n; i++) col += Math.hypot(a[2 * (i * n + j)], a[2 * (i * n + j) + 1]);
    if (!Number.isFinite(col)) throw new RangeError(`complexExpm: column ${j} of a has a non-finite entry`);
    norm1 = Math.max(norm1, col);
  }
  const s = norm1 > 0.5 ? Math.ceil(Math.log2(norm1 / 0.5)) : 0;
  const scale = 2 ** -s;
  const x = new Float64Array(len);
  for (let k = 0; k < len; k++) x[k] = a[k] * scale;
  // Horner: T = I + X(I + X/2(I + X/3(… (I + X/d)))).
  let t = new Float64Array(len);
  let tmp = new Float64Array(len);
  for (let i = 0; i < n; i++) t[2 * (i * n + i)] = 1;
  for (let k = TAYLOR_DEGREE; k >= 1; k--) {
    multiply(n, x, t, tmp);
    const inv = 1 / k;
    for (let q = 0; q < len; q++) tmp[q] *= inv;
    for (let i = 0; i < n; i++) tmp[2 * (i * n + i)] += 1;
    const sw = t;
    t = tmp;
    tmp = sw;
  }
  for (let q = 0; q < s; q++) {
    multiply(n, t, t, tmp);
    const sw = t;
    t = tmp;
    tmp = sw;
  }
  out.set(t.subarray(0, len));
}

function multiply(n: number, a: Float64Array, b: Float64Array, c: Float64Array): void {
  c.fill(0);
  for (let i = 0; i < n; i++) {
    for (let l = 0; l < n; l++) {
      const ar = a[2 * (i * n + l)];
      const ai = a[2 * (i * n + l) + 1];
      if (ar === 0 && ai === 0) continue;
      for (let j = 0; j < n; j++) {
        const br = b[2 * (l * n + j)];
        const bi = b[2 * (l * n + j) + 1];
        c[2 * (i * n + j)] += ar * br - ai * bi;
        c[2 * (i * n + j) + 1] += ar * bi + ai * br;
      }
    }
  }
}
