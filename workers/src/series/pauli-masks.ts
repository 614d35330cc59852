/**
 * Multiword Pauli-string masks for clusters of any size (the two-mask form of
 * physics/types.ts holds at most 30 sites).
 *
 * Layout: a string on N sites is 2W unsigned 32-bit words, W = max(1, ⌈N/32⌉): words 0..W−1
 * are the x mask, words W..2W−1 the z mask; site s is bit (s mod 32) of word ⌊s/32⌋. As in
 * DESIGN.md §2 and physics/types.ts, bit s of x set → X or Y on site s, bit s of z set → Z or Y,
 * and the operator is P(x, z) = i^{|x∧z|} X^x Z^z (Hermitian; Y = iXZ).
 *
 * Product rule (common practice, the same identity physics/pauli-algebra.ts states):
 *   P(xa, za)·P(xb, zb) = i^k P(xa⊕xb, za⊕zb),  k = |xa∧za| + |xb∧zb| + 2|za∧xb| − |x∧z| (mod 4).
 * Two strings anticommute iff |xa∧zb| + |za∧xb| is odd.
 * Cost: O(W) word operations per product; no allocation.
 */

/** Bits per mask word. */
export const BITS_PER_WORD = 32;

/** Words per mask for `sites` sites (at least one, so the identity on 0 sites has a key). */
export function wordsForSites(sites: number): number {
  if (!Number.isInteger(sites) || sites < 0) {
    throw new RangeError(`sites must be a non-negative integer; got ${String(sites)}`);
  }
  return Math.max(1, Math.ceil(sites / BITS_PER_WORD));
}

/** popcount of a 32-bit word (SWAR; common practice). */
export function popcount32(v: number): number {
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

/** Pauli letter code on one site: bit 0 = x, bit 1 = z (1 = X, 2 = Z, 3 = Y). */
export type LetterCode = 1 | 2 | 3;

/** Letter code of 'X' | 'Y' | 'Z'. */
export function letterCode(letter: string): LetterCode {
  switch (letter) {
    case 'X': return 1;
    case 'Z': return 2;
    case 'Y': return 3;
    default: throw new RangeError(`a Pauli letter is X, Y or Z; got ${JSON.stringify(letter)}`);
  }
}

/** Letter of a code (1 = X, 2 = Z, 3 = Y). */
export function letterOf(code: number): 'X' | 'Y' | 'Z' {
  if (code === 1) return 'X';
  if (code === 2) return 'Z';
  if (code === 3) return 'Y';
  throw new RangeError(`a letter code is 1 (X), 2 (Z) or 3 (Y); got ${String(code)}`);
}

/**
 * Writes the string ⊗_k letter_k(site_k) into buf[off .. off+2W) (cleared first).
 * @throws RangeError if a site is outside 0..32W−1 or repeated.
 */
export function writeMask(
  buf: Uint32Array, off: number, words: number, sites: ArrayLike<number>, codes: ArrayLike<number>,
): void {
  buf.fill(0, off, off + 2 * words);
  for (let k = 0; k < sites.length; k++) {
    const s = sites[k];
    if (!Number.isInteger(s) || s < 0 || s >= words * BITS_PER_WORD) {
      throw new RangeError(`site ${String(s)} does not fit a ${words}-word mask`);
    }
    const w = s >>> 5;
    const bit = 1 << (s & 31);
    if (((buf[off + w] | buf[off + words + w]) & bit) !== 0) {
      throw new RangeError(`site ${s} appears twice in one Pauli string`);
    }
    const c = codes[k];
    if (c & 1) buf[off + w] |= bit;
    if (c & 2) buf[off + words + w] |= bit;
  }
}

/** The string in buf[off..] as a word such as "X0 Y3 Z40" (sites ascending); identity → "". */
export function maskToWord(buf: Uint32Array, off: number, words: number): string {
  const parts: string[] = [];
  for (let w = 0; w < words; w++) {
    let rest = (buf[off + w] | buf[off + words + w]) >>> 0;
    while (rest !== 0) {
      const bit = rest & -rest;
      const b = 31 - Math.clz32(bit);
      const hasX = (buf[off + w] & bit) !== 0;
      const hasZ = (buf[off + words + w] & bit) !== 0;
      parts.push(`${hasX && hasZ ? 'Y' : hasX ? 'X' : 'Z'}${w * BITS_PER_WORD + b}`);
      rest = (rest & ~bit) >>> 0;
    }
  }
  return parts.join(' ');
}

/** Sites where the string in buf[off..] acts (ascending). */
export function maskSupport(buf: Uint32Array, off: number, words: number): number[] {
  const out: number[] = [];
  for (let w = 0; w < words; w++) {
    let rest = (buf[off + w] | buf[off + words + w]) >>> 0;
    while (rest !== 0) {
      const bit = rest & -rest;
      out.push(w * BITS_PER_WORD + 31 - Math.clz32(bit));
      rest = (rest & ~bit) >>> 0;
    }
  }
  return out;
}
