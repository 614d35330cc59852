/**
 * propagateToTimes (several times from one Chebyshev recurrence) against mathjs `expm`
 * (a general-purpose library, the independent dense reference used by the propagator tests),
 * and quenchBlocks (how a grid is cut into such blocks).
 */
import { describe, expect, it } from 'vitest';
import {
  MAX_BLOCK_TIMES, maxBlockTimes, propagateToTimes, quenchBlocks,
} from '../../../workers/src/engines/typical/index.js';
import { MAX_REAL_TIME_TAU } from '../../../workers/src/propagators/index.js';
import {
  denseApply, distance, expmTimes, norm, randomHermitian, randomVector, rowSumBound,
} from '../propagators/dense-complex.js';

const n = 8;
const h = randomHermitian(n, 21);
const r = rowSumBound(h); // Gershgorin: spectrum ⊂ [−r, r]
const interval = { lo: -r - 0.2, hi: r + 0.4 }; // loose and off-centre on purpose

describe('propagateToTimes', () => {
  it('gives e^{−isH}ψ at every offset within its returned bound, offset 0 included', () => {
    for (const tol of [1e-3, 1e-12]) {
      const offsets = [0, 0.05, 0.4, 0.4, 1.3, 6];
      const psi0 = randomVector(n, 3);
      const psi = psi0.slice();
      const outs = offsets.map(() => new Float64Array(2 * n));
      const rep = propagateToTimes(denseApply(h), interval, offsets, psi, new Float64Array(2 * n), outs, tol);
      expect(rep.matvecs).toBe(Math.max(...rep.orders));
      expect(rep.axpys).toBe(rep.orders.reduce((a, k) => a + k + 1, 0));
      expect(rep.orders[0]).toBe(0);
      offsets.forEach((s, j) => {
        const ref = expmTimes(h, 0, -s, psi0);
        expect(rep.errorBounds[j]).toBeLessThanOrEqual(tol);
        // The bound covers truncation; 1e-12 covers expm's and the recurrence's rounding.
        expect(distance(outs[j], ref) / norm(psi0), `s = ${s}`).toBeLessThanOrEqual(rep.errorBounds[j] + 1e-12);
      });
      expect(Array.from(outs[2])).toEqual(Array.from(outs[3]));
    }
  });

  it('handles a zero-width interval (Op = c·1) as a pure phase, and an empty offset list', () => {
    const psi0 = randomVector(n, 4);
    const outs = [new Float64Array(2 * n)];
    const c = 0.7;
    propagateToTimes((i, o, al, be, ga) => { for (let k = 0; k < i.length; k++) o[k] = (al * c + be) * i[k] + (ga === 0 ? 0 : ga * o[k]); },
      { lo: c, hi: c }, [2], psi0.slice(), new Float64Array(2 * n), outs, 1e-10);
    for (let k = 0; k < n; k++) {
      const re = psi0[2 * k] * Math.cos(-1.4) - psi0[2 * k + 1] * Math.sin(-1.4);
      expect(outs[0][2 * k]).toBeCloseTo(re, 14);
    }
    const rep = propagateToTimes(denseApply(h), interval, [], psi0.slice(), new Float64Array(2 * n), [], 1e-8);
    expect(rep.matvecs).toBe(0);
  });

  it('rejects unsorted or negative offsets, aliased buffers and a bad interval', () => {
    const psi = randomVector(n, 5);
    const w = new Float64Array(2 * n);
    const o = [new Float64Array(2 * n), new Float64Array(2 * n)];
    const apply = denseApply(h);
    expect(() => propagateToTimes(apply, interval, [1, 0.5], psi, w, o, 1e-8)).toThrow(/ascending/);
    expect(() => propagateToTimes(apply, interval, [-1], psi, w, o, 1e-8)).toThrow(/offsets/);
    expect(() => propagateToTimes(apply, interval, [1], psi, w, [psi], 1e-8)).toThrow(/outs\[0\]/);
    expect(() => propagateToTimes(apply, interval, [1], psi, psi, o, 1e-8)).toThrow(/^work must be a distinct vector/);
    expect(() => propagateToTimes(apply, { lo: 1, hi: 0 }, [1], psi, w, o, 1e-8)).toThrow(/interval/);
    expect(() => propagateToTimes(apply, interval, [1, 2, 3], psi, w, o, 1e-8)).toThrow(/outs must hold/);
  });
});

describe('quenchBlocks', () => {
  const grid = Array.from({ length: 100 }, (_, k) => (2 * k) / 99);

  it('covers every grid time once, in order, each block starting where the last one ended', () => {
    const blocks = quenchBlocks(grid, 72, 17, 1e-9, MAX_BLOCK_TIMES);
    let next = 0;
    let from = 0;
    for (const b of blocks) {
      expect(b.start).toBe(next);
      expect(b.from).toBe(from);
      expect(b.count).toBeGreaterThanOrEqual(1);
      expect(b.count).toBeLessThanOrEqual(MAX_BLOCK_TIMES);
      expect((grid[b.start + b.count - 1] - b.from) * 72).toBeLessThanOrEqual(MAX_REAL_TIME_TAU);
      next += b.count;
      from = grid[b.start + b.count - 1];
    }
    expect(next).toBe(100);
  });

  it('groups many short steps when an application costs many passes, and steps one by one when it costs none', () => {
    // 4 × 4 TFIM-like: a = 72, G ≈ 17 passes, dτ ≈ 1.45: the cost model picks blocks of ≈ 20
    // (fewer than 10 blocks for 100 times); with G = 0 extra times only add axpys: blocks of 1.
    expect(quenchBlocks(grid, 72, 17, 1e-9, MAX_BLOCK_TIMES).length).toBeLessThan(10);
    expect(quenchBlocks(grid, 72, 0, 1e-9, MAX_BLOCK_TIMES).length).toBe(100);
    expect(quenchBlocks(grid, 72, 17, 1e-9, 1).length).toBe(100);
    // A span beyond τ = MAX_REAL_TIME_TAU is never one block.
    const long = quenchBlocks([100, 200], 3, 100, 1e-9, MAX_BLOCK_TIMES);
    expect(long.map((b) => b.count)).toEqual([1, 1]);
  });

  it('limits the block outputs to 1 GiB of vectors and rejects a block limit below 1', () => {
    expect(maxBlockTimes(2 ** 10)).toBe(MAX_BLOCK_TIMES);
    expect(maxBlockTimes(2 ** 24)).toBe(4);
    expect(maxBlockTimes(2 ** 27)).toBe(1);
    expect(() => quenchBlocks(grid, 1, 1, 1e-9, 0)).toThrow(/maxBlock/);
  });
});
