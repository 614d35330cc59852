/**
 * The mps engine against the exact engine where bonds span more than one chain step and go
 * through swap gates (apply-long-gate.ts; without truncation the swaps are exact, so the
 * Trotter splitting is the only approximation): two-leg ladders lined up rung by rung (leg
 * bonds span two steps, in imaginary and real time; with periodic legs the rungs run in folded
 * ring order and legs span up to four), and an open chain whose quench Hamiltonian, a
 * pauli-sum, adds next-nearest and third-neighbour terms (some with an odd number of Y, so
 * the auxiliary gates need the transpose). Settings, tolerances and their reasons:
 * exact-comparison.ts (1e-8 on every value, within the engine's own error bars;
 * thermodynamics per site).
 * Sizes and times are kept short: with truncation off (1e-20 per update) the bond dimension
 * needed grows fast once terms cross a cut more than once (χ ≈ 100 by t = 0.15 in the chain
 * case), and every long bond costs two swaps per span step. dt is set so that the fourth-order
 * Trotter error stays well below 1e-8 (4e-8 for the ladder at dt = 0.025, scaling as dt⁴);
 * measured deviations: 2.3e-9 (open ladder), 1.9e-9 (periodic legs), 4.8e-9 (chain).
 */
import { describe, it } from 'vitest';
import { checkAgainstExact, exactComparisonInput } from './exact-comparison.js';

/** A loaded shared machine can take several times the ~30 s these need alone. */
const TIMEOUT_MS = 600_000;

describe('MpsEngine against the exact engine with bonds longer than one chain step', () => {
  it('agrees to 1e-8 on an Ising quench of an open 2×4 ladder', async () => {
    await checkAgainstExact(exactComparisonInput(8, { model: 'ising', J: 0.5, hx: 0.55, hz: 0.2 }, { model: 'ising', J: 0.4, hx: 0.3, hz: -0.1 }, 0.0125,
      { lattice: { kind: 'ladder', length: 4 }, beta: 0.5, stop: 0.2 }));
  }, TIMEOUT_MS);

  it('agrees to 1e-8 on an XXZ quench of a 2×3 ladder with periodic legs (legs spanning up to four chain steps)', async () => {
    await checkAgainstExact(exactComparisonInput(6, { model: 'xxz', J: 0.25, delta: 1.4, hz: 0.1 }, { model: 'xxz', J: 0.25, delta: 0.6, hz: -0.2 }, 0.01,
      { lattice: { kind: 'ladder', length: 3, boundary: ['periodic', 'open'] }, beta: 0.5, stop: 0.2 }));
  }, TIMEOUT_MS);

  it('agrees to 1e-8 on a chain quenched with next-nearest and third-neighbour terms, some with an odd number of Y', async () => {
    const L = 8;
    const terms: Array<{ weight: number; word: string }> = [];
    for (let i = 0; i + 1 < L; i++) terms.push({ weight: -0.4, word: `Z${i} Z${i + 1}` });
    for (let i = 0; i + 2 < L; i++) terms.push({ weight: 0.15, word: `Z${i} Z${i + 2}` }, { weight: 0.03, word: `X${i} Y${i + 2}` });
    for (let i = 0; i < L; i++) terms.push({ weight: -0.3, word: `X${i}` }, { weight: 0.1, word: `Z${i}` });
    terms.push({ weight: -0.05, word: 'Y1 Z4' }, { weight: 0.05, word: 'X3 X6' });
    await checkAgainstExact(exactComparisonInput(L, { model: 'ising', J: 0.5, hx: 0.45, hz: 0.15 }, { model: 'pauli-sum', terms }, 0.025,
      { beta: 0.3, stop: 0.15 }));
  }, TIMEOUT_MS);
});
