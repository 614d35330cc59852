import { describe, expect, it } from 'vitest';
import {
  applyDoubledAffine, compileOperator, dotc, scaleSum, transposeSum,
} from '../../../workers/src/kernels/index.js';
import {
  addScaled, identity, kron, matVec, maxAbsDiff, randomSum, randomVector, seededRandom, sumDense,
  transposeDense, type Dense,
} from './dense-reference.js';

// Doubled-space entries sum ≤ ~30 O(1) products; rounding is a few 1e-15. 1e-13 leaves headroom
// while any index-layout, sign or transpose error gives O(0.1) deviations.
const TOL = 1e-13;

/** Dense A⊗1 + 1⊗B on the 2N-qubit space, physical qubits = low bits: kron(1, A) + kron(B, 1). */
function doubledDense(a: Dense | null, b: Dense | null, dim: number): Dense {
  const k = { n: dim * dim, re: new Float64Array(dim ** 4), im: new Float64Array(dim ** 4) };
  if (a) addScaled(k, kron(identity(dim), a), 1);
  if (b) addScaled(k, kron(b, identity(dim)), 1);
  return k;
}

/** Column-major dense product M·C for dim×dim M stored as interleaved r + dim·c. */
function rightMultiply(m: Float64Array, c: Dense): Float64Array {
  const dim = c.n;
  const out = new Float64Array(m.length);
  for (let r = 0; r < dim; r++) for (let j = 0; j < dim; j++) {
    let sr = 0, si = 0;
    for (let k = 0; k < dim; k++) {
      const mr = m[2 * (r + dim * k)], mi = m[2 * (r + dim * k) + 1];
      const cr = c.re[k * dim + j], ci = c.im[k * dim + j];
      sr += mr * cr - mi * ci;
      si += mr * ci + mi * cr;
    }
    out[2 * (r + dim * j)] = sr;
    out[2 * (r + dim * j) + 1] = si;
  }
  return out;
}

