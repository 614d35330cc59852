import { describe, expect, it } from 'vitest';
import { SweepSpec, type SweepSpecInput } from '../../../shared-types/src/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { formatPauliWord } from '../../../workers/src/physics/pauli-word.js';
import { popcount } from '../../../workers/src/physics/pauli-algebra.js';
import type { PauliString } from '../../../workers/src/physics/types.js';
import {
  evaluateSeries, expandObservables, type ObservableLayout,
} from '../../../workers/src/observables/expand-observables.js';
import { formatLabelNumber, seriesLabels } from '../../../workers/src/observables/plan-series.js';

// Weighted sums of O(N²) terms of size ≤ 1: rounding stays far below 1e-12.
const SUM_TOL = 1e-12;

function setup(patch: Partial<SweepSpecInput>) {
  const spec = SweepSpec.parse({
    lattice: { kind: 'chain', length: 4 },
    h0: { model: 'ising', J: 1, hx: 0.5, hz: 0.25 },
    h1: { model: 'xxz', J: 1, delta: 0.5 },
    betas: [1],
    times: { stop: 1, count: 2 },
    observables: [{ kind: 'site', pauli: 'Z' }],
    ...patch,
  });
  const graph = buildLattice(spec.lattice);
  const h0 = buildHamiltonian(spec.h0, graph);
  const h1 = buildHamiltonian(spec.h1, graph);
  return { spec, graph, h0, h1, layout: expandObservables(spec, graph, h0, h1) };
}

/** ⟨P⟩ in the classical basis state |s⟩ (Z|0⟩ = +|0⟩): (−1)^{|s&z|} if P is diagonal, else 0. */
const classical = (p: PauliString, s: number) => (p.x !== 0 ? 0 : popcount(s & p.z) % 2 === 0 ? 1 : -1);

function evaluate(layout: ObservableLayout, prim: (p: PauliString) => number) {
  const v = Float64Array.from(layout.primitives, prim);
  const out = new Float64Array(layout.series.length);
  evaluateSeries(layout, v, new Float64Array(v.length), out, new Float64Array(v.length + layout.series.length));
  return new Map(layout.series.map((s, k) => [s.label, out[k]]));
}

function linearWords(layout: ObservableLayout, label: string) {
  const s = layout.series.find((t) => t.label === label)!;
  return new Map(s.linear.map(([p, w]) => [formatPauliWord(layout.primitives[p]), w]));
}

describe('formatLabelNumber', () => {
  it('rounds to 4 decimals without trailing zeros and writes −0 as 0', () => {
    expect(formatLabelNumber(Math.PI)).toBe('3.1416');
    expect(formatLabelNumber(Math.SQRT2)).toBe('1.4142');
    expect(formatLabelNumber(1)).toBe('1');
    expect(formatLabelNumber(-0)).toBe('0');
    expect(formatLabelNumber(-0.00001)).toBe('0');
    expect(formatLabelNumber(-0.5)).toBe('-0.5');
  });
});

describe('expandObservables: labels', () => {
  it('labels every kind of observable as documented, in spec order', () => {
    const { layout, spec, graph } = setup({
      lattice: { kind: 'square', size: [2, 2] },
      observables: [
        { kind: 'site', pauli: 'Z', perSite: true },
        { kind: 'pair', paulis: 'ZZ', connected: true, perPair: true },
        { kind: 'pair', paulis: 'XY', pairs: 'next-nearest' },
        { kind: 'pair', paulis: 'XX', pairs: 'by-distance' },
        { kind: 'pair', paulis: 'YZ', pairs: [[3, 1]] },
        { kind: 'energy', of: 'h1' },
        { kind: 'magnetisation', pauli: 'X', pattern: 'staggered' },
        { kind: 'structure-factor', paulis: 'ZZ', momenta: [[Math.PI, -0], [0.5, Math.PI / 2]], connected: true },
      ],
    });
    const labels = layout.series.map((s) => s.label);
    expect(labels).toEqual([
      'Z:avg', 'Z@0', 'Z@1', 'Z@2', 'Z@3',
      'ZZ:nearest~conn', 'ZZ@0-1~conn', 'ZZ@0-2~conn', 'ZZ@1-3~conn', 'ZZ@2-3~conn',
      'XY:next-nearest',
      'XX:d=1', 'XX:d=1.4142',
      'YZ:pairs',
      'E:h1',
      'mX:staggered',
      'S_ZZ(3.1416,0)~conn', 'S_ZZ(0.5,1.5708)~conn',
    ]);
    expect(layout.series.map((s) => s.observable)).toEqual([0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 3, 3, 4, 5, 6, 7, 7]);
    expect(seriesLabels(spec, graph)).toEqual(layout.series.map(({ label, observable }) => ({ label, observable })));
  });

  it('lists each primitive string once', () => {
    const { layout } = setup({ observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'magnetisation', pauli: 'Z' }] });
    expect(layout.primitives.map(formatPauliWord)).toEqual(['Z0', 'Z1', 'Z2', 'Z3']);
  });
});

