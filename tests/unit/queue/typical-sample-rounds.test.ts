/**
 * The typical engine's sample rounds replayed from stored samples, and their split into
 * blocks (workers/src/queue/typical/sample-rounds.ts): the replay reaches the engine's own
 * decisions from the same samples, stops at a gap, and the blocks of a round cover it exactly.
 */
import { describe, expect, it } from 'vitest';
import {
  TRUNCATION_SHARE, TypicalEngine, mergeTypicalSamples, runTypicalSamples, typicalLayout,
  type TypicalSampleRecord, type TypicalSamples,
} from '../../../workers/src/engines/typical/index.js';
import {
  MAX_BLOCKS_PER_ROUND, MIN_BLOCKS_PER_ROUND, MIN_SPLIT_SECONDS, TARGET_BLOCK_SECONDS, replayRounds, roundsReached, sampleBlocks, worstStatError,
} from '../../../workers/src/queue/typical/index.js';
import { collect, spec } from '../exact/collect.js';

/** A spec whose measured error asks for a second (and third) round after the pilot. */
const SPEC = spec({
  lattice: { kind: 'chain', length: 6, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1.5], times: { values: [0, 0.5, 1] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  engine: 'typical', tolerance: 0.02, seed: 5,
});

/** Replays over samples held in memory, with `missing` left out. */
function replayOver(samples: TypicalSamples, pilot: number, cap: number, missing: Set<number> = new Set()) {
  const layout = typicalLayout(SPEC);
  const bySample = new Map<number, TypicalSampleRecord[]>();
  for (const r of samples.records) bySample.set(r.sample, [...(bySample.get(r.sample) ?? []), r]);
  return replayRounds({
    pilot, cap, statTarget: (1 - TRUNCATION_SHARE) * SPEC.tolerance, specHash: samples.specHash, times: samples.times, primitives: samples.primitives,
    load: async (from, to) => Array.from({ length: to - from }, (_, i) => (missing.has(from + i) ? null : bySample.get(from + i) ?? null)),
    worstError: (s) => worstStatError(layout, s, [0, 1], SPEC.tolerance),
  });
}

describe('replayRounds', () => {
  describe('when every sample the engine used is stored', () => {
    it('should reach the engine\'s sample count and round count, and call it final', async () => {
      const engine = new TypicalEngine({ maxSamples: 64 });
      const { pilot, cap } = engine.sampling(SPEC);
      const local = await collect(engine, SPEC, [0, 1]);
      const used = Number(local.diagnostics[0].extra.samples);
      const rounds = Number(local.diagnostics[0].extra.rounds);
      expect(rounds).toBeGreaterThanOrEqual(2);
      // More samples stored than the engine used (a late duplicate block): the replay ignores them.
      const stored = await runTypicalSamples(SPEC, [0, 1], { start: 0, count: used + 3 });
      const replay = await replayOver(stored, pilot, cap);
      expect(replay.final).toBe(true);
      expect(replay.targets).toHaveLength(rounds);
      expect(replay.targets[replay.targets.length - 1]).toBe(used);
      expect(replay.stored).toBe(used);
      expect(new Set(replay.samples.records.map((r) => r.sample)).size).toBe(used);
    });
  });

  describe('when a sample of the pilot is missing', () => {
    it('should stop in the first round, not final, with the stored samples only', async () => {
      const stored = await runTypicalSamples(SPEC, [0, 1], { start: 0, count: 4 });
      const replay = await replayOver(stored, 4, 64, new Set([2]));
      expect(replay.targets).toEqual([4]);
      expect(replay.final).toBe(false);
      expect(replay.stored).toBe(3);
      expect(replay.samples.records.map((r) => r.sample)).toEqual([0, 1, 3, 0, 1, 3]);
    });
  });

  describe('when two rounds are split in different ways', () => {
    it('should merge to the same records whatever the order the samples were stored in', async () => {
      const a = await runTypicalSamples(SPEC, [0, 1], { start: 0, count: 5 });
      const b = await runTypicalSamples(SPEC, [0, 1], { start: 5, count: 3 });
      const merged = mergeTypicalSamples([b, a]);
      const replay = await replayOver(merged, 4, 8);
      expect(replay.samples.records).toEqual(mergeTypicalSamples([a, b]).records);
    });
  });
});

describe('sampleBlocks', () => {
  it.each([
    ['cheap samples', 0, 16, 0.05], ['expensive samples', 4, 20, 9], ['a huge round', 8, 1024, 0.5], ['one sample', 3, 4, 1],
  ])('should cover the round exactly, in order, with %s', (_what, from, to, seconds) => {
    const blocks = sampleBlocks(from, to, seconds);
    expect(blocks[0].start).toBe(from);
    blocks.forEach((b, i) => {
      expect(b.count).toBeGreaterThan(0);
      if (i > 0) expect(b.start).toBe(blocks[i - 1].start + blocks[i - 1].count);
    });
    expect(blocks[blocks.length - 1].start + blocks[blocks.length - 1].count).toBe(to);
    expect(blocks.length).toBeLessThanOrEqual(MAX_BLOCKS_PER_ROUND);
    expect(blocks.length).toBeGreaterThanOrEqual(Math.min(MIN_BLOCKS_PER_ROUND, to - from));
  });

  it('should keep a round of little work in one block', () => {
    expect(sampleBlocks(4, 12, MIN_SPLIT_SECONDS / 10)).toEqual([{ start: 4, count: 8 }]);
    expect(sampleBlocks(4, 12, MIN_SPLIT_SECONDS / 7)).toHaveLength(MIN_BLOCKS_PER_ROUND);
  });

  it('should give one sample per block when a sample takes longer than the block target', () => {
    expect(sampleBlocks(0, 16, TARGET_BLOCK_SECONDS * 1.5).map((b) => b.count)).toEqual(Array(16).fill(1));
  });

  it('should size blocks by the work target once a round has many cheap samples', () => {
    expect(sampleBlocks(0, 64, TARGET_BLOCK_SECONDS / 4).map((b) => b.count)).toEqual(Array(16).fill(4));
  });

  it('should refuse an empty range and a non-positive estimate', () => {
    expect(() => sampleBlocks(4, 4, 1)).toThrow(RangeError);
    expect(() => sampleBlocks(0, 4, 0)).toThrow(RangeError);
    expect(() => sampleBlocks(0, 4, Number.NaN)).toThrow(RangeError);
  });
});

describe('roundsReached', () => {
  it('should name the round a stored count lies in (a completed round counts as its own)', () => {
    expect(roundsReached([4, 16, 40], 3)).toBe(1);
    expect(roundsReached([4, 16, 40], 4)).toBe(1);
    expect(roundsReached([4, 16, 40], 5)).toBe(2);
    expect(roundsReached([4, 16, 40], 40)).toBe(3);
  });
});
