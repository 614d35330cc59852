/**
 * Unit tests of the linked-cluster machinery (workers/src/series): the cluster enumeration
 * against published polyomino counts, and the cluster sums against the whole-cluster moments
 * of the same finite lattice — both exact to the stated order, computed by different routes,
 * so they must agree coefficient by coefficient.
 */
import { describe, expect, it } from 'vitest';
import type { SweepSpec, SweepSpecInput } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import {
  ClusterExpansion, buildLocalModel, computeSweepSeries, enumerateConnectedSets, infiniteLatticeLnZ, pointGroupOf,
} from '../../../workers/src/series/index.js';

function squareAdjacency(L: number): number[][] {
  const adj: number[][] = [];
  for (let y = 0; y < L; y++) {
    for (let x = 0; x < L; x++) {
      const a: number[] = [];
      if (x > 0) a.push(y * L + x - 1);
      if (x < L - 1) a.push(y * L + x + 1);
      if (y > 0) a.push((y - 1) * L + x);
      if (y < L - 1) a.push((y + 1) * L + x);
      adj.push(a);
    }
  }
  return adj;
}

const spec = (input: Partial<SweepSpecInput>): SweepSpec => SweepSpecSchema.parse({
  lattice: { kind: 'chain', length: 4 },
  h0: { model: 'ising', J: 1, hx: 0.6, hz: 0.3 },
  h1: { model: 'xxz', J: 0.7, delta: 0.4, hz: 0.2 },
  betas: [0.1], times: { values: [0] },
  observables: [{ kind: 'site', pauli: 'X' }],
  ...input,
});

/** Largest |a − b| relative to max(1, |b|) over all coefficients. */
function maxRelDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let k = 0; k < a.length; k++) m = Math.max(m, Math.abs(a[k] - b[k]) / Math.max(1, Math.abs(b[k])));
  return m;
}

describe('enumerateConnectedSets', () => {
  it('counts the fixed polyominoes of 1..10 cells as their lowest cell (Redelmeier, Discrete Math. 36, 191 (1981); values from memory)', () => {
    const L = 21;
    const counts = new Array<number>(11).fill(0);
    const c = 10 * L + 10;
    enumerateConnectedSets(squareAdjacency(L), [c], 10, (s) => { counts[s.length]++; }, { minVertex: c });
    expect(counts.slice(1)).toEqual([1, 2, 6, 19, 63, 216, 760, 2725, 9910, 36446]);
  });

  it('visits every connected superset of a disconnected start set exactly once, with the start treated as one piece', () => {
    // Path 0-1-2-3-4; start {0, 4}: sets containing both, up to 3 sites, connected via the start.
    const adj = [[1], [0, 2], [1, 3], [2, 4], [3]];
    const seen: string[] = [];
    enumerateConnectedSets(adj, [0, 4], 3, (s) => { seen.push([...s].sort().join('')); });
    expect(seen.sort()).toEqual(['014', '034', '04']);
  });

  it('respects the allowed filter and refuses bad start sets', () => {
    const adj = squareAdjacency(3);
    let n = 0;
    enumerateConnectedSets(adj, [4], 9, () => { n++; }, { allowed: (v) => v !== 1 && v !== 3 });
    // Centre plus any subset of {5, 7} and their further neighbours, never through 1 or 3.
    expect(n).toBeGreaterThan(1);
    expect(() => enumerateConnectedSets(adj, [], 3, () => {})).toThrow(RangeError);
    expect(() => enumerateConnectedSets(adj, [9], 3, () => {})).toThrow(RangeError);
    expect(() => enumerateConnectedSets(adj, [2, 2], 3, () => {})).toThrow(RangeError);
  });
});

describe('linked clusters against whole-cluster moments', () => {
  const cases: Array<[string, Partial<SweepSpecInput>, number, number]> = [
    ['an open 3×4 square lattice (Ising H0 with both fields, XXZ H1)', {
      lattice: { kind: 'square', size: [3, 4], boundary: ['open', 'open'] },
      observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest', connected: true }, { kind: 'energy', of: 'h1' }],
    }, 7, 4],
    ['a periodic ring of 10 (the infinite-lattice path for ln Z)', {
      lattice: { kind: 'chain', length: 10, boundary: 'periodic' },
      observables: [{ kind: 'pair', paulis: 'XY', pairs: 'nearest' }, { kind: 'site', pauli: 'Z', sites: [3] }],
    }, 8, 5],
    ['a periodic 2×2 honeycomb lattice with XXZ H0', {
      lattice: { kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] },
      h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.3 },
      h1: { model: 'ising', J: 1, hx: 0.8, hz: 0 },
      observables: [{ kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' }],
    }, 5, 4],
    ['a ladder of 5 rungs, periodic along the legs', {
      lattice: { kind: 'ladder', length: 5, boundary: ['periodic', 'open'] },
      observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'next-nearest' }],
    }, 6, 3],
  ];
  for (const [name, input, n, K] of cases) {
    it(`agree coefficient by coefficient on ${name}`, () => {
      const s = spec(input);
      const whole = computeSweepSeries(s, { thermoOrder: n, quenchOrder: K, method: 'whole-cluster' });
      const lce = computeSweepSeries(s, { thermoOrder: n, quenchOrder: K, method: 'linked-cluster' });
      // Tolerance: both routes round ~1e−15 per operation; moments of ≤ 16 sites to order ≤ 8
      // cancel into cumulants with a loss of ≤ 5 digits.
      expect(maxRelDiff(lce.lnZ, whole.lnZ)).toBeLessThan(1e-9);
      expect(lce.series.map((x) => x.label)).toEqual(whole.series.map((x) => x.label));
      lce.series.forEach((x, i) => expect(maxRelDiff(x.coefficients, whole.series[i].coefficients)).toBeLessThan(1e-9));
    });
  }
});

