/**
 * The checkpoint of an mps branch after the imaginary-time evolution has reached one β, so a
 * retried branch resumes from that β instead of from β = 0. One Float64Array:
 *   [CHECKPOINT_FORMAT, betaIndex, β, 6 totals of the state, 6 totals of the half-step copy,
 *    serialised state (purified-mps.ts), serialised half-step copy].
 * Totals: lnNorm, discardedSum, discardedRootSum, maxDiscarded, maxBond, gates
 * (evolve-stages.ts). What the service must do: store the array (e.g. as a Buffer under the
 * branch's key, overwriting the previous β's), and on a retry pass it back as
 * `options.resume` together with `resumeFrom`; βs below the checkpoint's are not re-run.
 */
import type { EvolutionStats } from './evolve-stages.js';
import { deserializeMps, serializeMps, type PurifiedMps } from './purified-mps.js';

/** Format tag (first double). */
export const CHECKPOINT_FORMAT = 1;

/** A decoded checkpoint. */
export interface MpsCheckpointState {
  readonly betaIndex: number;
  readonly beta: number;
  readonly state: PurifiedMps;
  readonly stats: EvolutionStats;
  readonly half: PurifiedMps;
  readonly halfStats: EvolutionStats;
}

function statsArray(s: EvolutionStats): number[] {
  return [s.lnNorm, s.discardedSum, s.discardedRootSum, s.maxDiscarded, s.maxBond, s.gates];
}

function statsFrom(a: Float64Array, o: number): EvolutionStats {
  return { lnNorm: a[o], discardedSum: a[o + 1], discardedRootSum: a[o + 2], maxDiscarded: a[o + 3], maxBond: a[o + 4], gates: a[o + 5] };
}

/** Encodes a checkpoint (see the file header). */
export function encodeCheckpoint(c: MpsCheckpointState): Float64Array {
  const a = serializeMps(c.state);
  const b = serializeMps(c.half);
  const head = [CHECKPOINT_FORMAT, c.betaIndex, c.beta, ...statsArray(c.stats), ...statsArray(c.halfStats)];
  const out = new Float64Array(head.length + a.length + b.length);
  out.set(head, 0);
  out.set(a, head.length);
  out.set(b, head.length + a.length);
  return out;
}

/**
 * Decodes a checkpoint.
 * @throws RangeError if the data is not a checkpoint of this format.
 */
export function decodeCheckpoint(data: Float64Array): MpsCheckpointState {
  if (data[0] !== CHECKPOINT_FORMAT) throw new RangeError(`decodeCheckpoint: format tag ${data[0]}, expected ${CHECKPOINT_FORMAT}`);
  const first = deserializeMps(data, 15);
  const second = deserializeMps(data, first.next);
  return {
    betaIndex: data[1], beta: data[2], stats: statsFrom(data, 3), halfStats: statsFrom(data, 9),
    state: first.mps, half: second.mps,
  };
}
