/**
 * The building blocks of a TEBD step: the Trotter stage lists (orders 2 and 4, merging), the
 * bond model (terms to 4×4 bond Hamiltonians, refusals; long bonds: long-bonds.test.ts) and the gates (unitarity, the
 * auxiliary gate as conj of the physical one, invariance of |I⟩ under e^{−iτK}).
 * Tolerances: stage weights are sums of a few doubles (1e-12); gate identities 1e-13 (4×4 and
 * 16×16 matrix exponentials, complex-expm.ts).
 */
import { describe, expect, it } from 'vitest';
import { bondGates } from '../../../workers/src/engines/mps/bond-gates.js';
import { bondModel, unsupportedTerm } from '../../../workers/src/engines/mps/bond-model.js';
import type { ChainTerm } from '../../../workers/src/engines/mps/chain-terms.js';
import {
  TRIPLE_JUMP_INNER, TRIPLE_JUMP_OUTER, trotterStages,
} from '../../../workers/src/engines/mps/trotter-schedule.js';
import type { PauliFactor } from '../../../workers/src/physics/pauli-word.js';

const f = (letter: 'X' | 'Y' | 'Z', site: number): PauliFactor => ({ letter, site });
const term = (weight: number, ...factors: PauliFactor[]): ChainTerm => ({ weight, factors });

function layerTotals(stages: ReturnType<typeof trotterStages>): [number, number] {
  const t: [number, number] = [0, 0];
  for (const s of stages) t[s.layer] += s.weight;
  return t;
}

describe('trotterStages', () => {
  it('gives Strang steps with merged half steps: A/2 B A B … A/2', () => {
    const st = trotterStages(2, 3);
    expect(st.map((s) => s.layer)).toEqual([0, 1, 0, 1, 0, 1, 0]);
    expect(st.map((s) => s.weight)).toEqual([0.5, 1, 1, 1, 1, 1, 0.5]);
  });

  it('gives the fourth-order triple jump with weights summing to the step count per layer', () => {
    expect(2 * TRIPLE_JUMP_OUTER + TRIPLE_JUMP_INNER).toBeCloseTo(1, 15);
    // Third-order condition of the triple jump: 2w₁³ + w₀³ = 0.
    expect(2 * TRIPLE_JUMP_OUTER ** 3 + TRIPLE_JUMP_INNER ** 3).toBeCloseTo(0, 14);
    const st = trotterStages(4, 5);
    expect(st.length).toBe(6 * 5 + 1);
    const [a, b] = layerTotals(st);
    expect(a).toBeCloseTo(5, 12);
    expect(b).toBeCloseTo(5, 12);
    for (let k = 1; k < st.length; k++) expect(st[k].layer).not.toBe(st[k - 1].layer);
  });

  it('merges everything into one exact stage when there is a single layer', () => {
    expect(trotterStages(4, 7, 1)).toHaveLength(1);
    expect(trotterStages(4, 7, 1)[0].weight).toBeCloseTo(7, 12);
    expect(() => trotterStages(2, 0)).toThrow(/steps/);
    expect(() => trotterStages(3 as 2, 1)).toThrow(/order/);
  });
});

