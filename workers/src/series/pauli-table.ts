/**
 * PauliTable — a sparse complex-weighted sum of Pauli strings, Σ_P c_P·P, on any number of
 * sites, stored as a hash table keyed by the strings' multiword masks (pauli-masks.ts).
 *
 * Layout (struct of arrays, no per-term objects):
 *   keys: Uint32Array, 2W words per term (x words, then z words), terms in insertion order;
 *   re, im: Float64Array, the coefficient of each term;
 *   slots: Int32Array open-addressing index (linear probing, power-of-two size, load ≤ 1/2),
 *          −1 = empty, else a term index.
 * Terms are never removed (a coefficient may become 0; `pruned()` copies without them).
 * Hash: FNV-1a over the words followed by a murmur3 finaliser (common practice).
 * Cost: O(W) per insert/lookup on average; memory 8W + 16 + 8 bytes per term (slots at ≤ 1/2
 * load). Normalised trace Tr(A)/2^N is the identity coefficient (Tr P = 0 for P ≠ 1).
 */
import { wordsForSites, writeMask, maskToWord } from './pauli-masks.js';

const EMPTY = -1;
const INITIAL_CAPACITY = 16;

function hashWords(src: Uint32Array, off: number, stride: number): number {
  let h = 0x811c9dc5;
  for (let w = 0; w < stride; w++) h = Math.imul(h ^ src[off + w], 0x01000193);
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** A sparse complex-weighted Pauli sum (see the file header for layout and costs). */
export class PauliTable {
  /** Words per mask W (the table holds strings on up to 32W sites). */
  readonly words: number;
  /** Words per key, 2W. */
  readonly stride: number;
  /** Keys of the terms, 2W words each, in insertion order. */
  keys: Uint32Array;
  /** Real parts of the coefficients. */
  re: Float64Array;
  /** Imaginary parts of the coefficients. */
  im: Float64Array;
  /** Number of terms (including any whose coefficient has become 0). */
  size = 0;
  #slots: Int32Array;
  #slotMask: number;

  /**
   * @param words - words per mask W ≥ 1 (use {@link wordsForSites}).
   * @param capacity - expected number of terms (the table grows as needed).
   */
  constructor(words: number, capacity = INITIAL_CAPACITY) {
    if (!Number.isInteger(words) || words < 1) throw new RangeError(`words must be an integer ≥ 1; got ${String(words)}`);
    this.words = words;
    this.stride = 2 * words;
    const cap = Math.max(INITIAL_CAPACITY, capacity | 0);
    this.keys = new Uint32Array(cap * this.stride);
    this.re = new Float64Array(cap);
    this.im = new Float64Array(cap);
    let slots = INITIAL_CAPACITY * 2;
    while (slots < 2 * cap) slots *= 2;
    this.#slots = new Int32Array(slots).fill(EMPTY);
    this.#slotMask = slots - 1;
  }

  /** An empty table for strings on `sites` sites. */
  static forSites(sites: number, capacity = INITIAL_CAPACITY): PauliTable {
    return new PauliTable(wordsForSites(sites), capacity);
  }

  /** c·1 (the identity times a real or complex coefficient). */
  static identity(words: number, re = 1, im = 0): PauliTable {
    const t = new PauliTable(words);
    t.add(new Uint32Array(2 * words), 0, re, im);
    return t;
  }

  /**
   * Builds a table from (sites, letter codes, weight) terms; repeated strings are summed.
   * @param terms - each with site indices, letter codes (1 = X, 2 = Z, 3 = Y) and a real weight.
   */
  static fromTerms(
    words: number,
    terms: Iterable<{ readonly sites: ArrayLike<number>; readonly codes: ArrayLike<number>; readonly weight: number }>,
  ): PauliTable {
    const t = new PauliTable(words);
    const buf = new Uint32Array(2 * words);
    for (const term of terms) {
      writeMask(buf, 0, words, term.sites, term.codes);
      t.add(buf, 0, term.weight, 0);
    }
    return t;
  }

  /** Index of the string src[off .. off+2W) or −1. */
  find(src: Uint32Array, off: number): number {
    const stride = this.stride;
    const keys = this.keys;
    let slot = hashWords(src, off, stride) & this.#slotMask;
    for (;;) {
      const idx = this.#slots[slot];
      if (idx === EMPTY) return -1;
      const base = idx * stride;
      let same = true;
      for (let w = 0; w < stride; w++) {
        if (keys[base + w] !== src[off + w]) { same = false; break; }
      }
      if (same) return idx;
      slot = (slot + 1) & this.#slotMask;
    }
  }

  /** Adds (re + i·im)·P to the sum, P = the string src[off .. off+2W); returns its term index. */
  add(src: Uint32Array, off: number, re: number, im: number): number {
    const stride = this.stride;
    let keys = this.keys;
    let slot = hashWords(src, off, stride) & this.#slotMask;
    for (;;) {
      const idx = this.#slots[slot];
      if (idx === EMPTY) break;
      const base = idx * stride;
      let same = true;
      for (let w = 0; w < stride; w++) {
        if (keys[base + w] !== src[off + w]) { same = false; break; }
      }
      if (same) {
        this.re[idx] += re;
        this.im[idx] += im;
        return idx;
      }
      slot = (slot + 1) & this.#slotMask;
    }
    const idx = this.size;
    if (idx === this.re.length) {
      this.#growTerms();
      keys = this.keys;
    }
    keys.set(src.subarray(off, off + stride), idx * stride);
    this.re[idx] = re;
    this.im[idx] = im;
    this.size = idx + 1;
    this.#slots[slot] = idx;
    if (2 * this.size > this.#slots.length) this.#rehash(2 * this.#slots.length);
    return idx;
  }

  #growTerms(): void {
    const cap = 2 * this.re.length;
    const keys = new Uint32Array(cap * this.stride);
    keys.set(this.keys);
    const re = new Float64Array(cap);
    re.set(this.re);
    const im = new Float64Array(cap);
    im.set(this.im);
    this.keys = keys;
    this.re = re;
    this.im = im;
  }

  #rehash(slotCount: number): void {
    const slots = new Int32Array(slotCount).fill(EMPTY);
    const mask = slotCount - 1;
    for (let idx = 0; idx < this.size; idx++) {
      let slot = hashWords(this.keys, idx * this.stride, this.stride) & mask;
      while (slots[slot] !== EMPTY) slot = (slot + 1) & mask;
      slots[slot] = idx;
    }
    this.#slots = slots;
    this.#slotMask = mask;
  }

  /** Coefficient of the string src[off..] as [re, im] ([0, 0] if absent). */
  coefficient(src: Uint32Array, off = 0): [number, number] {
    const idx = this.find(src, off);
    return idx < 0 ? [0, 0] : [this.re[idx], this.im[idx]];
  }

  /** Normalised trace Tr(A)/2^N = the identity coefficient, as [re, im]. */
  normalisedTrace(): [number, number] {
    return this.coefficient(new Uint32Array(this.stride), 0);
  }

  /** Multiplies every coefficient by (re + i·im), in place. */
  scale(re: number, im = 0): this {
    for (let k = 0; k < this.size; k++) {
      const a = this.re[k];
      const b = this.im[k];
      this.re[k] = a * re - b * im;
      this.im[k] = a * im + b * re;
    }
    return this;
  }

  /** this += (re + i·im)·other (same word count). */
  addScaled(other: PauliTable, re = 1, im = 0): this {
    if (other.words !== this.words) throw new RangeError(`addScaled: word counts differ (${this.words} vs ${other.words})`);
    for (let k = 0; k < other.size; k++) {
      const a = other.re[k];
      const b = other.im[k];
      this.add(other.keys, k * other.stride, a * re - b * im, a * im + b * re);
    }
    return this;
  }

  /** A copy without the terms with |c| ≤ eps (eps = 0 drops exact zeros only). */
  pruned(eps = 0): PauliTable {
    const out = new PauliTable(this.words, this.size);
    for (let k = 0; k < this.size; k++) {
      if (Math.hypot(this.re[k], this.im[k]) > eps) out.add(this.keys, k * this.stride, this.re[k], this.im[k]);
    }
    return out;
  }

  /** Largest |c| over the terms. */
  maxAbs(): number {
    let m = 0;
    for (let k = 0; k < this.size; k++) m = Math.max(m, Math.hypot(this.re[k], this.im[k]));
    return m;
  }

  /** Terms as readable [word, re, im] triples (for tests and messages), insertion order. */
  entries(): Array<[string, number, number]> {
    const out: Array<[string, number, number]> = [];
    for (let k = 0; k < this.size; k++) out.push([maskToWord(this.keys, k * this.stride, this.words), this.re[k], this.im[k]]);
    return out;
  }
}
