import { describe, expect, it } from 'vitest';
import {
  addComplexSums, addComplexTerm, commutator, createComplexSum, fromPauliSum, isHermitian, multiplyPauli, multiplyComplexSums,
  pauliCommutes, pauliFromKey, pauliKey, popcount, scaleComplexSum, simplifyComplexSum, toPauliSum,
  transposeSign, transposeComplexSum, type ComplexPauliSum,
} from '../../../workers/src/physics/pauli-algebra.js';
import { parsePauliWord } from '../../../workers/src/physics/pauli-word.js';
import {
  SX, SY, SZ, axpy, densePauli, denseSum, matmul, maxAbsDiff, transpose,
} from './dense-pauli.js';

// Dense products of 8×8 matrices with entries in {0, ±1, ±i} are exact in floating point.
const EXACT = 0;
const ROUNDING = 1e-12;

const PHASE = [[1, 0], [0, 1], [-1, 0], [0, -1]] as const;

/** Seeded generator (mulberry32) so the random sums are reproducible. */
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

function randomSum(sites: number, count: number, seed: number, real = false): ComplexPauliSum {
  const r = rng(seed);
  const s = createComplexSum(sites);
  const m = 1 << sites;
  for (let k = 0; k < count; k++) {
    addComplexTerm(s, { x: Math.floor(r() * m), z: Math.floor(r() * m) }, r() - 0.5, real ? 0 : r() - 0.5);
  }
  return s;
}

describe('popcount', () => {
  it('counts set bits including bit 29 and bit 31', () => {
    expect(popcount(0)).toBe(0);
    expect(popcount(0b1011)).toBe(3);
    expect(popcount(2 ** 30 - 1)).toBe(30);
    expect(popcount(0xffffffff | 0)).toBe(32);
  });
});

describe('single Pauli matrices (checked against explicit 2×2 matrix products)', () => {
  const X = parsePauliWord('X0', 1);
  const Y = parsePauliWord('Y0', 1);
  const Z = parsePauliWord('Z0', 1);

  it('the masks describe σx, σy, σz', () => {
    expect(maxAbsDiff(densePauli(X, 1), SX)).toBe(EXACT);
    expect(maxAbsDiff(densePauli(Y, 1), SY)).toBe(EXACT);
    expect(maxAbsDiff(densePauli(Z, 1), SZ)).toBe(EXACT);
  });

  it('gives XY = iZ, YZ = iX, ZX = iY and the reversed orders with −i', () => {
    expect(multiplyPauli(X, Y)).toEqual({ ...Z, phase: 1 });
    expect(multiplyPauli(Y, Z)).toEqual({ ...X, phase: 1 });
    expect(multiplyPauli(Z, X)).toEqual({ ...Y, phase: 1 });
    expect(multiplyPauli(Y, X)).toEqual({ ...Z, phase: 3 });
    // the same from the explicit matrices: σxσy = iσz
    expect(maxAbsDiff(matmul(SX, SY), axpy(axpy(SZ, SZ, -1), SZ, 0, 1))).toBe(EXACT);
  });

  it('squares every Pauli matrix to the identity with phase 1', () => {
    for (const p of [X, Y, Z]) expect(multiplyPauli(p, p)).toEqual({ x: 0, z: 0, phase: 0 });
  });

  it('has distinct Pauli matrices anticommute and gives [X, Y] = 2iZ', () => {
    expect(pauliCommutes(X, Y)).toBe(false);
    expect(pauliCommutes(Y, Z)).toBe(false);
    expect(pauliCommutes(X, X)).toBe(true);
    const c = commutator(fromPauliSum({ sites: 1, terms: [{ ...X, weight: 1 }] }), fromPauliSum({ sites: 1, terms: [{ ...Y, weight: 1 }] }));
    expect([...c.terms.values()]).toEqual([{ x: 0, z: 1, re: 0, im: 2 }]);
  });

  it('has Yᵀ = −Y and Xᵀ = X, Zᵀ = Z', () => {
    expect(transposeSign(Y)).toBe(-1);
    expect(transposeSign(X)).toBe(1);
    expect(transposeSign(Z)).toBe(1);
    expect(maxAbsDiff(transpose(SY), axpy(SY, SY, -2))).toBe(EXACT);
  });
});

describe('every pair of strings on three sites, against dense Kronecker products', () => {
  const strings: { x: number; z: number }[] = [];
  for (let x = 0; x < 8; x++) for (let z = 0; z < 8; z++) strings.push({ x, z });
  const dense = strings.map((p) => densePauli(p, 3));

  it('multiplyPauli gives the matrix product with its phase i^k', () => {
    for (let a = 0; a < 64; a++) for (let b = 0; b < 64; b++) {
      const p = multiplyPauli(strings[a], strings[b]);
      const [pr, pi] = PHASE[p.phase];
      const expected = matmul(dense[a], dense[b]);
      const got = axpy(axpy(expected, expected, -1), densePauli(p, 3), pr, pi);
      expect(maxAbsDiff(got, expected)).toBe(EXACT);
    }
  });

  it('pauliCommutes agrees with AB − BA', () => {
    for (let a = 0; a < 64; a++) for (let b = 0; b < 64; b++) {
      const ab = matmul(dense[a], dense[b]);
      const ba = matmul(dense[b], dense[a]);
      expect(pauliCommutes(strings[a], strings[b])).toBe(maxAbsDiff(ab, ba) === 0);
    }
  });

  it('transposeSign agrees with the dense transpose', () => {
    for (let a = 0; a < 64; a++) {
      const t = transpose(dense[a]);
      const s = transposeSign(strings[a]);
      expect(maxAbsDiff(t, axpy(axpy(t, t, -1), dense[a], s))).toBe(EXACT);
    }
  });

  it('acts on basis states as P|s⟩ = i^{|x&z|} (−1)^{|s&z|} |s ⊕ x⟩ (types.ts)', () => {
    for (let a = 0; a < 64; a++) {
      const { x, z } = strings[a];
      for (let s = 0; s < 8; s++) {
        const [pr, pi] = PHASE[popcount(x & z) % 4];
        const sign = popcount(s & z) % 2 === 0 ? 1 : -1;
        const row = s ^ x;
        expect(dense[a].re[row * 8 + s] + 0).toBe(sign * pr + 0);
        expect(dense[a].im[row * 8 + s] + 0).toBe(sign * pi + 0);
      }
    }
  });
});

