/**
 * Unit tests of thermal moments and the series in β built from them (workers/src/series):
 * moments against dense matrix powers (dense-reference.ts), closed-form low moments of the
 * presets, and the truncated-series algebra on functions with known expansions.
 */
import { describe, expect, it } from 'vitest';
import {
  PauliTable, expectationSeries, hamiltonianPowers, lnZSeries, mixedMoments, powerMoments,
  seriesDivide, seriesLog, seriesMultiply, sumSeries, wordsForSites,
} from '../../../workers/src/series/index.js';
import { dense, denseQuench, mul, normTrace, type Word } from './dense-reference.js';

interface Term { sites: number[]; codes: number[]; weight: number }
const LETTER = ['', 'X', 'Z', 'Y'];
const words = (terms: Term[]): Word[] => terms.map((t) => ({ weight: t.weight, word: t.sites.map((s, q) => `${LETTER[t.codes[q]]}${s}`).join(' ') }));

function tfimChain(n: number, J: number, hx: number, hz: number): Term[] {
  const t: Term[] = [];
  for (let i = 0; i + 1 < n; i++) t.push({ sites: [i, i + 1], codes: [2, 2], weight: -J });
  for (let i = 0; i < n; i++) t.push({ sites: [i], codes: [1], weight: -hx }, { sites: [i], codes: [2], weight: -hz });
  return t;
}

function xxzRing(n: number, J: number, delta: number, hz: number): Term[] {
  const t: Term[] = [];
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    const s = [Math.min(i, j), Math.max(i, j)];
    t.push({ sites: s, codes: [1, 1], weight: J }, { sites: s, codes: [3, 3], weight: J }, { sites: s, codes: [2, 2], weight: J * delta });
    t.push({ sites: [i], codes: [2], weight: -hz });
  }
  return t;
}

describe('powerMoments', () => {
  it('equals Tr(H^n)/2^N of the dense matrix for a 6-site Ising chain, n ≤ 8', () => {
    const terms = tfimChain(6, 1, 0.7, 0.3);
    const m = powerMoments(hamiltonianPowers(PauliTable.fromTerms(1, terms), 8));
    const h = dense(words(terms), 6);
    let p = h;
    for (let n = 1; n <= 8; n++) {
      // Tolerance: relative 1e-12 of moments that reach ~1e5.
      expect(m[n]).toBeCloseTo(normTrace(p)[0], 12 - Math.ceil(Math.log10(1 + Math.abs(m[n]))));
      p = mul(p, h);
    }
    expect(m[0]).toBe(1);
  });

  it('has Tr(H²)/2^N = N_bonds J² + N(hx² + hz²) and Tr(H³)/2^N = −6 J hz² N_bonds for the Ising preset (common practice)', () => {
    const n = 9, J = 1.3, hx = 0.7, hz = 0.4;
    const m = powerMoments(hamiltonianPowers(PauliTable.fromTerms(1, tfimChain(n, J, hx, hz)), 3));
    expect(m[1]).toBe(0);
    expect(m[2]).toBeCloseTo((n - 1) * J * J + n * (hx * hx + hz * hz), 12);
    // Only (Z_iZ_j)(Z_i)(Z_j) and its 3! orderings multiply to the identity.
    expect(m[3]).toBeCloseTo(-6 * J * hz * hz * (n - 1), 12);
  });

  it('has Tr(H²)/2^N = N_bonds J²(2 + Δ²) + N hz² for the XXZ preset (common practice)', () => {
    const n = 5, J = 0.8, delta = 1.7, hz = 0.25;
    const m = powerMoments(hamiltonianPowers(PauliTable.fromTerms(1, xxzRing(n, J, delta, hz)), 2));
    expect(m[2]).toBeCloseTo(n * J * J * (2 + delta * delta) + n * hz * hz, 12);
  });

  it('refuses a negative or fractional order', () => {
    const h = PauliTable.fromTerms(1, tfimChain(2, 1, 1, 0));
    expect(() => hamiltonianPowers(h, -1)).toThrow(RangeError);
    expect(() => hamiltonianPowers(h, 2.5)).toThrow(RangeError);
  });

  it('handles order 0 and the empty Hamiltonian', () => {
    expect(Array.from(powerMoments(hamiltonianPowers(new PauliTable(1), 4)))).toEqual([1, 0, 0, 0, 0]);
    expect(Array.from(powerMoments(hamiltonianPowers(PauliTable.fromTerms(1, tfimChain(3, 1, 1, 1)), 0)))).toEqual([1]);
  });
});

