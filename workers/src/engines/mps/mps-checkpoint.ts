/**
 * The checkpoint of an mps branch (the bytes behind the engine-agnostic hook of
 * engines/branch-checkpoints.ts), so a retried branch resumes instead of restarting. Two kinds:
 *
 * - 'thermal': the imaginary-time evolution has reached β (before its thermodynamics and
 *   quench): the state, its half-step copy (step doubling) and their running totals.
 * - 'quench': the real-time evolution of β has emitted the points 0..nextTimeIndex−1: the
 *   quench state and the quench's running values (run-mps-quench.ts), what the end-of-β
 *   diagnostics need from the thermal part, and — when more β of the branch follow — the
 *   thermal state and its half-step copy to carry upward in β.
 *
 * Layout (float-record.ts, one Float64Array, its bytes stored as they are):
 *   [CHECKPOINT_FORMAT, kind (1 thermal, 2 quench), betaIndex, β, sites, time count, …kind body].
 * Totals of an evolution (evolve-stages.ts) are 6 numbers: lnNorm, discardedSum,
 * discardedRootSum, maxDiscarded, maxBond, gates.
 */
import type { EvolutionStats } from './evolve-stages.js';
import { FloatReader, FloatWriter } from './float-record.js';
import type { PurifiedMps } from './purified-mps.js';
import type { QuenchProgress } from './run-mps-quench.js';

/** Format tag (first double); 2 added the quench kind. */
export const CHECKPOINT_FORMAT = 2;

/** The imaginary-time state at β with its half-step copy. */
export interface ThermalCarry {
  readonly state: PurifiedMps;
  readonly stats: EvolutionStats;
  readonly half: PurifiedMps;
  readonly halfStats: EvolutionStats;
}

/** What the end-of-β diagnostics need from the thermal part. */
export interface ThermalSummary {
  readonly stats: EvolutionStats;
  /** Trotter estimate of the thermal state's strings. */
  readonly trotter: number;
  readonly stationarityResidual: number | null;
  /** Largest |Im⟨P⟩| of the thermal measurement. */
  readonly maxImag: number;
}

/** Fields of every checkpoint. */
interface CheckpointBase {
  readonly betaIndex: number;
  readonly beta: number;
  /** Sites of the chain and length of the time grid (checked on resume). */
  readonly sites: number;
  readonly timeCount: number;
}

/** A decoded checkpoint. */
export type MpsCheckpointState =
  | (CheckpointBase & { readonly kind: 'thermal'; readonly carry: ThermalCarry })
  | (CheckpointBase & {
    readonly kind: 'quench';
    readonly thermal: ThermalSummary;
    readonly progress: QuenchProgress;
    readonly quench: PurifiedMps;
    /** The thermal state, kept only when more β of the branch follow. */
    readonly carry: ThermalCarry | null;
  });

const statsList = (s: EvolutionStats) => [s.lnNorm, s.discardedSum, s.discardedRootSum, s.maxDiscarded, s.maxBond, s.gates];

function readStats(r: FloatReader): EvolutionStats {
  const a = r.list();
  if (a.length !== 6) throw new RangeError(`decodeCheckpoint: ${a.length} evolution totals, expected 6`);
  return { lnNorm: a[0], discardedSum: a[1], discardedRootSum: a[2], maxDiscarded: a[3], maxBond: a[4], gates: a[5] };
}

function writeCarry(w: FloatWriter, c: ThermalCarry): void {
  w.list(statsList(c.stats)).list(statsList(c.halfStats)).mps(c.state).mps(c.half);
}

function readCarry(r: FloatReader): ThermalCarry {
  const stats = readStats(r);
  const halfStats = readStats(r);
  const state = r.mps();
  return { stats, halfStats, state, half: r.mps() };
}

/** Encodes a checkpoint as bytes (see the file header). */
export function encodeCheckpoint(c: MpsCheckpointState): Uint8Array {
  const w = new FloatWriter().num(CHECKPOINT_FORMAT).num(c.kind === 'thermal' ? 1 : 2)
    .num(c.betaIndex).num(c.beta).num(c.sites).num(c.timeCount);
  if (c.kind === 'thermal') writeCarry(w, c.carry);
  else {
    const p = c.progress;
    w.list(statsList(c.thermal.stats)).num(c.thermal.trotter).num(c.thermal.stationarityResidual).num(c.thermal.maxImag);
    w.num(p.nextTimeIndex).list(statsList(p.stats)).num(p.h1At0).num(p.h1Drift).num(p.rate).num(p.trotter).num(p.maxImag)
      .list(p.bondByTime).list(p.discardedByTime).mps(c.quench);
    w.num(c.carry === null ? 0 : 1);
    if (c.carry !== null) writeCarry(w, c.carry);
  }
  const f = w.finish();
  return new Uint8Array(f.buffer, f.byteOffset, f.byteLength);
}

/**
 * Decodes checkpoint bytes (copied, so any alignment is fine).
 * @throws RangeError if the bytes are not a checkpoint of this format.
 */
export function decodeCheckpoint(bytes: Uint8Array): MpsCheckpointState {
  if (bytes.byteLength % 8 !== 0 || bytes.byteLength < 48) throw new RangeError(`decodeCheckpoint: ${bytes.byteLength} bytes is not a checkpoint`);
  const data = new Float64Array(bytes.byteLength / 8);
  new Uint8Array(data.buffer).set(bytes);
  const r = new FloatReader(data);
  const format = r.num();
  if (format !== CHECKPOINT_FORMAT) throw new RangeError(`decodeCheckpoint: format tag ${format}, expected ${CHECKPOINT_FORMAT}`);
  const kind = r.num();
  const base = { betaIndex: r.num(), beta: r.num(), sites: r.num(), timeCount: r.num() };
  let out: MpsCheckpointState;
  if (kind === 1) out = { ...base, kind: 'thermal', carry: readCarry(r) };
  else if (kind === 2) {
    const thermal: ThermalSummary = { stats: readStats(r), trotter: r.num(), stationarityResidual: r.nullable(), maxImag: r.num() };
    const progress: QuenchProgress = {
      nextTimeIndex: r.num(), stats: readStats(r), h1At0: r.num(), h1Drift: r.num(), rate: r.nullable(), trotter: r.num(),
      maxImag: r.num(), bondByTime: r.list(), discardedByTime: r.list(),
    };
    const quench = r.mps();
    const carry = r.num() === 1 ? readCarry(r) : null;
    out = { ...base, kind: 'quench', thermal, progress, quench, carry };
  } else throw new RangeError(`decodeCheckpoint: unknown kind ${kind}`);
  if (!r.done) throw new RangeError('decodeCheckpoint: trailing data');
  return out;
}
