/**
 * FreeFermionEngine behaviour: closed forms on one site, β = 0, stationarity when H1 = H0,
 * conservation of ⟨H1⟩, the resume and abort options, bad β indices, and the
 * diagnostics it promises.
 */
import { describe, expect, it } from 'vitest';
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../shared-types/src/index.js';
import type { BranchSink } from '../../../workers/src/engines/engine.js';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { parseSpec, runEngine, seriesIndex } from './run-engine.js';

const engine = new FreeFermionEngine();

function collect(): BranchSink & { points: SweepPoint[]; thermos: ThermoRecord[]; diags: DiagnosticsRecord[] } {
  const points: SweepPoint[] = [];
  const thermos: ThermoRecord[] = [];
  const diags: DiagnosticsRecord[] = [];
  return {
    points, thermos, diags,
    thermo: (r) => thermos.push(r), point: (p) => points.push(p), diagnostics: (d) => diags.push(d),
  };
}

describe('FreeFermionEngine', () => {
  it('reproduces the single-site closed forms ln Z = ln 2cosh βh, ⟨X⟩ = tanh βh, C = (βh)² sech² βh', async () => {
    // One spin in a field h: H = −hX (two levels ∓h; common practice).
    const h = 0.8;
    const run = await runEngine(engine, {
      lattice: { kind: 'chain', length: 1 }, h0: { model: 'ising', hx: h }, h1: { model: 'ising', hx: 2 },
      betas: [0, 0.5, 3], times: { values: [0, 1.7] }, observables: [{ kind: 'site', pauli: 'X' }, { kind: 'site', pauli: 'Y' }],
    });
    run.thermo.forEach((r) => {
      const x = r.beta * h;
      expect(Math.abs(r.lnZ - Math.log(2 * Math.cosh(x)))).toBeLessThan(1e-15);
      expect(Math.abs(r.energy + h * Math.tanh(x))).toBeLessThan(1e-15);
      expect(Math.abs(r.heatCapacity - (x / Math.cosh(x)) ** 2)).toBeLessThan(1e-15);
      expect(r.freeEnergy === null).toBe(r.beta === 0);
    });
    // X commutes with H1 = −2X: ⟨X⟩(t) = tanh βh at all t; ⟨Y⟩ = 0 exactly (parity-odd).
    run.values.forEach((rows, b) => rows.forEach((v) => {
      expect(Math.abs(v[0] - Math.tanh(run.thermo[b].beta * h))).toBeLessThan(1e-15);
      expect(v[1]).toBe(0);
    }));
  });

  it('gives the infinite-temperature values at β = 0: ⟨X⟩ = ⟨ZZ⟩ = 0, E = the constant term, ln Z = L ln 2', async () => {
    const run = await runEngine(engine, {
      lattice: { kind: 'chain', length: 7, boundary: 'periodic' },
      h0: { model: 'pauli-sum', terms: [{ weight: 0.75, word: '' }, { weight: -1, word: 'Z0 Z1' }, { weight: -0.4, word: 'X3' }, { weight: 1, word: 'Z6 Z0' }] },
      h1: { model: 'ising', J: 1, hx: 0.3 },
      betas: [0], times: { values: [0, 2] },
      observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
    });
    expect(Math.abs(run.thermo[0].lnZ - 7 * Math.LN2)).toBeLessThan(1e-14);
    expect(Math.abs(run.thermo[0].energy - 0.75)).toBeLessThan(1e-15);
    for (const row of run.values[0]) for (const v of row) expect(Math.abs(v)).toBeLessThan(1e-15);
  });

  it('keeps the state stationary when H1 = H0 and reports it', async () => {
    const run = await runEngine(engine, {
      lattice: { kind: 'chain', length: 30, boundary: 'periodic' },
      h0: { model: 'ising', J: 1, hx: 0.9 }, h1: { model: 'ising', J: 1, hx: 0.9 },
      betas: [0.7, 4], times: { start: 0, stop: 10, count: 6 },
      observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: [[0, 9], [3, 28]] }],
    });
    run.diagnostics.forEach((d) => {
      expect(d.stationarityResidual).not.toBeNull();
      expect(d.stationarityResidual!).toBeLessThan(1e-13);
      expect(d.h1Drift).toBeLessThan(1e-12);
    });
  });

  it('conserves ⟨H1⟩ after a quench and reports the decomposition health in the diagnostics', async () => {
    const run = await runEngine(engine, {
      lattice: { kind: 'chain', length: 60, boundary: 'periodic' },
      h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
      betas: [1], times: { start: 0, stop: 20, count: 5 },
      observables: [{ kind: 'energy', of: 'h1' }],
    });
    const e = seriesIndex(run, 'E:h1');
    const d = run.diagnostics[0];
    expect(d.h1Drift).toBeLessThan(1e-12);
    for (const row of run.values[0]) expect(Math.abs(row[e] - run.values[0][0][e])).toBeLessThan(1e-12);
    expect(d.stationarityResidual).toBeNull();
    expect(d.normDrift).toBeLessThan(1e-13);
    expect(d.extra.sectors).toBe(2);
    expect(d.extra.schurResidualH1 as number).toBeLessThan(1e-13);
    expect(d.propagatorErrorBound).toBeGreaterThan(0);
  });

  it('skips points below resumeFrom but still emits thermodynamics and diagnostics', async () => {
    const s = parseSpec({
      lattice: { kind: 'chain', length: 6 }, h0: { model: 'ising', hx: 0.5 }, h1: { model: 'ising', hx: 1 },
      betas: [1, 2], times: { start: 0, stop: 1, count: 5 }, observables: [{ kind: 'site', pauli: 'X' }],
    });
    const sink = collect();
    await engine.runBranch(s, [1, 0], sink, { resumeFrom: { 0: 3 } });
    expect(sink.thermos.map((r) => r.betaIndex)).toEqual([0, 1]);
    expect(sink.points.filter((p) => p.betaIndex === 0).map((p) => p.timeIndex)).toEqual([3, 4]);
    expect(sink.points.filter((p) => p.betaIndex === 1).map((p) => p.timeIndex)).toEqual([0, 1, 2, 3, 4]);
    expect(sink.diags.length).toBe(2);
  });

  it('rejects with an AbortError when the signal fires, before or during a run', async () => {
    const s = parseSpec({
      lattice: { kind: 'chain', length: 40 }, h0: { model: 'ising', hx: 0.5 }, h1: { model: 'ising', hx: 1 },
      betas: [1], times: { start: 0, stop: 5, count: 50 }, observables: [{ kind: 'site', pauli: 'X' }],
    });
    const before = new AbortController();
    before.abort();
    await expect(engine.runBranch(s, [0], collect(), { signal: before.signal })).rejects.toMatchObject({ name: 'AbortError' });
    const during = new AbortController();
    const sink = collect();
    const wrapped: BranchSink = { ...sink, point: (p) => { sink.point(p); if (p.timeIndex === 2) during.abort(); } };
    await expect(engine.runBranch(s, [0], wrapped, { signal: during.signal })).rejects.toMatchObject({ name: 'AbortError' });
    expect(sink.points.length).toBe(3);
  });

  it('rejects β indices outside the grid and runs nothing for an empty branch', async () => {
    const s = parseSpec({
      lattice: { kind: 'chain', length: 4 }, h0: { model: 'ising', hx: 0.5 }, h1: { model: 'ising', hx: 1 },
      betas: [1], times: { values: [0] }, observables: [{ kind: 'site', pauli: 'X' }],
    });
    await expect(engine.runBranch(s, [1], collect())).rejects.toThrow(RangeError);
    const sink = collect();
    await engine.runBranch(s, [], sink);
    expect(sink.points.length + sink.thermos.length).toBe(0);
  });
});