describe('expandObservables: weights', () => {
  it('averages a site observable over the listed sites', () => {
    const { layout } = setup({ observables: [{ kind: 'site', pauli: 'Y', sites: [3, 1] }] });
    expect(linearWords(layout, 'Y:avg')).toEqual(new Map([['Y3', 0.5], ['Y1', 0.5]]));
  });

  it('puts the first letter of a mixed pair on the first site of each pair', () => {
    const { layout } = setup({ observables: [{ kind: 'pair', paulis: 'XY', pairs: [[3, 1], [0, 2]] }] });
    expect(linearWords(layout, 'XY:pairs')).toEqual(new Map([['Y1 X3', 0.5], ['X0 Y2', 0.5]]));
  });

  it('gives connected correlators a quadratic term −w·⟨A_i⟩⟨B_j⟩ per pair', () => {
    const { layout } = setup({ observables: [{ kind: 'pair', paulis: 'ZX', connected: true }] });
    const s = layout.series[0];
    expect(s.linear.length).toBe(3);
    expect(s.quadratic.map(([a, b, w]) => [formatPauliWord(layout.primitives[a]), formatPauliWord(layout.primitives[b]), w]))
      .toEqual([['Z0', 'X1', -1 / 3], ['Z1', 'X2', -1 / 3], ['Z2', 'X3', -1 / 3]]);
  });

  it('takes energy weights from the Hamiltonian and identity terms into the constant', () => {
    const { layout, h0 } = setup({
      h0: { model: 'pauli-sum', terms: [{ weight: 2.5, word: '' }, { weight: -1, word: 'X0 X1' }, { weight: 0.3, word: 'Y3' }] },
      observables: [{ kind: 'energy', of: 'h0' }],
    });
    expect(h0.terms.length).toBe(3);
    expect(layout.series[0].constant).toBe(2.5);
    expect(linearWords(layout, 'E:h0')).toEqual(new Map([['X0 X1', -1], ['Y3', 0.3]]));
  });

  it('refuses a staggered magnetisation on a lattice without sublattice signs', () => {
    const spec = SweepSpec.parse({
      lattice: { kind: 'chain', length: 3, boundary: 'periodic' }, h0: { model: 'ising' }, h1: { model: 'ising' },
      betas: [1], times: { stop: 1, count: 2 }, observables: [{ kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' }],
    });
    const g = buildLattice(spec.lattice);
    const h = buildHamiltonian(spec.h0, g);
    expect(() => expandObservables(spec, g, h, h)).toThrow(/bipartite/);
  });

  it('refuses an explicit pair outside the lattice', () => {
    const spec = { ...setup({}).spec, observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[0, 4]], perPair: false, connected: false }] } as SweepSpec;
    const g = buildLattice(spec.lattice);
    const h = buildHamiltonian(spec.h0, g);
    expect(() => expandObservables(spec, g, h, h)).toThrow(/site 4.*0\.\.3/);
  });
});