describe('ClusterExpansion sums', () => {
  const lattice = { kind: 'square' as const, size: [6, 6] as [number, number], boundary: ['periodic', 'periodic'] as ['periodic', 'periodic'] };
  const graph = buildLattice(lattice);
  const h0 = buildLocalModel({ model: 'ising', J: 1, hx: 0.5, hz: 0.2 }, graph);

  it('gives the same total from lowest-site sums and from N times the share of one site on a torus', () => {
    const ce = new ClusterExpansion(h0, h0, { thermoOrder: 5, positions: graph.positions, pointGroup: pointGroupOf('square') });
    const total = ce.lnZTotal();
    const share = ce.lnZShare(14);
    for (let k = 0; k <= 5; k++) expect(total[k]).toBeCloseTo(36 * share[k], 10);
  });

  it('gives identical weights with and without the point group', () => {
    const a = new ClusterExpansion(h0, h0, { thermoOrder: 6, positions: graph.positions, pointGroup: pointGroupOf('square') });
    const b = new ClusterExpansion(h0, h0, { thermoOrder: 6 });
    const wa = a.lnZShare(21);
    const wb = b.lnZShare(21);
    for (let k = 0; k <= 6; k++) expect(wa[k]).toBeCloseTo(wb[k], 11);
    expect(a.stats.solved).toBeLessThan(b.stats.solved);
  });

  it('gives the per-site series of the infinite lattice on a torus longer than the largest cluster', () => {
    const s = spec({ lattice, h0: { model: 'ising', J: 1, hx: 0.5, hz: 0.2 } });
    const perSite = infiniteLatticeLnZ(s, 5, 5);
    const ce = new ClusterExpansion(h0, h0, { thermoOrder: 5 });
    const total = ce.lnZTotal();
    for (let k = 0; k <= 5; k++) expect(36 * perSite[k]).toBeCloseTo(total[k], 10);
  });

  it('refuses negative orders, mismatched models and sites outside the graph', () => {
    expect(() => new ClusterExpansion(h0, h0, { thermoOrder: -1 })).toThrow(RangeError);
    const small = buildLocalModel({ model: 'ising', J: 1, hx: 1, hz: 0 }, buildLattice({ kind: 'chain', length: 3, boundary: 'open' }));
    expect(() => new ClusterExpansion(h0, small)).toThrow(RangeError);
    const ce = new ClusterExpansion(small, small, { thermoOrder: 2, quenchOrder: 2 });
    expect(() => ce.lnZShare(3)).toThrow(RangeError);
    expect(() => ce.observable({ sites: [], codes: [] })).toThrow(RangeError);
  });
});

describe('translation orbits of primitives', () => {
  it('give the same series as computing every primitive (the same Hamiltonian as an explicit Pauli sum is not reduced)', () => {
    const lattice = { kind: 'square' as const, size: [3, 3] as [number, number], boundary: ['periodic', 'periodic'] as ['periodic', 'periodic'] };
    const graph = buildLattice(lattice);
    const terms = [
      ...graph.bonds.map(([i, j]) => ({ weight: -1, word: `Z${i} Z${j}` })),
      ...Array.from({ length: 9 }, (_, i) => ({ weight: -0.6, word: `X${i}` })),
    ];
    const observables: SweepSpecInput['observables'] = [
      { kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'XZ', pairs: 'nearest', perPair: true },
    ];
    const h1 = { model: 'ising' as const, J: 0.5, hx: 1.2, hz: 0 };
    const preset = spec({ lattice, h0: { model: 'ising', J: 1, hx: 0.6, hz: 0 }, h1, observables });
    const explicit = spec({ lattice, h0: { model: 'pauli-sum', terms }, h1, observables });
    for (const method of ['whole-cluster', 'linked-cluster'] as const) {
      const a = computeSweepSeries(preset, { thermoOrder: 4, quenchOrder: 4, method });
      const b = computeSweepSeries(explicit, { thermoOrder: 4, quenchOrder: 4, method });
      expect(a.stats.distinctPrimitives).toBeLessThan(b.stats.distinctPrimitives);
      expect(maxRelDiff(a.lnZ, b.lnZ)).toBeLessThan(1e-12);
      a.series.forEach((x, i) => expect(maxRelDiff(x.coefficients, b.series[i].coefficients)).toBeLessThan(1e-12));
    }
  });
});
