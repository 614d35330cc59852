/**
 * Xoshiro128 — the xoshiro128** pseudorandom generator: 128-bit state, period 2^128 − 1,
 * 32-bit outputs. Source: D. Blackman & S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47, 36 (2021), doi:10.1145/3460772 (the reference
 * algorithm, transcribed to 32-bit JavaScript integer arithmetic).
 *
 *   result = rotl(s1 · 5, 7) · 9;  t = s1 << 9;
 *   s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t; s3 = rotl(s3, 11)
 *
 * Streams: {@link Xoshiro128.forStream} seeds the state from a (seed, stream) pair through the
 * mix32 finaliser, so that stream k of a seed is reproducible on its own (no need to draw
 * streams 0..k−1 first: samples can run on different machines). Distinct (seed, stream) pairs
 * give distinct, unrelated-looking starting states; the all-zero state (the one fixed point)
 * is replaced by a constant.
 * Cost: ~10 integer operations per 32-bit output; no allocation after construction.
 * Caveat: not cryptographic.
 */
import { mix32 } from './mix32.js';

/** 2^−32 and 2^−53, for converting integers to doubles in [0, 1). */
const TWO_POW_M32 = 2 ** -32;
const TWO_POW_M53 = 2 ** -53;

/** The xoshiro128** generator (see file header). */
export class Xoshiro128 {
  #s0: number;
  #s1: number;
  #s2: number;
  #s3: number;

  /**
   * A generator with the given 128-bit state (four 32-bit words, taken mod 2^32).
   * @throws RangeError when a word is not a finite number; an all-zero state is replaced by a constant.
   */
  constructor(s0: number, s1: number, s2: number, s3: number) {
    for (const [name, v] of [['s0', s0], ['s1', s1], ['s2', s2], ['s3', s3]] as const) {
      if (typeof v !== 'number' || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite number; got ${String(v)}`);
    }
    this.#s0 = s0 >>> 0;
    this.#s1 = s1 >>> 0;
    this.#s2 = s2 >>> 0;
    this.#s3 = s3 >>> 0;
    if ((this.#s0 | this.#s1 | this.#s2 | this.#s3) === 0) this.#s0 = 0x9e3779b9;
  }

  /**
   * The generator of stream `stream` of seed `seed` (both integers in [0, 2^32)): each state
   * word is mix32 of a distinct combination of the two, so (seed, stream) ↦ state is fixed forever.
   * @throws RangeError naming the argument when seed or stream is not an integer in [0, 2^32).
   */
  static forStream(seed: number, stream: number): Xoshiro128 {
    for (const [name, v] of [['seed', seed], ['stream', stream]] as const) {
      if (!Number.isInteger(v) || v < 0 || v >= 2 ** 32) throw new RangeError(`${name} must be an integer in [0, 2^32); got ${String(v)}`);
    }
    const a = mix32(seed ^ 0x243f6a88);
    const b = mix32(Math.imul(stream, 0x9e3779b9) ^ a);
    return new Xoshiro128(
      mix32(a + 0x3c6ef372),
      mix32(b + 0x85ebca6b),
      mix32((a ^ b) + 0xc2b2ae35),
      mix32(b + 0x27d4eb2f + stream),
    );
  }

  /** Next output, an unsigned 32-bit integer. */
  nextUint32(): number {
    const s0 = this.#s0, s1 = this.#s1, s2 = this.#s2, s3 = this.#s3;
    const m = Math.imul(s1, 5);
    const result = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
    const t = s1 << 9;
    let n2 = s2 ^ s0;
    let n3 = s3 ^ s1;
    const n1 = s1 ^ n2;
    const n0 = s0 ^ n3;
    n2 ^= t;
    n3 = (n3 << 11) | (n3 >>> 21);
    this.#s0 = n0 >>> 0;
    this.#s1 = n1 >>> 0;
    this.#s2 = n2 >>> 0;
    this.#s3 = n3 >>> 0;
    return result;
  }

  /** Uniform double in [0, 1) with 32 random bits (k·2^−32). */
  nextFloat32Bits(): number {
    return this.nextUint32() * TWO_POW_M32;
  }

  /** Uniform double in [0, 1) with 53 random bits (two outputs). */
  nextDouble(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) * TWO_POW_M53;
  }
}
