/**
 * `betasweep status` text: a typical sweep's branches show their samples (so far, or final);
 * other engines' branches show none.
 */
import { describe, expect, it } from 'vitest';
import { formatStatus } from '../../../services/cli/src/commands/status.js';

const base = {
  id: 'sw_aaaaaaaaaaaaaaaa', status: 'running', label: '', engine: 'typical', error: null,
  pointsDone: 6, pointsTotal: 6, progress: 1,
  timings: { createdAt: '2025-01-01T00:00:00Z', startedAt: '2025-01-01T00:00:01Z', finishedAt: null, queuedSeconds: 1, runSeconds: 4 },
  plan: { engine: 'typical', reason: 'r', seconds: 1, memoryBytes: 2 ** 20, accuracy: 0.01 },
  betas: [0.5, 1],
};
const branch = (index: number, samples?: { stored: number; target: number; final: boolean }) => ({
  index, betaIndices: [index], state: samples?.final ? 'done' : 'running', attempts: 1, pointsDone: 3, pointsTotal: 3, worker: 'w1', error: null,
  ...(samples ? { samples } : {}),
});

describe('formatStatus', () => {
  it('should show a sampled branch\'s samples so far, and the final count once it is final', () => {
    const text = formatStatus({ ...base, branches: [branch(0, { stored: 5, target: 8, final: false }), branch(1, { stored: 16, target: 16, final: true })] });
    const lines = text.split('\n');
    expect(lines.find((l) => l.includes('branch   0'))).toMatch(/samples 5\/8 so far/);
    expect(lines.find((l) => l.includes('branch   1'))).toMatch(/16 samples \(final\)/);
  });

  it('should show no samples for a branch without them', () => {
    expect(formatStatus({ ...base, branches: [branch(0)] })).not.toMatch(/sample/);
  });
});