describe('applyDoubledAffine', () => {
  it('matches the dense (A⊗1 + 1⊗B) on the 2N-qubit space for N = 1..4', () => {
    const rand = seededRandom(31);
    for (let n = 1; n <= 4; n++) {
      const dim = 2 ** n;
      const sa = randomSum(rand, n, 3 * n);
      const sb = randomSum(rand, n, 2 * n);
      const vin = randomVector(rand, 2 * dim * dim);
      const out0 = randomVector(rand, 2 * dim * dim);
      const [alpha, beta, gamma] = [-0.8, 0.45, 0.6];
      const out = out0.slice();
      applyDoubledAffine(compileOperator(sa), compileOperator(sb), vin, out, alpha, beta, gamma);
      const kv = matVec(doubledDense(sumDense(sa), sumDense(sb), dim), vin);
      const expected = kv.map((h, k) => alpha * h + beta * vin[k] + gamma * out0[k]);
      expect(maxAbsDiff(out, expected)).toBeLessThan(TOL);
    }
  });

  it('gives the same result from the table-free compact form on either side', () => {
    const rand = seededRandom(37);
    for (let n = 1; n <= 3; n++) {
      const dim = 2 ** n;
      const sa = randomSum(rand, n, 3 * n);
      const sb = randomSum(rand, n, 3 * n);
      const vin = randomVector(rand, 2 * dim * dim);
      const kv = matVec(doubledDense(sumDense(sa), sumDense(sb), dim), vin);
      const out = new Float64Array(2 * dim * dim);
      applyDoubledAffine(compileOperator(sa, { tables: false }), compileOperator(sb, { tables: false }), vin, out, 1, 0, 0);
      expect(maxAbsDiff(out, kv)).toBeLessThan(TOL);
      applyDoubledAffine(compileOperator(sa), compileOperator(sb, { tables: false }), vin, out, 1, 0, 0);
      expect(maxAbsDiff(out, kv)).toBeLessThan(TOL);
    }
  });

  it('matches the dense result for chain Hamiltonians whose real tables take the fused paths', () => {
    // Ising chain with X fields (N real single-flip groups) and an XX+YY+ZZ chain (real groups
    // with zero entries on aligned spins): exercises the paired A gathers and the 4-, 2- and
    // 1-column real B passes, plus skipped zero factors.
    const rand = seededRandom(38);
    const n = 4;
    const dim = 2 ** n;
    const ising = { sites: n, terms: [] as { x: number; z: number; weight: number }[] };
    const hop = { sites: n, terms: [] as { x: number; z: number; weight: number }[] };
    for (let i = 0; i < n; i++) {
      ising.terms.push({ x: 1 << i, z: 0, weight: -0.7 - 0.1 * i }, { x: 0, z: 1 << i, weight: 0.2 });
      if (i + 1 < n) {
        const m = (1 << i) | (1 << (i + 1));
        ising.terms.push({ x: 0, z: m, weight: -1 });
        hop.terms.push({ x: m, z: 0, weight: 1 }, { x: m, z: m, weight: 0.8 }, { x: 0, z: m, weight: 0.5 });
      }
    }
    for (const [sa, sb] of [[ising, hop], [hop, ising], [ising, scaleSum(transposeSum(ising), -1)]]) {
      const vin = randomVector(rand, 2 * dim * dim);
      const out0 = randomVector(rand, 2 * dim * dim);
      const out = out0.slice();
      applyDoubledAffine(compileOperator(sa), compileOperator(sb), vin, out, 0.3, -0.2, 1);
      const kv = matVec(doubledDense(sumDense(sa), sumDense(sb), dim), vin);
      expect(maxAbsDiff(out, kv.map((h, k) => 0.3 * h - 0.2 * vin[k] + out0[k]))).toBeLessThan(TOL);
    }
  });

  it('accepts a null physical or auxiliary operator', () => {
    const rand = seededRandom(32);
    const n = 3;
    const dim = 2 ** n;
    const s = randomSum(rand, n, 7);
    const vin = randomVector(rand, 2 * dim * dim);
    const onlyA = new Float64Array(2 * dim * dim);
    applyDoubledAffine(compileOperator(s), null, vin, onlyA, 1, 0, 0);
    expect(maxAbsDiff(onlyA, matVec(doubledDense(sumDense(s), null, dim), vin))).toBeLessThan(TOL);
    const onlyB = new Float64Array(2 * dim * dim);
    applyDoubledAffine(null, compileOperator(s), vin, onlyB, 1, 0, 0);
    expect(maxAbsDiff(onlyB, matVec(doubledDense(null, sumDense(s), dim), vin))).toBeLessThan(TOL);
    const neither = new Float64Array(2 * dim * dim);
    applyDoubledAffine(null, null, vin, neither, 1, 2, 0, n);
    expect(maxAbsDiff(neither, vin.map((v) => 2 * v))).toBe(0);
  });

  it('acts on the auxiliary index as (1⊗B)M = M·Bᵀ, including Y strings', () => {
    const rand = seededRandom(33);
    for (let n = 1; n <= 4; n++) {
      const dim = 2 ** n;
      const sb = randomSum(rand, n, 3 * n);
      const m = randomVector(rand, 2 * dim * dim);
      const out = new Float64Array(2 * dim * dim);
      applyDoubledAffine(null, compileOperator(sb), m, out, 1, 0, 0);
      expect(maxAbsDiff(out, rightMultiply(m, transposeDense(sumDense(sb))))).toBeLessThan(TOL);
    }
  });

  it('leaves M = H (any function of H) stationary under K = H⊗1 − 1⊗Hᵀ, Y terms included', () => {
    const rand = seededRandom(34);
    const n = 3;
    const dim = 2 ** n;
    const sum = randomSum(rand, n, 10);
    const h = sumDense(sum);
    // M = H as a column-major interleaved matrix.
    const m = new Float64Array(2 * dim * dim);
    for (let r = 0; r < dim; r++) for (let c = 0; c < dim; c++) {
      m[2 * (r + dim * c)] = h.re[r * dim + c];
      m[2 * (r + dim * c) + 1] = h.im[r * dim + c];
    }
    const out = new Float64Array(2 * dim * dim);
    const a = compileOperator(sum);
    applyDoubledAffine(a, compileOperator(scaleSum(transposeSum(sum), -1)), m, out, 1, 0, 0);
    expect(maxAbsDiff(out, new Float64Array(out.length))).toBeLessThan(TOL);
    // Without the transpose the Y terms break stationarity: the check can fail.
    applyDoubledAffine(a, compileOperator(scaleSum(sum, -1)), m, out, 1, 0, 0);
    expect(maxAbsDiff(out, new Float64Array(out.length))).toBeGreaterThan(0.01);
  });

  it('is Hermitian on the doubled space: ⟨u|Kv⟩ = ⟨Ku|v⟩', () => {
    const rand = seededRandom(35);
    const n = 3;
    const dim = 2 ** n;
    const a = compileOperator(randomSum(rand, n, 8));
    const b = compileOperator(randomSum(rand, n, 8));
    const u = randomVector(rand, 2 * dim * dim);
    const v = randomVector(rand, 2 * dim * dim);
    const ku = new Float64Array(u.length);
    const kv = new Float64Array(v.length);
    applyDoubledAffine(a, b, u, ku, 1, 0, 0);
    applyDoubledAffine(a, b, v, kv, 1, 0, 0);
    const x = new Float64Array(2);
    const y = new Float64Array(2);
    dotc(u, kv, x);
    dotc(ku, v, y);
    expect(Math.abs(x[0] - y[0])).toBeLessThan(TOL);
    expect(Math.abs(x[1] - y[1])).toBeLessThan(TOL);
  });

  it('does not read out when γ = 0 and handles a single site', () => {
    const a = compileOperator({ sites: 1, terms: [{ x: 1, z: 1, weight: 1 }, { x: 0, z: 1, weight: 0.5 }] });
    const b = compileOperator({ sites: 1, terms: [{ x: 1, z: 0, weight: -1 }] });
    const rand = seededRandom(36);
    const vin = randomVector(rand, 8);
    const out = new Float64Array(8).fill(Number.NaN);
    applyDoubledAffine(a, b, vin, out, 1, 0, 0);
    expect(out.every(Number.isFinite)).toBe(true);
    const ref = matVec(doubledDense(sumDense({ sites: 1, terms: [{ x: 1, z: 1, weight: 1 }, { x: 0, z: 1, weight: 0.5 }] }),
      sumDense({ sites: 1, terms: [{ x: 1, z: 0, weight: -1 }] }), 2), vin);
    expect(maxAbsDiff(out, ref)).toBeLessThan(TOL);
  });

  it('throws a RangeError on mismatched sites, short buffers, aliasing or a missing size', () => {
    const a2 = compileOperator({ sites: 2, terms: [{ x: 1, z: 0, weight: 1 }] });
    const a3 = compileOperator({ sites: 3, terms: [{ x: 1, z: 0, weight: 1 }] });
    const v = new Float64Array(32);
    expect(() => applyDoubledAffine(a2, a3, new Float64Array(128), new Float64Array(128), 1, 0, 0)).toThrow(/sites/);
    expect(() => applyDoubledAffine(a2, null, new Float64Array(16), v, 1, 0, 0)).toThrow(/input/);
    expect(() => applyDoubledAffine(a2, null, v, v, 1, 0, 0)).toThrow(RangeError);
    expect(() => applyDoubledAffine(null, null, v, new Float64Array(32), 1, 0, 0)).toThrow(/sites/);
    expect(() => applyDoubledAffine(null, null, v, new Float64Array(32), 1, 0, 0, 16)).toThrow(/sites/);
  });
});
