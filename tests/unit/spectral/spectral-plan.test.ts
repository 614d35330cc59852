/**
 * The spectral engine's plan: one branch for all β, refusals that name the field, the limit and
 * the estimate, costs that reflect the symmetry blocks (so `auto` sees the fast path), and an
 * a-priori accuracy that covers the errors the run then reports.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import {
  MAX_SPECTRAL_SITES, MEMORY_BUDGET_BYTES, SpectralEngine,
} from '../../../workers/src/engines/spectral/index.js';
import { selectEngine } from '../../../workers/src/sweep/select-engine.js';
import { collect, spec } from '../exact/collect.js';

const engine = new SpectralEngine();
const xxz = (length: number, extra: Partial<SweepSpecInput> = {}) => spec({
  lattice: { kind: 'chain', length, boundary: 'periodic' },
  h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 },
  h1: { model: 'xxz', J: 1, delta: 2 },
  betas: [0.5, 0, 2],
  times: { start: 0, stop: 5, count: 11 },
  observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'pair', paulis: 'ZZ', connected: true }, { kind: 'energy', of: 'h1' }],
  ...extra,
});

describe('SpectralEngine.plan', () => {
  it('plans one branch with every β, with memory, work and time estimates', () => {
    const plan = engine.plan(xxz(10));
    expect(plan).toMatchObject({ engine: 'spectral', feasible: true, refusal: null, sites: 10, branches: [[0, 1, 2]] });
    expect(plan.memoryBytes).toBeGreaterThan(0);
    expect(plan.flops).toBeGreaterThan(0);
    expect(plan.seconds).toBeGreaterThan(0);
    expect(plan.accuracy).toBeLessThanOrEqual(1e-8);
  });

  it('estimates far less work with magnetisation blocks than without, and less still with lattice symmetries', () => {
    const lattice = engine.plan(xxz(10));
    const blocks = new SpectralEngine({ symmetry: 'magnetisation' }).plan(xxz(10));
    const whole = new SpectralEngine({ symmetry: 'none' }).plan(xxz(10));
    // Σ_k C(10,k)³ ≈ 3.8e7 against 1024³ ≈ 1.1e9 for the O(d³) stages.
    expect(whole.flops / blocks.flops).toBeGreaterThan(10);
    expect(whole.memoryBytes).toBeGreaterThan(blocks.memoryBytes);
    // Momentum and parity sectors cut each magnetisation block ≈ 10–20-fold: ≥ 100× fewer d³ flops.
    expect(blocks.flops / lattice.flops).toBeGreaterThan(50);
    expect(lattice.reason).toMatch(/symmetry: magnetisation \+ translation a1 \(order 10\) \+ reflection inversion; \d+ joint blocks, largest 25 states/);
  });

  it('lets auto pick the spectral engine with symmetry blocks for a ring of 10, as the fastest estimate', () => {
    const { engine: chosen, plan } = selectEngine(xxz(10));
    expect(chosen.name).toBe('spectral');
    expect(plan.reason).toMatch(/^auto: spectral/);
    expect(plan.reason).toMatch(/reflection inversion/);
  });

  it(`refuses more than ${MAX_SPECTRAL_SITES} sites, naming the lattice, the limit and the size`, () => {
    const plan = engine.plan(xxz(MAX_SPECTRAL_SITES + 1));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal).toMatchObject({ field: 'lattice', limit: MAX_SPECTRAL_SITES, estimate: MAX_SPECTRAL_SITES + 1 });
    expect(plan.refusal!.message).toMatch(new RegExp(String(MAX_SPECTRAL_SITES + 1)));
  });

  it('refuses a 13-site problem without blocks on memory, with the estimate above the budget', () => {
    // tolerance 1e-6: at 13 sites the a-priori rounding estimate (~5e-8 for E:h1) exceeds the default 1e-8.
    const plan = new SpectralEngine({ symmetry: 'none' }).plan(xxz(13, { tolerance: 1e-6 }));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal!.field).toBe('memory');
    expect(plan.refusal!.limit).toBe(MEMORY_BUDGET_BYTES);
    expect(plan.refusal!.estimate).toBeGreaterThan(MEMORY_BUDGET_BYTES);
    // With magnetisation blocks the same lattice fits (largest sector C(13,6) = 1716 states) …
    const magnetisation = new SpectralEngine({ symmetry: 'magnetisation' });
    expect(magnetisation.plan(xxz(13, { tolerance: 1e-6 })).feasible).toBe(true);
    expect(magnetisation.plan(xxz(13)).refusal!.field).toBe('tolerance');
    // … and with momentum sectors (blocks of ≈ 1716/13) its a-priori error meets the default 1e-8.
    expect(engine.plan(xxz(13)).feasible).toBe(true);
  });

  it('plans a ring of 16 with symmetry blocks within the memory budget, and refuses an Ising ring of 16 on memory', () => {
    const plan = engine.plan(xxz(16, { tolerance: 1e-6 }));
    expect(plan.feasible).toBe(true);
    expect(plan.memoryBytes).toBeLessThan(MEMORY_BUDGET_BYTES);
    // M = 8, momentum k = 4·2π/16 by character counting: (C(16,8) − 2·4 + 6·2 + 70)/16 = 809
    // (the fixed states of T^a with 8 bits set: 2, 6, 70 for gcd(a, 16) = 2, 4, 8); k = 0 has
    // 810 but is split by parity.
    expect(plan.reason).toMatch(/largest 809 states/);
    const ising = engine.plan(xxz(16, { h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 } }));
    expect(ising.refusal!.field).toBe('memory'); // no magnetisation: blocks of ≈ 2^16/32 states
  });

  it('refuses a tolerance that rounding over very long times cannot meet', () => {
    const plan = engine.plan(xxz(8, { times: { start: 0, stop: 1e4, count: 3 }, tolerance: 1e-13 }));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal!.field).toBe('tolerance');
    expect(plan.refusal!.limit).toBe(1e-13);
    expect(plan.refusal!.estimate).toBeGreaterThan(1e-13);
  });

  it('refuses, without throwing, a spec whose observables name sites outside the lattice', () => {
    const s = xxz(4, { observables: [{ kind: 'site', pauli: 'Z', sites: [7] }] });
    const plan = engine.plan(s);
    expect(plan.feasible).toBe(false);
    expect(plan.refusal!.field).toBe('spec');
  });

  for (const [name, input] of [
    ['an XXZ quench with blocks', xxz(8)],
    ['an Ising quench without blocks', spec({
      lattice: { kind: 'ladder', length: 3 }, h0: { model: 'ising', J: 1, hx: 0.4 }, h1: { model: 'ising', J: 1, hx: 1.6 },
      betas: [1, 3], times: { start: 0, stop: 8, count: 5 },
      observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' }],
    })],
  ] as const) {
    it(`promises an accuracy that covers every error the run reports (${name})`, async () => {
      const plan = engine.plan(input);
      const out = await collect(engine, input, plan.branches[0]);
      let worst = 0;
      for (const p of out.points) for (const e of p.errors) worst = Math.max(worst, e);
      expect(worst).toBeGreaterThan(0);
      expect(worst).toBeLessThanOrEqual(plan.accuracy);
    });
  }
});
