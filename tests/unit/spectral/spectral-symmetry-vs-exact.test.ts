/**
 * The spectral engine with lattice symmetry blocks (momentum and parity sectors, with and
 * without magnetisation) against the exact engine (Chebyshev propagation of the 4^N doubled
 * state, workers/src/engines/exact) and against itself without blocks: every thermodynamic
 * value and every series point must agree to 1e-10, in the modes 'all' (translations and a
 * reflection), 'translations' and 'none'.
 *
 * Why 1e-10: as in spectral-vs-exact.test.ts — the exact engine runs at tolerance 1e-12, the
 * spectral values are accurate to ~1e-13, and a wrong character, a wrong orbit normalisation,
 * a missing multiplicity or a wrongly averaged observable gives O(0.01–1) differences (the
 * tests also check that the dynamics moves). Each difference must lie within the engines'
 * reported errors combined, and the reported errors stay below 1e-9.
 * Observables deliberately break translation (⟨X_0⟩, ⟨Z_i⟩ per site, ⟨X_0 Y_3⟩, staggered
 * magnetisation): the engine measures their group averages, exact for a symmetric state.
 * Cases: a ring of 8 with a chiral X Y − Y X term (translation invariant, reflection broken:
 * complex momentum blocks), a transverse-field Ising ring of 10 (translations + inversion,
 * no magnetisation), a 3×3 Ising torus and a 4×2 XXZ torus (two translations + inversion), and
 * a quench to an H1 with one different site field (no spatial symmetry left).
 */
import { afterAll, describe, expect, it } from 'vitest';
import type { Hamiltonian, SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { SpectralEngine } from '../../../workers/src/engines/spectral/index.js';
import type { SymmetryMode } from '../../../workers/src/symmetry/index.js';
import { collect, seriesOf, spec } from '../exact/collect.js';
import type { Collected } from '../exact/collect.js';
import { compareRuns, motion } from './compare-runs.js';

const AGREEMENT = 1e-10;
const observed: Array<{ name: string; mode: string; thermo: number; points: number; blocks: unknown }> = [];
const exact = new ExactEngine();

/** XX + YY + 0.6 ZZ + d·(X Y − Y X) on every bond of a ring of n, field −hz·Z (site `bent` gets −(hz + 0.3)). */
function chiralRing(n: number, d: number, hz: number, bent = -1): Hamiltonian {
  const terms = [];
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    terms.push({ weight: 1, word: `X${i} X${j}` }, { weight: 1, word: `Y${i} Y${j}` }, { weight: 0.6, word: `Z${i} Z${j}` });
    terms.push({ weight: d, word: `X${i} Y${j}` }, { weight: -d, word: `Y${i} X${j}` }, { weight: -(hz + (i === bent ? 0.3 : 0)), word: `Z${i}` });
  }
  return { model: 'pauli-sum', terms };
}

async function check(name: string, input: SweepSpecInput, modes: SymmetryMode[], moving: string[]): Promise<Record<string, Collected>> {
  const s = spec({ tolerance: 1e-12, ...input });
  const betas = s.betas.map((_, b) => b);
  const ref = await collect(exact, s, betas);
  const out: Record<string, Collected> = {};
  for (const mode of modes) {
    const engine = new SpectralEngine({ symmetry: mode });
    const run = await collect(engine, s, betas);
    const d = compareRuns(run, ref);
    expect(d.thermo).toBeLessThanOrEqual(AGREEMENT);
    expect(d.points).toBeLessThanOrEqual(AGREEMENT);
    expect(d.maxError).toBeLessThanOrEqual(1e-9);
    for (const label of moving) expect(motion(run, seriesOf(engine, s, label))).toBeGreaterThan(1e-3);
    observed.push({ name, mode, thermo: d.thermo, points: d.points, blocks: run.diagnostics[0].extra.jointBlockSizes });
    out[mode] = run;
  }
  return out;
}

const ring = (length: number) => ({ kind: 'chain', length, boundary: 'periodic' }) as const;

