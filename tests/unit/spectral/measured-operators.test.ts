/**
 * What the spectral engine transforms into the H1 eigenbasis:
 * - measurementPlan picks per-series operators when they are fewer than the primitives, and its
 *   layout reproduces evaluateSeries on the original layout exactly in value (by linearity) and
 *   in error (Σ|w|·δ is what evaluateSeries gives a linear part), and falls back to primitives
 *   when they are fewer (structure factors at many momenta share all pair strings).
 * - with a group average as canonical map, translates of one string become one operator and
 *   the series still read the same values (⟨Z_i⟩ equal on a symmetric state);
 * - transformOperator / transformOperatorReal give Vᴴ·O·V as a dense reference computes it
 *   (dense Pauli matrices from tests/support/reference, independent of the kernels), for real
 *   and imaginary Pauli strings and a sum mixing both, on a magnetisation block.
 *   Tolerance 1e-13: d = 20-entry sums of O(1) products, a few ulps each.
 */
import { describe, expect, it } from 'vitest';
import { measurementPlan } from '../../../workers/src/engines/spectral/measurement-plan.js';
import { transformOperator } from '../../../workers/src/engines/spectral/transform-operator.js';
import { transformOperatorReal } from '../../../workers/src/engines/spectral/transform-operator-real.js';
import { hermitianEigen } from '../../../workers/src/linalg/hermitian-eigen.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { evaluateSeries, expandObservables } from '../../../workers/src/observables/expand-observables.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { parsePauliWord } from '../../../workers/src/physics/pauli-word.js';
import {
  analyseSymmetry, blockMatrix, groupSectors, partitionByLabel, sectorBasis, symmetriseTerms, trivialGroup,
} from '../../../workers/src/symmetry/index.js';
import { pauliSumArrays } from '../../support/reference/dense-pauli.js';
import { seededRandom } from '../../bench/bench-record.js';
import { spec } from '../exact/collect.js';

describe('measurementPlan', () => {
  const graph = buildLattice({ kind: 'chain', length: 6, boundary: 'periodic' });
  const h = buildHamiltonian({ model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, graph);

  it('transforms one operator per series when that is cheaper, with the same values and errors', () => {
    const s = spec({
      lattice: { kind: 'chain', length: 6, boundary: 'periodic' }, h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 },
      h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, betas: [1], times: { values: [0] },
      observables: [{ kind: 'energy', of: 'h1' }, { kind: 'pair', paulis: 'ZZ', connected: true }, { kind: 'site', pauli: 'Z' }],
    });
    const layout = expandObservables(s, graph, h, h);
    const plan = measurementPlan(layout);
    expect(plan.mode).toBe('series');
    expect(plan.operators.length).toBeLessThan(layout.primitives.length);
    // Made-up primitive values; operator values follow by linearity.
    const r = seededRandom(1);
    const pv = Float64Array.from(layout.primitives, () => 2 * r() - 1);
    const pe = new Float64Array(layout.primitives.length).fill(1e-9);
    const key = (p: { x: number; z: number }) => layout.primitives.findIndex((q) => q.x === p.x && q.z === p.z);
    const ov = Float64Array.from(plan.operators, (o) => o.terms.reduce((acc, t) => acc + t.weight * pv[key(t)], 0));
    const oe = Float64Array.from(plan.weights, (w) => w * 1e-9);
    const ns = layout.series.length;
    const [v1, e1, v2, e2] = [new Float64Array(ns), new Float64Array(ns), new Float64Array(ns), new Float64Array(ns)];
    evaluateSeries(layout, pv, pe, v1, e1);
    evaluateSeries(plan.layout, ov, oe, v2, e2);
    for (let k = 0; k < ns; k++) {
      expect(Math.abs(v1[k] - v2[k])).toBeLessThanOrEqual(1e-14);
      expect(Math.abs(e1[k] - e2[k])).toBeLessThanOrEqual(1e-22);
    }
  });

  it('keeps one operator per primitive when structure factors at many momenta share the pair strings', () => {
    // 30 momenta → 30 linear parts, against 21 primitives (15 pair strings, 6 single Z_i).
    const momenta = Array.from({ length: 30 }, (_, k) => [0.2 * k, 0] as [number, number]);
    const s = spec({
      lattice: { kind: 'chain', length: 6, boundary: 'periodic' }, h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 },
      h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, betas: [1], times: { values: [0] },
      observables: [{ kind: 'structure-factor', paulis: 'ZZ', momenta }],
    });
    const layout = expandObservables(s, graph, h, h);
    const plan = measurementPlan(layout);
    expect(plan.mode).toBe('primitives');
    expect(plan.layout).toBe(layout);
    expect(plan.operators).toHaveLength(layout.primitives.length);
  });
});

