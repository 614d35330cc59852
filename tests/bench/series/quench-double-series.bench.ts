/**
 * Benchmark of the quench double series (workers/src/series: computeSweepSeries) for an
 * N = 16 cluster: ⟨Z_i Z_j⟩(t) on nearest-neighbour pairs of a periodic 4×4 square lattice,
 * H0 = Ising (J = 1, hx = 0.5), H1 = Ising (J = 1, hx = 1.5), double series in (t, β) to total
 * orders K = 4, 6, 8, by the whole-cluster route (moments on all 16 sites) and by the
 * linked-cluster route (translation-reduced: two distinct primitives, x- and y-bonds).
 * Each series feeds a checksum; a non-finite checksum fails the run.
 *
 * Run: npx tsx tests/bench/series/quench-double-series.bench.ts
 */
import { SweepSpec } from '../../../shared-types/src/index.js';
import { computeSweepSeries } from '../../../workers/src/series/index.js';
import { type BenchRecord, peakRssMb, printRecords } from '../bench-record.js';

const spec = SweepSpec.parse({
  lattice: { kind: 'square', size: [4, 4], boundary: ['periodic', 'periodic'] },
  h0: { model: 'ising', J: 1, hx: 0.5, hz: 0 },
  h1: { model: 'ising', J: 1, hx: 1.5, hz: 0 },
  betas: [0.1], times: { values: [0.1] },
  observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
});

/** K = 4, 6, 8 by both routes (see file header). */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const method of ['whole-cluster', 'linked-cluster'] as const) {
    for (const K of [4, 6, 8]) {
      const t0 = performance.now();
      const s = computeSweepSeries(spec, { thermoOrder: 2, quenchOrder: K, method });
      const ms = performance.now() - t0;
      const checksum = s.series[0].coefficients.reduce((a, v) => a + v, 0);
      if (!Number.isFinite(checksum)) throw new Error('non-finite checksum');
      records.push({
        label: `quenchDoubleSeries:${method}-ZZ-K=${K}:size=16`,
        medianMs: ms,
        extra: { totalOrder: K, primitives: s.stats.primitives, distinct: s.stats.distinctPrimitives, clustersSolved: s.stats.solved, checksum },
      });
    }
  }
  records.push({ label: 'process:peak-rss:size=0', medianMs: 0, extra: { peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
