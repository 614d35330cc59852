/**
 * Whole-sweep benchmark of the exact engine: wall time, peak RSS against the state payload,
 * and the Pauli-application throughput (state bytes read + written per doubled-operator
 * application: 2 × 16 B × 4^N) as a ratio to the triad bandwidth measured in the same run.
 */
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';
import { peakRssMb, type BenchRecord } from '../bench-record.js';
import { triadBandwidth } from '../triad.js';

export async function benchExactSweep(name: string, input: SweepSpecInput): Promise<BenchRecord[]> {
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`bench spec invalid: ${parsed.issues.map((i) => i.message).join('; ')}`);
  const triad = Number(process.env.BETASWEEP_BENCH_TRIAD_GBS) || triadBandwidth();
  const t0 = performance.now();
  // One thread: the targets are stated per core.
  const result = await runSweep(parsed.spec, { threads: 1 });
  const seconds = (performance.now() - t0) / 1000;
  const n = result.plan.sites;
  const payloadMb = (16 * 4 ** n) / 2 ** 20;
  const matvecs = result.diagnostics.reduce((s, d) => s + Number(d.extra.matvecs ?? 0), 0);
  const gbs = (matvecs * 2 * 16 * 4 ** n) / (seconds * 1e9);
  const worstError = Math.max(...result.series.flatMap((s) => s.errors.flat()));
  if (!(worstError <= parsed.spec.tolerance)) throw new Error(`error estimate ${worstError} above tolerance`);
  const rss = peakRssMb();
  return [{
    label: `sweep:exact-${name}:size=${n}`,
    medianMs: seconds * 1000,
    extra: {
      betas: result.betas.length,
      times: result.times.length,
      matvecs,
      msPerMatvec: (seconds * 1000) / matvecs,
      stateGBs: gbs,
      triadGBs: triad,
      ratio: gbs / triad,
      peakRssMb: rss,
      payloadMb,
      rssBudgetMb: 3 * payloadMb + 200,
      planSeconds: result.plan.seconds,
      worstErrorEstimate: worstError,
    },
  }];
}
