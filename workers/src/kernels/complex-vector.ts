/**
 * Level-1 helpers on complex vectors stored interleaved (re, im) in Float64Arrays.
 * Each works on the whole array (length = 2 × number of complex entries) and allocates nothing.
 * Mirrors BLAS dznrm2² / zdotc / zaxpy / zdscal / zcopy (common practice); the sums use four
 * partial accumulators (fewer dependent adds, slightly smaller rounding growth than one).
 * Cost: one pass over the data each.
 */

function sameLength(a: Float64Array, b: Float64Array, na: string, nb: string): void {
  if (a.length !== b.length) throw new RangeError(`${na} and ${nb} must have the same length; got ${a.length} and ${b.length}`);
}

/** Σ |x_k|² over all complex entries (= Σ of squares of all doubles). */
export function norm2sq(x: Float64Array): number {
  const n = x.length;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let k = 0;
  for (; k + 3 < n; k += 4) {
    s0 += x[k] * x[k];
    s1 += x[k + 1] * x[k + 1];
    s2 += x[k + 2] * x[k + 2];
    s3 += x[k + 3] * x[k + 3];
  }
  for (; k < n; k++) s0 += x[k] * x[k];
  return (s0 + s2) + (s1 + s3);
}

/** out ← Σ_k conj(a_k)·b_k, with out[0] = re, out[1] = im. @throws RangeError on length mismatch. */
export function dotc(a: Float64Array, b: Float64Array, out: Float64Array): void {
  sameLength(a, b, 'a', 'b');
  const n = a.length;
  let r0 = 0, r1 = 0, i0 = 0, i1 = 0;
  let k = 0;
  for (; k + 3 < n; k += 4) {
    const ar = a[k], ai = a[k + 1], br = b[k], bi = b[k + 1];
    const cr = a[k + 2], ci = a[k + 3], dr = b[k + 2], di = b[k + 3];
    r0 += ar * br + ai * bi;
    i0 += ar * bi - ai * br;
    r1 += cr * dr + ci * di;
    i1 += cr * di - ci * dr;
  }
  for (; k + 1 < n; k += 2) {
    const ar = a[k], ai = a[k + 1], br = b[k], bi = b[k + 1];
    r0 += ar * br + ai * bi;
    i0 += ar * bi - ai * br;
  }
  out[0] = r0 + r1;
  out[1] = i0 + i1;
}

/** y ← y + (re + i·im)·x. @throws RangeError on length mismatch. */
export function axpyComplex(y: Float64Array, re: number, im: number, x: Float64Array): void {
  sameLength(y, x, 'y', 'x');
  const n = y.length;
  if (im === 0) {
    for (let k = 0; k < n; k++) y[k] += re * x[k];
    return;
  }
  for (let k = 0; k + 1 < n; k += 2) {
    const xr = x[k], xi = x[k + 1];
    y[k] += re * xr - im * xi;
    y[k + 1] += re * xi + im * xr;
  }
}

/** x ← s·x for a real s. */
export function scaleReal(x: Float64Array, s: number): void {
  for (let k = 0, n = x.length; k < n; k++) x[k] *= s;
}

/** x ← (re + i·im)·x. */
export function scaleComplex(x: Float64Array, re: number, im: number): void {
  for (let k = 0, n = x.length; k + 1 < n; k += 2) {
    const xr = x[k], xi = x[k + 1];
    x[k] = re * xr - im * xi;
    x[k + 1] = re * xi + im * xr;
  }
}

/** dst ← src. @throws RangeError on length mismatch. */
export function copyInto(dst: Float64Array, src: Float64Array): void {
  sameLength(dst, src, 'dst', 'src');
  dst.set(src);
}
