/**
 * Benchmark of the symmetry-adapted basis (workers/src/symmetry): for periodic XXZ rings of
 * N = 12 … 20 with magnetisation, translations and inversion,
 *   sector-basis:build     orbit tables and vectors (sectorBasis + sectorPartition), O(2^N·|G|);
 *   block-matrix:largest   the sparse block of H of the largest block, O(d·T).
 * Median of 3 after a warm-up; the vector count (with multiplicities = 2^N) and the number of
 * stored entries are checked and reported, so nothing is optimised away.
 *
 * Run: npx tsx tests/bench/symmetry/sector-basis.bench.ts
 */
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import { buildLattice } from '../../../workers/src/lattice/build-lattice.js';
import { buildHamiltonian } from '../../../workers/src/physics/build-hamiltonian.js';
import {
  analyseSymmetry, blockMatrix, blockSector, sectorBasis, sectorPartition,
} from '../../../workers/src/symmetry/index.js';
import type { BasisPartition, SectorBasis } from '../../../workers/src/symmetry/index.js';
import { type BenchRecord, median, printRecords, timeIt } from '../bench-record.js';

const SIZES = [12, 14, 16, 18, 20];

/** Benchmarks at every size. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const n of SIZES) {
    const s = SweepSpecSchema.parse({
      lattice: { kind: 'chain', length: n, boundary: 'periodic' }, h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 },
      h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 }, betas: [1], times: { values: [0] }, observables: [{ kind: 'energy', of: 'h0' }],
    });
    const h = buildHamiltonian(s.h0, buildLattice(s.lattice));
    const a = analyseSymmetry(s.lattice, h, h, 'all');
    let basis: SectorBasis | null = null;
    let partition: BasisPartition | null = null;
    const build = timeIt(() => {
      basis = sectorBasis(a.group, a.sectors);
      partition = sectorPartition(basis, true, a.label);
    }, 3);
    const b = basis!;
    const p = partition!;
    const spanned = p.blocks.reduce((acc, blk, k) => acc + blk.length * blockSector(b, p, k).multiplicity, 0);
    if (spanned !== 2 ** n) throw new Error(`basis spans ${spanned} states, not 2^${n}`);
    records.push({ label: `sector-basis:build:size=${n}`, medianMs: median(build), extra: { vectors: b.count, blocks: p.blocks.length, groupOrder: a.group.elements.length } });
    let largest = 0;
    p.blocks.forEach((blk, k) => { if (blk.length > p.blocks[largest].length) largest = k; });
    let entries = 0;
    const matrix = timeIt(() => { entries = blockMatrix(b, p, largest, h.terms, true)!.row.length; }, 3);
    if (!(entries > 0)) throw new Error('empty block');
    records.push({ label: `block-matrix:largest:size=${n}`, medianMs: median(matrix), extra: { d: p.blocks[largest].length, entries, terms: h.terms.length } });
  }
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e) => { console.error(e); process.exitCode = 1; });
}
