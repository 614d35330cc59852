/**
 * The mps engine against the exact engine: XXZ → XXZ + Dzyaloshinskii–Moriya quench of a 6-site
 * open chain, whose H1 has terms with an odd number of Y (H1 ≠ H1ᵀ), so the auxiliary gate must
 * be e^{+iτh_bᵀ} (settings, tolerances and their reasons: exact-comparison.ts).
 */
import { describe, it } from 'vitest';
import { checkAgainstExact, exactComparisonInput } from './exact-comparison.js';

describe('MpsEngine against the exact engine', () => {
  it('agrees to 1e-8 on an XXZ quench with a Dzyaloshinskii–Moriya term (odd Y count: the transpose matters)', async () => {
    const L = 6;
    const terms: Array<{ weight: number; word: string }> = [];
    for (let i = 0; i + 1 < L; i++) {
      terms.push({ weight: 0.35, word: `X${i} X${i + 1}` }, { weight: 0.35, word: `Y${i} Y${i + 1}` }, { weight: 0.25, word: `Z${i} Z${i + 1}` });
      terms.push({ weight: 0.15, word: `X${i} Y${i + 1}` }, { weight: -0.15, word: `Y${i} X${i + 1}` });
    }
    terms.push({ weight: 0.1, word: 'Y0' }, { weight: -0.2, word: `Z${L - 1}` });
    await checkAgainstExact(exactComparisonInput(L, { model: 'xxz', J: 0.35, delta: 1.4, hz: 0.1 }, { model: 'pauli-sum', terms }, 0.01));
  });
});
