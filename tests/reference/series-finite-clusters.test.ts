/**
 * External checks of the series engine on finite clusters:
 * - against the `exact` engine (DESIGN.md §3) on a 2×3 Ising cluster quenched with an XXZ
 *   Hamiltonian that has Y terms, at small β and t: every value within the two engines'
 *   combined error estimates, and the series error falling with the order as its truncation
 *   estimate says;
 * - closed-form leading coefficients (common practice): for the Ising preset
 *   Tr(H)/2^N = 0, Tr(H²)/2^N = N_bonds J² + N(hx² + hz²),
 *   Tr(H³)/2^N = −6 J hz² N_bonds − 6 J³ N_triangles (3! orderings of (Z_iZ_j)(Z_i)(Z_j) per bond
 *   and of the three bonds of a triangle — the only products of three terms ∝ 1), so
 *   ln Z = N ln 2 + β² μ₂/2 − β³ μ₃/6 + O(β⁴) and C = β² μ₂ + O(β³), on lattices large enough
 *   for the linked-cluster route (open, periodic, honeycomb, triangular).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult, SweepSpec, SweepSpecInput, ThermoRecord, SweepPoint } from '../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../shared-types/src/index.js';
import { SeriesEngine } from '../../workers/src/engines/series/index.js';
import { buildLattice } from '../../workers/src/lattice/build-lattice.js';
import { computeSweepSeries, localEnergyScale, buildLocalModel, thermoAt } from '../../workers/src/series/index.js';
import { runReferenceSweep } from '../support/reference/run-reference-sweep.js';

const INPUT: SweepSpecInput = {
  lattice: { kind: 'square', size: [2, 3], boundary: ['open', 'open'] },
  h0: { model: 'ising', J: 1, hx: 0.8, hz: 0.3 },
  h1: { model: 'xxz', J: 0.6, delta: 0.5, hz: 0.1 },
  betas: [0.02, 0.05, 0.1],
  times: { values: [0, 0.05, 0.1] },
  observables: [
    { kind: 'site', pauli: 'X' },
    { kind: 'pair', paulis: 'ZZ', pairs: 'nearest', connected: true },
    { kind: 'pair', paulis: 'XY', pairs: 'nearest' },
    { kind: 'energy', of: 'h0' },
  ],
  engine: 'exact',
  tolerance: 1e-11,
};

async function runSeries(spec: SweepSpec, thermoOrder: number, quenchOrder: number) {
  const thermo: ThermoRecord[] = [];
  const points: SweepPoint[] = [];
  await new SeriesEngine({ thermoOrder, quenchOrder }).runBranch(spec, spec.betas.map((_, b) => b), {
    thermo: (r) => thermo.push(r), point: (p) => points.push(p), diagnostics: () => {},
  });
  return { thermo, points };
}

let exact: SweepResult;
let spec: SweepSpec;
beforeAll(async () => {
  exact = await runReferenceSweep(INPUT);
  spec = SweepSpecSchema.parse({ ...INPUT, engine: 'auto', tolerance: 1e-3 });
});

describe('series engine against the exact engine (2×3 cluster)', () => {
  it('agrees on thermodynamics and every quench point within the combined error estimates', async () => {
    const { thermo, points } = await runSeries(spec, 10, 8);
    expect(thermo).toHaveLength(3);
    expect(points).toHaveLength(9);
    for (const r of thermo) {
      const e = exact.thermo[r.betaIndex];
      for (const key of ['lnZ', 'energy', 'heatCapacity', 'entropy'] as const) {
        expect(Math.abs(r[key] - e[key])).toBeLessThanOrEqual(r.errors[key] + e.errors[key] + 1e-12);
        expect(r.errors[key]).toBeLessThan(1e-3);
      }
    }
    for (const p of points) {
      p.values.forEach((v, i) => {
        const ref = exact.series[i].values[p.betaIndex][p.timeIndex];
        const refErr = exact.series[i].errors[p.betaIndex][p.timeIndex];
        expect(Math.abs(v - ref)).toBeLessThanOrEqual(p.errors[i] + refErr + 1e-12);
        expect(p.errors[i]).toBeLessThan(1e-3);
      });
    }
  });

  it('has its error fall with the order, each time below its own estimate', async () => {
    let previous = Infinity;
    for (const K of [3, 5, 7, 9]) {
      const { points } = await runSeries(spec, K, K);
      const p = points.find((q) => q.betaIndex === 2 && q.timeIndex === 2)!;
      let worst = 0;
      p.values.forEach((v, i) => {
        const err = Math.abs(v - exact.series[i].values[2][2]);
        expect(err).toBeLessThanOrEqual(p.errors[i] + exact.series[i].errors[2][2] + 1e-12);
        worst = Math.max(worst, err);
      });
      expect(worst).toBeLessThan(previous);
      previous = worst;
    }
    expect(previous).toBeLessThan(1e-6);
  });
});

describe('closed-form leading coefficients of the Ising preset (common practice)', () => {
  const cases: Array<[string, SweepSpecInput['lattice']]> = [
    ['an open 7×6 square lattice', { kind: 'square', size: [7, 6], boundary: ['open', 'open'] }],
    ['a periodic 9×9 square lattice (infinite-lattice route)', { kind: 'square', size: [9, 9], boundary: ['periodic', 'periodic'] }],
    ['an open 4×3 honeycomb lattice', { kind: 'honeycomb', size: [4, 3], boundary: ['open', 'open'] }],
    ['a periodic 5×5 triangular lattice', { kind: 'triangular', size: [5, 5], boundary: ['periodic', 'periodic'] }],
  ];
  const J = 1.1, hx = 0.6, hz = 0.35;
  for (const [name, lattice] of cases) {
    it(`gives μ₂/2 and −μ₃/6 for ln Z and C ≈ β²μ₂ on ${name}`, () => {
      const s = SweepSpecSchema.parse({
        lattice, h0: { model: 'ising', J, hx, hz }, h1: { model: 'ising', J, hx, hz },
        betas: [0.001], times: { values: [0] }, observables: [{ kind: 'energy', of: 'h0' }],
      });
      const graph = buildLattice(s.lattice);
      const N = graph.sites;
      const nb = graph.bonds.length;
      const series = computeSweepSeries(s, { thermoOrder: 4, quenchOrder: 1 });
      expect(series.method).toBe('linked-cluster');
      const mu2 = nb * J * J + N * (hx * hx + hz * hz);
      const bonded = new Set(graph.bonds.map(([i, j]) => `${i},${j}`));
      let triangles = 0;
      for (const [i, j] of graph.bonds) for (let k = j + 1; k < N; k++) if (bonded.has(`${i},${k}`) && bonded.has(`${j},${k}`)) triangles++;
      if (lattice.kind === 'triangular') expect(triangles).toBe(2 * N);
      const mu3 = -6 * J * hz * hz * nb - 6 * J ** 3 * triangles;
      expect(series.lnZ[0]).toBeCloseTo(N * Math.LN2, 10);
      expect(series.lnZ[1]).toBeCloseTo(0, 12);
      expect(series.lnZ[2]).toBeCloseTo(mu2 / 2, 10);
      expect(series.lnZ[3]).toBeCloseTo(-mu3 / 6, 10);
      const beta = 1e-3;
      const th = thermoAt(series, beta, localEnergyScale(buildLocalModel(s.h0, graph)));
      // C = β²μ₂ − β³μ₃ + O(β⁴).
      expect(Math.abs(th.heatCapacity.value - beta * beta * mu2)).toBeLessThan(2 * beta ** 3 * Math.abs(mu3) + 1e-9 * beta ** 2 * mu2);
    });
  }
});
