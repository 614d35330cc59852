/**
 * The symmetry-adapted basis (workers/src/symmetry: sector-basis, sector-dimensions,
 * block-matrix, symmetrise-terms), checked against the plain 2^N space:
 * - sector dimensions from character counting (what plans use) equal the enumerated basis, and
 *   the blocks, counted with their multiplicities, span exactly 2^N states;
 * - the explicitly built vectors |O, σ⟩ are orthonormal and ⟨q′|H|q⟩ computed from them with the
 *   matrix-free kernel (applyOperatorAffine: independent of block-matrix.ts) equals the sparse
 *   block entry by entry (1e-13: sums of a few O(1) terms, rounding only);
 * - the eigenvalues of all blocks, with multiplicities, are the spectrum of the full matrix
 *   (1e-12 ≈ 10³·ε·‖H‖ for dense eigensolvers of order 256–512);
 * - group averages of observables: equal images of different strings give identical operators.
 */
import { describe, expect, it } from 'vitest';
import { Hamiltonian as HamiltonianSchema, Lattice as LatticeSchema } from '../../../shared-types/src/index.js';
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { denseBlock } from '../../../workers/src/engines/spectral/dense-block.js';
import { applyOperatorAffine, compileOperator } from '../../../workers/src/kernels/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { hermitianEigen } from '../../../workers/src/linalg/hermitian-eigen.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import type { PauliSum } from '../../../workers/src/physics/types.js';
import {
  analyseSymmetry, blockMatrix, blockSector, blockShapes, sectorBasis, sectorOrbits, sectorPartition, symmetriseTerms,
} from '../../../workers/src/symmetry/index.js';
import type { SectorBasis, SymmetryMode } from '../../../workers/src/symmetry/index.js';
import { mapState, stateMapper } from '../../../workers/src/symmetry/site-permutation.js';

type Lattice = SweepSpecInput['lattice'];
type Hamiltonian = SweepSpecInput['h0'];
const chiral = (n: number, d: number, hz: number): Hamiltonian => ({
  model: 'pauli-sum',
  terms: Array.from({ length: n }, (_, i) => {
    const j = (i + 1) % n;
    return [{ weight: 1, word: `X${i} X${j}` }, { weight: 1, word: `Y${i} Y${j}` }, { weight: 0.6, word: `Z${i} Z${j}` },
      { weight: d, word: `X${i} Y${j}` }, { weight: -d, word: `Y${i} X${j}` }, { weight: -hz, word: `Z${i}` }];
  }).flat(),
});

interface Case { name: string; lattice: Lattice; h: Hamiltonian; mode: SymmetryMode }
const CASES: Case[] = [
  { name: 'XXZ ring of 8 (magnetisation, translations, inversion)', lattice: { kind: 'chain', length: 8, boundary: 'periodic' }, h: { model: 'xxz', J: 1, delta: 0.4, hz: 0.3 }, mode: 'all' },
  { name: 'chiral ring of 8 (complex momentum blocks)', lattice: { kind: 'chain', length: 8, boundary: 'periodic' }, h: chiral(8, 0.35, 0.2), mode: 'all' },
  { name: '3×3 Ising torus', lattice: { kind: 'square', size: [3, 3], boundary: ['periodic', 'periodic'] }, h: { model: 'ising', J: 1, hx: 0.7, hz: 0.2 }, mode: 'all' },
  { name: '4×2 XXZ torus', lattice: { kind: 'square', size: [4, 2], boundary: ['periodic', 'periodic'] }, h: { model: 'xxz', J: 1, delta: 1.3, hz: 0.1 }, mode: 'all' },
  { name: 'open Ising chain of 7 (inversion only)', lattice: { kind: 'chain', length: 7, boundary: 'open' }, h: { model: 'ising', J: 1, hx: 0.7 }, mode: 'all' },
  { name: '2×2 honeycomb torus', lattice: { kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] }, h: { model: 'ising', J: 1, hx: 0.5, hz: 0.3 }, mode: 'all' },
  { name: 'XXZ ring of 6, translations only', lattice: { kind: 'chain', length: 6, boundary: 'periodic' }, h: { model: 'xxz', J: 1, delta: 0.4, hz: 0.3 }, mode: 'translations' },
];

