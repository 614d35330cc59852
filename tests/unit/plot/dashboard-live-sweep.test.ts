import { describe, expect, it } from 'vitest';
import { LiveSweep } from '../../../services/dashboard/src/live-sweep.js';
import type { ResultDocument, SweepStatusReport } from '../../../services/dashboard/src/types.js';

const status = {
  id: 'sw_aaaaaaaaaaaaaaaa', status: 'running', label: 'live', engine: 'exact', error: null, pointsDone: 0, pointsTotal: 4, progress: 0,
  timings: { createdAt: '2026-01-01T00:00:00Z', startedAt: null, finishedAt: null, queuedSeconds: 0, runSeconds: null },
  plan: { engine: 'exact', reason: '', feasible: true, refusal: null, memoryBytes: 0, flops: 0, seconds: 0, accuracy: 1e-8, branches: [[0], [1]], sites: 2 },
  betas: [0.5, 1], times: [0, 1], series: [{ label: 'X:avg', observable: 0 }, { label: 'ZZ:nearest', observable: 1 }],
} satisfies SweepStatusReport;

describe('LiveSweep', () => {
  describe('when events arrive', () => {
    it('should start with NaN everywhere and fill each point once, counting distinct points', () => {
      const live = new LiveSweep(status);
      expect(live.data.series[1].values.flat().every(Number.isNaN)).toBe(true);
      expect(live.apply('point', JSON.stringify({ betaIndex: 1, timeIndex: 0, values: [0.1, 0.2], errors: [1e-9, 2e-9] }))).toBe(true);
      // A retried branch may send the same point again: it is not counted twice.
      live.apply('point', JSON.stringify({ betaIndex: 1, timeIndex: 0, values: [0.1, 0.2], errors: [1e-9, 2e-9] }));
      expect(live.points).toBe(1);
      expect(live.data.series[1].values[1][0]).toBe(0.2);
      expect(live.data.series[1].errors[1][0]).toBe(2e-9);
      expect(live.data.series[0].values[0][0]).toBeNaN();
    });

    it('should ignore points outside the grid and unreadable data', () => {
      const live = new LiveSweep(status);
      expect(live.apply('point', JSON.stringify({ betaIndex: 5, timeIndex: 0, values: [1, 1], errors: [0, 0] }))).toBe(false);
      expect(live.apply('point', '{not json')).toBe(false);
      expect(live.points).toBe(0);
    });

    it('should keep one thermodynamics and one diagnostics record per β (the latest)', () => {
      const live = new LiveSweep(status);
      const thermo = (energy: number) => JSON.stringify({ betaIndex: 0, beta: 0.5, lnZ: 1, energy, heatCapacity: 0, freeEnergy: -2, entropy: 0, errors: {}, sites: 2 });
      live.apply('thermo', thermo(-1));
      live.apply('thermo', thermo(-2));
      expect(live.data.thermo.map((t) => t.energy)).toEqual([-2]);
      live.apply('diagnostics', JSON.stringify({ betaIndex: 1, h1Drift: 0, normDrift: 0, stationarityResidual: null, propagatorErrorBound: 0, extra: {} }));
      live.apply('diagnostics', JSON.stringify({ betaIndex: 0, h1Drift: 0, normDrift: 0, stationarityResidual: null, propagatorErrorBound: 0, extra: {} }));
      expect(live.diagnostics.map((d) => d.betaIndex)).toEqual([0, 1]);
    });
  });

  describe('when the final result replaces the stream', () => {
    it('should take every value from the result and ignore later events', () => {
      const live = new LiveSweep(status);
      const result = {
        spec: { label: 'final' }, betas: [0.5, 1], times: [0, 1], plan: status.plan, thermo: [], diagnostics: [],
        series: [{ label: 'X:avg', values: [[1, 2], [3, 4]], errors: [[0, 0], [0, 0]] }, { label: 'ZZ:nearest', values: [[5, 6], [7, 8]], errors: [[0, 0], [0, 0]] }],
      } as unknown as ResultDocument;
      live.useResult(result);
      expect(live.final).toBe(true);
      expect(live.points).toBe(4);
      expect(live.data.label).toBe('final');
      expect(live.apply('point', JSON.stringify({ betaIndex: 0, timeIndex: 0, values: [9, 9], errors: [0, 0] }))).toBe(false);
      expect(live.data.series[0].values[0][0]).toBe(1);
    });
  });
});
