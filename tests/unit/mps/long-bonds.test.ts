/**
 * Bonds longer than one chain step: the chain order of chains, rings and ladders (and the
 * refusal of two-dimensional lattices), long bonds and their layers in the bond model, Trotter
 * stages over more than two layers and their update count, and one long gate applied through
 * swaps against the same gate applied to the dense 4^L vector (dense-purified.ts).
 * Tolerances: stage weights are sums of a few doubles (1e-12); the swap routing without
 * truncation is exact up to rounding of ~20 two-site updates on a 4^5 vector (1e-12).
 */
import { describe, expect, it } from 'vitest';
import type { Lattice } from '../../../shared-types/src/index.js';
import { createGateWorkspace } from '../../../workers/src/engines/mps/apply-gate.js';
import { applyLongGate } from '../../../workers/src/engines/mps/apply-long-gate.js';
import { longBondGates, swapGate } from '../../../workers/src/engines/mps/bond-gates.js';
import { bondModel, layerCosts } from '../../../workers/src/engines/mps/bond-model.js';
import { chainOrder, type ChainOrder } from '../../../workers/src/engines/mps/chain-order.js';
import type { ChainTerm } from '../../../workers/src/engines/mps/chain-terms.js';
import { emptyStats } from '../../../workers/src/engines/mps/evolve-stages.js';
import { createMoveWorkspace, moveCenterTo } from '../../../workers/src/engines/mps/move-center.js';
import { identityPurification } from '../../../workers/src/engines/mps/purified-mps.js';
import { TrotterPropagator } from '../../../workers/src/engines/mps/trotter-propagator.js';
import { trotterStages, updatesFor } from '../../../workers/src/engines/mps/trotter-schedule.js';
import { buildLattice } from '../../../workers/src/lattice/index.js';
import type { PauliFactor } from '../../../workers/src/physics/pauli-word.js';
import { denseVector } from './dense-purified.js';

const f = (letter: 'X' | 'Y' | 'Z', site: number): PauliFactor => ({ letter, site });
const term = (weight: number, ...factors: PauliFactor[]): ChainTerm => ({ weight, factors });

function spans(lattice: Lattice): number[] {
  const g = buildLattice(lattice);
  const o = chainOrder(lattice, g.sites) as ChainOrder;
  expect([...o.site].sort((a, b) => a - b)).toEqual(Array.from({ length: g.sites }, (_, i) => i));
  o.site.forEach((s, p) => expect(o.position[s]).toBe(p));
  return g.bonds.map(([i, j]) => Math.abs(o.position[i] - o.position[j]));
}

describe('chainOrder', () => {
  it('lines a ladder up rung by rung, so rungs span one step and legs two', () => {
    const o = chainOrder({ kind: 'ladder', length: 3, boundary: ['open', 'open'] }, 6) as ChainOrder;
    expect(o.site).toEqual([0, 3, 1, 4, 2, 5]);
    expect(Math.max(...spans({ kind: 'ladder', length: 5, boundary: ['open', 'open'] }))).toBe(2);
  });

  it('folds rings, so no bond of a ring (or of a ladder with periodic legs) spans more than two (four) steps', () => {
    expect(Math.max(...spans({ kind: 'chain', length: 9, boundary: 'periodic' }))).toBe(2);
    expect(Math.max(...spans({ kind: 'chain', length: 10, boundary: 'periodic' }))).toBe(2);
    expect(Math.max(...spans({ kind: 'ladder', length: 6, boundary: ['periodic', 'open'] }))).toBe(4);
    expect(Math.max(...spans({ kind: 'chain', length: 7, boundary: 'open' }))).toBe(1);
  });

  it('refuses two-dimensional lattices, naming the field', () => {
    for (const kind of ['square', 'triangular', 'honeycomb'] as const) {
      const r = chainOrder({ kind, size: [3, 3], boundary: ['open', 'open'] }, 9 * (kind === 'honeycomb' ? 2 : 1));
      expect(r).toMatchObject({ field: 'lattice.kind' });
      expect((r as { message: string }).message).toMatch(new RegExp(`${kind} lattice`));
    }
  });
});

describe('bondModel with long bonds', () => {
  it('keeps pairs more than one step apart as long bonds, in layers without a common site', () => {
    const m = bondModel([term(1, f('Z', 0), f('Z', 2)), term(0.5, f('X', 1), f('X', 3)), term(2, f('Z', 2), f('Z', 4)),
      term(-1, f('Y', 0), f('X', 3)), term(0.3, f('Z', 0), f('Z', 1)), term(0.25, f('Z', 0), f('Z', 2))], 5);
    expect(m.long.map((g) => [g.left, g.right])).toEqual([[0, 2], [0, 3], [1, 3], [2, 4]]);
    expect(m.long[0].h[0]).toBe(1.25); // both Z0 Z2 terms on one long bond
    for (const layer of m.longLayers) {
      const ends = layer.flatMap((k) => [m.long[k].left, m.long[k].right]);
      expect(new Set(ends).size).toBe(ends.length);
    }
    expect(m.longLayers.flat().sort()).toEqual([0, 1, 2, 3]);
    expect(m.localNorm).toBe(2);
    // Neighbour layers of 4 bonds, then each long bond at 2(span − 1) swaps + 1 gate.
    const costs = layerCosts(m);
    expect(costs.slice(0, 2)).toEqual([2, 2]);
    expect(costs.slice(2).reduce((a, b) => a + b, 0)).toBe(3 + 5 + 3 + 3);
  });
});

