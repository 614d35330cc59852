/**
 * What the API needs from the sweep runner: validate and canonicalise a spec, plan it, list
 * the engines, and write a result as CSV. The default loads the runner (and its engines)
 * on first use; tests may pass their own.
 */
import type { SpecIssue, SweepHeader, SweepPlan, SweepResult, SweepSpec } from '../../../shared-types/src/index.js';

export type PlannerParse =
  | { success: true; spec: SweepSpec; hash: string }
  | { success: false; issues: SpecIssue[] };

export interface Planner {
  parse(input: unknown): PlannerParse;
  plan(spec: SweepSpec, hash: string): { plan: SweepPlan; header: SweepHeader };
  engines(): Array<{ name: string; version: string; description: string }>;
  toCsv(result: SweepResult): string;
}

/** One-line descriptions of the engines the catalogue lists. */
const DESCRIPTIONS: Record<string, string> = {
  exact: 'the doubled state vector with matrix-free Pauli kernels; Chebyshev/Lanczos propagators with error control',
  typical: 'random-phase vectors for the auxiliary trace (canonical typicality); jackknife error bars',
  'free-fermion': 'Gaussian states for models quadratic under Jordan-Wigner (Ising and XY chains)',
  mps: 'purified matrix-product state with TEBD; truncation reported',
  series: 'high-temperature and short-time series by Pauli-string algebra, with Padé',
};

/** The sweep runner as a Planner (imports it, and so every engine, on first call). */
export async function loadSweepPlanner(): Promise<Planner> {
  const runner = await import('../../../workers/src/sweep/index.js');
  return {
    parse: (input) => runner.parseSweepSpec(input),
    plan(spec, hash) {
      const { engine, plan } = runner.selectEngine(spec);
      return { plan, header: runner.sweepHeader(spec, hash, engine, plan) };
    },
    engines: () => [...runner.ENGINES.values()].map((e) => ({ name: e.name, version: e.version, description: DESCRIPTIONS[e.name] ?? e.name })),
    toCsv: (result) => runner.resultToCsv(result),
  };
}
