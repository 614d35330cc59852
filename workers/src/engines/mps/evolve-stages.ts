/**
 * evolveStages — runs a list of Trotter stages (trotter-schedule.ts) on a purified MPS.
 *
 * A stage applies the gates of one layer (even bonds 0, 2, … or odd bonds 1, 3, …). Gates of a
 * layer are applied in a sweep whose direction follows the orthogonality centre: ascending
 * bonds with the centre moving right when it sits in the left half, descending otherwise, so
 * the centre is always inside the gate (optimal truncation) and only one centre move is needed
 * between consecutive gates of a layer. Gates come from `gatesFor(weight)`, which the caller
 * caches per distinct weight. Norm growth (imaginary time) is accumulated as a log; discarded
 * weights are accumulated into `stats`.
 */
import { applyBondGate, applySiteGate } from './apply-gate.js';
import type { GateWorkspace, Truncation } from './apply-gate.js';
import { moveCenterLeft, moveCenterRight } from './move-center.js';
import type { MoveWorkspace } from './move-center.js';
import type { PurifiedMps } from './purified-mps.js';
import type { TrotterStage } from './trotter-schedule.js';

/** Running totals of an evolution. */
export interface EvolutionStats {
  /** Σ ln(norm growth) of the gates. */
  lnNorm: number;
  /** Σ of relative discarded weights. */
  discardedSum: number;
  /** Σ of √(relative discarded weight) (a rigorous bound on the state error from truncation). */
  discardedRootSum: number;
  /** Largest relative discarded weight of one gate. */
  maxDiscarded: number;
  /** Largest bond dimension reached. */
  maxBond: number;
  /** Gates applied. */
  gates: number;
}

/** Zeroed totals. */
export function emptyStats(): EvolutionStats {
  return { lnNorm: 0, discardedSum: 0, discardedRootSum: 0, maxDiscarded: 0, maxBond: 1, gates: 0 };
}

/** Workspaces of an evolution. */
export interface EvolveWorkspace {
  readonly gate: GateWorkspace;
  readonly move: MoveWorkspace;
}

/**
 * Applies `stages` in order. `gatesFor(weight)` returns the gates of time weight·τ: one per
 * bond b (index b) or a single site gate when the chain has one site.
 */
export function evolveStages(
  mps: PurifiedMps, stages: readonly { layer: 0 | 1; weight: number }[] | readonly TrotterStage[],
  gatesFor: (weight: number) => readonly Float64Array[], truncation: Truncation,
  ws: EvolveWorkspace, stats: EvolutionStats,
): void {
  const out = new Float64Array(2);
  const bonds = mps.sites - 1;
  for (const st of stages) {
    const gates = gatesFor(st.weight);
    if (bonds === 0) {
      applySiteGate(mps, 0, gates[0], out);
      stats.lnNorm += out[0];
      stats.gates++;
      continue;
    }
    const first = st.layer;
    if (first > bonds - 1) continue;
    const last = first + 2 * Math.floor((bonds - 1 - first) / 2);
    const ascending = mps.center <= (first + last + 1) / 2;
    for (let k = 0; k <= (last - first) / 2; k++) {
      const b = ascending ? first + 2 * k : last - 2 * k;
      while (mps.center < b) moveCenterRight(mps, ws.move);
      while (mps.center > b + 1) moveCenterLeft(mps, ws.move);
      applyBondGate(mps, b, gates[b], ascending ? 'right' : 'left', truncation, ws.gate, out);
      stats.lnNorm += out[0];
      stats.discardedSum += out[1];
      stats.discardedRootSum += Math.sqrt(out[1]);
      if (out[1] > stats.maxDiscarded) stats.maxDiscarded = out[1];
      if (mps.dims[b + 1] > stats.maxBond) stats.maxBond = mps.dims[b + 1];
      stats.gates++;
    }
  }
}
