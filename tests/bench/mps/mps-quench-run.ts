/**
 * Child process of tests/bench/mps/mps.bench.ts (not a bench module itself): one β of the
 * L = 64 Ising quench, so that the peak RSS it reports belongs to that β alone.
 *
 *   npx tsx tests/bench/mps/mps-quench-run.ts BETA TMAX BUDGET_SECONDS
 *
 * H0 Ising J = 1, hx = 1.2 → H1 hx = 1.0, t = 0, 0.5, …, TMAX, χ ≤ 64, discarded weight
 * ≤ 1e-12 per update, fourth order, dt = 0.05. The run is aborted after BUDGET_SECONDS of wall
 * time (0: no budget); the record then says how far it got (tReached). Checkpoints go through
 * the engine's hook every 60 s (kept in memory: the size of the last one and the time to encode
 * it again are reported, and it gives the bond dimensions of an aborted run). The free-fermion engine (Lieb,
 * Schultz & Mattis 1961; Pfeuty 1970) gives the reference values. Prints `@@quench {record}`.
 */
import { SweepSpec } from '../../../shared-types/src/index.js';
import type { SweepPoint } from '../../../shared-types/src/index.js';
import type { BranchCheckpoints } from '../../../workers/src/engines/engine.js';
import { FreeFermionEngine } from '../../../workers/src/engines/free-fermion/index.js';
import { decodeCheckpoint, encodeCheckpoint, MpsEngine } from '../../../workers/src/engines/mps/index.js';
import { type BenchRecord, peakRssMb } from '../bench-record.js';

const [beta, tmax, budget] = process.argv.slice(2, 5).map(Number);
const spec = SweepSpec.parse({
  lattice: { kind: 'chain', length: 64 },
  h0: { model: 'ising', J: 1, hx: 1.2 },
  h1: { model: 'ising', J: 1, hx: 1.0 },
  betas: [beta],
  times: { start: 0, stop: tmax, count: Math.round(tmax / 0.5) + 1 },
  observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ', perPair: true }],
  tolerance: 1e-5,
  mps: { maxBond: 64, truncation: 1e-12, trotterOrder: 4, dt: 0.05 },
});

const reference: SweepPoint[] = [];
await new FreeFermionEngine().runBranch(spec, [0], { thermo() {}, point: (p) => reference.push(p), diagnostics() {} });

const points: SweepPoint[] = [];
let extra: Record<string, unknown> = {};
let last: Uint8Array | null = null;
let saves = 0;
const checkpoints: BranchCheckpoints = {
  intervalSeconds: 60,
  load: async () => null,
  save: async (d) => {
    last = d;
    saves++;
  },
};
const stop = new AbortController();
const timer = budget > 0 ? setTimeout(() => stop.abort(), budget * 1000) : null;
const t0 = performance.now();
let aborted = false;
try {
  await new MpsEngine().runBranch(spec, [0], {
    thermo() {},
    point: (p) => {
      points.push(p);
      if (process.env.BENCH_MPS_PROGRESS) console.error(`  β ${beta}: t index ${p.timeIndex} after ${((performance.now() - t0) / 1000).toFixed(0)} s`);
    },
    diagnostics: (d) => { extra = d.extra; },
  }, { signal: stop.signal, checkpoints });
} catch (e) {
  if ((e as Error).name !== 'AbortError') throw e;
  aborted = true;
}
const ms = performance.now() - t0;
if (timer) clearTimeout(timer);

const dev: number[] = [];
const bar: number[] = [];
for (const p of points) {
  const q = reference.find((x) => x.timeIndex === p.timeIndex)!;
  let d = 0;
  let e = 0;
  p.values.forEach((v, k) => {
    if (!Number.isFinite(v)) throw new Error('NaN in the mps values');
    d = Math.max(d, Math.abs(v - q.values[k]));
    e = Math.max(e, p.errors[k]);
  });
  dev.push(d);
  bar.push(e);
}
let within = -1;
for (let k = 0; k < dev.length && dev[k] <= 1e-5; k++) within = k;
const lastCheckpoint = last === null ? null : decodeCheckpoint(last);
let encodeMs = 0;
if (lastCheckpoint !== null) {
  const t = performance.now();
  encodeCheckpoint(lastCheckpoint);
  encodeMs = performance.now() - t;
}
const bonds = aborted
  ? (lastCheckpoint?.kind === 'quench' ? lastCheckpoint.progress.bondByTime.join(',') : '')
  : String(extra.bondByTime);
const record: BenchRecord = {
  label: `mps:ising-quench:beta=${beta}:size=64`,
  medianMs: ms,
  extra: {
    peakRssMb: peakRssMb(),
    tReached: points.length ? points[points.length - 1].timeIndex * 0.5 : -1,
    aborted: aborted ? `after ${budget} s` : 'no',
    tWithin1e5: within < 0 ? -1 : within * 0.5,
    maxDeviation: dev.length ? Math.max(...dev) : -1,
    deviationByTime: dev.map((x) => x.toExponential(1)).join(','),
    errorBarByTime: bar.map((x) => x.toExponential(1)).join(','),
    bondByTime: bonds,
    checkpointMb: last === null ? 0 : (last as Uint8Array).byteLength / 2 ** 20,
    checkpointSaves: saves,
    checkpointEncodeMs: encodeMs,
    ...(aborted ? {} : {
      discardedWeightSum: Number(extra.discardedWeightSum),
      trotterErrorEstimate: Number(extra.trotterErrorEstimate),
      updates: Number(extra.imaginaryUpdates) + Number(extra.realUpdates),
    }),
  },
};
process.stdout.write(`\n@@quench ${JSON.stringify(record)}\n`);
