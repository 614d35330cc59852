/**
 * majoranaHamiltonian: the quadratic Majorana form H = (i/4)Σ A_mn c_m c_n + c₀ of chains
 * quadratic under Jordan–Wigner, checked against dense Pauli matrices (exact small-integer
 * arithmetic up to the weights), the ring's parity-sector form Π_p H Π_p = Π_p H_p Π_p, and the
 * refusals of non-quadratic terms. Source of the method: Lieb, Schultz & Mattis, Ann. Phys. 16,
 * 407 (1961) §2 (the "c-cyclic" boundary term).
 */
import { describe, expect, it } from 'vitest';
import {
  isNotQuadratic, majoranaHamiltonian, sectorForm, type MajoranaHamiltonian,
} from '../../../workers/src/engines/free-fermion/majorana-hamiltonian.js';
import { siteTerms } from '../../../workers/src/physics/site-terms.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import type { Hamiltonian, Lattice } from '../../../shared-types/src/index.js';
import { embeddedHamiltonian, type DenseTerm } from './dense-reference.js';

function form(h: Hamiltonian, lattice: Lattice) {
  const graph = buildLattice(lattice);
  return majoranaHamiltonian(siteTerms(h, graph), graph.sites);
}

/** Dense complex matrix (re, im as number[][]) of (i/4)Σ A c c + c₀ built from Majorana strings. */
function denseFromMajorana(entries: ReturnType<typeof sectorForm>['entries'], constant: number, L: number): { re: number[][]; im: number[][] } {
  // (i/4)(A_mn c_m c_n + A_nm c_n c_m) = (i/2) A_mn c_m c_n for m < n; c_m c_n as a Pauli word:
  // c_m = X_0⋯X_{j−1}(Z|Y)_j. Build it numerically from the words.
  const d = 2 ** L;
  const re = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  const im = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  const word = (m: number) => {
    const j = m >> 1;
    return `${Array.from({ length: j }, (_, k) => `X${k}`).join(' ')} ${m % 2 ? 'Y' : 'Z'}${j}`.trim();
  };
  const mat = (w: string) => {
    const e = embeddedHamiltonian([{ weight: 1, word: w }], L, true);
    return { r: e.slice(0, d).map((row) => row.slice(0, d)), i: e.slice(d).map((row) => row.slice(0, d)) };
  };
  for (const { m, n, value } of entries) {
    const a = mat(word(m));
    const b = mat(word(n));
    for (let r = 0; r < d; r++) for (let c = 0; c < d; c++) {
      let pr = 0, pi = 0;
      for (let k = 0; k < d; k++) {
        pr += a.r[r][k] * b.r[k][c] - a.i[r][k] * b.i[k][c];
        pi += a.r[r][k] * b.i[k][c] + a.i[r][k] * b.r[k][c];
      }
      // (i/2)·value·(pr + i pi)
      re[r][c] += -0.5 * value * pi;
      im[r][c] += 0.5 * value * pr;
    }
  }
  for (let r = 0; r < d; r++) re[r][r] += constant;
  return { re, im };
}

function denseTerms(terms: DenseTerm[], L: number): { re: number[][]; im: number[][] } {
  const d = 2 ** L;
  const e = embeddedHamiltonian(terms, L, true);
  return { re: e.slice(0, d).map((row) => row.slice(0, d)), im: e.slice(d).map((row) => row.slice(0, d)) };
}

function maxDiff(a: { re: number[][]; im: number[][] }, b: { re: number[][]; im: number[][] }, rows?: (r: number) => boolean): number {
  let m = 0;
  a.re.forEach((row, r) => row.forEach((v, c) => {
    if (rows && (!rows(r) || !rows(c))) return;
    m = Math.max(m, Math.abs(v - b.re[r][c]), Math.abs(a.im[r][c] - b.im[r][c]));
  }));
  return m;
}

