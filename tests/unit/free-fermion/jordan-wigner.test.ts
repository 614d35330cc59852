/**
 * The Jordan–Wigner map of jordan-wigner.ts checked operator by operator against dense Pauli
 * matrices (site i = bit i, DESIGN.md §2): the Majoranas c_{2j} = X_0⋯X_{j−1}Z_j,
 * c_{2j+1} = X_0⋯X_{j−1}Y_j anticommute and square to 1, and every Pauli string equals
 * i^k·c_{m_1}⋯c_{m_s} with the phase and indices pauliToMajorana returns. Entries are 0, ±1, ±i,
 * so the comparisons are exact. Source of the construction: Lieb, Schultz & Mattis, Ann. Phys.
 * 16, 407 (1961) (our own conventions).
 */
import { describe, expect, it } from 'vitest';
import {
  monomialIndices, pauliToMajorana, pfaffianSign, timesParity,
} from '../../../workers/src/engines/free-fermion/jordan-wigner.js';
import type { PauliFactor } from '../../../workers/src/physics/pauli-word.js';
import { pauliMasks } from './dense-reference.js';

/** Dense complex d × d matrix as [re, im]. */
type CMat = { re: Float64Array; im: Float64Array; d: number };

function pauliMatrix(word: string, L: number): CMat {
  const d = 2 ** L;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  const { x, z, y } = pauliMasks(word);
  for (let s = 0; s < d; s++) {
    let par = 0;
    for (let v = s & z; v; v &= v - 1) par ^= 1;
    const sign = par ? -1 : 1;
    const r = s ^ x;
    const ph = [[sign, 0], [0, sign], [-sign, 0], [0, -sign]][y % 4];
    re[r * d + s] = ph[0];
    im[r * d + s] = ph[1];
  }
  return { re, im, d };
}

function mul(a: CMat, b: CMat): CMat {
  const d = a.d;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let i = 0; i < d; i++) for (let k = 0; k < d; k++) {
    const ar = a.re[i * d + k], ai = a.im[i * d + k];
    if (ar === 0 && ai === 0) continue;
    for (let j = 0; j < d; j++) {
      re[i * d + j] += ar * b.re[k * d + j] - ai * b.im[k * d + j];
      im[i * d + j] += ar * b.im[k * d + j] + ai * b.re[k * d + j];
    }
  }
  return { re, im, d };
}

function identity(d: number): CMat {
  const re = new Float64Array(d * d);
  for (let i = 0; i < d; i++) re[i * d + i] = 1;
  return { re, im: new Float64Array(d * d), d };
}

function scalePhase(a: CMat, k: number): CMat {
  const [pr, pi] = [[1, 0], [0, 1], [-1, 0], [0, -1]][((k % 4) + 4) % 4];
  return { re: a.re.map((v, i) => pr * v - pi * a.im[i]), im: a.im.map((v, i) => pr * v + pi * a.re[i]), d: a.d };
}

function majorana(m: number, L: number): CMat {
  const j = m >> 1;
  const string = Array.from({ length: j }, (_, k) => `X${k}`).join(' ');
  return pauliMatrix(`${string} ${m % 2 === 0 ? 'Z' : 'Y'}${j}`.trim(), L);
}

function factorsOf(word: string): PauliFactor[] {
  return word.split(' ').filter(Boolean).map((t) => ({ letter: t[0] as PauliFactor['letter'], site: Number(t.slice(1)) }));
}

function same(a: CMat, b: CMat): boolean {
  return a.re.every((v, i) => v === b.re[i]) && a.im.every((v, i) => v === b.im[i]);
}

describe('the Jordan–Wigner Majoranas', () => {
  it('anticommute pairwise and square to one on 3 sites', () => {
    const L = 3;
    const c = Array.from({ length: 2 * L }, (_, m) => majorana(m, L));
    for (let m = 0; m < 2 * L; m++) {
      for (let n = 0; n < 2 * L; n++) {
        const ab = mul(c[m], c[n]);
        const ba = mul(c[n], c[m]);
        const sum = { re: ab.re.map((v, i) => v + ba.re[i]), im: ab.im.map((v, i) => v + ba.im[i]), d: ab.d };
        const want = m === n ? scalePhase(identity(8), 0) : { re: new Float64Array(64), im: new Float64Array(64), d: 8 };
        if (m === n) { want.re = want.re.map((v) => 2 * v); }
        expect(same(sum, want)).toBe(true);
      }
    }
  });
});

