/**
 * Test helper: validate a spec as a user would write it and run every branch of one engine
 * through its runBranch, collecting thermodynamics, series tables and diagnostics.
 */
import type {
  DiagnosticsRecord, SweepPlan, SweepSpec, SweepSpecInput, ThermoRecord,
} from '../../../shared-types/src/index.js';
import type { Engine } from '../../../workers/src/engines/engine.js';
import { parseSweepSpec } from '../../../workers/src/sweep/parse-sweep-spec.js';

/** What a run produced, indexed by canonical β index and time index. */
export interface EngineRun {
  spec: SweepSpec;
  plan: SweepPlan;
  labels: string[];
  thermo: ThermoRecord[];
  /** values[b][t][k] for series k. */
  values: number[][][];
  errors: number[][][];
  diagnostics: DiagnosticsRecord[];
}

/** Parses `input` (throws with the issues if invalid). */
export function parseSpec(input: SweepSpecInput): SweepSpec {
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`spec rejected: ${JSON.stringify(parsed.issues)}`);
  return parsed.spec;
}

/** Parses `input`, plans and runs every branch of `engine` (throws if the plan refuses). */
export async function runEngine(engine: Engine, input: SweepSpecInput | SweepSpec): Promise<EngineRun> {
  const spec = parseSpec(input as SweepSpecInput);
  const plan = engine.plan(spec);
  if (!plan.feasible) throw new Error(`plan refused: ${JSON.stringify(plan.refusal)}`);
  const labels = engine.series(spec).map((s) => s.label);
  const thermo: ThermoRecord[] = [];
  const values: number[][][] = [];
  const errors: number[][][] = [];
  const diagnostics: DiagnosticsRecord[] = [];
  for (const branch of plan.branches) {
    await engine.runBranch(spec, branch, {
      thermo: (r) => { thermo[r.betaIndex] = r; },
      point: (p) => {
        (values[p.betaIndex] ??= [])[p.timeIndex] = p.values;
        (errors[p.betaIndex] ??= [])[p.timeIndex] = p.errors;
      },
      diagnostics: (d) => { diagnostics[d.betaIndex] = d; },
    });
  }
  return { spec, plan, labels, thermo, values, errors, diagnostics };
}

/** Index of a series label (throws if missing). */
export function seriesIndex(run: EngineRun, label: string): number {
  const k = run.labels.indexOf(label);
  if (k < 0) throw new Error(`no series "${label}"; have ${run.labels.join(', ')}`);
  return k;
}
