/**
 * planFreeFermion: feasible plans carry the fan-out, cost, memory and accuracy; non-quadratic
 * Hamiltonians, lattices beyond the budgets and tolerances below the rounding floor are refused
 * with the field, the limit and the estimate. The plan never throws on a valid spec.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import {
  FreeFermionEngine, MEMORY_BUDGET_BYTES, WORK_BUDGET_FLOPS,
} from '../../../workers/src/engines/free-fermion/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { seriesLabels } from '../../../workers/src/observables/plan-series.js';
import { parseSpec } from './run-engine.js';

const engine = new FreeFermionEngine();

function spec(over: Partial<SweepSpecInput> = {}): SweepSpecInput {
  return {
    lattice: { kind: 'chain', length: 12, boundary: 'open' },
    h0: { model: 'ising', J: 1, hx: 0.5 },
    h1: { model: 'ising', J: 1, hx: 1.5 },
    betas: [2, 0.5, 1],
    times: { start: 0, stop: 4, count: 9 },
    observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }, { kind: 'energy', of: 'h1' }],
    tolerance: 1e-8,
    ...over,
  };
}

describe('planFreeFermion', () => {
  it('plans one branch per β with positive cost, memory and an accuracy within the tolerance', () => {
    const plan = engine.plan(parseSpec(spec()));
    expect(plan.feasible).toBe(true);
    expect(plan.engine).toBe('free-fermion');
    expect(plan.refusal).toBeNull();
    expect(plan.branches).toEqual([[0], [1], [2]]);
    expect(plan.sites).toBe(12);
    expect(plan.flops).toBeGreaterThan(0);
    expect(plan.seconds).toBeGreaterThan(0);
    expect(plan.memoryBytes).toBeGreaterThan(8 * 24 * 24);
    expect(plan.accuracy).toBeGreaterThan(0);
    expect(plan.accuracy).toBeLessThanOrEqual(1e-8);
  });

  it('names the same series as the observables layer', () => {
    const s = parseSpec(spec({ observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' }, { kind: 'structure-factor', paulis: 'XX', momenta: [[1, 0]] }] }));
    expect(engine.series(s)).toEqual(seriesLabels(s, buildLattice(s.lattice)));
  });

  it('refuses a longitudinal field with the offending term', () => {
    const plan = engine.plan(parseSpec(spec({ h0: { model: 'ising', J: 1, hx: 0.5, hz: 0.2 } })));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('h0');
    expect(plan.refusal?.message).toMatch(/Z0.*odd in the Jordan–Wigner Majoranas/);
  });

  it('refuses interacting Hamiltonians and lattices that are not chains in the site order', () => {
    const xxz = engine.plan(parseSpec(spec({ h1: { model: 'xxz', J: 1, delta: 1 } })));
    expect([xxz.feasible, xxz.refusal?.field, xxz.refusal?.estimate]).toEqual([false, 'h1', 4]);
    const ladder = engine.plan(parseSpec(spec({ lattice: { kind: 'ladder', length: 4 } })));
    expect([ladder.feasible, ladder.refusal?.field]).toEqual([false, 'h0']);
    const square = engine.plan(parseSpec(spec({ lattice: { kind: 'square', size: [3, 3] } })));
    expect(square.feasible).toBe(false);
  });

  it('refuses a ring of 4096 sites by memory, naming the budget', () => {
    const plan = engine.plan(parseSpec(spec({ lattice: { kind: 'chain', length: 4096, boundary: 'periodic' }, betas: [1], times: { values: [0] } })));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('memory');
    expect(plan.refusal?.limit).toBe(MEMORY_BUDGET_BYTES);
    expect(plan.refusal!.estimate).toBeGreaterThan(MEMORY_BUDGET_BYTES);
  });

  it('refuses ZZ correlators at every distance on 1000 sites by work (long strings cost O(L⁵))', () => {
    const plan = engine.plan(parseSpec(spec({ lattice: { kind: 'chain', length: 1000 }, betas: [1], times: { values: [0, 1] }, observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' }] })));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('work');
    expect(plan.refusal!.estimate).toBeGreaterThan(WORK_BUDGET_FLOPS);
  });

  it('refuses a tolerance below the rounding estimate and accepts a looser one', () => {
    const strict = engine.plan(parseSpec(spec({ lattice: { kind: 'chain', length: 800 }, tolerance: 1e-13 })));
    expect(strict.feasible).toBe(false);
    expect(strict.refusal?.field).toBe('tolerance');
    expect(strict.refusal!.estimate).toBeGreaterThan(1e-13);
    const loose = engine.plan(parseSpec(spec({ lattice: { kind: 'chain', length: 800 }, tolerance: 1e-8 })));
    expect(loose.feasible).toBe(true);
  });

  it('plans 1000-site chains (the reach of the engine) with a time estimate and memory below 1 GiB', () => {
    for (const boundary of ['open', 'periodic'] as const) {
      const plan = engine.plan(parseSpec(spec({ lattice: { kind: 'chain', length: 1000, boundary }, betas: [1], times: { values: [0, 1, 2] } })));
      expect(plan.feasible, JSON.stringify(plan.refusal)).toBe(true);
      expect(plan.memoryBytes).toBeLessThan(2 ** 30);
      expect(plan.seconds).toBeGreaterThan(1);
    }
  });
});
