/** Helpers shared by the service tests and the service benchmark (no vitest imports here). */
import type { SweepSpecInput } from '../../../shared-types/src/index.js';
import { parseSweepSpec, selectEngine, sweepHeader } from '../../../workers/src/sweep/index.js';

/** What the store needs to create a sweep for `input` (as the API builds it). */
export async function newSweepFor(input: SweepSpecInput, owner = 'tester') {
  const parsed = parseSweepSpec(input);
  if (!parsed.success) throw new Error(`spec invalid: ${JSON.stringify(parsed.issues)}`);
  const { engine, plan } = selectEngine(parsed.spec);
  return { owner, spec: parsed.spec, specHash: parsed.hash, plan, header: sweepHeader(parsed.spec, parsed.hash, engine, plan) };
}
