/**
 * The purified MPS: the β = 0 state, centre moves, string measurements and serialisation,
 * checked against the dense 4^L vector of small chains (dense-purified.ts).
 * Tolerance 1e-13: every operation is a few Householder reflections or products of O(1)
 * numbers on vectors of length ≤ 4^5.
 */
import { describe, expect, it } from 'vitest';
import { createGateWorkspace } from '../../../workers/src/engines/mps/apply-gate.js';
import { bondModel } from '../../../workers/src/engines/mps/bond-model.js';
import { emptyStats } from '../../../workers/src/engines/mps/evolve-stages.js';
import { createMeasureWorkspace, measureStrings } from '../../../workers/src/engines/mps/measure-strings.js';
import { createMoveWorkspace, moveCenterTo } from '../../../workers/src/engines/mps/move-center.js';
import {
  deserializeMps, identityPurification, serializeMps, type PurifiedMps,
} from '../../../workers/src/engines/mps/purified-mps.js';
import { TrotterPropagator } from '../../../workers/src/engines/mps/trotter-propagator.js';
import type { PauliFactor } from '../../../workers/src/physics/pauli-word.js';
import { denseExpectation, denseVector } from './dense-purified.js';

/** An entangled 5-site state: imaginary then real time under a Hamiltonian with Y terms. */
function entangled(): PurifiedMps {
  const f = (letter: 'X' | 'Y' | 'Z', site: number): PauliFactor => ({ letter, site });
  const terms = [];
  for (let i = 0; i < 4; i++) {
    terms.push({ weight: 0.7, factors: [f('X', i), f('Y', i + 1)] }, { weight: -0.5, factors: [f('Z', i), f('Z', i + 1)] });
  }
  for (let i = 0; i < 5; i++) terms.push({ weight: 0.3 + 0.1 * i, factors: [f(i % 2 ? 'X' : 'Y', i)] });
  const model = bondModel(terms, 5);
  const ws = { gate: createGateWorkspace(), move: createMoveWorkspace() };
  const mps = identityPurification(5);
  const tr = { maxBond: 256, maxWeight: 0 };
  new TrotterPropagator(model, { kind: 'imaginary' }, 2, tr).run(mps, 3, 0.2, ws, emptyStats());
  new TrotterPropagator(model, { kind: 'real', auxiliary: 'none' }, 2, tr).run(mps, 3, 0.3, ws, emptyStats());
  return mps;
}

function maxDiff(a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (let k = 0; k < a.length; k++) d = Math.max(d, Math.abs(a[k] - b[k]));
  return d;
}

describe('purified MPS', () => {
  it('starts at β = 0 as ⊗(|00̃⟩ + |11̃⟩)/√2 with bond dimension 1 and zero Pauli expectations', () => {
    const mps = identityPurification(3);
    expect([...mps.dims]).toEqual([1, 1, 1, 1]);
    const v = denseVector(mps);
    // Non-zero amplitudes exactly at p_i ∈ {0, 3} for every site: 2^3 of them, each 2^{−3/2}.
    let count = 0;
    for (let x = 0; x < 64; x++) {
      const digits = [Math.floor(x / 16), Math.floor(x / 4) % 4, x % 4];
      const inside = digits.every((p) => p === 0 || p === 3);
      if (inside) {
        expect(v[2 * x]).toBeCloseTo(2 ** -1.5, 15);
        count++;
      } else expect(v[2 * x]).toBe(0);
    }
    expect(count).toBe(8);
    const values = new Float64Array(3);
    const strings = [{ factors: [{ letter: 'X' as const, site: 1 }] }, { factors: [{ letter: 'Z' as const, site: 0 }, { letter: 'Z' as const, site: 2 }] }, { factors: [{ letter: 'Y' as const, site: 2 }] }];
    measureStrings(mps, strings, values, createMoveWorkspace(), createMeasureWorkspace());
    expect([...values]).toEqual([0, 0, 0]);
  });

  it('keeps the state and the gauge when the centre moves back and forth', () => {
    const mps = entangled();
    const v0 = denseVector(mps);
    const move = createMoveWorkspace();
    for (const target of [0, 4, 2, 0, 3]) {
      moveCenterTo(mps, target, move);
      expect(mps.center).toBe(target);
      expect(maxDiff(denseVector(mps), v0)).toBeLessThan(1e-13);
      // Left of the centre: Σ_{α,p} conj(A[α,p,β])·A[α,p,β'] = δ.
      for (let i = 0; i < target; i++) {
        const chiL = mps.dims[i];
        const chiR = mps.dims[i + 1];
        const t = mps.tensors[i];
        for (let b = 0; b < chiR; b++) for (let c = 0; c < chiR; c++) {
          let re = 0;
          let im = 0;
          for (let r = 0; r < 4 * chiL; r++) {
            re += t[2 * (r * chiR + b)] * t[2 * (r * chiR + c)] + t[2 * (r * chiR + b) + 1] * t[2 * (r * chiR + c) + 1];
            im += t[2 * (r * chiR + b)] * t[2 * (r * chiR + c) + 1] - t[2 * (r * chiR + b) + 1] * t[2 * (r * chiR + c)];
          }
          expect(Math.abs(re - (b === c ? 1 : 0))).toBeLessThan(1e-13);
          expect(Math.abs(im)).toBeLessThan(1e-13);
        }
      }
    }
  });

  it('measures one-site, neighbour and distant strings with Y factors as the dense vector does', () => {
    const mps = entangled();
    const v = denseVector(mps);
    const strings: { factors: PauliFactor[] }[] = [
      { factors: [{ letter: 'X', site: 0 }] }, { factors: [{ letter: 'Y', site: 3 }] }, { factors: [{ letter: 'Z', site: 4 }] },
      { factors: [{ letter: 'X', site: 1 }, { letter: 'Y', site: 2 }] }, { factors: [{ letter: 'Y', site: 0 }, { letter: 'Y', site: 4 }] },
      { factors: [{ letter: 'Z', site: 1 }, { letter: 'X', site: 2 }, { letter: 'Y', site: 4 }] },
    ];
    const values = new Float64Array(strings.length);
    const maxImag = measureStrings(mps, strings, values, createMoveWorkspace(), createMeasureWorkspace());
    expect(maxImag).toBeLessThan(1e-14);
    strings.forEach((s, k) => {
      const [re, im] = denseExpectation(v, 5, s.factors);
      expect(Math.abs(im)).toBeLessThan(1e-14);
      expect(Math.abs(values[k] - re)).toBeLessThan(1e-13);
    });
    expect(Math.max(...values.map(Math.abs))).toBeGreaterThan(1e-3); // not trivially zero
  });

  it('serialises and restores a state bit for bit, and rejects foreign data', () => {
    const mps = entangled();
    const data = serializeMps(mps);
    const { mps: back, next } = deserializeMps(data);
    expect(next).toBe(data.length);
    expect(back.center).toBe(mps.center);
    expect([...back.dims]).toEqual([...mps.dims]);
    back.tensors.forEach((t, i) => expect([...t]).toEqual([...mps.tensors[i]]));
    const bad = data.slice();
    bad[0] = 99;
    expect(() => deserializeMps(bad)).toThrow(/format tag/);
    expect(() => deserializeMps(data.slice(0, 20))).toThrow(RangeError);
  });
});
