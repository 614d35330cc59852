/**
 * The result schemas: a minimal valid SweepResult, the point/thermo/diagnostics records and
 * their edge values, plus the inferred types.
 */
import { describe, expect, expectTypeOf, it } from 'vitest';
import {
  DiagnosticsRecord, SweepHeader, SweepPoint, SweepResult, ThermoRecord, canonicalSpec, parseSpecInput, specHash,
  type SweepPlan,
} from '../../../shared-types/src/index.js';
import { minimalSpec } from './spec-fixtures.js';

function spec() {
  const r = parseSpecInput({ ...minimalSpec(), betas: [0, 1], times: { stop: 1, count: 2 } });
  if (!r.success) throw new Error('invalid fixture');
  return canonicalSpec(r.spec);
}

function plan(): SweepPlan {
  return {
    engine: 'exact', reason: 'small lattice', feasible: true, refusal: null, memoryBytes: 4096, flops: 1e6,
    seconds: 0.01, accuracy: 1e-8, branches: [[0, 1]], sites: 4,
  };
}

const thermo = (betaIndex: number, beta: number) => ({
  betaIndex, beta, lnZ: 4 * Math.log(2), energy: 0, heatCapacity: 0, freeEnergy: beta === 0 ? null : -1, entropy: 2.7,
  errors: { lnZ: 0, energy: 0, heatCapacity: 0, freeEnergy: beta === 0 ? null : 0, entropy: 0 }, sites: 4,
});

/** A minimal complete result: 2 β × 2 times × 1 series. */
function minimalResult(): Record<string, unknown> {
  const s = spec();
  return {
    format: 'betasweep.result/1',
    spec: s,
    specHash: specHash(s),
    engine: { name: 'exact', version: '0.1.0' },
    plan: plan(),
    betas: [0, 1],
    times: [0, 1],
    series: [{ label: 'X:avg', observable: 0, values: [[0, 0.1], [0.2, 0.3]], errors: [[0, 0], [0, 0]] }],
    thermo: [thermo(0, 0), thermo(1, 1)],
    diagnostics: [0, 1].map((betaIndex) => ({
      betaIndex, h1Drift: 1e-14, normDrift: 1e-15, stationarityResidual: null, propagatorErrorBound: 1e-12,
    })),
    timing: { startedAt: '2025-01-01T00:00:00.000Z', finishedAt: '2025-01-01T00:00:01.000Z', seconds: 1 },
  };
}

describe('SweepResult', () => {
  it('should accept a minimal complete result and default each diagnostics extra to {}', () => {
    const r = SweepResult.safeParse(minimalResult());
    expect(r.success).toBe(true);
    expect(r.success && r.data.diagnostics.map((d) => d.extra)).toEqual([{}, {}]);
  });

  it.each<[string, Record<string, unknown>]>([
    ['another format tag', { format: 'betasweep.result/2' }],
    ['an unknown field', { comment: 'hi' }],
    ['a NaN value', { series: [{ label: 'X:avg', observable: 0, values: [[Number.NaN]], errors: [[0]] }] }],
    ['a spec that breaks the spec schema', { spec: { ...spec(), betas: [-1] } }],
  ])('should reject %s', (_what, patch) => {
    expect(SweepResult.safeParse({ ...minimalResult(), ...patch }).success).toBe(false);
  });

  it('should infer the series table as values[b][t]', () => {
    expectTypeOf<SweepResult['series'][number]['values']>().toEqualTypeOf<number[][]>();
    expectTypeOf<SweepResult['spec']['betas']>().toEqualTypeOf<number[]>();
    expectTypeOf<SweepResult['format']>().toEqualTypeOf<'betasweep.result/1'>();
  });
});

describe('SweepPoint', () => {
  const point = { betaIndex: 0, timeIndex: 3, values: [0.5, -0.25], errors: [1e-9, 1e-9] };

  it('should accept one error per value', () => {
    expect(SweepPoint.safeParse(point).success).toBe(true);
  });

  it('should reject errors of another length, on the path of errors', () => {
    const r = SweepPoint.safeParse({ ...point, errors: [0] });
    expect(r.success ? [] : r.error.issues.map((i) => i.path)).toEqual([['errors']]);
  });

  it.each([
    ['a negative β index', { betaIndex: -1 }], ['a fractional time index', { timeIndex: 0.5 }],
    ['an infinite value', { values: [Number.POSITIVE_INFINITY, 0] }], ['−0 index is fine', null],
  ])('should handle %s', (_what, patch) => {
    const r = SweepPoint.safeParse(patch === null ? { ...point, betaIndex: -0 } : { ...point, ...patch });
    expect(r.success).toBe(patch === null);
  });

  it('should accept a positive whole sample count and reject 0, fractions and NaN', () => {
    expect(SweepPoint.safeParse({ ...point, samples: 16 }).success).toBe(true);
    for (const samples of [0, 2.5, Number.NaN]) expect(SweepPoint.safeParse({ ...point, samples }).success, String(samples)).toBe(false);
    expectTypeOf<SweepPoint['samples']>().toEqualTypeOf<number | undefined>();
  });
});

describe('ThermoRecord', () => {
  it('should allow a null free energy (β = 0) and require at least one site', () => {
    expect(ThermoRecord.safeParse(thermo(0, 0)).success).toBe(true);
    expect(ThermoRecord.safeParse({ ...thermo(0, 0), sites: 0 }).success).toBe(false);
    expectTypeOf<ThermoRecord['freeEnergy']>().toEqualTypeOf<number | null>();
  });
});

describe('DiagnosticsRecord', () => {
  it('should keep engine extras and not let a "__proto__" key change the prototype', () => {
    const input: unknown = JSON.parse(
      '{"betaIndex":0,"h1Drift":0,"normDrift":0,"stationarityResidual":0,"propagatorErrorBound":0,'
      + '"extra":{"matvecs":120,"__proto__":{"polluted":true}}}',
    );
    const r = DiagnosticsRecord.safeParse(input);
    expect(r.success).toBe(true);
    if (!r.success) return;
    expect(Object.getPrototypeOf(r.data.extra)).toBe(Object.prototype);
    expect((r.data.extra as Record<string, unknown>).polluted).toBeUndefined();
    expect(r.data.extra.matvecs).toBe(120);
    expectTypeOf<DiagnosticsRecord['extra']>().toEqualTypeOf<Record<string, string | number | boolean | null>>();
  });
});

describe('SweepHeader', () => {
  it('should accept a header built from a result', () => {
    const res = minimalResult();
    const header = {
      specHash: res.specHash, engine: res.engine, betas: res.betas, times: res.times,
      series: [{ label: 'X:avg', observable: 0 }], plan: res.plan,
    };
    expect(SweepHeader.safeParse(header).success).toBe(true);
    expect(SweepHeader.safeParse({ ...header, series: [{ label: 'X:avg', observable: -1 }] }).success).toBe(false);
  });
});
