/**
 * Memory-bandwidth yardstick: the STREAM-style triad a[i] = b[i] + s·c[i] over three large
 * Float64Arrays (3 × 8 bytes moved per element; common practice, after McCalpin's STREAM).
 */
import { median, timeIt } from './bench-record.js';

/** Median triad bandwidth in GB/s over `reps` repetitions on arrays of `length` doubles. */
export function triadBandwidth(length = 1 << 24, reps = 7): number {
  const a = new Float64Array(length);
  const b = new Float64Array(length).fill(1.5);
  const c = new Float64Array(length).fill(0.25);
  const s = 1.0001;
  const ms = median(timeIt(() => {
    for (let i = 0; i < length; i++) a[i] = b[i] + s * c[i];
  }, reps));
  if (!Number.isFinite(a[length - 1])) throw new Error('triad produced a non-finite value');
  return (3 * 8 * length) / (ms * 1e6);
}
