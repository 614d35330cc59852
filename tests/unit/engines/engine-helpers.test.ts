/**
 * The helpers the engines share around their own computation (workers/src/engines/*.ts next to
 * engine.ts): a branch's β order, point emission with resume, the ThermoRecord's derived
 * fields, and the plan's lattice check and refusals.
 */
import { describe, expect, it } from 'vitest';
import type { SweepPoint, SweepSpec, SweepSpecInput } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import { branchOrder } from '../../../workers/src/engines/branch-order.js';
import type { BranchSink } from '../../../workers/src/engines/engine.js';
import { refusePlan } from '../../../workers/src/engines/plan-refusal.js';
import type { PlanDraft } from '../../../workers/src/engines/plan-refusal.js';
import { planSites } from '../../../workers/src/engines/plan-sites.js';
import { pointEmitter } from '../../../workers/src/engines/point-emitter.js';
import { thermoRecord } from '../../../workers/src/engines/thermo-record.js';

const spec = (extra: Partial<SweepSpecInput> = {}): SweepSpec => SweepSpecSchema.parse({
  lattice: { kind: 'chain', length: 4 },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [2, 0, 0.5, 2],
  times: { start: 0, stop: 1, count: 3 },
  observables: [{ kind: 'site', pauli: 'X' }],
  ...extra,
} as SweepSpecInput);

const draft: PlanDraft = {
  engine: 'test', reason: 'a test', memoryBytes: 0, flops: 0, seconds: 0, accuracy: 1e-8, branches: [[0]],
};

function pointSink(points: SweepPoint[]): BranchSink {
  return { thermo: () => undefined, point: (p) => points.push(p), diagnostics: () => undefined };
}

describe('branchOrder', () => {
  it('returns the β grid and the branch indices once each, ascending in β', () => {
    const { betas, order } = branchOrder(spec(), [2, 0, 2, 1]);
    expect(betas).toEqual([0, 0.5, 2]);
    expect(order).toEqual([0, 1, 2]);
  });

  it('returns an empty order for an empty branch', () => {
    expect(branchOrder(spec(), []).order).toEqual([]);
  });

  it('throws a RangeError naming an index outside the grid, a negative or a fractional index', () => {
    expect(() => branchOrder(spec(), [3])).toThrow(RangeError);
    expect(() => branchOrder(spec(), [3])).toThrow('betaIndices: 3 is not an index of the β grid (0..2)');
    expect(() => branchOrder(spec(), [-1])).toThrow(RangeError);
    expect(() => branchOrder(spec(), [0.5])).toThrow(RangeError);
    expect(() => branchOrder(spec(), [Number.NaN])).toThrow(RangeError);
  });
});

describe('pointEmitter', () => {
  it('emits every point as plain arrays copied from the buffers when nothing is resumed', () => {
    const points: SweepPoint[] = [];
    const emit = pointEmitter(pointSink(points), 1);
    const values = new Float64Array([1, 2]);
    emit(0, values, new Float64Array([1e-9, 2e-9]));
    values[0] = 99;
    expect(points).toEqual([{ betaIndex: 1, timeIndex: 0, values: [1, 2], errors: [1e-9, 2e-9] }]);
    expect(Array.isArray(points[0].values)).toBe(true);
  });

  it('skips the times below resumeFrom of its own β index only', () => {
    const points: SweepPoint[] = [];
    const sink = pointSink(points);
    const resumeFrom = { 0: 2, 1: 1 };
    const emit0 = pointEmitter(sink, 0, resumeFrom);
    const emit2 = pointEmitter(sink, 2, resumeFrom);
    for (let t = 0; t < 3; t++) {
      emit0(t, [t], [0]);
      emit2(t, [t], [0]);
    }
    expect(points.filter((p) => p.betaIndex === 0).map((p) => p.timeIndex)).toEqual([2]);
    expect(points.filter((p) => p.betaIndex === 2).map((p) => p.timeIndex)).toEqual([0, 1, 2]);
  });
});

describe('thermoRecord', () => {
  const measured = {
    betaIndex: 3, beta: 0.5, sites: 4, lnZ: 3, energy: -2, heatCapacity: 0.75,
    errors: { lnZ: 1e-10, energy: 2e-10, heatCapacity: 3e-10 },
  };

  it('derives F = −ln Z/β and S = ln Z + βE with their errors |Δ ln Z|/β and |Δ ln Z| + β|ΔE|', () => {
    // Every value here is exactly representable, so exact equality holds.
    expect(thermoRecord(measured)).toEqual({
      betaIndex: 3, beta: 0.5, lnZ: 3, energy: -2, heatCapacity: 0.75, freeEnergy: -6, entropy: 2,
      errors: { lnZ: 1e-10, energy: 2e-10, heatCapacity: 3e-10, freeEnergy: 2e-10, entropy: 1e-10 + 0.5 * 2e-10 },
      sites: 4,
    });
  });

  it('gives a null free energy and its error at β = 0, and S = ln Z', () => {
    const r = thermoRecord({ ...measured, beta: 0 });
    expect(r.freeEnergy).toBeNull();
    expect(r.errors.freeEnergy).toBeNull();
    expect(r.entropy).toBe(3);
    expect(r.errors.entropy).toBe(1e-10);
  });

  it('keeps the key order of the record (betaIndex first, sites last)', () => {
    expect(Object.keys(thermoRecord(measured))).toEqual(
      ['betaIndex', 'beta', 'lnZ', 'energy', 'heatCapacity', 'freeEnergy', 'entropy', 'errors', 'sites']);
  });
});

describe('planSites and refusePlan', () => {
  it('returns the site count of a lattice within the limit', () => {
    expect(planSites(spec(), draft, 4, 'the test engine holds 2^N')).toEqual({ ok: true, sites: 4 });
  });

  it('refuses a lattice above the limit, naming the field, the limit and the site count', () => {
    const r = planSites(spec(), draft, 3, 'the test engine holds 2^N');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.plan).toEqual({
      ...draft, feasible: false, sites: 4,
      refusal: { field: 'lattice', limit: 3, estimate: 4, message: 'the test engine holds 2^N and is limited to 3 sites; this lattice has 4' },
    });
  });

  it('refuses with zero sites when the lattice cannot be built', () => {
    const broken = { ...spec(), lattice: { kind: 'unknown' } } as unknown as SweepSpec;
    const r = planSites(broken, draft, 10, 'the test engine holds 2^N');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.plan.sites).toBe(0);
    expect(r.plan.refusal).toMatchObject({ field: 'lattice', limit: 0, estimate: 0 });
    expect(r.plan.refusal!.message).toMatch(/^the lattice cannot be built: /);
  });

  it('keeps the draft figures in a refusal', () => {
    const plan = refusePlan({ ...draft, memoryBytes: 10, flops: 20 }, 5, 'memory', 8, 10, 'too big');
    expect(plan).toMatchObject({ feasible: false, memoryBytes: 10, flops: 20, sites: 5, refusal: { field: 'memory', limit: 8, estimate: 10, message: 'too big' } });
  });
});
