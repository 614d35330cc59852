/**
 * Unit tests of the multiword Pauli algebra (workers/src/series): products with phases,
 * commutators and normalised traces against dense matrices built independently from the 2×2
 * Pauli matrices (dense-reference.ts), including strings that straddle a 32-site word boundary
 * (sites are relabelled onto a few dense qubits: only the sites a string touches matter).
 */
import { describe, expect, it } from 'vitest';
import {
  PauliTable, letterCode, maskToWord, multiplyTables, traceProduct, wordsForSites, writeMask,
} from '../../../workers/src/series/index.js';
import { dense, mul, normTrace } from './dense-reference.js';

/** Deterministic generator (mulberry32; common practice). */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Sites used by the random strings: around word boundaries of a 70-site system. */
const SITES = [0, 31, 32, 33, 63, 64, 69];
const DENSE_OF = new Map(SITES.map((s, k) => [s, k]));

function randomTable(rand: () => number, terms: number): { table: PauliTable } {
  const table = new PauliTable(wordsForSites(70));
  const buf = new Uint32Array(table.stride);
  for (let k = 0; k < terms; k++) {
    const sites: number[] = [];
    const codes: number[] = [];
    for (const s of SITES) {
      const c = Math.floor(rand() * 4);
      if (c > 0) { sites.push(s); codes.push(c); }
    }
    const re = rand() - 0.5;
    const im = rand() - 0.5;
    writeMask(buf, 0, table.words, sites, codes);
    table.add(buf, 0, re, im);
  }
  return { table };
}

/** Dense matrix of a table, with its strings mapped onto the 7 dense qubits. */
function denseOf(t: PauliTable) {
  const n = SITES.length;
  const d = 2 ** n;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (const [word, cr, ci] of t.entries()) {
    const mapped = word.trim() === '' ? '' : word.split(' ').map((f) => `${f[0]}${DENSE_OF.get(Number(f.slice(1)))}`).join(' ');
    const p = dense([{ weight: 1, word: mapped }], n);
    for (let k = 0; k < d * d; k++) {
      re[k] += cr * p.re[k] - ci * p.im[k];
      im[k] += cr * p.im[k] + ci * p.re[k];
    }
  }
  return { dim: d, re, im };
}

describe('PauliTable', () => {
  it('uses one 32-bit word per mask up to 32 sites and two from 33', () => {
    expect(wordsForSites(0)).toBe(1);
    expect(wordsForSites(32)).toBe(1);
    expect(wordsForSites(33)).toBe(2);
    expect(() => wordsForSites(-1)).toThrow(RangeError);
  });

  it('merges repeated strings and keeps insertion order', () => {
    const t = PauliTable.fromTerms(2, [
      { sites: [40, 3], codes: [letterCode('Z'), letterCode('X')], weight: 0.5 },
      { sites: [3], codes: [2], weight: 1 },
      { sites: [3, 40], codes: [1, 2], weight: 0.25 },
    ]);
    expect(t.size).toBe(2);
    expect(t.entries()).toEqual([['X3 Z40', 0.75, 0], ['Z3', 1, 0]]);
  });

  it('rejects a site given twice in one string', () => {
    const buf = new Uint32Array(2);
    expect(() => writeMask(buf, 0, 1, [4, 4], [1, 2])).toThrow(RangeError);
    expect(() => writeMask(buf, 0, 1, [32], [1])).toThrow(RangeError);
  });

  it('grows past its initial capacity without losing terms', () => {
    const t = new PauliTable(1);
    const buf = new Uint32Array(2);
    for (let s = 0; s < 1000; s++) { buf[0] = s; buf[1] = s >>> 3; t.add(buf, 0, s, 0); }
    for (let s = 0; s < 1000; s++) { buf[0] = s; buf[1] = s >>> 3; t.add(buf, 0, 1, -1); }
    expect(t.size).toBe(1000);
    buf[0] = 777; buf[1] = 777 >>> 3;
    expect(t.coefficient(buf)).toEqual([778, -1]);
  });

  it('reads the normalised trace as the identity coefficient and is 0 without one', () => {
    expect(PauliTable.identity(3, 2.5, -1).normalisedTrace()).toEqual([2.5, -1]);
    expect(PauliTable.fromTerms(1, [{ sites: [0], codes: [1], weight: 1 }]).normalisedTrace()).toEqual([0, 0]);
  });

  it('formats words with Y for x and z both set, sites ascending, across words', () => {
    const buf = new Uint32Array(4);
    writeMask(buf, 0, 2, [35, 1, 0], [3, 2, 1]);
    expect(maskToWord(buf, 0, 2)).toBe('X0 Z1 Y35');
  });
});

