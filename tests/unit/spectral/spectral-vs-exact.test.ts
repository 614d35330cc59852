/**
 * The spectral engine against the exact engine (Chebyshev propagation of the doubled state,
 * workers/src/engines/exact) on the same specs, with and without magnetisation blocks:
 * every thermodynamic value and every series point must agree to 1e-10.
 *
 * Why 1e-10: the exact engine runs at tolerance 1e-12 (its reported errors stay below that);
 * the spectral engine's values are accurate to ~1e-13 here (observed), while its reported
 * error estimates are first-order bounds of a few 1e-10 for energies (series weight Σ|w| ≈ 22
 * times 2βη0 + 2η1t with η ≈ 2·‖H‖·‖VᴴV − I‖_F ≈ 5e-13; spectral-error.ts). 1e-10 is six
 * orders of magnitude below any physics mistake (a wrong sign of a Y term, a missing transpose,
 * a wrong block) — those give O(0.01–1) differences, and the test also checks that the
 * dynamics actually moves. Each difference must also lie within the two engines' reported
 * errors combined (the error estimates must cover the truth), and the reported errors must stay
 * below 1e-9 (not uselessly loose).
 * Cases include Y-odd strings (⟨Y_i⟩, ⟨X Y⟩, an X Y − Y X Hamiltonian term: complex blocks),
 * magnetisation-changing observables (⟨X_i⟩ = 0 by symmetry), H1 breaking the symmetry of H0
 * (joint blocks coarser than H0's), and H1 = H0 (stationarity).
 */
import { afterAll, describe, expect, it } from 'vitest';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { SpectralEngine } from '../../../workers/src/engines/spectral/index.js';
import { collect, seriesOf, spec } from '../exact/collect.js';
import type { Collected } from '../exact/collect.js';
import { compareRuns, motion } from './compare-runs.js';

const AGREEMENT = 1e-10;
/** Observed figures, printed once for the report. */
const observed: Array<{ symmetry: string; thermo: number; points: number; maxError: number }> = [];
const exact = new ExactEngine();

async function check(input: SweepSpecInput, moving: string[]): Promise<Record<string, Collected>> {
  const s = spec({ tolerance: 1e-12, ...input });
  const betas = s.betas.map((_, b) => b);
  const ref = await collect(exact, s, betas);
  const results: Record<string, Collected> = {};
  for (const symmetry of ['magnetisation', 'none'] as const) {
    const engine = new SpectralEngine({ symmetry });
    const out = await collect(engine, s, betas);
    const d = compareRuns(out, ref);
    expect(d.thermo).toBeLessThanOrEqual(AGREEMENT);
    expect(d.points).toBeLessThanOrEqual(AGREEMENT);
    expect(d.maxError).toBeLessThanOrEqual(1e-9);
    observed.push({ symmetry, ...d });
    for (const label of moving) expect(motion(out, seriesOf(engine, s, label))).toBeGreaterThan(1e-3);
    results[symmetry] = out;
  }
  return results;
}

