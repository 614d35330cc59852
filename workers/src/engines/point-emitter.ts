/**
 * pointEmitter — hands one β's quench points to the sink as `SweepPoint`s (plain arrays, a copy
 * of the engine's buffers), leaving out the times a resumed branch already stored:
 * timeIndex < resumeFrom[betaIndex] (BranchOptions.resumeFrom in engine.ts: still computed,
 * not emitted).
 */
import type { BranchSink } from './engine.js';

/** Emits the point at one grid time (all series' values and their errors, in series order). */
export type PointEmitter = (timeIndex: number, values: ArrayLike<number>, errors: ArrayLike<number>) => void;

/** The emitter of β index `betaIndex` (resumeFrom: BranchOptions.resumeFrom; none skips nothing). */
export function pointEmitter(sink: BranchSink, betaIndex: number, resumeFrom: Readonly<Record<number, number>> = {}): PointEmitter {
  const skipBelow = resumeFrom[betaIndex] ?? 0;
  return (timeIndex, values, errors) => {
    if (timeIndex < skipBelow) return;
    sink.point({ betaIndex, timeIndex, values: Array.from(values), errors: Array.from(errors) });
  };
}