function setup(c: Case) {
  const lattice = LatticeSchema.parse(c.lattice);
  const graph = buildLattice(lattice);
  const h = buildHamiltonian(HamiltonianSchema.parse(c.h), graph);
  const a = analyseSymmetry(lattice, h, h, c.mode);
  const basis = sectorBasis(a.group, a.sectors);
  const partition = sectorPartition(basis, a.magnetisationJoint, a.label);
  return { h, a, basis, partition };
}

/** Dense column-major complex matrix of H on 2^N states, from the matrix-free kernel. */
function fullMatrix(h: PauliSum): Float64Array {
  const op = compileOperator(h);
  const dim = op.dim;
  const e = new Float64Array(2 * dim * dim);
  for (let s = 0; s < dim; s++) e[2 * (s + s * dim)] = 1;
  const out = new Float64Array(2 * dim * dim);
  applyOperatorAffine(op, dim, e, out, 1, 0, 0);
  return out;
}

/** The explicit vector |q⟩ on 2^N states (file header of sector-basis.ts). */
function explicitVector(basis: SectorBasis, q: number): Float64Array {
  const sigma = basis.sectorOf[q];
  const sector = basis.sectors[sigma];
  const order = sectorOrbits(basis, sigma).order;
  const v = new Float64Array(2 * 2 ** basis.sites);
  const seen = new Set<number>();
  for (let g = 0; g < order; g++) {
    const s = mapState(stateMapper(basis.group.elements[g]), 0, basis.rep[q]);
    if (seen.has(s)) continue;
    seen.add(s);
    v[2 * s] = sector.characters[2 * g] / Math.sqrt(basis.orbitSize[q]);
    v[2 * s + 1] = -sector.characters[2 * g + 1] / Math.sqrt(basis.orbitSize[q]);
  }
  expect(seen.size).toBe(basis.orbitSize[q]);
  return v;
}