describe('trotterStages over more than two layers', () => {
  it('gives the symmetric Strang sequence and the triple jump with every layer summing to the step count', () => {
    const st = trotterStages(2, 2, 4);
    expect(st.map((s) => s.layer)).toEqual([0, 1, 2, 3, 2, 1, 0, 1, 2, 3, 2, 1, 0]);
    expect(st.map((s) => s.weight)).toEqual([0.5, 0.5, 0.5, 1, 0.5, 0.5, 1, 0.5, 0.5, 1, 0.5, 0.5, 0.5]);
    const st4 = trotterStages(4, 3, 3);
    for (let layer = 0; layer < 3; layer++) {
      expect(st4.filter((s) => s.layer === layer).reduce((a, s) => a + s.weight, 0)).toBeCloseTo(3, 12);
    }
    for (let k = 1; k < st4.length; k++) expect(st4[k].layer).not.toBe(st4[k - 1].layer);
    for (const [order, steps, costs] of [[2, 7, [3, 2, 5]], [4, 5, [4, 4, 9, 1]], [4, 6, [3]]] as const) {
      const direct = trotterStages(order, steps, costs.length).reduce((a, s) => a + costs[s.layer], 0);
      expect(updatesFor(order, steps, costs)).toBe(direct);
    }
    expect(() => trotterStages(2, 1, 0)).toThrow(/layers/);
  });
});

describe('applyLongGate', () => {
  /** An entangled 5-site state (imaginary then real time of a neighbour model with Y terms). */
  function entangled() {
    const terms: ChainTerm[] = [];
    for (let i = 0; i < 4; i++) terms.push(term(0.7, f('X', i), f('Y', i + 1)), term(-0.5, f('Z', i), f('Z', i + 1)));
    for (let i = 0; i < 5; i++) terms.push(term(0.3 + 0.1 * i, f(i % 2 ? 'X' : 'Y', i)));
    const model = bondModel(terms, 5);
    const ws = { gate: createGateWorkspace(), move: createMoveWorkspace() };
    const mps = identityPurification(5);
    const tr = { maxBond: 256, maxWeight: 0 };
    new TrotterPropagator(model, { kind: 'imaginary' }, 2, tr).run(mps, 3, 0.2, ws, emptyStats());
    new TrotterPropagator(model, { kind: 'real', auxiliary: 'none' }, 2, tr).run(mps, 3, 0.3, ws, emptyStats());
    return { mps, ws };
  }

  /** G applied to the local indices of positions (i, j) of a dense vector (index Σ p_k·4^{L−1−k}). */
  function denseApply(v: Float64Array, L: number, i: number, j: number, g: Float64Array): Float64Array {
    const out = new Float64Array(v.length);
    const si = 4 ** (L - 1 - i);
    const sj = 4 ** (L - 1 - j);
    for (let x = 0; x < v.length / 2; x++) {
      const pi = Math.floor(x / si) % 4;
      const pj = Math.floor(x / sj) % 4;
      const base = x - pi * si - pj * sj;
      for (let q = 0; q < 16; q++) {
        const y = base + (q >> 2) * si + (q & 3) * sj;
        const gr = g[2 * (q * 16 + 4 * pi + pj)];
        const gi = g[2 * (q * 16 + 4 * pi + pj) + 1];
        out[2 * y] += gr * v[2 * x] - gi * v[2 * x + 1];
        out[2 * y + 1] += gr * v[2 * x + 1] + gi * v[2 * x];
      }
    }
    return out;
  }

  for (const [i, j, centre] of [[0, 3, 4], [0, 3, 0], [1, 4, 2], [0, 4, 1]] as const) {
    it(`equals the dense gate on positions (${i}, ${j}) with the centre at ${centre}, and restores the site order`, () => {
      const { mps, ws } = entangled();
      moveCenterTo(mps, centre, ws.move);
      const model = bondModel([term(0.8, f('X', i), f('Y', j)), term(-0.4, f('Z', i), f('Z', j)), term(0.2, f('X', i), f('X', i + 1))], 5);
      const [g] = longBondGates(model, 0.37, { kind: 'real', auxiliary: 'transpose' });
      const want = denseApply(denseVector(mps), 5, i, j, g);
      const stats = emptyStats();
      applyLongGate(mps, i, j, g, swapGate(), { maxBond: 1024, maxWeight: 0 }, ws, stats);
      const got = denseVector(mps);
      let d = 0;
      for (let k = 0; k < got.length; k++) d = Math.max(d, Math.abs(got[k] - want[k]));
      expect(d).toBeLessThan(1e-12);
      expect(stats.gates).toBe(2 * (j - i - 1) + 1);
      expect(stats.discardedSum).toBeLessThan(1e-24);
    });
  }
});