describe('measurementPlan with group averages', () => {
  it('merges the translates of per-site strings into one operator and keeps every series value', () => {
    const graph = buildLattice({ kind: 'chain', length: 6, boundary: 'periodic' });
    const h = buildHamiltonian({ model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, graph);
    const s = spec({
      lattice: { kind: 'chain', length: 6, boundary: 'periodic' }, h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 },
      h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.2 }, betas: [1], times: { values: [0] },
      observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' }],
    });
    const layout = expandObservables(s, graph, h, h);
    const { group } = analyseSymmetry(s.lattice, h, h, 'all');
    const plan = measurementPlan(layout, (terms) => symmetriseTerms(group, terms));
    // Z:avg and Z@0..5 → one operator; ZZ at distances 1, 2, 3 → three.
    expect(plan.operators).toHaveLength(4);
    // On a symmetric state ⟨Z_i⟩ = z and ⟨Z_i Z_j⟩ = c(d): every series must read back the same value.
    const z = 0.3;
    const c = [0, -0.4, 0.25, -0.1];
    const dist = (p: { z: number }) => { const [i, j] = [0, 1, 2, 3, 4, 5].filter((k) => (p.z >> k) & 1); return Math.min(j - i, 6 - j + i); };
    const pv = Float64Array.from(layout.primitives, (p) => (p.x === 0 && (p.z & (p.z - 1)) === 0 ? z : c[dist(p)]));
    const ov = Float64Array.from(plan.operators, (o) => o.terms.reduce((acc, t) => acc + t.weight * pv[layout.primitives.findIndex((q) => q.x === t.x && q.z === t.z)], 0));
    const ns = layout.series.length;
    const [v1, e1, v2, e2] = [new Float64Array(ns), new Float64Array(ns), new Float64Array(ns), new Float64Array(ns)];
    evaluateSeries(layout, pv, new Float64Array(pv.length), v1, e1);
    evaluateSeries(plan.layout, ov, new Float64Array(ov.length), v2, e2);
    for (let k = 0; k < ns; k++) expect(Math.abs(v1[k] - v2[k])).toBeLessThanOrEqual(1e-15);
  });
});

describe('transformOperator', () => {
  const n = 5;
  // Block: the 10 states with two spins down, as a magnetisation sector.
  const partition = partitionByLabel(32, (s) => [1, 3].includes(bits(s)) ? 0 : bits(s) === 2 ? 1 : 2 + bits(s), 'test');
  function bits(s: number) { let c = 0; for (let i = 0; i < n; i++) c += (s >> i) & 1; return c; }
  const basis = sectorBasis(trivialGroup(n), groupSectors(trivialGroup(n))); // the computational basis
  const block = partition.blockOf[3]; // popcount 2
  const states = partition.blocks[block];
  const d = states.length;
  // Real orthogonal V from a random real symmetric matrix.
  const r = seededRandom(7);
  const a = new Float64Array(2 * d * d);
  for (let c = 0; c < d; c++) for (let i = c; i < d; i++) { const x = r() - 0.5; a[2 * (i + c * d)] = x; a[2 * (c + i * d)] = x; }
  const v = new Float64Array(2 * d * d);
  hermitianEigen(d, a, new Float64Array(d), v);
  const vReal = Float64Array.from({ length: d * d }, (_, k) => v[2 * k]);

  /** Dense Vᴴ·O_BB·V from the reference Pauli matrices. */
  function reference(terms: Array<[number, string]>): Array<[number, number]> {
    const { re, im } = pauliSumArrays(terms.map(([weight, word]) => ({ weight, word })), n);
    const out: Array<[number, number]> = [];
    for (let q = 0; q < d; q++) for (let p = 0; p <= q; p++) {
      let sr = 0, si = 0;
      for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) {
        const or = re[states[i]][states[j]], oi = im[states[i]][states[j]];
        const x = v[2 * (i + p * d)], y = v[2 * (j + q * d)]; // real V
        sr += x * or * y; si += x * oi * y;
      }
      out.push([sr, si]);
    }
    return out;
  }

  for (const [name, terms] of [
    ['a real string (X X)', [[1, 'X0 X2']]],
    ['an imaginary string (X Y)', [[1, 'X1 Y3']]],
    ['a weighted sum mixing real and imaginary strings', [[0.7, 'X0 X2'], [-0.4, 'Y1 X4'], [1.3, 'Z0 Z3'], [0.25, 'Y2 Y3']]],
  ] as Array<[string, Array<[number, string]>]>) {
    it(`matches the dense Vᴴ·O·V for ${name}, in the complex and the real path`, () => {
      const op = blockMatrix(basis, partition, block, terms.map(([weight, word]) => ({ ...parsePauliWord(word, n), weight })), false)!;
      const ref = reference(terms);
      const scratch = new Float64Array(2 * d * d);
      const complex = new Float64Array(d * (d + 1));
      const real = new Float64Array(d * (d + 1));
      transformOperator(op, v, scratch, complex);
      transformOperatorReal(op, vReal, scratch, real);
      ref.forEach(([sr, si], k) => {
        expect(Math.abs(complex[2 * k] - sr)).toBeLessThanOrEqual(1e-13);
        expect(Math.abs(complex[2 * k + 1] - si)).toBeLessThanOrEqual(1e-13);
        expect(Math.abs(real[2 * k] - sr)).toBeLessThanOrEqual(1e-13);
        expect(Math.abs(real[2 * k + 1] - si)).toBeLessThanOrEqual(1e-13);
      });
    });
  }

  it('has no block for a string that changes the magnetisation', () => {
    expect(blockMatrix(basis, partition, block, [{ ...parsePauliWord('X1', n), weight: 1 }], false)).toBeNull();
  });
});