describe('pauliKey', () => {
  it('round-trips 30-site masks exactly and distinguishes near neighbours', () => {
    const p = { x: 2 ** 30 - 1, z: 2 ** 30 - 2 };
    expect(pauliFromKey(pauliKey(p))).toEqual(p);
    expect(pauliKey({ x: 2 ** 29, z: 1 })).not.toBe(pauliKey({ x: 2 ** 29, z: 0 }));
  });
});

describe('complex Pauli sums (dense checks on three sites)', () => {
  const a = randomSum(3, 12, 1);
  const b = randomSum(3, 9, 2);

  it('multiplyComplexSums matches the dense product', () => {
    const got = denseSum(multiplyComplexSums(a, b).terms.values(), 3);
    expect(maxAbsDiff(got, matmul(denseSum(a.terms.values(), 3), denseSum(b.terms.values(), 3)))).toBeLessThan(ROUNDING);
  });

  it('commutator matches AB − BA', () => {
    const A = denseSum(a.terms.values(), 3);
    const B = denseSum(b.terms.values(), 3);
    const got = denseSum(commutator(a, b).terms.values(), 3);
    expect(maxAbsDiff(got, axpy(matmul(A, B), matmul(B, A), -1))).toBeLessThan(ROUNDING);
  });

  it('addComplexSums and scaleComplexSum match dense a + c·b', () => {
    const got = denseSum(addComplexSums(a, scaleComplexSum(b, 0.5, -2)).terms.values(), 3);
    expect(maxAbsDiff(got, axpy(denseSum(a.terms.values(), 3), denseSum(b.terms.values(), 3), 0.5, -2))).toBeLessThan(ROUNDING);
  });

  it('transposeComplexSum matches the dense transpose', () => {
    const got = denseSum(transposeComplexSum(a).terms.values(), 3);
    expect(maxAbsDiff(got, transpose(denseSum(a.terms.values(), 3)))).toBeLessThan(ROUNDING);
  });

  it('the commutator of two Hermitian sums is anti-Hermitian: i[H, G] is Hermitian, [H, G] is not', () => {
    const h = randomSum(3, 10, 3, true);
    const g = randomSum(3, 10, 4, true);
    expect(isHermitian(h)).toBe(true);
    const c = simplifyComplexSum(commutator(h, g), 1e-15);
    expect(c.terms.size).toBeGreaterThan(0);
    expect(isHermitian(c, 1e-15)).toBe(false);
    expect(isHermitian(scaleComplexSum(c, 0, 1), 1e-15)).toBe(true);
  });

  it('a product of two commuting Hermitian strings is Hermitian, of anticommuting ones is not', () => {
    const zz = fromPauliSum({ sites: 2, terms: [{ x: 0, z: 3, weight: 1 }] });
    const xx = fromPauliSum({ sites: 2, terms: [{ x: 3, z: 0, weight: 1 }] });
    const x0 = fromPauliSum({ sites: 2, terms: [{ x: 1, z: 0, weight: 1 }] });
    expect(isHermitian(multiplyComplexSums(zz, xx))).toBe(true);
    expect(isHermitian(multiplyComplexSums(zz, x0))).toBe(false);
  });

  it('simplifyComplexSum drops terms whose modulus is at most eps', () => {
    const s = createComplexSum(2);
    addComplexTerm(s, { x: 1, z: 0 }, 1, 0);
    addComplexTerm(s, { x: 2, z: 0 }, 1e-13, 1e-13);
    addComplexTerm(s, { x: 0, z: 1 }, 1, 0);
    addComplexTerm(s, { x: 0, z: 1 }, -1, 0);
    expect(simplifyComplexSum(s).terms.size).toBe(2);
    expect(simplifyComplexSum(s, 1e-12).terms.size).toBe(1);
  });

  it('toPauliSum refuses a non-negligible imaginary weight and round-trips a real sum', () => {
    const s = createComplexSum(2);
    addComplexTerm(s, { x: 1, z: 1 }, 0.5, 1e-3);
    expect(() => toPauliSum(s, 1e-6)).toThrow(RangeError);
    const real = { sites: 2, terms: [{ x: 1, z: 1, weight: 0.5 }, { x: 2, z: 0, weight: -1 }] };
    expect(toPauliSum(fromPauliSum(real))).toEqual(real);
  });
});
