/**
 * The seeded generator behind every random choice (workers/src/random): xoshiro128**
 * (Blackman & Vigna, ACM Trans. Math. Softw. 47, 36 (2021)) and its (seed, stream) seeding.
 */
import { describe, expect, it } from 'vitest';
import { mix32, Xoshiro128 } from '../../../workers/src/random/index.js';

describe('Xoshiro128', () => {
  it('reproduces the reference algorithm from the state (1, 2, 3, 4)', () => {
    // Values printed by the authors' C reference of xoshiro128** (transcribed from the paper's
    // published code, compiled with gcc on this machine): outputs 1–6 and output 1001.
    const g = new Xoshiro128(1, 2, 3, 4);
    expect(Array.from({ length: 6 }, () => g.nextUint32())).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
    for (let k = 0; k < 994; k++) g.nextUint32();
    expect(g.nextUint32()).toBe(136054147);
  });

  it('gives the same sequence for the same (seed, stream) and different ones otherwise', () => {
    const draw = (seed: number, stream: number) => {
      const g = Xoshiro128.forStream(seed, stream);
      return Array.from({ length: 8 }, () => g.nextUint32());
    };
    expect(draw(7, 3)).toEqual(draw(7, 3));
    const seen = new Set<string>();
    for (const seed of [0, 1, 2, 2 ** 31 - 1]) {
      for (const stream of [0, 1, 2, 1000, 2 ** 32 - 1]) seen.add(draw(seed, stream).join(','));
    }
    expect(seen.size).toBe(20);
  });

  it('draws uniform numbers: mean, variance and bit balance within 5 standard errors', () => {
    // 2^16 draws: the mean of U(0,1) has standard error 1/√(12·2^16) ≈ 1.1e-3, the variance
    // 1/√(180·2^16) ≈ 2.9e-4; 5σ bounds make a false failure ~1e-6 likely, and a broken
    // generator (e.g. a stuck high bit) far outside.
    const n = 2 ** 16;
    for (const stream of [0, 1, 99]) {
      const g = Xoshiro128.forStream(12345, stream);
      let s = 0, s2 = 0;
      const bits = new Float64Array(32);
      for (let k = 0; k < n; k++) {
        const u = g.nextUint32();
        const x = u / 2 ** 32;
        s += x; s2 += x * x;
        for (let b = 0; b < 32; b++) bits[b] += (u >>> b) & 1;
      }
      const mean = s / n;
      const variance = s2 / n - mean * mean;
      expect(Math.abs(mean - 0.5)).toBeLessThan(5 / Math.sqrt(12 * n));
      expect(Math.abs(variance - 1 / 12)).toBeLessThan(5 / Math.sqrt(180 * n));
      // Each bit is a fair coin: standard error 0.5/√n ≈ 2e-3 on its frequency.
      for (let b = 0; b < 32; b++) expect(Math.abs(bits[b] / n - 0.5)).toBeLessThan(5 * 0.5 / Math.sqrt(n));
    }
  });

  it('returns doubles in [0, 1) from nextDouble and nextFloat32Bits', () => {
    const g = Xoshiro128.forStream(1, 1);
    for (let k = 0; k < 1000; k++) {
      const a = g.nextDouble();
      const b = g.nextFloat32Bits();
      expect(a >= 0 && a < 1).toBe(true);
      expect(b >= 0 && b < 1).toBe(true);
    }
  });

  it('replaces the all-zero state, which would be a fixed point', () => {
    const g = new Xoshiro128(0, 0, 0, 0);
    const out = Array.from({ length: 4 }, () => g.nextUint32());
    expect(out.some((v) => v !== 0)).toBe(true);
  });

  it('rejects seeds and streams outside [0, 2^32) and non-finite state words', () => {
    expect(() => Xoshiro128.forStream(-1, 0)).toThrow(RangeError);
    expect(() => Xoshiro128.forStream(0, 2 ** 32)).toThrow(/stream/);
    expect(() => Xoshiro128.forStream(0.5, 0)).toThrow(/seed/);
    expect(() => Xoshiro128.forStream(Number.NaN, 0)).toThrow(RangeError);
    expect(() => new Xoshiro128(1, Number.NaN, 0, 0)).toThrow(/s1/);
  });
});

describe('mix32', () => {
  it('is a bijection on a sample of inputs and changes about half the bits per flipped input bit', () => {
    // MurmurHash3's finaliser: full avalanche means a flipped input bit changes each output bit
    // with probability ≈ ½; over 4096 inputs × 32 flips the mean changed-bit count is 16 ± ~0.03.
    const outs = new Set<number>();
    let changed = 0, trials = 0;
    for (let v = 0; v < 4096; v++) {
      const h = mix32(v * 2654435761);
      outs.add(h);
      for (let b = 0; b < 32; b++) {
        let d = (h ^ mix32((v * 2654435761) ^ (1 << b))) >>> 0;
        let c = 0;
        while (d) { c += d & 1; d >>>= 1; }
        changed += c; trials++;
      }
    }
    expect(outs.size).toBe(4096);
    expect(Math.abs(changed / trials - 16)).toBeLessThan(0.2);
    expect(mix32(0)).toBe(0);
  });
});