describe('multiplyTables', () => {
  it('reproduces the single-site products XZ = −iY, ZX = iY, XY = iZ (common practice)', () => {
    const x = PauliTable.fromTerms(1, [{ sites: [0], codes: [1], weight: 1 }]);
    const y = PauliTable.fromTerms(1, [{ sites: [0], codes: [3], weight: 1 }]);
    const z = PauliTable.fromTerms(1, [{ sites: [0], codes: [2], weight: 1 }]);
    expect(multiplyTables(x, z).entries()).toEqual([['Y0', 0, -1]]);
    expect(multiplyTables(z, x).entries()).toEqual([['Y0', 0, 1]]);
    expect(multiplyTables(x, y).entries()).toEqual([['Z0', 0, 1]]);
    expect(multiplyTables(y, y).entries()).toEqual([['', 1, 0]]);
  });

  it('matches dense complex matrix products for random sums across word boundaries', () => {
    const rand = rng(7);
    for (let trial = 0; trial < 4; trial++) {
      const a = randomTable(rand, 6).table;
      const b = randomTable(rand, 6).table;
      const ab = multiplyTables(a, b);
      const da = denseOf(a), db = denseOf(b), dab = denseOf(ab);
      const ref = mul(da, db);
      // Tolerance: a few roundings of O(1) sums of ≤ 36 products.
      for (let k = 0; k < ref.re.length; k++) {
        expect(dab.re[k]).toBeCloseTo(ref.re[k], 12);
        expect(dab.im[k]).toBeCloseTo(ref.im[k], 12);
      }
    }
  });

  it('gives the commutator AB − BA and drops commuting pairs', () => {
    const rand = rng(11);
    const a = randomTable(rand, 5).table;
    const b = randomTable(rand, 5).table;
    const c = multiplyTables(a, b, { commutator: true });
    const ref = multiplyTables(a, b);
    ref.addScaled(multiplyTables(b, a), -1, 0);
    const dc = denseOf(c), dr = denseOf(ref);
    for (let k = 0; k < dc.re.length; k++) {
      expect(dc.re[k]).toBeCloseTo(dr.re[k], 12);
      expect(dc.im[k]).toBeCloseTo(dr.im[k], 12);
    }
    const zz = PauliTable.fromTerms(1, [{ sites: [0, 1], codes: [2, 2], weight: 1 }]);
    const xx = PauliTable.fromTerms(1, [{ sites: [0, 1], codes: [1, 1], weight: 1 }]);
    expect(multiplyTables(zz, xx, { commutator: true }).size).toBe(0);
  });

  it('applies the overall factor and accumulates into a given table', () => {
    const x = PauliTable.fromTerms(1, [{ sites: [2], codes: [1], weight: 3 }]);
    const into = PauliTable.identity(1, 1);
    multiplyTables(x, x, { into, factor: [0, 2] });
    expect(into.entries()).toEqual([['', 1, 18]]);
  });

  it('refuses tables of different widths', () => {
    expect(() => multiplyTables(new PauliTable(1), new PauliTable(2))).toThrow(RangeError);
  });

  it('returns an empty product for an empty factor', () => {
    const x = PauliTable.fromTerms(1, [{ sites: [2], codes: [1], weight: 3 }]);
    expect(multiplyTables(x, new PauliTable(1)).size).toBe(0);
  });
});

describe('traceProduct', () => {
  it('equals the normalised trace of the dense product', () => {
    const rand = rng(3);
    const a = randomTable(rand, 8).table;
    const b = randomTable(rand, 8).table;
    // Share some strings so the trace is not trivially zero.
    b.addScaled(a, 0.3, -0.2);
    const [re, im] = traceProduct(a, b);
    const [dr, di] = normTrace(mul(denseOf(a), denseOf(b)));
    expect(re).toBeCloseTo(dr, 12);
    expect(im).toBeCloseTo(di, 12);
    expect(traceProduct(a, b)).toEqual(traceProduct(b, a));
  });
});
