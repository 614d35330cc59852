/** N = 10 open Ising chain quench: 4 β, 100 time points, tolerance 1e-8 (time reported; no target). */
import { printRecords, type BenchRecord } from '../bench-record.js';
import { benchExactSweep } from './exact-sweep.js';

export async function run(): Promise<BenchRecord[]> {
  return benchExactSweep('chain-10', {
    lattice: { kind: 'chain', length: 10, boundary: 'open' },
    h0: { model: 'ising', J: 1, hx: 0.5 },
    h1: { model: 'ising', J: 1, hx: 1.5 },
    betas: [0.25, 0.5, 1, 2],
    times: { start: 0, stop: 2, count: 100 },
    observables: [
      { kind: 'site', pauli: 'X' },
      { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' },
    ],
    engine: 'exact',
    tolerance: 1e-8,
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
