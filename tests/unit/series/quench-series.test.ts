/**
 * Unit tests of the quench double series ⟨O(t)⟩_β (workers/src/series/quench-series.ts)
 * against dense exact evolution: Tr(e^{−βH0} U† O U)/Z with U = e^{−iH1 t}, both exponentials
 * from mathjs `expm` (dense-reference.ts). H1 carries Y terms so the i·[H1, ·] phases matter.
 */
import { describe, expect, it } from 'vitest';
import {
  PauliTable, hamiltonianPowers, mixedMoments, quenchSeries, resumSeries, scaledCoefficients,
} from '../../../workers/src/series/index.js';
import { dense, denseQuench, mul, normTrace, type Word } from './dense-reference.js';

interface Term { sites: number[]; codes: number[]; weight: number }
const LETTER = ['', 'X', 'Z', 'Y'];
const words = (terms: Term[]): Word[] => terms.map((t) => ({ weight: t.weight, word: t.sites.map((s, q) => `${LETTER[t.codes[q]]}${s}`).join(' ') }));

const N = 5;
/** H0: Ising chain with both fields. */
const H0: Term[] = [];
for (let i = 0; i + 1 < N; i++) H0.push({ sites: [i, i + 1], codes: [2, 2], weight: -1 });
for (let i = 0; i < N; i++) H0.push({ sites: [i], codes: [1], weight: -0.6 }, { sites: [i], codes: [2], weight: -0.25 });
/** H1: XXZ-like with Y terms and a field. */
const H1: Term[] = [];
for (let i = 0; i + 1 < N; i++) {
  H1.push({ sites: [i, i + 1], codes: [1, 1], weight: 0.7 }, { sites: [i, i + 1], codes: [3, 3], weight: 0.7 }, { sites: [i, i + 1], codes: [2, 2], weight: 0.4 });
}
for (let i = 0; i < N; i++) H1.push({ sites: [i], codes: [1], weight: -0.5 });
const O: Term[] = [{ sites: [1, 2], codes: [2, 3], weight: 1 }, { sites: [2], codes: [1], weight: 0.5 }];

const d0 = dense(words(H0), N);
const d1 = dense(words(H1), N);
const dO = dense(words(O), N);

function series(order: number) {
  return quenchSeries({
    observable: PauliTable.fromTerms(1, O), h1: PauliTable.fromTerms(1, H1),
    h0Powers: hamiltonianPowers(PauliTable.fromTerms(1, H0), order), order,
  });
}

describe('quenchSeries', () => {
  it('has the closed-form leading coefficients c00 = Tr O/2^N, c01 = −Tr(O H0)/2^N, c11 = −Tr(i[H1,O] H0)/2^N (common practice)', () => {
    const s = series(4);
    const K = 4;
    const trO = normTrace(dO)[0];
    const trOH = normTrace(mul(dO, d0))[0];
    const comm = mul(d1, dO);
    const rev = mul(dO, d1);
    // i[H1, O] as a dense matrix.
    const a1 = { dim: comm.dim, re: comm.im.map((v, k) => -(v - rev.im[k])), im: comm.re.map((v, k) => v - rev.re[k]) };
    expect(s.value[0]).toBeCloseTo(trO, 14);
    expect(s.value[1]).toBeCloseTo(-trOH, 13);
    expect(s.value[(K + 1) + 0]).toBeCloseTo(normTrace(a1)[0], 13);
    expect(s.value[(K + 1) + 1]).toBeCloseTo(-normTrace(mul(a1, d0))[0], 13);
  });

  it('matches dense evolution at small (β, t), with the error falling with the order', () => {
    const points: Array<[number, number]> = [[0.05, 0.05], [0.1, 0.08], [0.15, 0.1]];
    for (const [beta, t] of points) {
      const ref = denseQuench(d0, d1, dO, beta, t).value;
      let previous = Infinity;
      for (const K of [2, 4, 6, 8]) {
        const s = series(K);
        const { d } = scaledCoefficients(s.value, null, K, t, beta);
        const est = resumSeries(d, 1, { pade: false });
        const err = Math.abs(est.value - ref);
        // The truncation estimate bounds the actual error (plus expm's ~1e-13 rounding) ...
        expect(err).toBeLessThanOrEqual(est.error + 1e-12);
        // ... and the error drops by at least a factor 10 per two orders while above rounding.
        if (previous > 1e-11) expect(err).toBeLessThan(previous / 10);
        previous = err;
      }
    }
  });

  it('is stationary (every t^k coefficient with k ≥ 1 vanishes) when H1 = H0', () => {
    const K = 6;
    const s = quenchSeries({
      observable: PauliTable.fromTerms(1, O), h1: PauliTable.fromTerms(1, H0),
      h0Powers: hamiltonianPowers(PauliTable.fromTerms(1, H0), K), order: K,
    });
    let maxStatic = 0;
    for (let m = 0; m <= K; m++) maxStatic = Math.max(maxStatic, Math.abs(s.value[m]));
    for (let k = 1; k <= K; k++) {
      for (let m = 0; m <= K - k; m++) expect(Math.abs(s.value[k * (K + 1) + m])).toBeLessThan(1e-12 * Math.max(1, maxStatic));
    }
  });

  it('gives ⟨O⟩_β at t = 0 equal to the thermal expectation series', () => {
    const K = 6;
    const s = series(K);
    const p = hamiltonianPowers(PauliTable.fromTerms(1, H0), K);
    const mm = mixedMoments(PauliTable.fromTerms(1, O), p);
    // c_{0,1} = −(Tr(O H0) − Tr O · Tr H0)/2^N with Tr H0 = 0 here.
    expect(s.value[1]).toBeCloseTo(-mm.re[1], 13);
  });

  it('refuses an order above the powers and mismatched widths', () => {
    const p = hamiltonianPowers(PauliTable.fromTerms(1, H0), 2);
    expect(() => quenchSeries({ observable: PauliTable.fromTerms(1, O), h1: PauliTable.fromTerms(1, H1), h0Powers: p, order: 3 })).toThrow(RangeError);
    expect(() => quenchSeries({ observable: PauliTable.fromTerms(2, O), h1: PauliTable.fromTerms(1, H1), h0Powers: p, order: 2 })).toThrow(RangeError);
  });
});
