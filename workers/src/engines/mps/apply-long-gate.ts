/**
 * applyLongGate — a two-site gate on chain positions (i, j), j − i ≥ 2, of a purified MPS by
 * swap gates (the standard routing of TEBD for longer-range terms, as used e.g. by Stoudenmire &
 * White, New J. Phys. 12, 055026 (2010) — reference recalled from memory): the end nearer the
 * orthogonality centre is swapped next to the other one, the gate is applied there (index
 * 4·p_i + p_j, as for a neighbour bond), and the swaps are undone, so the site order is
 * restored after every gate:
 *
 *   centre nearer j: swaps on bonds j−1, …, i+1 (centre moving left), G on (i, i+1), swaps on
 *                    bonds i+1, …, j−1 (centre moving right; it ends at j);
 *   centre nearer i: swaps on bonds i, …, j−2 (right), G on (j−1, j), swaps on j−2, …, i
 *                    (left; it ends at i).
 * Every swap is a truncated two-site update (apply-gate.ts), so the centre is always inside the
 * update and each truncation is optimal; its discarded weight is counted like any other.
 * Cost: 2·(j − i − 1) + 1 two-site updates.
 */
import { applyBondGate, type Truncation } from './apply-gate.js';
import type { EvolutionStats, EvolveWorkspace } from './evolve-stages.js';
import { moveCenterLeft, moveCenterRight } from './move-center.js';
import type { PurifiedMps } from './purified-mps.js';

/** Records one update's ln-norm growth and discarded weight (out[0], out[1]) in `stats`. */
export function recordUpdate(mps: PurifiedMps, b: number, out: Float64Array, stats: EvolutionStats): void {
  stats.lnNorm += out[0];
  stats.discardedSum += out[1];
  stats.discardedRootSum += Math.sqrt(out[1]);
  if (out[1] > stats.maxDiscarded) stats.maxDiscarded = out[1];
  if (mps.dims[b + 1] > stats.maxBond) stats.maxBond = mps.dims[b + 1];
  stats.gates++;
}

/**
 * Applies `gate` to positions (i, j) through swaps (see the file header).
 * @throws RangeError unless 0 ≤ i, i + 2 ≤ j < sites.
 */
export function applyLongGate(
  mps: PurifiedMps, i: number, j: number, gate: Float64Array, swap: Float64Array, truncation: Truncation,
  ws: EvolveWorkspace, stats: EvolutionStats,
): void {
  if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 0 && j - i >= 2 && j < mps.sites)) {
    throw new RangeError(`applyLongGate: positions (${i}, ${j}) are not two sites at least two steps apart on a chain of ${mps.sites}`);
  }
  const out = new Float64Array(2);
  const update = (b: number, g: Float64Array, direction: 'left' | 'right') => {
    while (mps.center < b) moveCenterRight(mps, ws.move);
    while (mps.center > b + 1) moveCenterLeft(mps, ws.move);
    applyBondGate(mps, b, g, direction, truncation, ws.gate, out);
    recordUpdate(mps, b, out, stats);
  };
  if (Math.abs(mps.center - j) < Math.abs(mps.center - i)) {
    for (let b = j - 1; b > i; b--) update(b, swap, 'left');
    update(i, gate, 'right');
    for (let b = i + 1; b < j; b++) update(b, swap, 'right');
  } else {
    for (let b = i; b < j - 1; b++) update(b, swap, 'right');
    update(j - 1, gate, 'left');
    for (let b = j - 2; b >= i; b--) update(b, swap, 'left');
  }
}
