/**
 * `npm run bench [filter]`: runs every tests/bench/**\/*.bench.ts in its own child process (so
 * peak RSS is per scenario), after measuring the triad bandwidth once for the ratios.
 * Prints one table; `--json FILE` also writes the records.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { printRecords, type BenchRecord } from './bench-record.js';
import { triadBandwidth } from './triad.js';

function benchFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) return benchFiles(p);
    return name.endsWith('.bench.ts') ? [p] : [];
  }).sort();
}

const args = process.argv.slice(2);
const jsonIdx = args.indexOf('--json');
const jsonOut = jsonIdx >= 0 ? args[jsonIdx + 1] : undefined;
const filter = args.filter((_, i) => jsonIdx < 0 || (i !== jsonIdx && i !== jsonIdx + 1))[0];
const root = join(import.meta.dirname, '.');
const files = benchFiles(root).filter((f) => !filter || f.includes(filter));

const triad = triadBandwidth();
console.log(`triad bandwidth (median of 7, 3 × 2^24 doubles): ${triad.toFixed(2)} GB/s\n`);
const all: BenchRecord[] = [{ label: 'memory:triad:size=16777216', medianMs: 0, extra: { GBs: triad } }];
let failed = 0;
for (const file of files) {
  const rel = relative(process.cwd(), file);
  console.log(`== ${rel}`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(root, 'run-one.ts'), file], {
    encoding: 'utf8',
    env: { ...process.env, BETASWEEP_BENCH_TRIAD_GBS: String(triad) },
    maxBuffer: 64 * 2 ** 20,
  });
  const line = r.stdout.split('\n').find((l) => l.startsWith('@@records '));
  if (r.status !== 0 || !line) {
    failed++;
    console.log(`   FAILED (exit ${r.status}): ${r.stderr.trim().split('\n').slice(-3).join(' | ')}`);
    continue;
  }
  const records = JSON.parse(line.slice('@@records '.length)) as BenchRecord[];
  printRecords(records);
  all.push(...records);
}
if (jsonOut) writeFileSync(jsonOut, JSON.stringify(all, null, 2));
if (failed) {
  console.error(`${failed} benchmark file(s) failed`);
  process.exitCode = 1;
}
