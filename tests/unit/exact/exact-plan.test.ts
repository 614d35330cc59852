/**
 * The exact engine's plan: refusals name the field, the limit and the estimate; feasible plans
 * carry memory, work and fan-out consistent with what runBranch does.
 */
import { describe, expect, it } from 'vitest';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { ASSUMED_FLOPS_PER_SECOND, MAX_EXACT_SITES } from '../../../workers/src/engines/exact/index.js';
import { collect, spec } from './collect.js';

const engine = new ExactEngine();
const chain = (length: number, extra: Record<string, unknown> = {}) => spec({
  lattice: { kind: 'chain', length },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 0, 2],
  times: { start: 0, stop: 2, count: 5 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
  ...extra,
});

describe('ExactEngine.plan', () => {
  it('refuses more than 12 sites, naming the lattice, the limit and the site count', () => {
    const plan = engine.plan(chain(13));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal).toMatchObject({ field: 'lattice', limit: MAX_EXACT_SITES, estimate: 13 });
    expect(plan.refusal!.message).toContain('12 sites');
    expect(plan.sites).toBe(13);
  });

  it('plans one branch per β with three doubled-state vectors of memory and a positive cost', () => {
    const plan = engine.plan(chain(4));
    expect(plan.feasible).toBe(true);
    expect(plan.refusal).toBeNull();
    expect(plan.branches).toEqual([[0], [1], [2]]);
    expect(plan.sites).toBe(4);
    expect(plan.accuracy).toBe(1e-8);
    expect(plan.memoryBytes).toBeGreaterThanOrEqual(3 * 16 * 4 ** 4);
    expect(plan.memoryBytes).toBeLessThan(4 * 16 * 4 ** 4);
    expect(plan.flops).toBeGreaterThan(0);
    expect(plan.seconds).toBeCloseTo(plan.flops / ASSUMED_FLOPS_PER_SECOND, 12);
  });

  it('estimates more work for a longer quench and a lower temperature', () => {
    const base = engine.plan(chain(4)).flops;
    expect(engine.plan(chain(4, { times: { start: 0, stop: 20, count: 5 } })).flops).toBeGreaterThan(base);
    expect(engine.plan(chain(4, { betas: [0.5, 0, 20] })).flops).toBeGreaterThan(base);
  });

  it('counts the same operator applications that a one-β branch performs (within the measurement ones)', async () => {
    const s = chain(4, { betas: [2] });
    const plan = engine.plan(s);
    const out = await collect(engine, s, [0]);
    const matvecs = out.diagnostics[0].extra.matvecs as number;
    // flops = Σ matvecs × cost + measurements: bound the matvec count from the plan both ways.
    expect(matvecs).toBeGreaterThan(0);
    const perApplication = plan.flops / matvecs;
    expect(perApplication).toBeGreaterThan(8 * 4 ** 4);
    expect(perApplication).toBeLessThan(400 * 4 ** 4);
  });

  it('refuses a tolerance below its rounding allowance, naming the tolerance', () => {
    const plan = engine.plan(chain(8, { tolerance: 1e-13, betas: [20], times: { start: 0, stop: 200, count: 3 } }));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal!.field).toBe('tolerance');
    expect(plan.refusal!.estimate).toBeGreaterThan(plan.refusal!.limit / 2);
  });

  it('labels the series like the observables layer', () => {
    expect(engine.series(chain(4)).map((x) => x.label)).toEqual(['X:avg', 'ZZ:nearest']);
  });
});
