/**
 * Symmetry blocks (workers/src/symmetry) and the block matrices built from them
 * (engines/spectral/dense-block.ts, apply-block.ts).
 * - conservesMagnetisation decides by the Pauli algebra: sums conserve Σ Z_i even when no single
 *   term does (XX + YY; the antisymmetric X Y − Y X), and single terms that flip spins do not.
 * - popcount sectors have the binomial sizes C(N, k).
 * - dense blocks assembled side by side equal the full matrix obtained by applying the matrix-free
 *   kernel (applyOperatorAffine) to basis vectors, entry for entry (exact: the same table values
 *   are copied, no arithmetic besides the sums of equal-mask terms done by compileOperator).
 */
import { describe, expect, it } from 'vitest';
import { applyBlock } from '../../../workers/src/engines/spectral/apply-block.js';
import { denseBlock } from '../../../workers/src/engines/spectral/dense-block.js';
import { applyOperatorAffine, compileOperator } from '../../../workers/src/kernels/index.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import type { PauliSum } from '../../../workers/src/physics/types.js';
import {
  conservesMagnetisation, joinPartitions, partitionByLabel, symmetryBlocks,
} from '../../../workers/src/symmetry/index.js';
import { seededRandom } from '../../bench/bench-record.js';

const chain = (n: number) => buildLattice({ kind: 'chain', length: n, boundary: 'open' });
const words = (n: number, terms: Array<[number, string]>): PauliSum =>
  buildHamiltonian({ model: 'pauli-sum', terms: terms.map(([weight, word]) => ({ weight, word })) }, chain(n));

describe('conservesMagnetisation', () => {
  it('holds for the XXZ chain with a field and for Z-only Hamiltonians', () => {
    expect(conservesMagnetisation(buildHamiltonian({ model: 'xxz', J: 1, delta: 0.3, hz: 0.7 }, chain(5)))).toBe(true);
    expect(conservesMagnetisation(buildHamiltonian({ model: 'ising', J: 1, hx: 0, hz: 0.4 }, chain(4)))).toBe(true);
  });

  it('fails for a transverse field, a lone XX term, or XX and YY with unequal weights', () => {
    expect(conservesMagnetisation(buildHamiltonian({ model: 'ising', J: 1, hx: 0.2, hz: 0 }, chain(4)))).toBe(false);
    expect(conservesMagnetisation(words(3, [[1, 'X0 X1']]))).toBe(false);
    expect(conservesMagnetisation(words(3, [[1, 'X0 X1'], [0.999, 'Y0 Y1']]))).toBe(false);
    expect(conservesMagnetisation(words(3, [[1, 'X0 X1'], [1, 'Y0 Y1'], [0.1, 'X2']]))).toBe(false);
  });

  it('holds for X0 Y1 − Y0 X1, which no term-by-term pattern on XX + YY would recognise', () => {
    expect(conservesMagnetisation(words(2, [[0.6, 'X0 Y1'], [-0.6, 'Y0 X1']]))).toBe(true);
    expect(conservesMagnetisation(words(2, [[0.6, 'X0 Y1'], [0.6, 'Y0 X1']]))).toBe(false);
  });

  it('accepts a tolerance for commutator strings and rejects a negative one', () => {
    const h = words(2, [[1, 'X0 X1'], [1 + 1e-15, 'Y0 Y1']]);
    expect(conservesMagnetisation(h)).toBe(false);
    expect(conservesMagnetisation(h, 1e-12)).toBe(true);
    expect(() => conservesMagnetisation(h, -1)).toThrow(RangeError);
  });
});

describe('symmetryBlocks and joinPartitions', () => {
  it('splits 2^N states into popcount sectors of sizes C(N, k), with consistent position tables', () => {
    const p = symmetryBlocks(buildHamiltonian({ model: 'xxz', J: 1, delta: 1, hz: 0 }, chain(6)), 'magnetisation');
    expect(p.symmetry).toBe('magnetisation');
    expect(p.blocks.map((b) => b.length)).toEqual([1, 6, 15, 20, 15, 6, 1]);
    p.blocks.forEach((b, k) => b.forEach((s, i) => {
      expect(p.blockOf[s]).toBe(k);
      expect(p.position[s]).toBe(i);
    }));
  });

  it('falls back to one block when the symmetry is absent or not asked for', () => {
    const ising = buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(4));
    expect(symmetryBlocks(ising, 'magnetisation').blocks).toHaveLength(1);
    expect(symmetryBlocks(buildHamiltonian({ model: 'xxz', J: 1, delta: 1, hz: 0 }, chain(4)), 'none').blocks).toHaveLength(1);
  });

  it('joins partitions into their finest common coarsening', () => {
    const sectors = partitionByLabel(8, (s) => (s & 1) + ((s >> 1) & 1) + ((s >> 2) & 1), 'magnetisation');
    const whole = partitionByLabel(8, () => 0, 'none');
    expect(joinPartitions(sectors, whole).blocks).toHaveLength(1);
    expect(joinPartitions(sectors, sectors).blocks.map((b) => Array.from(b))).toEqual(sectors.blocks.map((b) => Array.from(b)));
    // {0,1},{2,3},… joined with {1,2},{3,4},… chains everything; with {0},{1},… it stays pairs.
    const pairs = partitionByLabel(8, (s) => s >> 1, 'a');
    const shifted = partitionByLabel(8, (s) => ((s + 1) >> 1) % 4, 'b');
    expect(joinPartitions(pairs, shifted).blocks).toHaveLength(1);
    expect(joinPartitions(pairs, partitionByLabel(8, (s) => s, 'c')).blocks.map((b) => Array.from(b)))
      .toEqual([[0, 1], [2, 3], [4, 5], [6, 7]]);
    expect(() => joinPartitions(pairs, partitionByLabel(4, () => 0, 'd'))).toThrow(RangeError);
  });
});

