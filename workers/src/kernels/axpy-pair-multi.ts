/**
 * axpyPairMulti — y_j ← y_j + a_j·x0 + b_j·x1 for several outputs y_j at once (complex
 * interleaved vectors, complex coefficients); with `overwrite`, y_j ← a_j·x0 + b_j·x1.
 *
 * Why: a multi-time Chebyshev sum adds c_{j,k}·T_k to every output j at every order k. Adding
 * two orders per pass halves the passes over the outputs, and walking the vectors in chunks of
 * CHUNK doubles keeps the x0, x1 chunk in L1 while every output reads it, so x0 and x1 come
 * from memory once per call instead of once per output. Traffic per call ≈ (2 + 2·count)
 * vectors, against 6·count for two plain axpys per output. Common practice (loop fusion and
 * blocking); no published source.
 *
 * coef holds 4 doubles per output: [Re a_j, Im a_j, Re b_j, Im b_j], j = 0..count−1. x1 = null
 * means b_j = 0 (one order). Cost: 8 flops per complex entry per output and order (4 when a_j
 * is real and b_j imaginary, as for real-time Chebyshev coefficients at orders (even, odd)).
 * Memory: none allocated.
 */

/** Doubles per chunk (16 KiB of each input vector). */
export const PAIR_CHUNK = 2048;

/**
 * Unchecked kernel (see file header). All vectors have x0's length; outs[j] for j < count are
 * distinct from x0 and x1.
 */
export function axpyPairMulti(
  outs: readonly Float64Array[], count: number, coef: Float64Array, x0: Float64Array, x1: Float64Array | null, overwrite: boolean,
): void {
  const n = x0.length;
  for (let base = 0; base < n; base += PAIR_CHUNK) {
    const end = Math.min(n, base + PAIR_CHUNK);
    for (let j = 0; j < count; j++) {
      const y = outs[j];
      const ar = coef[4 * j], ai = coef[4 * j + 1];
      if (x1 === null) {
        if (overwrite) {
          for (let i = base; i < end; i += 2) {
            const pr = x0[i], pi = x0[i + 1];
            y[i] = ar * pr - ai * pi;
            y[i + 1] = ar * pi + ai * pr;
          }
        } else {
          for (let i = base; i < end; i += 2) {
            const pr = x0[i], pi = x0[i + 1];
            y[i] += ar * pr - ai * pi;
            y[i + 1] += ar * pi + ai * pr;
          }
        }
        continue;
      }
      const br = coef[4 * j + 2], bi = coef[4 * j + 3];
      if (ai === 0 && br === 0 && !overwrite) {
        // Real a, imaginary b: the pattern of (−i)^k·J_k at orders (even, odd); half the products.
        for (let i = base; i < end; i += 2) {
          y[i] += ar * x0[i] - bi * x1[i + 1];
          y[i + 1] += ar * x0[i + 1] + bi * x1[i];
        }
        continue;
      }
      if (overwrite) {
        for (let i = base; i < end; i += 2) {
          const pr = x0[i], pi = x0[i + 1], qr = x1[i], qi = x1[i + 1];
          y[i] = ar * pr - ai * pi + br * qr - bi * qi;
          y[i + 1] = ar * pi + ai * pr + br * qi + bi * qr;
        }
      } else {
        for (let i = base; i < end; i += 2) {
          const pr = x0[i], pi = x0[i + 1], qr = x1[i], qi = x1[i + 1];
          y[i] += ar * pr - ai * pi + br * qr - bi * qi;
          y[i + 1] += ar * pi + ai * pr + br * qi + bi * qr;
        }
      }
    }
  }
}
