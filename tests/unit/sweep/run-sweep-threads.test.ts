/**
 * Local sweeps on worker threads give exactly the records of the single-thread path, and an
 * abort stops them.
 */
import { describe, expect, it } from 'vitest';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';

function spec() {
  const parsed = parseSweepSpec({
    lattice: { kind: 'chain', length: 5, boundary: 'periodic' },
    h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 },
    h1: { model: 'xxz', J: 1, delta: 1.5, hz: 0.2 },
    betas: [0.2, 0.7, 1.5],
    times: { start: 0, stop: 1, count: 6 },
    observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }, { kind: 'energy', of: 'h0' }],
    engine: 'exact',
  });
  if (!parsed.success) throw new Error(JSON.stringify(parsed.issues));
  return parsed.spec;
}

describe('runSweep', () => {
  describe('when branches run on worker threads', () => {
    it('should give bit-for-bit the values of the single-thread run', async () => {
      const one = await runSweep(spec(), { threads: 1 });
      const two = await runSweep(spec(), { threads: 2 });
      expect(two.series).toEqual(one.series);
      expect(two.thermo).toEqual(one.thermo);
      expect(two.diagnostics.map((d) => d.h1Drift)).toEqual(one.diagnostics.map((d) => d.h1Drift));
    });

    it('should reject with an abort when the signal fires', async () => {
      const controller = new AbortController();
      const run = runSweep(spec(), { threads: 2, signal: controller.signal, onProgress: () => controller.abort() });
      await expect(run).rejects.toThrow(/abort/i);
    });
  });
});
