import { describe, expect, it } from 'vitest';
import { applyOperatorAffine, compileOperator, dotc } from '../../../workers/src/kernels/index.js';
import { matVec, maxAbsDiff, randomSum, randomVector, seededRandom, sumDense } from './dense-reference.js';

// Entries are O(1) and each output entry sums ≤ ~15 products of O(1) numbers, so the
// kernel and the dense reference differ by a few 1e-15 at most; 1e-13 leaves headroom while
// any wrong sign, phase or index gives O(0.1) errors.
const TOL = 1e-13;

describe('applyOperatorAffine', () => {
  it('matches α·H·in + β·in + γ·out from the dense matrix for N = 1..4 and a batch of vectors', () => {
    const rand = seededRandom(21);
    for (let n = 1; n <= 4; n++) {
      const dim = 2 ** n;
      const sum = randomSum(rand, n, 3 * n);
      const op = compileOperator(sum);
      const nv = 3;
      const vin = randomVector(rand, 2 * dim * nv);
      const out0 = randomVector(rand, 2 * dim * nv);
      const [alpha, beta, gamma] = [0.7, -0.3, 1.9];
      const out = out0.slice();
      applyOperatorAffine(op, nv, vin, out, alpha, beta, gamma);
      const hv = matVec(sumDense(sum), vin, nv);
      const expected = hv.map((h, k) => alpha * h + beta * vin[k] + gamma * out0[k]);
      expect(maxAbsDiff(out, expected)).toBeLessThan(TOL);
    }
  });

  it('matches the dense matrix on the fused transverse-field pass and the real-entry pass (N = 5)', () => {
    // One-term X groups (fused gather pass), a real two-term group (X0X1 + Y0Y1) and a complex
    // one (X2Y3: entry ∝ i), with Z terms on the diagonal.
    const n = 5;
    const terms = [
      ...Array.from({ length: n }, (_, i) => ({ x: 1 << i, z: 0, weight: 0.3 + 0.1 * i })),
      { x: 3, z: 0, weight: 0.8 }, { x: 3, z: 3, weight: 0.8 },
      { x: 12, z: 8, weight: -0.45 },
      { x: 0, z: 6, weight: 1.1 }, { x: 0, z: 17, weight: -0.6 },
    ];
    const sum = { sites: n, terms };
    const rand = seededRandom(31);
    const vin = randomVector(rand, 2 * 2 ** n * 2);
    const out0 = randomVector(rand, 2 * 2 ** n * 2);
    const hv = matVec(sumDense(sum), vin, 2);
    for (const tables of [true, false]) {
      const out = out0.slice();
      applyOperatorAffine(compileOperator(sum, { tables }), 2, vin, out, -1.3, 0.2, 0.5);
      const expected = hv.map((h, k) => -1.3 * h + 0.2 * vin[k] + 0.5 * out0[k]);
      expect(maxAbsDiff(out, expected)).toBeLessThan(TOL);
    }
  });

  it('matches the dense matrix when the transverse fields are uniform (summed, scaled once; paired or not), with and without a diagonal, γ = 0 or not', () => {
    const n = 5;
    const field = Array.from({ length: n }, (_, i) => ({ x: 1 << i, z: 0, weight: -0.7 }));
    const rand = seededRandom(37);
    // Paired path (a bit-0 flip, no other flip touches bit 0): the field alone, with Z terms,
    // with a non-constant group. Unpaired (the weighted gather): no field on site 0, or a
    // second constant group flipping bit 0 (X0X1 with the same weight).
    const cases = [
      field, [...field, { x: 0, z: 6, weight: 1.1 }, { x: 0, z: 24, weight: -0.4 }], [...field, { x: 3, z: 3, weight: 0.8 }],
      field.slice(1), [...field, { x: 3, z: 0, weight: -0.7 }, { x: 0, z: 5, weight: 0.3 }],
    ];
    for (const terms of cases) {
      const sum = { sites: n, terms };
      const vin = randomVector(rand, 2 * 2 ** n);
      const out0 = randomVector(rand, 2 * 2 ** n);
      const hv = matVec(sumDense(sum), vin, 1);
      for (const gamma of [0, 0.5]) {
        const out = gamma === 0 ? new Float64Array(out0.length).fill(Number.NaN) : out0.slice();
        applyOperatorAffine(compileOperator(sum), 1, vin, out, 0.9, -0.2, gamma);
        const expected = hv.map((h, k) => 0.9 * h - 0.2 * vin[k] + gamma * out0[k]);
        expect(maxAbsDiff(out, expected), `${terms.length} terms, γ = ${gamma}`).toBeLessThan(TOL);
      }
    }
  });

  it('gives the same result from the table-free compact form ({ tables: false })', () => {
    const rand = seededRandom(24);
    for (let n = 1; n <= 4; n++) {
      const dim = 2 ** n;
      const sum = randomSum(rand, n, 3 * n);
      const compact = compileOperator(sum, { tables: false });
      expect(compact.groups.every((g) => g.table.length === 0)).toBe(true);
      const vin = randomVector(rand, 4 * dim);
      const out0 = randomVector(rand, 4 * dim);
      const out = out0.slice();
      applyOperatorAffine(compact, 2, vin, out, -1.1, 0.2, 0.5);
      const hv = matVec(sumDense(sum), vin, 2);
      expect(maxAbsDiff(out, hv.map((h, k) => -1.1 * h + 0.2 * vin[k] + 0.5 * out0[k]))).toBeLessThan(TOL);
    }
  });

  it('is Hermitian: ⟨u|Hv⟩ = ⟨Hu|v⟩ for random u, v', () => {
    const rand = seededRandom(22);
    const n = 4;
    const dim = 2 ** n;
    const op = compileOperator(randomSum(rand, n, 12));
    const u = randomVector(rand, 2 * dim);
    const v = randomVector(rand, 2 * dim);
    const hu = new Float64Array(2 * dim);
    const hv = new Float64Array(2 * dim);
    applyOperatorAffine(op, 1, u, hu, 1, 0, 0);
    applyOperatorAffine(op, 1, v, hv, 1, 0, 0);
    const a = new Float64Array(2);
    const b = new Float64Array(2);
    dotc(u, hv, a);
    dotc(hu, v, b);
    expect(Math.abs(a[0] - b[0])).toBeLessThan(TOL);
    expect(Math.abs(a[1] - b[1])).toBeLessThan(TOL);
    expect(Math.abs(a[0]) + Math.abs(a[1])).toBeGreaterThan(0.01); // not trivially zero
  });

  it('does not read out when γ = 0, so NaN in out does not propagate', () => {
    const op = compileOperator({ sites: 2, terms: [{ x: 1, z: 0, weight: 1 }, { x: 0, z: 3, weight: 0.5 }] });
    const vin = new Float64Array([1, 0, 0, 1, 0, 0, 2, 0]);
    const out = new Float64Array(8).fill(Number.NaN);
    applyOperatorAffine(op, 1, vin, out, 1, 0, 0);
    expect(out.every(Number.isFinite)).toBe(true);
  });

  it('gives β·in + γ·out for an empty sum and shift·in for an identity-only sum', () => {
    const rand = seededRandom(23);
    const vin = randomVector(rand, 16);
    const out0 = randomVector(rand, 16);
    const out = out0.slice();
    applyOperatorAffine(compileOperator({ sites: 3, terms: [] }), 1, vin, out, 2, 0.5, -1);
    expect(maxAbsDiff(out, vin.map((v, k) => 0.5 * v - out0[k]))).toBeLessThan(TOL);

    const out2 = new Float64Array(16);
    applyOperatorAffine(compileOperator({ sites: 3, terms: [{ x: 0, z: 0, weight: 1.25 }] }), 1, vin, out2, 2, 0, 0);
    expect(maxAbsDiff(out2, vin.map((v) => 2.5 * v))).toBeLessThan(TOL);
  });

  it('flips the single site: X|0⟩ = |1⟩ on one site', () => {
    const op = compileOperator({ sites: 1, terms: [{ x: 1, z: 0, weight: 1 }] });
    const out = new Float64Array(4);
    applyOperatorAffine(op, 1, new Float64Array([1, 0, 0, 0]), out, 1, 0, 0);
    expect(Array.from(out)).toEqual([0, 0, 1, 0]);
  });

  it('throws a RangeError for short buffers, aliasing and a bad vector count', () => {
    const op = compileOperator({ sites: 2, terms: [{ x: 1, z: 0, weight: 1 }] });
    const v = new Float64Array(8);
    expect(() => applyOperatorAffine(op, 2, v, new Float64Array(16), 1, 0, 0)).toThrow(/input/);
    expect(() => applyOperatorAffine(op, 1, v, new Float64Array(4), 1, 0, 0)).toThrow(/out/);
    expect(() => applyOperatorAffine(op, 1, v, v, 1, 0, 0)).toThrow(RangeError);
    expect(() => applyOperatorAffine(op, -1, v, new Float64Array(8), 1, 0, 0)).toThrow(/nVectors/);
  });
});
