/**
 * Shared helpers for the benchmarks under tests/bench (not part of the test suites).
 * Benchmarks export `run(): Promise<BenchRecord[]>` and label runs `kernel:variant:size=N`.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';

/** One benchmark measurement. */
export interface BenchRecord {
  /** `kernel:variant:size=N`. */
  label: string;
  /** Median wall time of one repetition, milliseconds. */
  medianMs: number;
  /** Derived figures (GB/s, ratios, counts) and notes. */
  extra: Record<string, number | string>;
}

/** Median of a non-empty list (mean of the two middle values for even length). */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('values must not be empty');
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Run `fn` once to warm up, then `reps` timed times; returns the per-run times in ms. */
export function timeIt(fn: () => void, reps: number): number[] {
  if (!Number.isInteger(reps) || reps < 1) throw new RangeError(`reps must be a positive integer; got ${reps}`);
  fn();
  const times: number[] = [];
  for (let k = 0; k < reps; k++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  return times;
}

/**
 * Peak resident set size of this process so far, MiB. On Linux this reads VmHWM from
 * /proc/self/status: getrusage's maxRSS survives fork+exec, so a child spawned by a parent
 * that had touched large arrays would report the parent's peak.
 */
export function peakRssMb(): number {
  try {
    const m = /VmHWM:\s+(\d+)\s+kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (m) return Number(m[1]) / 1024;
  } catch {
    // not Linux: fall back below
  }
  return process.resourceUsage().maxRSS / 1024;
}

/** Seeded uniform RNG on [0, 1) (mulberry32; common practice). */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Print records as an aligned table. */
export function printRecords(records: readonly BenchRecord[]): void {
  for (const r of records) {
    const extra = Object.entries(r.extra)
      .map(([k, v]) => `${k}=${typeof v === 'number' && !Number.isInteger(v) ? +v.toPrecision(4) : v}`)
      .join(' ');
    console.log(`${r.label.padEnd(40)} ${r.medianMs.toFixed(3).padStart(10)} ms  ${extra}`);
  }
}
