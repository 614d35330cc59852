/**
 * refusePlan — a plan that refuses its spec (DESIGN.md §3): the draft's cost figures as far as
 * the engine got, `feasible: false`, and the refusal naming the field, its limit and the
 * estimate that broke it.
 */
import type { SweepPlan } from '../../../shared-types/src/index.js';

/** A plan before its verdict: every field but `feasible`, `refusal` and `sites`. */
export type PlanDraft = Omit<SweepPlan, 'feasible' | 'refusal' | 'sites'>;

/** The refused plan (see the file header); `sites` is 0 when the lattice could not be built. */
export function refusePlan(
  draft: PlanDraft, sites: number, field: string, limit: number, estimate: number, message: string,
): SweepPlan {
  return { ...draft, feasible: false, refusal: { field, limit, estimate, message }, sites };
}