describe('pauliToMajorana', () => {
  const L = 4;
  const words = [
    'X0', 'X3', 'Z0', 'Y0', 'Z2', 'Y3', 'Z0 Z1', 'Z1 Z2', 'Y0 Y1', 'Z0 Y1', 'Y2 Z3', 'Z0 Z3', 'Y0 Y3', 'Z0 X1 Z2',
    'X0 X1', 'X1 X3', 'X0 Z2', 'Z1 X3', 'X0 X1 X2 X3', 'Z0 X1 X2 Z3', 'Y0 Z1 Z2 Y3', 'Z3 Z0', '',
  ];
  for (const w of words) {
    it(`writes "${w || 'identity'}" as i^k times the product of its Majoranas`, () => {
      const q = pauliToMajorana(factorsOf(w));
      let prod = identity(2 ** L);
      for (const m of monomialIndices(q)) prod = mul(prod, majorana(m, L));
      expect(same(scalePhase(prod, q.phase), pauliMatrix(w, L))).toBe(true);
      expect(q.count).toBe(monomialIndices(q).length);
    });
  }

  it('gives the textbook bilinears: X_j = i c_{2j}c_{2j+1}, Z_jZ_{j+1} = i c_{2j+1}c_{2j+2}, Y_jY_{j+1} = −i c_{2j}c_{2j+3}', () => {
    const x = pauliToMajorana(factorsOf('X2'));
    expect([x.phase, Array.from(monomialIndices(x))]).toEqual([1, [4, 5]]);
    const zz = pauliToMajorana(factorsOf('Z2 Z3'));
    expect([zz.phase, Array.from(monomialIndices(zz))]).toEqual([1, [5, 6]]);
    const yy = pauliToMajorana(factorsOf('Y2 Y3'));
    expect([yy.phase, Array.from(monomialIndices(yy))]).toEqual([3, [4, 7]]);
  });

  it('stores long strings as a few intervals: Z_0 Z_999 is c_1 ⋯ c_1998 in one interval', () => {
    const q = pauliToMajorana(factorsOf('Z0 Z999'));
    expect(q.count).toBe(1998);
    expect([q.lo, q.hi]).toEqual([[1], [1998]]);
  });

  it('multiplies by the parity P = X_0⋯X_{L−1} correctly (timesParity)', () => {
    const P = pauliMatrix('X0 X1 X2 X3', L);
    for (const w of ['Z0 Z3', 'Z3 Y0', 'X1', 'Y1 Y2', 'X0 X1 X2 X3', '']) {
      const q = timesParity(pauliToMajorana(factorsOf(w)), L);
      let prod = identity(16);
      for (const m of monomialIndices(q)) prod = mul(prod, majorana(m, L));
      expect(same(scalePhase(prod, q.phase), mul(pauliMatrix(w, L), P))).toBe(true);
    }
  });

  it('gives the Wick sign i^{k−r} for Hermitian strings and refuses odd or non-Hermitian monomials', () => {
    expect(pfaffianSign(pauliToMajorana(factorsOf('X0')))).toBe(1);
    expect(pfaffianSign(pauliToMajorana(factorsOf('Z0 Z1')))).toBe(1);
    // X_0X_1 = −c_0c_1c_2c_3 (k = 2, r = 2): ⟨X_0X_1⟩ = +Pf, = ⟨X_0⟩⟨X_1⟩ for uncorrelated sites.
    expect(pfaffianSign(pauliToMajorana(factorsOf('X0 X1')))).toBe(1);
    expect(pfaffianSign(pauliToMajorana(factorsOf('Y0 Y1')))).toBe(-1);
    expect(() => pfaffianSign(pauliToMajorana(factorsOf('Z0')))).toThrow(/odd/);
    expect(() => pfaffianSign({ phase: 0, lo: [0], hi: [1], count: 2, indexSumParity: 1 })).toThrow(/not Hermitian/);
  });

  it('rejects a repeated site', () => {
    expect(() => pauliToMajorana([{ letter: 'X', site: 1 }, { letter: 'Z', site: 1 }])).toThrow(/more than once/);
  });
});
