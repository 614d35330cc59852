/**
 * The status body served by the polling route (statusJson: changing fields serialised per
 * request, spec/plan/grids serialised once per sweep) is the same document as serialising
 * the full view, for a fresh record and after the changing fields move on.
 */
import { describe, expect, it } from 'vitest';
import { statusJson, statusView } from '../../../services/api/src/sweep-views.js';
import { MemoryJobStore } from '../../../workers/src/store/index.js';
import { newSweepFor } from '../../service/support/harness-core.js';

describe('statusJson', () => {
  it('should equal the serialised status view, before and after progress', async () => {
    const store = new MemoryJobStore();
    const input = await newSweepFor({
      label: 'status-body', lattice: { kind: 'chain', length: 4 }, h0: { model: 'ising', J: 1, hx: 0.5 },
      h1: { model: 'ising', J: 1, hx: 1.5 }, betas: [0.5, 1], times: { stop: 1, count: 3 },
      observables: [{ kind: 'site', pauli: 'X' }], engine: 'exact',
    });
    const { id } = (await store.createSweep(input)) as { id: string };
    const now = Date.parse('2026-12-01T12:00:00Z');
    const first = (await store.getSweep(id))!;
    expect(JSON.parse(statusJson(first, now))).toEqual(JSON.parse(JSON.stringify(statusView(first, now))));
    // Same plan object, new changing fields: the cached tail is reused, the head follows.
    const moved = { ...first, status: 'running' as const, startedAt: '2026-12-01T11:59:00.000Z', pointsDone: 2 };
    const body = JSON.parse(statusJson(moved, now));
    expect(body).toEqual(JSON.parse(JSON.stringify(statusView(moved, now))));
    expect(body.status).toBe('running');
    expect(body.timings.runSeconds).toBe(60);
    expect(body.pointsDone).toBe(2);
  });
});