describe('mixedMoments', () => {
  it('equals Tr(O H^n)/2^N of dense matrices for an XXZ ring with Y terms', () => {
    const terms = xxzRing(5, 1, 0.6, 0.4);
    const o: Term[] = [{ sites: [0, 2], codes: [3, 1], weight: 1 }, { sites: [1], codes: [2], weight: 0.5 }];
    const p = hamiltonianPowers(PauliTable.fromTerms(1, terms), 7);
    const mm = mixedMoments(PauliTable.fromTerms(1, o), p);
    const h = dense(words(terms), 5);
    let q = dense(words(o), 5);
    for (let n = 0; n <= 7; n++) {
      const [re, im] = normTrace(q);
      expect(mm.re[n]).toBeCloseTo(re, 9);
      expect(mm.im[n]).toBeCloseTo(im, 9);
      q = mul(q, h);
    }
  });

  it('refuses an order above the powers it was given', () => {
    const p = hamiltonianPowers(PauliTable.fromTerms(1, tfimChain(3, 1, 1, 0)), 4);
    expect(() => mixedMoments(PauliTable.identity(1), p, 5)).toThrow(RangeError);
  });
});

describe('truncated series algebra', () => {
  it('gives ln(1 + x) = Σ (−1)^{k+1} x^k/k (common practice)', () => {
    const a = new Float64Array(9);
    a[0] = 1; a[1] = 1;
    const l = seriesLog(a).value;
    for (let k = 1; k <= 8; k++) expect(l[k]).toBeCloseTo((-1) ** (k + 1) / k, 15);
  });

  it('gives 1/(1 − x) = Σ x^k and multiplies back to the numerator', () => {
    const one = new Float64Array([1, 0, 0, 0, 0, 0]);
    const q = seriesDivide(one, [1, -1, 0, 0, 0, 0]).value;
    expect(Array.from(q)).toEqual([1, 1, 1, 1, 1, 1]);
    expect(Array.from(seriesMultiply(q, [1, -1, 0, 0, 0, 0]))).toEqual([1, 0, 0, 0, 0, 0]);
    expect(sumSeries([1, 2, 3], 2)).toBe(17);
  });

  it('refuses a logarithm of a series not starting at 1 and a division by a series starting at 0', () => {
    expect(() => seriesLog([2, 1])).toThrow(RangeError);
    expect(() => seriesDivide([1, 1], [0, 1])).toThrow(RangeError);
    expect(seriesLog([]).value.length).toBe(0);
  });
});

describe('lnZSeries and expectationSeries', () => {
  it('sum to ln Z and ⟨O⟩_β of a dense 5-site XXZ ring at small β within ten times the last term kept', () => {
    const terms = xxzRing(5, 1, 0.6, 0.4);
    const order = 12;
    const p = hamiltonianPowers(PauliTable.fromTerms(1, terms), order);
    const m = powerMoments(p);
    const lz = lnZSeries(m).value;
    const o: Term[] = [{ sites: [0, 1], codes: [2, 2], weight: 1 }];
    const ev = expectationSeries(mixedMoments(PauliTable.fromTerms(1, o), p).re, m).value;
    const h = dense(words(terms), 5);
    const od = dense(words(o), 5);
    for (const beta of [0.02, 0.05, 0.1]) {
      const ref = denseQuench(h, h, od, beta, 0);
      // Allowed: 10 × the last term kept (the truncation is of that size at these β, far inside
      // the radius) plus 1e-11 for expm's own rounding.
      const allowZ = 10 * Math.abs(lz[order] * beta ** order) + 1e-11;
      const allowO = 10 * Math.abs(ev[order] * beta ** order) + 1e-11;
      expect(Math.abs(5 * Math.LN2 + sumSeries(lz, beta) - ref.lnZ)).toBeLessThan(allowZ);
      expect(Math.abs(sumSeries(ev, beta) - ref.value)).toBeLessThan(allowO);
    }
  });

  it('keeps a rounding magnitude at least as large as the coefficients', () => {
    const p = hamiltonianPowers(PauliTable.fromTerms(wordsForSites(6), tfimChain(6, 1, 1, 0.5)), 8);
    const s = lnZSeries(powerMoments(p));
    for (let k = 0; k <= 8; k++) expect(s.magnitude[k]).toBeGreaterThanOrEqual(Math.abs(s.value[k]) * (1 - 1e-12));
  });
});
