/**
 * The mps engine against the exact engine: non-integrable Ising quench of a 10-site open chain
 * (settings, tolerances and their reasons: exact-comparison.ts).
 */
import { describe, it } from 'vitest';
import { checkAgainstExact, exactComparisonInput } from './exact-comparison.js';

describe('MpsEngine against the exact engine', () => {
  it('agrees to 1e-8 on a non-integrable Ising quench of a 10-site chain', async () => {
    await checkAgainstExact(exactComparisonInput(10, { model: 'ising', J: 0.5, hx: 0.55, hz: 0.2 }, { model: 'ising', J: 0.4, hx: 0.3, hz: -0.1 }, 0.015));
  });
});