describe('SpectralEngine with lattice symmetry blocks against the exact engine', () => {
  afterAll(() => console.log('spectral (symmetry) vs exact, max |Δ|:', JSON.stringify(observed)));

  it('agrees to 1e-10 on a ring of 8 with chiral X Y − Y X terms (translations kept, reflection rejected)', async () => {
    const out = await check('chiral ring 8', {
      lattice: ring(8), h0: chiralRing(8, 0.4, 0.25), h1: chiralRing(8, -0.3, 0),
      betas: [0, 0.6, 1.7], times: { start: 0, stop: 2.4, count: 4 },
      observables: [
        { kind: 'site', pauli: 'Z', perSite: true }, { kind: 'site', pauli: 'X', sites: [0] },
        { kind: 'pair', paulis: 'XY', pairs: [[0, 3]] }, { kind: 'pair', paulis: 'ZZ', connected: true },
        { kind: 'energy', of: 'h1' }, { kind: 'structure-factor', paulis: 'XX', momenta: [[Math.PI / 2, 0]] },
      ],
    }, ['all', 'none'], ['ZZ:nearest~conn', 'XY:pairs']);
    const x = out.all.diagnostics[0].extra;
    expect(x.symmetry).toBe('magnetisation + translation a1 (order 8)');
    expect(x.symmetryDropped).toBe('reflection inversion: broken by h0 and h1');
    expect(x.realQuenchBlocks).toBeLessThan(x.jointBlocks as number); // complex momentum blocks ran
    expect(x.largestBlock).toBe(10); // C(8,4)/8 ≈ 8.75: momentum sectors of the M = 4 block hold 8–10 states
  });

  it('agrees to 1e-10 on a transverse-field Ising ring of 10 (translations and inversion, mirrored sectors)', async () => {
    const out = await check('ising ring 10', {
      lattice: ring(10), h0: { model: 'ising', J: 1, hx: 0.6, hz: 0.2 }, h1: { model: 'ising', J: 1, hx: 1.5 },
      betas: [0.8], times: { start: 0, stop: 1.6, count: 3 },
      observables: [
        { kind: 'site', pauli: 'X', sites: [0, 4] }, { kind: 'site', pauli: 'Y', sites: [2] },
        { kind: 'pair', paulis: 'XY', pairs: [[0, 3]] }, { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance', connected: true },
        { kind: 'energy', of: 'h0' },
      ],
    }, ['all', 'translations'], ['X:avg', 'E:h0']);
    const x = out.all.diagnostics[0].extra;
    expect(x.symmetry).toBe('translation a1 (order 10) + reflection inversion');
    expect(x.mirroredBlocks).toBe(4); // k = 1..4 stand for k = 9..6
    expect(x.largestBlock).toBeLessThanOrEqual(108); // ≈ 1024/10, against 1024 without blocks
  });

  it('agrees to 1e-10 on a 3×3 Ising torus and a 4×2 XXZ torus (two translations and inversion)', async () => {
    const torus = await check('ising torus 3x3', {
      lattice: { kind: 'square', size: [3, 3], boundary: ['periodic', 'periodic'] },
      h0: { model: 'ising', J: 1, hx: 0.5, hz: 0.3 }, h1: { model: 'ising', J: 0.8, hx: 1.2 },
      betas: [0.4, 1.1], times: { start: 0, stop: 1.5, count: 3 },
      observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: [[0, 4]] }, { kind: 'energy', of: 'h1' }],
    }, ['all', 'translations'], ['X@0', 'ZZ:pairs']);
    expect(torus.all.diagnostics[0].extra.symmetry).toBe('translation a1 (order 3) + translation a2 (order 3) + reflection inversion');
    const xxz = await check('xxz torus 4x2', {
      lattice: { kind: 'square', size: [4, 2], boundary: ['periodic', 'periodic'] },
      h0: { model: 'xxz', J: 1, delta: 0.3, hz: 0.4 }, h1: { model: 'xxz', J: 1, delta: 1.9 },
      betas: [0.5, 2], times: { start: 0, stop: 2, count: 3 },
      observables: [
        { kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' }, { kind: 'site', pauli: 'Z', sites: [1] },
        { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance', connected: true }, { kind: 'energy', of: 'h0' },
      ],
    }, ['all'], ['ZZ:d=1~conn']);
    expect(xxz.all.diagnostics[0].extra.symmetry).toBe('magnetisation + translation a1 (order 4) + translation a2 (order 2) + reflection inversion');
  });

  it('falls back to magnetisation blocks, and still agrees, when H1 has one site with a different field', async () => {
    const out = await check('bent ring 8', {
      lattice: ring(8), h0: chiralRing(8, 0, 0.2), h1: chiralRing(8, 0, 0.1, 3),
      betas: [1], times: { start: 0, stop: 2, count: 3 },
      observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'energy', of: 'h1' }],
    }, ['all'], ['Z@3']);
    const x = out.all.diagnostics[0].extra;
    expect(x.symmetry).toBe('magnetisation');
    expect(x.symmetryDropped).toBe('translation a1: broken by h1; reflection inversion: broken by h1');
  });
});
