/**
 * mix32 — a 32-bit integer finaliser: a bijection of [0, 2^32) with full avalanche.
 *
 * Formula (the 32-bit finaliser of MurmurHash3; Appleby, 2011, public domain; common practice):
 *   h ^= h >>> 16;  h *= 0x85ebca6b;  h ^= h >>> 13;  h *= 0xc2b2ae35;  h ^= h >>> 16   (mod 2^32)
 * Used only to derive generator states from (seed, stream) pairs, never as a generator itself.
 * Cost: 2 multiplications, 3 shifts, 3 XORs.
 */

/** The MurmurHash3 32-bit finaliser of `h` (taken mod 2^32); returns an unsigned 32-bit integer. */
export function mix32(h: number): number {
  h >>>= 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}
