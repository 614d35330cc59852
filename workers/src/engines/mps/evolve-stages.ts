/**
 * evolveStages — runs a list of Trotter stages (trotter-schedule.ts) on a purified MPS.
 *
 * Layers 0 and 1 are the neighbour bonds (even bonds 0, 2, … and odd bonds 1, 3, …). Their
 * gates are applied in a sweep whose direction follows the orthogonality centre: ascending
 * bonds with the centre moving right when it sits in the left half, descending otherwise, so
 * the centre is always inside the gate (optimal truncation) and only one centre move is needed
 * between consecutive gates of a layer. Layers 2, 3, … are the layers of long bonds
 * (bond-model.ts), each gate applied through swap gates (apply-long-gate.ts), in the same
 * centre-following order. Gates come from `gatesFor(weight)`, which the caller caches per
 * distinct weight. Norm growth (imaginary time) is accumulated as a log; discarded weights are
 * accumulated into `stats`.
 */
import { applyBondGate, applySiteGate } from './apply-gate.js';
import type { GateWorkspace, Truncation } from './apply-gate.js';
import { applyLongGate, recordUpdate } from './apply-long-gate.js';
import type { LongBond } from './bond-model.js';
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
  /** Two-site updates applied (gates and swaps). */
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

/** The gates of one stage time: neighbour bonds (or the single site gate) and long bonds. */
export interface StageGates {
  /** One per neighbour bond b (index b), or a single 4×4 site gate when the chain has one site. */
  readonly bonds: readonly Float64Array[];
  /** One per long bond of the layout (same order). */
  readonly long: readonly Float64Array[];
}

/** The long bonds of a model and their layers (bond-model.ts), with the swap gate. */
export interface LongLayout {
  readonly long: readonly LongBond[];
  readonly longLayers: readonly (readonly number[])[];
  readonly swap: Float64Array | null;
}

const NO_LONG: LongLayout = { long: [], longLayers: [], swap: null };

/** Applies `stages` in order (see the file header). */
export function evolveStages(
  mps: PurifiedMps, stages: readonly TrotterStage[], gatesFor: (weight: number) => StageGates, truncation: Truncation,
  ws: EvolveWorkspace, stats: EvolutionStats, layout: LongLayout = NO_LONG,
): void {
  const out = new Float64Array(2);
  const bonds = mps.sites - 1;
  for (const st of stages) {
    const gates = gatesFor(st.weight);
    if (bonds === 0) {
      applySiteGate(mps, 0, gates.bonds[0], out);
      stats.lnNorm += out[0];
      stats.gates++;
      continue;
    }
    if (st.layer >= 2) {
      const members = layout.longLayers[st.layer - 2];
      if (members === undefined || layout.swap === null) throw new RangeError(`evolveStages: no layer ${st.layer} of long bonds`);
      const mid = (layout.long[members[0]].left + layout.long[members[members.length - 1]].right) / 2;
      const ascending = mps.center <= mid;
      for (let k = 0; k < members.length; k++) {
        const m = members[ascending ? k : members.length - 1 - k];
        const g = layout.long[m];
        applyLongGate(mps, g.left, g.right, gates.long[m], layout.swap, truncation, ws, stats);
      }
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
      applyBondGate(mps, b, gates.bonds[b], ascending ? 'right' : 'left', truncation, ws.gate, out);
      recordUpdate(mps, b, out, stats);
    }
  }
}