describe('sector bases', () => {
  for (const c of CASES) {
    it(`counts the block sizes by characters as the enumeration does, spanning 2^N (${c.name})`, () => {
      const { h, a, basis, partition } = setup(c);
      const counted = blockShapes(a.group, a.sectors, a.magnetisationJoint).map((b) => `${b.size}×${b.multiplicity}`).sort();
      const built = partition.blocks.map((b, k) => `${b.length}×${blockSector(basis, partition, k).multiplicity}`).sort();
      expect(built).toEqual(counted);
      const spanned = partition.blocks.reduce((acc, b, k) => acc + b.length * blockSector(basis, partition, k).multiplicity, 0);
      expect(spanned).toBe(2 ** h.sites);
      expect(partition.blocks.length).toBeGreaterThan(1);
    });

    it(`gives block spectra that together are the full spectrum (${c.name})`, () => {
      const { h, basis, partition } = setup(c);
      const dim = 2 ** h.sites;
      const full = new Float64Array(dim);
      hermitianEigen(dim, fullMatrix(h), full, null);
      const parts: number[] = [];
      partition.blocks.forEach((b, k) => {
        const d = b.length;
        const dense = new Float64Array(2 * d * d);
        denseBlock(blockMatrix(basis, partition, k, h.terms, true)!, dense);
        const w = new Float64Array(d);
        hermitianEigen(d, dense, w, null);
        for (let m = 0; m < blockSector(basis, partition, k).multiplicity; m++) parts.push(...w);
      });
      parts.sort((x, y) => x - y);
      parts.forEach((e, k) => expect(Math.abs(e - full[k])).toBeLessThanOrEqual(1e-12));
    });
  }

  for (const c of [CASES[6], { ...CASES[1], lattice: { kind: 'chain', length: 6, boundary: 'periodic' }, h: chiral(6, 0.35, 0.2) } as Case]) {
    it(`has orthonormal explicit vectors whose ⟨q′|H|q⟩ are the sparse block entries (${c.lattice.kind} of 6, ${c.mode})`, () => {
      const { h, basis, partition } = setup(c);
      const dim = 2 ** h.sites;
      const hm = fullMatrix(h);
      partition.blocks.forEach((b, k) => {
        const d = b.length;
        const vs = Array.from(b, (q) => explicitVector(basis, q));
        const dense = new Float64Array(2 * d * d);
        denseBlock(blockMatrix(basis, partition, k, h.terms, true)!, dense);
        for (let i = 0; i < d; i++) {
          for (let j = 0; j < d; j++) {
            let gr = 0, gi = 0, hr = 0, hi = 0;
            for (let s = 0; s < dim; s++) {
              const ar = vs[i][2 * s], ai = -vs[i][2 * s + 1]; // conj(v_i)
              gr += ar * vs[j][2 * s] - ai * vs[j][2 * s + 1];
              gi += ar * vs[j][2 * s + 1] + ai * vs[j][2 * s];
              let yr = 0, yi = 0; // (H v_j)(s)
              for (let t = 0; t < dim; t++) {
                const mr = hm[2 * (s + t * dim)], mi = hm[2 * (s + t * dim) + 1];
                yr += mr * vs[j][2 * t] - mi * vs[j][2 * t + 1];
                yi += mr * vs[j][2 * t + 1] + mi * vs[j][2 * t];
              }
              hr += ar * yr - ai * yi;
              hi += ar * yi + ai * yr;
            }
            expect(Math.abs(gr - (i === j ? 1 : 0))).toBeLessThanOrEqual(1e-13);
            expect(Math.abs(gi)).toBeLessThanOrEqual(1e-13);
            expect(Math.abs(hr - dense[2 * (i + j * d)])).toBeLessThanOrEqual(1e-13);
            expect(Math.abs(hi - dense[2 * (i + j * d) + 1])).toBeLessThanOrEqual(1e-13);
          }
        }
      });
    });
  }

  it('refuses, in strict mode, a Hamiltonian that is not invariant under the basis symmetry', () => {
    const { basis, partition } = setup(CASES[0]);
    const g = buildLattice(LatticeSchema.parse(CASES[0].lattice));
    const bent = buildHamiltonian({ model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 X1' }, { weight: 0.5, word: 'Z3' }] }, g);
    expect(() => partition.blocks.forEach((_, k) => blockMatrix(basis, partition, k, bent.terms, true))).toThrow(/not a symmetry/);
  });
});

describe('symmetriseTerms', () => {
  const c = setup(CASES[0]);
  it('maps every single-site Z_i of a ring to the same operator (1/N)·Σ Z_j, bit for bit', () => {
    const ops = [0, 3, 5].map((i) => symmetriseTerms(c.a.group, [{ x: 0, z: 1 << i, weight: 1 }]));
    for (const op of ops) {
      expect(op.map((t) => [t.x, t.z, t.weight]).sort((p, q) => p[1] - q[1])).toEqual(
        Array.from({ length: 8 }, (_, j) => [0, 1 << j, 1 / 8]));
    }
  });

  it('returns an invariant operator unchanged and averages X0 Y1 over translations and the inversion', () => {
    expect(symmetriseTerms(c.a.group, c.h.terms).length).toBe(c.h.terms.length);
    const xy = symmetriseTerms(c.a.group, [{ x: 3, z: 2, weight: 1 }]); // X0 Y1
    expect(xy).toHaveLength(16); // X_i Y_i+1 and, from the inversion, Y_i X_i+1
    for (const t of xy) expect(t.weight).toBe(1 / 16);
  });
});