describe('majoranaHamiltonian', () => {
  it('writes the open transverse-field chain as A_{2j,2j+1} = −2h, A_{2j+1,2j+2} = −2J', () => {
    const f = form({ model: 'ising', J: 1.3, hx: 0.4, hz: 0 }, { kind: 'chain', length: 3, boundary: 'open' }) as MajoranaHamiltonian;
    expect(isNotQuadratic(f)).toBe(false);
    expect(f.sectorDependent).toBe(false);
    expect(f.base.map((e) => [e.m, e.n, e.value])).toEqual([
      [0, 1, -0.8], [1, 2, -2.6], [2, 3, -0.8], [3, 4, -2.6], [4, 5, -0.8],
    ]);
  });

  it('reproduces an XY-type chain with all four couplings, fields and a constant as a dense matrix', () => {
    const L = 4;
    const terms: DenseTerm[] = [{ weight: 0.25, word: '' }];
    for (let i = 0; i + 1 < L; i++) {
      terms.push({ weight: -0.9, word: `Z${i} Z${i + 1}` }, { weight: 0.4, word: `Y${i} Y${i + 1}` },
        { weight: 0.3, word: `Z${i} Y${i + 1}` }, { weight: -0.2, word: `Y${i} Z${i + 1}` });
    }
    terms.push({ weight: 0.7, word: 'Z0 X1 Y2' }); // a longer-range bilinear (string of X between)
    for (let i = 0; i < L; i++) terms.push({ weight: -0.5 - 0.1 * i, word: `X${i}` });
    const f = form({ model: 'pauli-sum', terms }, { kind: 'chain', length: L, boundary: 'open' }) as MajoranaHamiltonian;
    const s = sectorForm(f, 1);
    // Only weight arithmetic rounds: 1e−15.
    expect(maxDiff(denseFromMajorana(s.entries, s.constant, L), denseTerms(terms, L))).toBeLessThan(1e-15);
  });

  it('splits a ring into parity sectors: on P = p the Hamiltonian equals its sector form', () => {
    const L = 4;
    const terms: DenseTerm[] = [];
    for (let i = 0; i < L; i++) terms.push({ weight: -1, word: `Z${i} Z${(i + 1) % L}` }, { weight: -0.6, word: `X${i}` });
    terms.push({ weight: 0.3, word: 'Y3 Z0' }, { weight: 0.2, word: 'X0 X1 X2 X3' });
    const f = form({ model: 'pauli-sum', terms }, { kind: 'chain', length: L, boundary: 'periodic' }) as MajoranaHamiltonian;
    expect(f.sectorDependent).toBe(true);
    expect(f.parityConstant).toBe(0.2);
    const dense = denseTerms(terms, L);
    for (const p of [1, -1] as const) {
      const s = sectorForm(f, p);
      const hp = denseFromMajorana(s.entries, s.constant, L);
      // Compare Π_p H Π_p with Π_p H_p Π_p, Π_p = (1 + pP)/2, P = X_0X_1X_2X_3 (flips all bits).
      const d = 2 ** L;
      const project = (m: { re: number[][]; im: number[][] }) => {
        const out = { re: m.re.map((r) => r.map(() => 0)), im: m.im.map((r) => r.map(() => 0)) };
        const flip = (x: number) => x ^ (d - 1);
        for (let r = 0; r < d; r++) for (let c = 0; c < d; c++) {
          // (Π M Π)_rc = ¼ [M_rc + p M_{r̄c} + p M_{r c̄} + M_{r̄ c̄}]
          out.re[r][c] = 0.25 * (m.re[r][c] + p * m.re[flip(r)][c] + p * m.re[r][flip(c)] + m.re[flip(r)][flip(c)]);
          out.im[r][c] = 0.25 * (m.im[r][c] + p * m.im[flip(r)][c] + p * m.im[r][flip(c)] + m.im[flip(r)][flip(c)]);
        }
        return out;
      };
      expect(maxDiff(project(hp), project(dense))).toBeLessThan(1e-15);
    }
  });

  it('refuses a longitudinal field: Z_i is odd in the Majoranas', () => {
    const f = form({ model: 'ising', J: 1, hx: 0.5, hz: 0.1 }, { kind: 'chain', length: 5, boundary: 'open' });
    expect(isNotQuadratic(f)).toBe(true);
    if (isNotQuadratic(f)) {
      expect(f.majoranas % 2).toBe(1);
      expect(f.message).toMatch(/odd in the Jordan–Wigner Majoranas/);
    }
  });

  it('refuses interactions: XX couplings (xxz), ladder rungs and multi-site X strings', () => {
    const xxz = form({ model: 'xxz', J: 1, delta: 0.5, hz: 0 }, { kind: 'chain', length: 4, boundary: 'open' });
    expect(isNotQuadratic(xxz) && xxz.majoranas).toBe(4);
    const ladder = form({ model: 'ising', J: 1, hx: 1, hz: 0 }, { kind: 'ladder', length: 3, boundary: ['open', 'open'] });
    expect(isNotQuadratic(ladder)).toBe(true);
    if (isNotQuadratic(ladder)) expect(ladder.message).toMatch(/product of \d+ Majoranas/);
    const xs = form({ model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 X2' }] }, { kind: 'chain', length: 4, boundary: 'open' });
    expect(isNotQuadratic(xs)).toBe(true);
  });

  it('accepts an XXZ chain with J = 0 (every term vanishes) and drops terms that cancel', () => {
    const f = form({ model: 'xxz', J: 0, delta: 2, hz: 0 }, { kind: 'chain', length: 3, boundary: 'open' });
    expect(isNotQuadratic(f)).toBe(false);
    const g = form({ model: 'pauli-sum', terms: [{ weight: 0.1, word: 'Z1' }, { weight: -0.1, word: 'Z1' }, { weight: 1, word: 'X0' }] },
      { kind: 'chain', length: 2, boundary: 'open' });
    expect(isNotQuadratic(g)).toBe(false);
  });
});
