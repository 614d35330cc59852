/**
 * Engine registry and the `auto` choice. `auto` asks every registered engine for a plan and
 * takes, among the feasible plans whose promised accuracy meets the spec's tolerance, the one
 * with the smallest estimated time (ties go to the earlier engine in ENGINES, which lists
 * exact methods first). The plan's `reason` names the choice and what the others said.
 */
import type { SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import type { Engine } from '../engines/engine.js';
import { ExactEngine } from '../engines/exact/index.js';
import { SpectralEngine } from '../engines/spectral/index.js';
import { FreeFermionEngine } from '../engines/free-fermion/index.js';
import { SeriesEngine } from '../engines/series/index.js';
import { MpsEngine } from '../engines/mps/index.js';
import { TypicalEngine } from '../engines/typical/index.js';

/** Engines by name, in the order `auto` prefers them on equal estimated time. */
export const ENGINES: ReadonlyMap<string, Engine> = new Map<string, Engine>([
  ['free-fermion', new FreeFermionEngine()],
  ['spectral', new SpectralEngine()],
  ['exact', new ExactEngine()],
  ['mps', new MpsEngine()],
  ['typical', new TypicalEngine()],
  // The cross-check engine comes last: auto takes it only when nothing exact can run.
  ['series', new SeriesEngine()],
]);

const fmtSeconds = (s: number) => (s < 1 ? `${(s * 1000).toFixed(0)} ms` : `${s.toPrecision(2)} s`);

/** The engine and plan for a spec. For `auto`, the plan's reason says why that engine. */
export function selectEngine(spec: SweepSpec): { engine: Engine; plan: SweepPlan } {
  if (spec.engine !== 'auto') {
    const engine = ENGINES.get(spec.engine);
    if (!engine) {
      // A name the schema knows but this build has not registered: a refusal, not a crash.
      const fallback = ENGINES.values().next().value as Engine;
      const plan = fallback.plan(spec);
      const message = `engine '${spec.engine}' is not available in this build; available: ${[...ENGINES.keys()].join(', ')}`;
      return {
        engine: fallback,
        plan: { ...plan, engine: spec.engine, feasible: false, reason: message, refusal: { field: 'engine', limit: 0, estimate: 0, message } },
      };
    }
    return { engine, plan: engine.plan(spec) };
  }
  const plans = [...ENGINES.values()].map((engine) => ({ engine, plan: engine.plan(spec) }));
  const usable = plans.filter((p) => p.plan.feasible && p.plan.accuracy <= spec.tolerance);
  const notes = plans.map(({ engine, plan }) => (plan.feasible
    ? `${engine.name} ~${fmtSeconds(plan.seconds)}${plan.accuracy > spec.tolerance ? ` but only ±${plan.accuracy.toExponential(1)}` : ''}`
    : `${engine.name} refused: ${plan.refusal?.message ?? plan.reason}`));
  if (usable.length === 0) {
    const first = plans[0];
    const message = `auto: no engine can meet tolerance ${spec.tolerance} within its limits — ${notes.join('; ')}`;
    return {
      engine: first.engine,
      plan: {
        ...first.plan, engine: 'auto', feasible: false, reason: message,
        refusal: first.plan.refusal ?? { field: 'tolerance', limit: spec.tolerance, estimate: Math.min(...plans.map((p) => p.plan.accuracy)), message },
      },
    };
  }
  const best = usable.reduce((a, b) => (b.plan.seconds < a.plan.seconds ? b : a));
  const others = notes.filter((_, i) => plans[i] !== best);
  const why = `auto: ${best.engine.name} — fastest estimate (~${fmtSeconds(best.plan.seconds)}) meeting tolerance ` +
    `${spec.tolerance}: ${best.plan.reason}${others.length ? ` | others: ${others.join('; ')}` : ''}`;
  return { engine: best.engine, plan: { ...best.plan, reason: why } };
}
