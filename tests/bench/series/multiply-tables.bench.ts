/**
 * Benchmark of multiplyTables (workers/src/series/multiply-tables.ts): forming H^k for
 * transverse-field Ising Hamiltonians (hx = 0.7, hz = 0.3, J = 1, random ±10 % weights from a
 * seeded RNG so nothing cancels by accident), as used by the thermal moments.
 * Figures: products per second (|H^{k−1}|·|H| string products per call) and the table size.
 * Sizes: a 12-site chain (one-word masks, k = 2..5) and a 40-site chain (two-word masks, k = 2..3).
 * Each result feeds a checksum; a non-finite checksum fails the run.
 *
 * Run: npx tsx tests/bench/series/multiply-tables.bench.ts
 */
import { PauliTable, multiplyTables, wordsForSites } from '../../../workers/src/series/index.js';
import { type BenchRecord, median, peakRssMb, printRecords, seededRandom, timeIt } from '../bench-record.js';

function chain(n: number, rand: () => number): PauliTable {
  const terms: Array<{ sites: number[]; codes: number[]; weight: number }> = [];
  const w = (x: number) => x * (0.9 + 0.2 * rand());
  for (let i = 0; i + 1 < n; i++) terms.push({ sites: [i, i + 1], codes: [2, 2], weight: w(-1) });
  for (let i = 0; i < n; i++) terms.push({ sites: [i], codes: [1], weight: w(-0.7) }, { sites: [i], codes: [2], weight: w(-0.3) });
  return PauliTable.fromTerms(wordsForSites(n), terms);
}

/** H^k for k = 2..5 on chains of 12 and 40 sites. */
export async function run(): Promise<BenchRecord[]> {
  const records: BenchRecord[] = [];
  for (const [n, kMax] of [[12, 5], [40, 3]] as const) {
    const h = chain(n, seededRandom(n));
    let power = h;
    for (let k = 2; k <= kMax; k++) {
      let out = power;
      const times = timeIt(() => { out = multiplyTables(power, h); }, k < kMax ? 5 : 2);
      const ms = median(times);
      let checksum = 0;
      for (let q = 0; q < out.size; q++) checksum += out.re[q];
      if (!Number.isFinite(checksum)) throw new Error('non-finite checksum');
      records.push({
        label: `multiplyTables:tfim-chain-H^${k}:size=${n}`,
        medianMs: ms,
        extra: { words: h.words, products: power.size * h.size, terms: out.size, Mproducts_per_s: (power.size * h.size) / (ms * 1e3), checksum },
      });
      power = out;
    }
  }
  records.push({ label: 'process:peak-rss:size=0', medianMs: 0, extra: { peakRssMb: peakRssMb() } });
  return records;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then(printRecords).catch((e: unknown) => { console.error(e); process.exitCode = 1; });
}
