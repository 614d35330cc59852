/**
 * Bit-parity helpers for Pauli signs: (−1)^{popcount(v)} for 32-bit unsigned v.
 * Formula: fold the word onto 4 bits by XOR, then look the parity up in the 16-bit table
 * 0x6996 (common practice, "bit twiddling hacks"). Cost: 4 shifts + 4 XORs, no branches.
 */

/** Parity of popcount(v) as 0 or 1, for 0 ≤ v < 2^32. */
export function parity(v: number): number {
  v ^= v >>> 16;
  v ^= v >>> 8;
  v ^= v >>> 4;
  return (0x6996 >>> (v & 0xf)) & 1;
}

/** popcount(v) for 0 ≤ v < 2^32. */
export function popcount(v: number): number {
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}
