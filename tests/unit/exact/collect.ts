/**
 * Test support (not a test): run one branch of an engine and collect what it emits.
 */
import type { DiagnosticsRecord, SweepPoint, SweepSpec, SweepSpecInput, ThermoRecord } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { BranchOptions, Engine } from '../../../workers/src/engines/engine.js';

export interface Collected {
  thermo: ThermoRecord[];
  points: SweepPoint[];
  diagnostics: DiagnosticsRecord[];
}

/** Parse a spec input with defaults applied (what engines receive). */
export function spec(input: SweepSpecInput): SweepSpec {
  return SweepSpecSchema.parse(input);
}

export async function collect(engine: Engine, s: SweepSpec, betaIndices: number[], options?: BranchOptions): Promise<Collected> {
  const out: Collected = { thermo: [], points: [], diagnostics: [] };
  await engine.runBranch(s, betaIndices, {
    thermo: (r) => out.thermo.push(r),
    point: (p) => out.points.push(p),
    diagnostics: (d) => out.diagnostics.push(d),
  }, options);
  return out;
}

/** Index of the first series of observable k. */
export function seriesOf(engine: Engine, s: SweepSpec, label: string): number {
  const k = engine.series(s).findIndex((x) => x.label === label);
  if (k < 0) throw new Error(`no series "${label}" in ${engine.series(s).map((x) => x.label).join(', ')}`);
  return k;
}
