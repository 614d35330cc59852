/**
 * One engine scenario of the spectral benchmark, run in its own child process so that its peak
 * RSS (VmHWM) is its own: `npx tsx spectral-scenario.ts NAME` prints one JSON line
 * `@@scenario {...}` with the wall time, the peak RSS, the 1-minute load average before and
 * after, selected diagnostics and the points (for differences against the exact engine).
 * Specs (fixed, built outside the timed region):
 *   xxz-N      periodic XXZ ring of N, Δ 0.5 → 2, hz 0.1 in H0; β = 0.5, 2; 21 times up to t = 5;
 *              ⟨Z_i⟩ per site, connected nearest ZZ, ⟨H1⟩; tolerance 5e-8 (N = 10: the
 *              whole-space a-priori bound at d = 1024 is ≈ 1.9e-8) or 1e-6 (N ≥ 14: ≈ 4e-8 at
 *              the largest block of N = 16);
 *   ising-N    periodic transverse-field Ising ring of N, hx 0.5 → 1.5; same grid; ⟨X_i⟩ per site,
 *              nearest ZZ, ⟨H1⟩ (no conserved magnetisation).
 * Engines: spectral-{all,translations,magnetisation,none} or exact.
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import type { SweepPoint, SweepSpec } from '../../../shared-types/src/index.js';
import { SweepSpec as SweepSpecSchema } from '../../../shared-types/src/index.js';
import type { Engine } from '../../../workers/src/engines/engine.js';
import { ExactEngine } from '../../../workers/src/engines/exact/index.js';
import { SpectralEngine } from '../../../workers/src/engines/spectral/index.js';
import type { SymmetryMode } from '../../../workers/src/symmetry/index.js';
import { peakRssMb } from '../bench-record.js';

/** What one scenario reports. */
export interface ScenarioResult {
  ms: number;
  peakRssMb: number;
  loadBefore: number;
  loadAfter: number;
  planSeconds: number;
  extra: Record<string, number | string | boolean | null>;
  points: SweepPoint[];
}

/** The spec of a scenario's model and size, e.g. 'xxz' and 10. */
export function scenarioSpec(model: 'xxz' | 'ising', n: number): SweepSpec {
  const common = {
    lattice: { kind: 'chain', length: n, boundary: 'periodic' },
    betas: [0.5, 2], times: { start: 0, stop: 5, count: 21 },
  } as const;
  if (model === 'xxz') {
    return SweepSpecSchema.parse({
      ...common, h0: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 }, h1: { model: 'xxz', J: 1, delta: 2 },
      observables: [{ kind: 'site', pauli: 'Z', perSite: true }, { kind: 'pair', paulis: 'ZZ', connected: true }, { kind: 'energy', of: 'h1' }],
      tolerance: n >= 14 ? 1e-6 : 5e-8,
    });
  }
  return SweepSpecSchema.parse({
    ...common, h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
    observables: [{ kind: 'site', pauli: 'X', perSite: true }, { kind: 'pair', paulis: 'ZZ' }, { kind: 'energy', of: 'h1' }],
    tolerance: 5e-8,
  });
}

/** Runs one scenario, e.g. ('spectral-all', 'xxz', 14). */
export async function runScenario(engineName: string, model: 'xxz' | 'ising', n: number): Promise<ScenarioResult> {
  const engine: Engine = engineName === 'exact'
    ? new ExactEngine()
    : new SpectralEngine({ symmetry: engineName.replace('spectral-', '') as SymmetryMode });
  const s = scenarioSpec(model, n);
  const plan = engine.plan(s);
  if (!plan.feasible) throw new Error(`${engineName} refused ${model}-${n}: ${plan.refusal?.message}`);
  const points: SweepPoint[] = [];
  let extra: Record<string, number | string | boolean | null> = {};
  const loadBefore = loadavg()[0];
  const t0 = performance.now();
  for (const branch of plan.branches) {
    await engine.runBranch(s, branch, {
      thermo: () => undefined,
      point: (p) => points.push(p),
      diagnostics: (d) => { extra = d.extra; },
    });
  }
  const ms = performance.now() - t0;
  return { ms, peakRssMb: peakRssMb(), loadBefore, loadAfter: loadavg()[0], planSeconds: plan.seconds, extra, points };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const [engineName, model, n] = process.argv.slice(2);
  runScenario(engineName, model as 'xxz' | 'ising', Number(n))
    .then((r) => process.stdout.write(`\n@@scenario ${JSON.stringify(r)}\n`))
    .catch((e) => { console.error(e); process.exitCode = 1; });
}
