/**
 * Engine registry and the `auto` choice. `auto` asks each engine for a plan and takes the
 * first feasible one in order of preference, recording why in the plan's `reason`.
 */
import type { SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import type { Engine } from '../engines/engine.js';
import { ExactEngine } from '../engines/exact/index.js';

/** Engines by name, in the order `auto` prefers them. */
export const ENGINES: ReadonlyMap<string, Engine> = new Map<string, Engine>([
  ['exact', new ExactEngine()],
]);

/** The engine and plan for a spec. For `auto`, the plan's reason says why that engine. */
export function selectEngine(spec: SweepSpec): { engine: Engine; plan: SweepPlan } {
  if (spec.engine !== 'auto') {
    const engine = ENGINES.get(spec.engine);
    if (!engine) throw new RangeError(`engine '${spec.engine}' is not available; available: ${[...ENGINES.keys()].join(', ')}`);
    return { engine, plan: engine.plan(spec) };
  }
  const refusals: string[] = [];
  let first: { engine: Engine; plan: SweepPlan } | undefined;
  for (const engine of ENGINES.values()) {
    const plan = engine.plan(spec);
    first ??= { engine, plan };
    if (plan.feasible) {
      const why = refusals.length ? ` (${refusals.join('; ')})` : '';
      return { engine, plan: { ...plan, reason: `auto: ${engine.name} — ${plan.reason}${why}` } };
    }
    refusals.push(`${engine.name} refused: ${plan.refusal?.message ?? plan.reason}`);
  }
  const fallback = first!;
  return { engine: fallback.engine, plan: { ...fallback.plan, reason: `auto: no engine can run this spec — ${refusals.join('; ')}` } };
}
