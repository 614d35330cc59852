/**
 * Magnetisation blocks (workers/src/symmetry with the trivial spatial group, i.e. the
 * computational basis) and the block matrices built from them (symmetry/block-matrix.ts,
 * engines/spectral/dense-block.ts, apply-block.ts).
 * - conservesMagnetisation decides by the Pauli algebra: sums conserve Σ Z_i even when no single
 *   term does (XX + YY; the antisymmetric X Y − Y X), and single terms that flip spins do not.
 * - popcount sectors have the binomial sizes C(N, k).
 * - dense blocks assembled side by side equal the full matrix obtained by applying the matrix-free
 *   kernel (applyOperatorAffine) to basis vectors, entry for entry (exact: both sum the terms of
 *   one flip mask in the same order, and the trivial group multiplies by exactly 1).
 */
import { describe, expect, it } from 'vitest';
import { applyBlock } from '../../../workers/src/engines/spectral/apply-block.js';
import { denseBlock } from '../../../workers/src/engines/spectral/dense-block.js';
import { applyOperatorAffine, compileOperator } from '../../../workers/src/kernels/index.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import type { PauliSum } from '../../../workers/src/physics/types.js';
import {
  analyseSymmetry, blockMatrix, conservesMagnetisation, groupSectors, partitionByLabel, sectorBasis, sectorPartition, trivialGroup,
} from '../../../workers/src/symmetry/index.js';
import type { BasisPartition, SectorBasis, SymmetryMode } from '../../../workers/src/symmetry/index.js';
import { seededRandom } from '../../bench/bench-record.js';

const chain = (n: number) => buildLattice({ kind: 'chain', length: n, boundary: 'open' });
const words = (n: number, terms: Array<[number, string]>): PauliSum =>
  buildHamiltonian({ model: 'pauli-sum', terms: terms.map(([weight, word]) => ({ weight, word })) }, chain(n));
/** The computational basis of n sites and its blocks under `mode` for H0 = H1 = h. */
function blocks(h: PauliSum, mode: SymmetryMode): { basis: SectorBasis; p: BasisPartition } {
  const a = analyseSymmetry({ kind: 'chain', length: h.sites, boundary: 'open' }, h, h, mode);
  const basis = sectorBasis(a.group, a.sectors);
  return { basis, p: sectorPartition(basis, a.magnetisationJoint, a.label) };
}
const computational = (n: number) => sectorBasis(trivialGroup(n), groupSectors(trivialGroup(n)));

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

describe('magnetisation blocks', () => {
  it('splits 2^N states into popcount sectors of sizes C(N, k), with consistent position tables', () => {
    const { basis, p } = blocks(buildHamiltonian({ model: 'xxz', J: 1, delta: 1, hz: 0 }, chain(6)), 'magnetisation');
    expect(p.symmetry).toBe('magnetisation');
    expect(basis.count).toBe(64);
    expect(p.blocks.map((b) => b.length).sort((x, y) => x - y)).toEqual([1, 1, 6, 6, 15, 15, 20]);
    p.blocks.forEach((b, k) => b.forEach((q, i) => {
      expect(p.blockOf[q]).toBe(k);
      expect(p.position[q]).toBe(i);
      expect(basis.rep[q]).toBe(q); // the trivial group: vector q is basis state q
    }));
  });

  it('falls back to one block when the symmetry is absent or not asked for', () => {
    const ising = buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(4));
    expect(blocks(ising, 'magnetisation').p.blocks).toHaveLength(1);
    expect(blocks(buildHamiltonian({ model: 'xxz', J: 1, delta: 1, hz: 0 }, chain(4)), 'none').p.blocks).toHaveLength(1);
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
    const { basis, p } = blocks(h, 'magnetisation');
    const dim = 32;
    const full = new Float64Array(2 * dim * dim);
    const e = new Float64Array(2 * dim * dim);
    for (let s = 0; s < dim; s++) e[2 * (s + s * dim)] = 1;
    applyOperatorAffine(op, dim, e, full, 1, 0, 0); // column s = H|s⟩
    const seen = new Float64Array(2 * dim * dim);
    p.blocks.forEach((states, b) => {
      const d = states.length;
      const m = new Float64Array(2 * d * d);
      denseBlock(blockMatrix(basis, p, b, h.terms, true)!, m);
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
    const { basis, p } = blocks(h, 'magnetisation');
    const b = p.blockOf[3]; // popcount-2 sector, 10 states
    const d = p.blocks[b].length;
    expect(d).toBe(10);
    const sparse = blockMatrix(basis, p, b, h.terms, true)!;
    const m = new Float64Array(2 * d * d);
    denseBlock(sparse, m);
    const r = seededRandom(4);
    const cols = 3;
    const x = Float64Array.from({ length: 2 * d * cols }, () => r() - 0.5);
    const y = new Float64Array(2 * d * cols);
    applyBlock(sparse, x, y, cols);
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

  it('refuses a partition that is not a symmetry of the operator, and a short output buffer', () => {
    const ising = buildHamiltonian({ model: 'ising', J: 1, hx: 1, hz: 0 }, chain(3));
    const sectors = partitionByLabel(8, (s) => (s & 1) + ((s >> 1) & 1) + ((s >> 2) & 1), 'magnetisation');
    expect(() => blockMatrix(computational(3), sectors, 1, ising.terms, true)).toThrow(/not a symmetry/);
    const diagonal = blockMatrix(computational(3), sectors, 1, [{ x: 0, z: 1, weight: 1 }], true)!;
    expect(() => denseBlock(diagonal, new Float64Array(4))).toThrow(/out must hold/);
  });

  it('drops entries into other blocks for observables, and returns null for a block without entries', () => {
    const sectors = partitionByLabel(8, (s) => (s & 1) + ((s >> 1) & 1) + ((s >> 2) & 1), 'magnetisation');
    expect(blockMatrix(computational(3), sectors, 1, [{ x: 1, z: 0, weight: 1 }], false)).toBeNull(); // X0
    const xx = blockMatrix(computational(3), sectors, 1, [{ x: 3, z: 0, weight: 1 }, { x: 1, z: 0, weight: 1 }], false)!;
    expect(Array.from(xx.re)).toEqual([1, 1]); // X0 X1 swaps |001⟩ and |010⟩; X0 leaves the sector
    expect(xx.real).toBe(true);
  });
});