describe('bondModel', () => {
  it('puts two-site terms on their bond and single-site terms on the bond to their right (last site: left)', () => {
    const m = bondModel([term(2, f('Z', 0), f('Z', 1)), term(0.5, f('X', 2)), term(-1, f('X', 0)), term(0.25)], 3);
    expect(m.constant).toBe(0.25);
    expect(m.bonds).toHaveLength(2);
    // Bond 0: 2·Z⊗Z − X on site 0; index s_0 + 2·s_1: diagonal of ZZ is (1, −1, −1, 1).
    expect([0, 1, 2, 3].map((q) => m.bonds[0][2 * (q * 4 + q)])).toEqual([2, -2, -2, 2]);
    expect(m.bonds[0][2 * (0 * 4 + 1)]).toBe(-1); // X on site 0 flips s_0 (the low digit)
    // Bond 1 carries X on site 2 = its high digit.
    expect(m.bonds[1][2 * (0 * 4 + 2)]).toBe(0.5);
    expect(m.localNorm).toBe(3);
  });

  it('refuses terms on more than two sites and keeps pairs that are not neighbours as long bonds', () => {
    expect(unsupportedTerm([term(1, f('Z', 0), f('Z', 1), f('Z', 2))])).toMatch(/3 sites/);
    expect(() => bondModel([term(1, f('X', 0), f('X', 1), f('X', 3))], 4)).toThrow(RangeError);
    expect(() => bondModel([term(1, f('X', 0), f('X', 4))], 4)).toThrow(/outside the chain/);
    expect(unsupportedTerm([term(1, f('Y', 3), f('X', 4)), term(1, f('Z', 0), f('Z', 2))])).toBeNull();
    expect(bondModel([term(1, f('X', 0), f('X', 3))], 4).long.map((g) => [g.left, g.right])).toEqual([[0, 3]]);
  });
});

describe('bondGates', () => {
  const model = bondModel([term(0.8, f('X', 0), f('Y', 1)), term(-0.6, f('Z', 0), f('Z', 1)), term(0.4, f('Y', 0)), term(0.3, f('X', 1))], 2);

  it('builds unitary real-time gates whose auxiliary half is the conjugate of the physical half', () => {
    const [g] = bondGates(model, 0.37, { kind: 'real', auxiliary: 'transpose' });
    const n = 16;
    for (let p = 0; p < n; p++) for (let q = 0; q < n; q++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        re += g[2 * (k * n + p)] * g[2 * (k * n + q)] + g[2 * (k * n + p) + 1] * g[2 * (k * n + q) + 1];
        im += g[2 * (k * n + p)] * g[2 * (k * n + q) + 1] - g[2 * (k * n + p) + 1] * g[2 * (k * n + q)];
      }
      expect(Math.abs(re - (p === q ? 1 : 0))).toBeLessThan(1e-13);
      expect(Math.abs(im)).toBeLessThan(1e-13);
    }
    // e^{−iτK}|I⟩ = |I⟩ on the pair: |I⟩ has amplitude 1/2 at p_0, p_1 ∈ {0, 3}.
    const idx = [0, 3, 12, 15];
    for (let q = 0; q < n; q++) {
      let re = 0;
      let im = 0;
      for (const x of idx) {
        re += g[2 * (q * n + x)] / 2;
        im += g[2 * (q * n + x) + 1] / 2;
      }
      expect(Math.abs(re - (idx.includes(q) ? 0.5 : 0))).toBeLessThan(1e-13);
      expect(Math.abs(im)).toBeLessThan(1e-13);
    }
  });

  it('does not leave |I⟩ invariant with the untransposed auxiliary gate when h ≠ hᵀ', () => {
    const [g] = bondGates(model, 0.37, { kind: 'real', auxiliary: 'plain' });
    let dev = 0;
    const idx = [0, 3, 12, 15];
    for (let q = 0; q < 16; q++) {
      let re = 0;
      let im = 0;
      for (const x of idx) {
        re += g[2 * (q * 16 + x)] / 2;
        im += g[2 * (q * 16 + x) + 1] / 2;
      }
      dev = Math.max(dev, Math.hypot(re - (idx.includes(q) ? 0.5 : 0), im));
    }
    expect(dev).toBeGreaterThan(1e-2);
  });

  it('builds imaginary-time gates e^{−τh} ⊗ 1 that leave the auxiliary index alone', () => {
    const [g] = bondGates(model, 0.2, { kind: 'imaginary' });
    for (let q = 0; q < 16; q++) for (let r = 0; r < 16; r++) {
      const auxQ = ((q >> 2) >> 1) + 2 * ((q & 3) >> 1);
      const auxR = ((r >> 2) >> 1) + 2 * ((r & 3) >> 1);
      if (auxQ !== auxR) {
        expect(Math.abs(g[2 * (q * 16 + r)])).toBe(0);
        expect(Math.abs(g[2 * (q * 16 + r) + 1])).toBe(0);
      }
    }
  });
});
