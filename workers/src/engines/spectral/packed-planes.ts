/**
 * PackedPlanes — a Hermitian d×d matrix as its upper triangle packed by columns (entry (m, n),
 * m ≤ n, at n(n+1)/2 + m) in two separate real planes, re and im; a plane that is exactly zero
 * is null (real operators on real blocks have no imaginary plane, Y-odd ones no real plane).
 * splitPacked converts the interleaved packed output of the product kernels to this form.
 * Split planes let the time loop skip zero planes and run unit-stride real dot products.
 * Cost: O(d²); allocates the planes it returns.
 */

/** A packed Hermitian matrix in split planes (null = exactly zero plane). */
export interface PackedPlanes {
  readonly re: Float64Array | null;
  readonly im: Float64Array | null;
}

/** Number of packed entries of an order-d upper triangle: d(d+1)/2. */
export function packedLength(d: number): number {
  return (d * (d + 1)) / 2;
}

/** Split an interleaved packed matrix (d(d+1) doubles) into planes, dropping all-zero planes. */
export function splitPacked(d: number, interleaved: Float64Array): PackedPlanes {
  const len = packedLength(d);
  let reZero = true;
  let imZero = true;
  for (let k = 0; k < len; k++) {
    if (interleaved[2 * k] !== 0) reZero = false;
    if (interleaved[2 * k + 1] !== 0) imZero = false;
  }
  const re = reZero ? null : new Float64Array(len);
  const im = imZero ? null : new Float64Array(len);
  for (let k = 0; k < len; k++) {
    if (re !== null) re[k] = interleaved[2 * k];
    if (im !== null) im[k] = interleaved[2 * k + 1];
  }
  return { re, im };
}
