/** N = 8 square-lattice (4×2 torus) Ising quench: 4 β, 200 time points, tolerance 1e-8. Target < 60 s on one core. */
import { printRecords, type BenchRecord } from '../bench-record.js';
import { benchExactSweep } from './exact-sweep.js';

export async function run(): Promise<BenchRecord[]> {
  return benchExactSweep('square-4x2', {
    lattice: { kind: 'square', size: [4, 2], boundary: ['periodic', 'periodic'] },
    h0: { model: 'ising', J: 1, hx: 0.8 },
    h1: { model: 'ising', J: 1, hx: 2.0 },
    betas: [0.25, 0.5, 1, 2],
    times: { start: 0, stop: 4, count: 200 },
    observables: [
      { kind: 'site', pauli: 'X' },
      { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' },
      { kind: 'energy', of: 'h1' },
    ],
    engine: 'exact',
    tolerance: 1e-8,
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
