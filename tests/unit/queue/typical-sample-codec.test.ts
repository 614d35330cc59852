/**
 * The stored form of a random sample (workers/src/queue/typical/sample-codec.ts): decoding
 * gives back every number bit for bit, from any byte alignment, and refuses bytes of another
 * shape or format.
 */
import { describe, expect, it } from 'vitest';
import { runTypicalSamples, typicalLayout } from '../../../workers/src/engines/typical/index.js';
import { decodeSample, encodeSample, SAMPLE_FORMAT } from '../../../workers/src/queue/typical/index.js';
import { spec } from '../exact/collect.js';

const SPEC = spec({
  lattice: { kind: 'chain', length: 6, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.7 }, h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1.5], times: { values: [0, 0.5, 1] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  engine: 'typical', tolerance: 0.05, seed: 5,
});
const layout = typicalLayout(SPEC);
const shape = { times: layout.times.length, primitives: layout.layout.primitives.length };

describe('sample codec', () => {
  describe('when a sample of a two-β branch is encoded and decoded', () => {
    it('should give back every record field bit for bit', async () => {
      const { records } = await runTypicalSamples(SPEC, [0, 1], { start: 3, count: 1 });
      expect(records).toHaveLength(2);
      const back = decodeSample(encodeSample(records, shape), shape);
      expect(back).toHaveLength(2);
      back.forEach((r, i) => {
        const o = records[i];
        for (const key of ['sample', 'betaIndex', 'lnWeight', 'energy', 'energyVariance', 'thermalError', 'h1Drift', 'normDrift', 'matvecs'] as const) {
          expect(Object.is(r[key], o[key]), key).toBe(true);
        }
        expect(Array.from(r.primitives)).toEqual(Array.from(o.primitives));
        expect(Array.from(r.stateErrors)).toEqual(Array.from(o.stateErrors));
      });
    });

    it('should decode bytes that are not 8-byte aligned (as a Redis reply may be)', async () => {
      const { records } = await runTypicalSamples(SPEC, [0], { start: 0, count: 1 });
      const bytes = encodeSample(records, shape);
      const shifted = Buffer.alloc(bytes.length + 3);
      bytes.copy(shifted, 3);
      const view = shifted.subarray(3);
      expect(view.byteOffset % 8).not.toBe(0);
      expect(decodeSample(view, shape)[0].energy).toBe(records[0].energy);
    });
  });

  describe('when the bytes do not fit', () => {
    it('should refuse another shape, a truncated sample, another format and mixed samples', async () => {
      const { records } = await runTypicalSamples(SPEC, [0], { start: 0, count: 2 });
      const bytes = encodeSample([records[0]], shape);
      expect(() => decodeSample(bytes, { ...shape, times: shape.times + 1 })).toThrow(RangeError);
      expect(() => decodeSample(bytes.subarray(0, bytes.length - 8), shape)).toThrow(/records/);
      expect(() => decodeSample(bytes.subarray(0, 7), shape)).toThrow(/whole doubles/);
      const other = Buffer.from(bytes);
      other.writeDoubleLE(SAMPLE_FORMAT + 1, 0);
      expect(() => decodeSample(other, shape)).toThrow(/format/);
      expect(() => encodeSample(records, shape)).toThrow(/sample/);
      expect(() => encodeSample([], shape)).toThrow(RangeError);
    });
  });
});
