/**
 * branchOrder — the β bookkeeping every engine does before it runs a branch: the spec's β grid
 * (betaGrid: ascending, repeats removed) and the branch's β indices checked against it, with
 * repeats dropped and sorted by ascending β, the order runBranch runs them in (engine.ts).
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { betaGrid } from '../sweep/beta-grid.js';

/** The β grid of a spec and a branch's β indices in run order. */
export interface BranchOrder {
  /** The spec's β grid; a point's `betaIndex` refers to it. */
  readonly betas: number[];
  /** The branch's distinct β indices, ascending in β (empty when the branch has none). */
  readonly order: number[];
}

/** The β grid and run order of a branch. @throws RangeError naming an index outside the β grid. */
export function branchOrder(spec: SweepSpec, betaIndices: readonly number[]): BranchOrder {
  const betas = betaGrid(spec);
  for (const b of betaIndices) {
    if (!Number.isInteger(b) || b < 0 || b >= betas.length) {
      throw new RangeError(`betaIndices: ${b} is not an index of the β grid (0..${betas.length - 1})`);
    }
  }
  const order = [...new Set(betaIndices)].sort((p, q) => betas[p] - betas[q]);
  return { betas, order };
}