describe('expandObservables: values in classical basis states', () => {
  // Néel state on the open chain of 4: s = 0b1010 → spins +1, −1, +1, −1.
  const neel = 0b1010;

  it('gives ⟨E:h0⟩ = −J Σ s_i s_j − hz Σ s_i and magnetisations of the spin pattern', () => {
    const { layout } = setup({
      observables: [
        { kind: 'energy', of: 'h0' }, { kind: 'energy', of: 'h1' },
        { kind: 'magnetisation', pauli: 'Z' }, { kind: 'magnetisation', pauli: 'Z', pattern: 'staggered' },
        { kind: 'pair', paulis: 'ZZ' }, { kind: 'pair', paulis: 'ZZ', pairs: 'next-nearest' },
      ],
    });
    const v = evaluate(layout, (p) => classical(p, neel));
    expect(v.get('E:h0')).toBeCloseTo(3, 14); // −1·(3 bonds × −1) − 0.25·0; the X field averages to 0
    expect(v.get('E:h1')).toBeCloseTo(-1.5, 14); // XXZ: only Δ Z_iZ_j survives: 0.5 × 3 × (−1)
    expect(v.get('mZ:uniform')).toBe(0);
    expect(v.get('mZ:staggered')).toBe(1);
    expect(v.get('ZZ:nearest')).toBe(-1);
    expect(v.get('ZZ:next-nearest')).toBe(1);
  });

  it('gives S(q) = (1/N)|Σ_i s_i e^{iq·r_i}|² on a square patch for any q, and S_conn = 0', () => {
    const momenta: [number, number][] = [[Math.PI, Math.PI], [0.3, -1.1], [0, 0], [Math.PI / 2, 0]];
    const { layout, graph } = setup({
      lattice: { kind: 'square', size: [3, 2], boundary: ['periodic', 'open'] },
      observables: [
        { kind: 'structure-factor', paulis: 'ZZ', momenta },
        { kind: 'structure-factor', paulis: 'ZZ', momenta, connected: true },
      ],
    });
    for (const state of [0b000000, 0b011010, 0b101101]) {
      const v = evaluate(layout, (p) => classical(p, state));
      for (const q of momenta) {
        let re = 0; let im = 0;
        for (let i = 0; i < graph.sites; i++) {
          const s = (state >> i) & 1 ? -1 : 1;
          const ph = q[0] * graph.positions[i][0] + q[1] * graph.positions[i][1];
          re += s * Math.cos(ph); im += s * Math.sin(ph);
        }
        const label = `S_ZZ(${formatLabelNumber(q[0])},${formatLabelNumber(q[1])})`;
        expect(Math.abs(v.get(label)! - (re * re + im * im) / graph.sites)).toBeLessThan(SUM_TOL);
        expect(Math.abs(v.get(`${label}~conn`)!)).toBeLessThan(SUM_TOL);
      }
    }
  });

  it('gives connected correlators zero and S_conn = (1/N)Σ(1 − m_i²) in a product state with ⟨Z_i⟩ = m_i', () => {
    const m = [0.3, -0.7, 0.1, 0.9];
    const { layout } = setup({
      observables: [
        { kind: 'pair', paulis: 'ZZ', pairs: 'by-distance', connected: true, perPair: true },
        { kind: 'structure-factor', paulis: 'ZZ', momenta: [[1.2, 0]], connected: true },
      ],
    });
    // product state: ⟨Π_{i∈S} Z_i⟩ = Π m_i
    const v = evaluate(layout, (p) => {
      let r = 1;
      for (let i = 0; i < 4; i++) if ((p.z >> i) & 1) r *= m[i];
      return p.x === 0 ? r : 0;
    });
    for (const [label, value] of v) {
      if (label.startsWith('ZZ')) expect(Math.abs(value)).toBeLessThan(SUM_TOL);
    }
    expect(v.get('S_ZZ(1.2,0)~conn')).toBeCloseTo(m.reduce((a, x) => a + 1 - x * x, 0) / 4, 14);
  });
});

describe('evaluateSeries', () => {
  const layout: ObservableLayout = {
    primitives: [{ x: 0, z: 1 }, { x: 0, z: 2 }],
    series: [
      { label: 'a', observable: 0, constant: 0.5, linear: [[0, 2]], quadratic: [[0, 1, -3]] },
      { label: 'b', observable: 0, constant: 0, linear: [], quadratic: [] },
    ],
  };

  it('propagates errors as |w|·δ and |w|(|B|δA + |A|δB + δAδB)', () => {
    const values = new Float64Array(2);
    const errors = new Float64Array(2);
    evaluateSeries(layout, Float64Array.of(0.2, -0.4), Float64Array.of(0.01, 0.02), values, errors);
    expect(values[0]).toBeCloseTo(0.5 + 0.4 + 0.24, 15);
    expect(errors[0]).toBeCloseTo(2 * 0.01 + 3 * (0.4 * 0.01 + 0.2 * 0.02 + 0.01 * 0.02), 15);
    expect(values[1]).toBe(0);
    expect(errors[1]).toBe(0);
  });

  it('bounds the change of every series when the inputs move within their errors', () => {
    const v0 = Float64Array.of(0.2, -0.4);
    const e0 = Float64Array.of(0.01, 0.02);
    const base = new Float64Array(2);
    const bound = new Float64Array(2);
    evaluateSeries(layout, v0, e0, base, bound);
    const out = new Float64Array(2);
    for (const sa of [-1, 1]) for (const sb of [-1, 1]) {
      evaluateSeries(layout, Float64Array.of(v0[0] + sa * e0[0], v0[1] + sb * e0[1]), new Float64Array(2), out, new Float64Array(2));
      expect(Math.abs(out[0] - base[0])).toBeLessThanOrEqual(bound[0] + 1e-15);
    }
  });

  it('rejects buffers shorter than the layout', () => {
    expect(() => evaluateSeries(layout, new Float64Array(1), new Float64Array(2), new Float64Array(2), new Float64Array(2))).toThrow(/primitiveValues/);
    expect(() => evaluateSeries(layout, new Float64Array(2), new Float64Array(2), new Float64Array(1), new Float64Array(2))).toThrow(/outValues/);
  });
});
