/**
 * packedDot — Σ_k a[aOff + k]·b[bOff + k] for k < length: one plane of ⟨O(t)⟩ = R′·Õ
 * (phase-rotate.ts, packed-planes.ts), BLAS ddot with offsets; four partial sums shorten the
 * dependency chain and the rounding growth.
 * Cost: 2·length flops, one read pass over each range; no allocation.
 */

/** Σ_{k < length} a[aOff + k]·b[bOff + k]. Unchecked kernel. */
export function packedDot(a: Float64Array, aOff: number, b: Float64Array, bOff: number, length: number): number {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let k = 0;
  for (; k + 3 < length; k += 4) {
    s0 += a[aOff + k] * b[bOff + k];
    s1 += a[aOff + k + 1] * b[bOff + k + 1];
    s2 += a[aOff + k + 2] * b[bOff + k + 2];
    s3 += a[aOff + k + 3] * b[bOff + k + 3];
  }
  for (; k < length; k++) s0 += a[aOff + k] * b[bOff + k];
  return (s0 + s2) + (s1 + s3);
}