describe('denseBlock and applyBlock', () => {
  // An XXZ chain with a field plus the Y-odd, magnetisation-conserving X Y − Y X term: complex blocks.
  const h: PauliSum = words(5, [
    [1, 'X0 X1'], [1, 'Y0 Y1'], [0.6, 'Z0 Z1'], [0.8, 'X1 X2'], [0.8, 'Y1 Y2'], [-0.3, 'Z1 Z2'],
    [0.45, 'X2 Y3'], [-0.45, 'Y2 X3'], [0.7, 'X3 X4'], [0.7, 'Y3 Y4'], [0.2, 'Z4'], [-0.9, 'Z0'], [1.5, ''],
  ]);
  const op = compileOperator(h);

  it('assembles, block by block, exactly the matrix the matrix-free kernel applies', () => {
    expect(conservesMagnetisation(h)).toBe(true);
    const p = symmetryBlocks(h, 'magnetisation');
    const dim = 32;
    const full = new Float64Array(2 * dim * dim);
    const e = new Float64Array(2 * dim * dim);
    for (let s = 0; s < dim; s++) e[2 * (s + s * dim)] = 1;
    applyOperatorAffine(op, dim, e, full, 1, 0, 0); // column s = H|s⟩
    const seen = new Float64Array(2 * dim * dim);
    p.blocks.forEach((states, b) => {
      const d = states.length;
      const m = new Float64Array(2 * d * d);
      denseBlock(op, p, b, m);
      for (let j = 0; j < d; j++) for (let i = 0; i < d; i++) {
        const q = 2 * (states[i] + states[j] * dim);
        expect(m[2 * (i + j * d)]).toBe(full[q]);
        expect(m[2 * (i + j * d) + 1]).toBe(full[q + 1]);
        seen[q] = 1;
      }
    });
    // Nothing outside the blocks.
    for (let q = 0; q < full.length; q += 2) if (seen[q] === 0) expect(Math.hypot(full[q], full[q + 1])).toBe(0);
  });

  it('applies a block to several vectors as the dense block does (to 1e-14)', () => {
    const p = symmetryBlocks(h, 'magnetisation');
    const b = 2; // popcount-2 sector, 10 states
    const d = p.blocks[b].length;
    const m = new Float64Array(2 * d * d);
    denseBlock(op, p, b, m);
    const r = seededRandom(4);
    const cols = 3;
    const x = Float64Array.from({ length: 2 * d * cols }, () => r() - 0.5);
    const y = new Float64Array(2 * d * cols);
    applyBlock(op, p, b, x, y, cols);
    for (let c = 0; c < cols; c++) for (let i = 0; i < d; i++) {
      let sr = 0, si = 0;
      for (let j = 0; j < d; j++) {
        const hr = m[2 * (i + j * d)], hi = m[2 * (i + j * d) + 1];
        const xr = x[2 * (j + c * d)], xi = x[2 * (j + c * d) + 1];
        sr += hr * xr - hi * xi; si += hr * xi + hi * xr;
      }
      expect(Math.abs(y[2 * (i + c * d)] - sr)).toBeLessThanOrEqual(1e-14);
      expect(Math.abs(y[2 * (i + c * d) + 1] - si)).toBeLessThanOrEqual(1e-14);
    }
  });

  it('refuses a partition that is not a symmetry of the operator', () => {
    const ising = compileOperator(buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(3)));
    const sectors = partitionByLabel(8, (s) => (s & 1) + ((s >> 1) & 1) + ((s >> 2) & 1), 'magnetisation');
    expect(() => denseBlock(ising, sectors, 1, new Float64Array(18))).toThrow(/not a symmetry/);
    expect(() => denseBlock(ising, sectors, 1, new Float64Array(4))).toThrow(/out must hold/);
  });
});
