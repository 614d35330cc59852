/**
 * Text form of a Pauli string ("X0 Z3 Y2") ↔ the two-mask form of types.ts.
 *
 * A word is space-separated factors: a letter X, Y or Z followed by a site index. The empty
 * (or all-blank) word is the identity. Factor order in the text does not matter: factors on
 * different sites commute, and a site may appear only once.
 */
import type { PauliString } from './types.js';

/** Highest site index the two-mask form can hold (bits 0..29 of a 32-bit integer). */
export const MAX_MASK_SITE = 29;

/** One factor of a Pauli word, as written. */
export interface PauliFactor {
  readonly letter: 'X' | 'Y' | 'Z';
  readonly site: number;
}

const FACTOR = /^([XYZ])(\d+)$/;

/**
 * Splits a word into its factors without any site limit (for checks on lattices larger than
 * the mask form allows). Throws a TypeError naming the first token that is not a factor.
 */
export function pauliFactors(word: string): PauliFactor[] {
  const out: PauliFactor[] = [];
  for (const token of word.trim().split(/\s+/)) {
    if (token === '') continue;
    const m = FACTOR.exec(token);
    if (m === null) {
      throw new TypeError(`Pauli word "${word}": token "${token}" is not a factor like "X0" (letter X, Y or Z, then a site index)`);
    }
    out.push({ letter: m[1] as PauliFactor['letter'], site: Number(m[2]) });
  }
  return out;
}

/**
 * Parses a Pauli word such as "X0 Z3 Y2" on a system of `sites` sites.
 *
 * @throws TypeError if a token is not a factor.
 * @throws RangeError naming the site and the limit if a site is ≥ `sites`, above 29 (the mask
 *   form's limit), or repeated.
 */
export function parsePauliWord(word: string, sites: number): PauliString {
  let x = 0;
  let z = 0;
  for (const { letter, site } of pauliFactors(word)) {
    if (site >= sites) {
      throw new RangeError(`Pauli word "${word}": site ${site} is outside the lattice (sites 0..${sites - 1})`);
    }
    if (site > MAX_MASK_SITE) {
      throw new RangeError(`Pauli word "${word}": site ${site} exceeds the mask limit (sites 0..${MAX_MASK_SITE})`);
    }
    const bit = 1 << site;
    if (((x | z) & bit) !== 0) {
      throw new RangeError(`Pauli word "${word}": site ${site} appears more than once (each site at most once)`);
    }
    if (letter !== 'Z') x |= bit;
    if (letter !== 'X') z |= bit;
  }
  return { x, z };
}

/** Formats a Pauli string as a word with factors in ascending site order, e.g. "X0 Y2 Z3"; the identity is "". */
export function formatPauliWord(p: PauliString): string {
  const parts: string[] = [];
  let rest = p.x | p.z;
  while (rest !== 0) {
    const bit = rest & -rest;
    const site = 31 - Math.clz32(bit);
    const hasX = (p.x & bit) !== 0;
    const hasZ = (p.z & bit) !== 0;
    parts.push(`${hasX && hasZ ? 'Y' : hasX ? 'X' : 'Z'}${site}`);
    rest &= ~bit;
  }
  return parts.join(' ');
}
