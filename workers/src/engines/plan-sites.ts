/**
 * planSites — the first check of a plan: the lattice's site count, or the plan's refusal
 * (field 'lattice') when the lattice cannot be built (limit and estimate 0) or has more sites
 * than the engine takes (limit maxSites, estimate the sites). The refusal message reads
 * "<what the engine holds> and is limited to <maxSites> sites; this lattice has <N>".
 */
import type { SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import { buildLattice } from '../lattice/build-lattice.js';
import { refusePlan } from './plan-refusal.js';
import type { PlanDraft } from './plan-refusal.js';

/** The site count, or the refused plan (as zod's safeParse: branch on `ok`). */
export type SitesCheck =
  | { readonly ok: true; readonly sites: number }
  | { readonly ok: false; readonly plan: SweepPlan };

/**
 * Sites of the spec's lattice, or the refusal (see the file header).
 * @param holds - what the engine holds that limits it, e.g. 'the exact engine holds 4^N amplitudes'.
 */
export function planSites(spec: SweepSpec, draft: PlanDraft, maxSites: number, holds: string): SitesCheck {
  let sites: number;
  try {
    sites = buildLattice(spec.lattice).sites;
  } catch (e) {
    return { ok: false, plan: refusePlan(draft, 0, 'lattice', 0, 0, `the lattice cannot be built: ${(e as Error).message}`) };
  }
  if (sites > maxSites) {
    return { ok: false, plan: refusePlan(draft, sites, 'lattice', maxSites, sites,
      `${holds} and is limited to ${maxSites} sites; this lattice has ${sites}`) };
  }
  return { ok: true, sites };
}
