import type { SweepPlan } from '../../../../shared-types/src/index.js';

/** The chosen engine refused the spec in its plan step; carries the estimate that refused it. Never retried. */
export class SweepRefusedError extends Error {
  override readonly name = 'SweepRefusedError';
  constructor(readonly plan: SweepPlan) {
    super(`sweep refused by engine '${plan.engine}': ${plan.refusal?.message ?? plan.reason}`);
  }
}