describe('SpectralEngine against the exact engine', () => {
  afterAll(() => console.log('spectral vs exact (max |Δ| thermo, points; max reported error):', JSON.stringify(observed)));

  it('agrees to 1e-10 on an XXZ quench of an 8-site ring (Y terms, magnetisation blocks)', async () => {
    const out = await check({
      lattice: { kind: 'chain', length: 8, boundary: 'periodic' },
      h0: { model: 'xxz', J: 1, delta: 0.6, hz: 0.2 },
      h1: { model: 'xxz', J: 1, delta: 1.8, hz: 0 },
      betas: [0, 0.4, 1.5],
      times: { start: 0, stop: 2.5, count: 5 },
      observables: [
        { kind: 'site', pauli: 'Z', perSite: true },
        { kind: 'site', pauli: 'X' },
        { kind: 'pair', paulis: 'XY', pairs: [[0, 3], [2, 5]] },
        { kind: 'pair', paulis: 'ZZ', connected: true },
        { kind: 'energy', of: 'h0' },
        { kind: 'energy', of: 'h1' },
      ],
    }, ['ZZ:nearest~conn', 'E:h0']);
    const mag = out.magnetisation.diagnostics[0].extra;
    expect(mag.symmetry).toBe('magnetisation');
    expect(mag.jointBlocks).toBe(9);
    expect(out.none.diagnostics[0].extra.jointBlocks).toBe(1);
    // ⟨X⟩ vanishes by symmetry: exactly 0 with blocks (never computed), rounding-small without.
    const engine = new SpectralEngine();
    const s = spec({
      lattice: { kind: 'chain', length: 8, boundary: 'periodic' }, h0: { model: 'xxz', J: 1, delta: 0.6, hz: 0.2 },
      h1: { model: 'xxz', J: 1, delta: 1.8, hz: 0 }, betas: [0, 0.4, 1.5], times: { start: 0, stop: 2.5, count: 5 },
      observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'site', pauli: 'X' }],
    });
    const x = seriesOf(engine, s, 'X:avg');
    for (const p of out.magnetisation.points) expect(p.values[x]).toBe(0);
  });

  it('agrees to 1e-10 when H0 has a complex X Y − Y X term and H1 breaks the magnetisation symmetry', async () => {
    const bonds: Array<[number, number]> = [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [5, 0], [0, 3]];
    const h0Terms = bonds.flatMap(([i, j], k) => [
      { weight: 0.9, word: `X${i} X${j}` }, { weight: 0.9, word: `Y${i} Y${j}` }, { weight: 0.4 - 0.1 * k, word: `Z${i} Z${j}` },
      { weight: 0.35, word: `X${i} Y${j}` }, { weight: -0.35, word: `Y${i} X${j}` },
    ]);
    const out = await check({
      lattice: { kind: 'bonds', sites: 6, bonds },
      h0: { model: 'pauli-sum', terms: [...h0Terms, { weight: 0.3, word: 'Z2' }] },
      h1: { model: 'ising', J: 1, hx: 0.8, hz: 0.1 },
      betas: [0.3, 1.2],
      times: { values: [0, 0.7, 1.9] },
      observables: [
        { kind: 'site', pauli: 'Y', perSite: true },
        { kind: 'site', pauli: 'X', perSite: true },
        { kind: 'pair', paulis: 'YZ', pairs: [[1, 4]] },
        { kind: 'energy', of: 'h1' },
        { kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' },
      ],
    }, ['X@0', 'mZ:staggered']);
    const extra = out.magnetisation.diagnostics[0].extra;
    expect(extra.h0Blocks).toBe(7); // H0 keeps its sectors …
    expect(extra.jointBlocks).toBe(1); // … but the quench needs the whole space
    expect(extra.realQuenchBlocks).toBe(0); // complex H0 eigenvectors: the complex path ran
  });

  it('agrees to 1e-10 when H1 = H0 and reports a stationary state', async () => {
    const out = await check({
      lattice: { kind: 'ladder', length: 3 },
      h0: { model: 'xxz', J: 0.7, delta: 1.3, hz: 0.25 },
      h1: { model: 'xxz', J: 0.7, delta: 1.3, hz: 0.25 },
      betas: [0.5, 2],
      times: { start: 0, stop: 2, count: 3 },
      observables: [{ kind: 'pair', paulis: 'ZZ' }, { kind: 'site', pauli: 'Z' }],
    }, []);
    for (const d of out.magnetisation.diagnostics) {
      expect(d.extra.sharedDecomposition).toBe(true);
      // Proxy 2·√(Σ p_k r_k²) with residuals r_k ~ 1e-15·‖H‖ (decompose-blocks.ts).
      expect(d.stationarityResidual).not.toBeNull();
      expect(d.stationarityResidual!).toBeLessThan(1e-12);
    }
    for (const beta of [0, 1]) {
      const pts = out.magnetisation.points.filter((p) => p.betaIndex === beta);
      for (const p of pts) p.values.forEach((v, k) => expect(Math.abs(v - pts[0].values[k])).toBeLessThan(1e-13));
    }
  });
});
