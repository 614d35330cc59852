/**
 * Test helper: validate a spec as a user would write it (parseSweepSpec: schema, semantic
 * checks, canonical form) and run it locally with runSweep. Throws with the issues if the
 * spec is rejected. Used by the reference checks to obtain engine results; the numbers the
 * results are compared with never come from here.
 */
import type { SweepResult, SweepSpecInput } from '../../../shared-types/src/index.js';

/** Parse and run a spec; the sweep runner is loaded lazily so the reference-only checks in the same file run on their own. */
export async function runReferenceSweep(input: SweepSpecInput): Promise<SweepResult> {
  const { parseSweepSpec, runSweep } = await import('../../../workers/src/sweep/index.js');
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`spec rejected: ${JSON.stringify(parsed.issues)}`);
  return runSweep(parsed.spec);
}

/** values[b][t] of the series with this label (throws if the engine did not emit it). */
export function seriesByLabel(result: SweepResult, label: string): SweepResult['series'][number] {
  const s = result.series.find((x) => x.label === label);
  if (!s) throw new Error(`no series "${label}"; have: ${result.series.map((x) => x.label).join(', ')}`);
  return s;
}
