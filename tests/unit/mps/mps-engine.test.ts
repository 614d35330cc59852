/**
 * The mps engine's contract: series labels, edge chains (one and two sites, against the exact
 * engine), β = 0 thermodynamics in closed form, abort, checkpoints and resume, the plan's
 * refusals and estimates, and the spec's `mps` settings.
 * Tolerances: one- and two-site chains need no truncation and (one or two bonds) no Trotter
 * splitting — the whole step is one exact gate — so they agree with the exact engine to 1e-12;
 * β = 0 values are closed forms (ln Z = L ln 2, E = the constant) to rounding (1e-14).
 */
import { describe, expect, it } from 'vitest';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import type { BranchCheckpoints } from '../../../workers/src/engines/engine.js';
import { MpsEngine, decodeCheckpoint } from '../../../workers/src/engines/mps/index.js';
import { collect, compare, spec } from './collect.js';

const mps = new MpsEngine();

const base: SweepSpecInput = {
  lattice: { kind: 'chain', length: 4 },
  h0: { model: 'ising', J: 1, hx: 0.8, hz: 0.2 },
  h1: { model: 'xxz', J: 0.5, delta: 0.7, hz: 0.1 },
  betas: [0, 0.5, 1.2],
  times: { start: 0, stop: 0.8, count: 3 },
  observables: [
    { kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'energy', of: 'h0' },
    { kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' }, { kind: 'structure-factor', paulis: 'XX', momenta: [[3.14159, 0]], connected: true },
  ],
  tolerance: 1e-8,
  mps: { maxBond: 16, truncation: 0, trotterOrder: 4, dt: 0.05 },
};

describe('MpsEngine', () => {
  it('emits the same series labels as the exact engine, and works beyond the 30-site mask limit', () => {
    const s = spec(base);
    expect(mps.series(s)).toEqual(new ExactEngine().series(s));
    const long = spec({ ...base, lattice: { kind: 'chain', length: 200 } });
    expect(mps.series(long).length).toBe(200 + 5);
    expect(mps.plan(long).feasible).toBe(true);
  });

  for (const L of [1, 2]) {
    it(`agrees with the exact engine to 1e-12 on a ${L}-site chain, where every step is one exact gate`, async () => {
      const s = spec({
        ...base, lattice: { kind: 'chain', length: L },
        h0: { model: 'pauli-sum', terms: [{ weight: 0.7, word: 'X0' }, { weight: -0.4, word: 'Y0' }, ...(L === 2 ? [{ weight: 0.9, word: 'Z0 Y1' }, { weight: 0.3, word: 'X1' }] : [])] },
        h1: { model: 'pauli-sum', terms: [{ weight: 1.1, word: 'Z0' }, { weight: 0.5, word: 'Y0' }, ...(L === 2 ? [{ weight: -0.6, word: 'X0 Y1' }, { weight: 0.2, word: '' }] : [])] },
        observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'site', pauli: 'Y', perSite: true }, { kind: 'energy', of: 'h1' }],
        tolerance: 1e-12,
        mps: { maxBond: 4, truncation: 0, trotterOrder: 2, dt: 0.3 },
      });
      const a = await collect(new ExactEngine(), s, [0, 1, 2]);
      const b = await collect(mps, s, [0, 1, 2]);
      expect(compare(a, b).diff).toBeLessThan(1e-12);
      b.thermo.forEach((t, k) => {
        expect(Math.abs(t.lnZ - a.thermo[k].lnZ)).toBeLessThan(1e-12);
        expect(Math.abs(t.heatCapacity - a.thermo[k].heatCapacity)).toBeLessThan(1e-12);
      });
    });
  }

  it('gives ln Z = L ln 2, E = the identity weight and C = 0 at β = 0', async () => {
    const s = spec({ ...base, h0: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 X1' }, { weight: 0.4, word: '' }] } });
    const out = await collect(mps, s, [0]);
    const t = out.thermo[0];
    expect(t.lnZ).toBeCloseTo(4 * Math.LN2, 14);
    expect(t.energy).toBeCloseTo(0.4, 14);
    expect(t.heatCapacity).toBe(0);
    expect(t.freeEnergy).toBeNull();
    expect(out.points).toHaveLength(3);
    expect(out.diagnostics[0].extra.maxBond).toBe(1);
  });

  it('rejects with an AbortError when the signal fires, before or during a run', async () => {
    const controller = new AbortController();
    controller.abort();
    await expect(collect(mps, spec(base), [1], { signal: controller.signal })).rejects.toMatchObject({ name: 'AbortError' });
    // Mid-run: aborted when the first point arrives, so no second point is emitted.
    const mid = new AbortController();
    const seen: number[] = [];
    const run = mps.runBranch(spec(base), [2], {
      thermo: () => {}, diagnostics: () => {},
      point: (p) => { seen.push(p.timeIndex); mid.abort(); },
    }, { signal: mid.signal });
    await expect(run).rejects.toMatchObject({ name: 'AbortError' });
    expect(seen).toEqual([0]);
  });

  it('saves a thermal checkpoint per β and quench checkpoints between grid times, and resumes from either with the same values', async () => {
    const s = spec(base);
    const saved: Uint8Array[] = [];
    const hook = (initial: Uint8Array | null): BranchCheckpoints => ({
      intervalSeconds: 0, load: async () => initial, save: async (d) => { saved.push(d.slice()); },
    });
    const full = await collect(mps, s, [1, 2], { checkpoints: hook(null) });
    const kinds = saved.map((d) => decodeCheckpoint(d)).map((c) => `${c.kind}:${c.betaIndex}${c.kind === 'quench' ? `:${c.progress.nextTimeIndex}` : ''}`);
    expect(kinds).toEqual(['thermal:1', 'quench:1:1', 'quench:1:2', 'thermal:2', 'quench:2:1', 'quench:2:2']);
    const stored = { 1: 3, 2: 2 };
    for (const [which, resumedFrom] of [[3, 'thermal'], [5, 'quench:t=2']] as const) {
      const resumed = await collect(mps, s, [1, 2], { checkpoints: hook(saved[which]), resumeFrom: stored });
      expect(resumed.thermo.map((t) => t.betaIndex)).toEqual(which === 3 ? [2] : []);
      expect(resumed.points.map((p) => p.timeIndex)).toEqual([2]);
      for (const p of resumed.points) {
        const q = full.points.find((x) => x.betaIndex === 2 && x.timeIndex === p.timeIndex)!;
        expect(p.values).toEqual(q.values);
        expect(p.errors).toEqual(q.errors);
      }
      const d = resumed.diagnostics[0].extra;
      expect(d.resumedFrom).toBe(resumedFrom);
      expect(d.imaginaryUpdatesRun).toBe(0);
      // From the thermal checkpoint the whole quench runs again; from t index 2 only its last interval.
      if (which === 3) expect(d.realUpdatesRun).toBe(full.diagnostics[1].extra.realUpdatesRun);
      else expect(Number(d.realUpdatesRun)).toBeLessThan(Number(full.diagnostics[1].extra.realUpdatesRun));
      expect(d.realUpdates).toBe(full.diagnostics[1].extra.realUpdates);
    }
    // A checkpoint ahead of the stored points, or bytes that are not a checkpoint: run from β = 0.
    const ahead = await collect(mps, s, [1, 2], { checkpoints: hook(saved[5]), resumeFrom: { 1: 3, 2: 1 } });
    expect(ahead.diagnostics[0].extra.resumedFrom).toBe('start');
    expect(ahead.diagnostics[0].extra.checkpointIgnored).toMatch(/restores 2 points of β index 2, 1 are stored/);
    expect(Number(ahead.diagnostics[0].extra.imaginaryUpdatesRun)).toBeGreaterThan(0);
    const junk = await collect(mps, s, [2], { checkpoints: hook(new Uint8Array(64)) });
    expect(junk.diagnostics[0].extra.checkpointIgnored).toMatch(/format tag/);
    expect(junk.points.map((p) => p.values)).toEqual((await collect(mps, s, [2])).points.map((p) => p.values));
  });

  it('reports bond dimensions, discarded weights and a Trotter estimate per run', async () => {
    const out = await collect(mps, spec(base), [2]);
    const x = out.diagnostics[0].extra;
    expect(Number(x.maxBond)).toBeGreaterThan(1);
    expect(Number(x.maxBond)).toBeLessThanOrEqual(16);
    expect(String(x.bondByTime).split(',')).toHaveLength(3);
    expect(Number(x.trotterErrorEstimate)).toBeGreaterThan(0);
    expect(Number(x.trotterErrorEstimate)).toBeLessThan(1e-4);
    expect(out.diagnostics[0].h1Drift).toBeLessThan(1e-6);
  });
});

describe('planMps', () => {
  it('plans rings and ladders through swap gates, and refuses 2D lattices, terms on three sites and a bond cap that breaks the memory budget', () => {
    const ring = mps.plan(spec({ ...base, lattice: { kind: 'chain', length: 6, boundary: 'periodic' } }));
    expect(ring.feasible).toBe(true);
    expect(ring.reason).toMatch(/folded ring, longer bonds through swap gates/);
    const ladder = mps.plan(spec({ ...base, lattice: { kind: 'ladder', length: 3 }, observables: [{ kind: 'site', pauli: 'X' }] }));
    expect(ladder.feasible).toBe(true);
    // Each leg bond (span 2) costs a swap, the gate and a swap: more work than the 6-site open chain.
    const open6 = mps.plan(spec({ ...base, lattice: { kind: 'chain', length: 6 }, observables: [{ kind: 'site', pauli: 'X' }] }));
    expect(ladder.flops).toBeGreaterThan(open6.flops);
    const square = mps.plan(spec({ ...base, lattice: { kind: 'square', size: [2, 3] }, observables: [{ kind: 'site', pauli: 'X' }] }));
    expect(square.feasible).toBe(false);
    expect(square.refusal?.field).toBe('lattice.kind');
    expect(square.refusal?.message).toMatch(/square lattice/);
    const three = mps.plan(spec({ ...base, h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 Z1 X2' }] } }));
    expect(three.feasible).toBe(false);
    expect(three.refusal?.field).toBe('h1');
    expect(three.refusal?.message).toMatch(/"X0 Z1 X2" acts on 3 sites/);
    const huge = mps.plan(spec({ ...base, lattice: { kind: 'chain', length: 2000 }, observables: [{ kind: 'pair', paulis: 'ZZ' }], mps: { maxBond: 2048 } }));
    expect(huge.feasible).toBe(false);
    expect(huge.refusal?.field).toBe('mps.maxBond');
    expect(huge.refusal!.estimate).toBeGreaterThan(huge.refusal!.limit);
  });

  it('plans one branch per β with positive costs and says which settings it derived', () => {
    const p = mps.plan(spec({ ...base, mps: undefined }));
    expect(p.feasible).toBe(true);
    expect(p.branches).toEqual([[0], [1], [2]]);
    expect(p.memoryBytes).toBeGreaterThan(0);
    expect(p.flops).toBeGreaterThan(0);
    expect(p.accuracy).toBeGreaterThanOrEqual(1e-8);
    expect(p.reason).toMatch(/derived from the tolerance: trotterOrder, maxBond, dt, truncation/);
  });
});

describe('SweepSpec.mps', () => {
  it('accepts partial settings and rejects an unknown order, a zero bond cap and unknown keys', () => {
    expect(SweepSpecSchema.safeParse({ ...base, mps: { dt: 0.01 } }).success).toBe(true);
    expect(SweepSpecSchema.safeParse({ ...base, mps: { trotterOrder: 3 } }).success).toBe(false);
    expect(SweepSpecSchema.safeParse({ ...base, mps: { maxBond: 0 } }).success).toBe(false);
    expect(SweepSpecSchema.safeParse({ ...base, mps: { chi: 10 } }).success).toBe(false);
    expect(SweepSpecSchema.safeParse({ ...base, engine: 'mps' }).success).toBe(true);
  });
});
