/**
 * Test support (not a test): run one branch of an engine, collect what it emits, and compare
 * two engines' points.
 */
import type { DiagnosticsRecord, SweepPoint, SweepSpec, SweepSpecInput, ThermoRecord } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { BranchOptions, BranchSink, Engine } from '../../../workers/src/engines/engine.js';

export interface Collected {
  thermo: ThermoRecord[];
  points: SweepPoint[];
  diagnostics: DiagnosticsRecord[];
}

/** Parse a spec input with defaults applied (what engines receive). */
export function spec(input: SweepSpecInput): SweepSpec {
  return SweepSpecSchema.parse(input);
}

/** A sink that stores everything in `out`. */
export function sinkInto(out: Collected): BranchSink {
  return {
    thermo: (r) => out.thermo.push(r),
    point: (p) => out.points.push(p),
    diagnostics: (d) => out.diagnostics.push(d),
  };
}

export async function collect<O extends BranchOptions>(
  engine: Engine & { runBranch(s: SweepSpec, b: number[], sink: BranchSink, o?: O): Promise<void> },
  s: SweepSpec, betaIndices: number[], options?: O,
): Promise<Collected> {
  const out: Collected = { thermo: [], points: [], diagnostics: [] };
  await engine.runBranch(s, betaIndices, sinkInto(out), options);
  return out;
}

/** max |a − b| over every value of matching points (same β and time index), and the largest error bar of `b`. */
export function compare(a: Collected, b: Collected, series?: readonly number[]): { diff: number; bar: number; count: number } {
  let diff = 0;
  let bar = 0;
  let count = 0;
  for (const p of a.points) {
    const q = b.points.find((x) => x.betaIndex === p.betaIndex && x.timeIndex === p.timeIndex);
    if (q === undefined) throw new Error(`no point (β ${p.betaIndex}, t ${p.timeIndex}) in the second run`);
    const ks = series ?? p.values.map((_, k) => k);
    for (const k of ks) {
      diff = Math.max(diff, Math.abs(p.values[k] - q.values[k]));
      bar = Math.max(bar, q.errors[k]);
      count++;
    }
  }
  return { diff, bar, count };
}

/** Index of a series by label. */
export function seriesIndex(engine: Engine, s: SweepSpec, label: string): number {
  const k = engine.series(s).findIndex((x) => x.label === label);
  if (k < 0) throw new Error(`no series "${label}" in ${engine.series(s).map((x) => x.label).join(', ')}`);
  return k;
}
