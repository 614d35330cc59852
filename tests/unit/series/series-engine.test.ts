/**
 * Unit tests of the series engine (workers/src/engines/series): plans and refusals, the result
 * stream on lattices far beyond the other engines (infinite-lattice route), and aborts.
 */
import { describe, expect, it } from 'vitest';
import type { DiagnosticsRecord, SweepPoint, SweepSpecInput, ThermoRecord } from '../../../shared-types/src/index.js';
import { SweepSpec } from '../../../shared-types/src/index.js';
import { SeriesEngine, planSeriesEngine } from '../../../workers/src/engines/series/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { seriesLabels } from '../../../workers/src/observables/plan-series.js';
import { infiniteLatticeLnZ } from '../../../workers/src/series/index.js';

const base = (over: Partial<SweepSpecInput>) => SweepSpec.parse({
  lattice: { kind: 'chain', length: 400, boundary: 'periodic' },
  h0: { model: 'ising', J: 1, hx: 0.5, hz: 0 },
  h1: { model: 'ising', J: 1, hx: 1, hz: 0 },
  betas: [0.01, 0.02],
  times: { values: [0, 0.01] },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }, { kind: 'site', pauli: 'Z' }],
  tolerance: 1e-6,
  ...over,
});

function collect() {
  const thermo: ThermoRecord[] = [];
  const points: SweepPoint[] = [];
  const diagnostics: DiagnosticsRecord[] = [];
  return { thermo, points, diagnostics, sink: { thermo: (r: ThermoRecord) => thermo.push(r), point: (p: SweepPoint) => points.push(p), diagnostics: (d: DiagnosticsRecord) => diagnostics.push(d) } };
}

describe('SeriesEngine.plan', () => {
  it('is feasible at small β and t, with orders and one branch holding every β', () => {
    const p = planSeriesEngine(base({}), 'series', { budgetSeconds: 20 });
    expect(p.plan.feasible).toBe(true);
    expect(p.plan.engine).toBe('series');
    expect(p.plan.branches).toEqual([[0, 1]]);
    expect(p.thermoOrder).toBeGreaterThanOrEqual(10);
    expect(p.quenchOrder).toBeGreaterThanOrEqual(4);
    expect(p.plan.accuracy).toBeLessThanOrEqual(1e-6);
    expect(p.plan.sites).toBe(400);
  });

  it('refuses outside the series window with the estimate that broke it', () => {
    const plan = new SeriesEngine().plan(base({ betas: [5] }));
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('tolerance');
    expect(plan.refusal?.message).toMatch(/window/);
  });

  it('refuses when even the lowest orders exceed the time budget', () => {
    const plan = planSeriesEngine(base({}), 'series', { budgetSeconds: 1e-9 }).plan;
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('seconds');
  });

  it('does not throw on a spec it cannot set up', () => {
    // The word names site 5 of a 3-site lattice: the schema accepts it, building the model does not.
    const spec = base({ lattice: { kind: 'bonds', sites: 3, bonds: [[0, 1]] }, h0: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 Z5' }] } });
    const plan = new SeriesEngine().plan(spec);
    expect(plan.feasible).toBe(false);
    expect(plan.refusal?.field).toBe('spec');
  });
});

describe('SeriesEngine.runBranch', () => {
  it('emits thermodynamics equal to N × the infinite-lattice series on a long ring, with the observables layer labels', async () => {
    const spec = base({});
    const engine = new SeriesEngine({ thermoOrder: 12, quenchOrder: 6 });
    expect(engine.name).toBe('series');
    expect(engine.series(spec)).toEqual(seriesLabels(spec, buildLattice(spec.lattice)));
    const { thermo, points, diagnostics, sink } = collect();
    await engine.runBranch(spec, [1, 0], sink);
    expect(thermo.map((r) => r.betaIndex)).toEqual([0, 1]);
    const perSite = infiniteLatticeLnZ(spec, 12, 12);
    for (const r of thermo) {
      let lnZ = 400 * Math.LN2;
      for (let k = 1; k <= 12; k++) lnZ += 400 * perSite[k] * r.beta ** k;
      expect(r.lnZ).toBeCloseTo(lnZ, 9);
      expect(r.sites).toBe(400);
      expect(r.errors.lnZ).toBeLessThan(1e-12);
      expect(r.freeEnergy).toBeCloseTo(-r.lnZ / r.beta, 9);
    }
    expect(points).toHaveLength(4);
    for (const p of points) {
      expect(p.values).toHaveLength(3);
      // ⟨Z⟩ vanishes by the spin-flip symmetry of both Hamiltonians: reported as an exact 0.
      expect(p.values[2]).toBe(0);
      expect(p.errors[2]).toBe(0);
      for (const e of p.errors) expect(Number.isFinite(e)).toBe(true);
    }
    expect(diagnostics[0].extra.seriesKind).toBe('infinite-lattice');
    expect(diagnostics[0].h1Drift).toBe(0);
  });

  it('skips points below resumeFrom and refuses unknown β indices', async () => {
    const spec = base({});
    const engine = new SeriesEngine({ thermoOrder: 4, quenchOrder: 2 });
    const { points, sink } = collect();
    await engine.runBranch(spec, [0], sink, { resumeFrom: { 0: 1 } });
    expect(points.map((p) => p.timeIndex)).toEqual([1]);
    await expect(engine.runBranch(spec, [2], collect().sink)).rejects.toThrow(RangeError);
  });

  it('rejects with the abort reason when the signal has fired', async () => {
    const controller = new AbortController();
    controller.abort(new DOMException('stop', 'AbortError'));
    await expect(new SeriesEngine({ thermoOrder: 4, quenchOrder: 2 }).runBranch(base({}), [0], collect().sink, { signal: controller.signal }))
      .rejects.toMatchObject({ name: 'AbortError' });
  });
});
