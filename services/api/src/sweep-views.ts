/** Builds response bodies from store records (pure). */
import type { z } from 'zod';
import type { SweepRecord } from '../../../workers/src/store/index.js';
import type { SweepLinks, SweepStatusBody } from './schemas/sweep-bodies.js';

/** Links of one sweep, relative to the server root. */
export function sweepLinks(id: string): z.infer<typeof SweepLinks> {
  const base = `/v1/sweeps/${id}`;
  return { self: base, result: `${base}/result`, csv: `${base}/result.csv`, events: `${base}/events`, cancel: `${base}/cancel` };
}

const seconds = (from: string, to: string | null, now: number) => ((to ? Date.parse(to) : now) - Date.parse(from)) / 1000;

/** The status report of one sweep. */
export function statusView(r: SweepRecord, now = Date.now()): z.infer<typeof SweepStatusBody> {
  return {
    id: r.id,
    status: r.status,
    label: r.label,
    specHash: r.specHash,
    engine: r.engine,
    error: r.error,
    pointsDone: r.pointsDone,
    pointsTotal: r.pointsTotal,
    progress: r.pointsTotal ? r.pointsDone / r.pointsTotal : 0,
    branches: r.branches,
    timings: {
      createdAt: r.createdAt,
      startedAt: r.startedAt,
      finishedAt: r.finishedAt,
      queuedSeconds: seconds(r.createdAt, r.startedAt ?? r.finishedAt, now),
      runSeconds: r.startedAt ? seconds(r.startedAt, r.finishedAt, now) : null,
    },
    plan: r.plan,
    betas: r.header.betas,
    times: r.header.times,
    series: r.header.series,
    spec: r.spec,
    links: sweepLinks(r.id),
    check: r.check,
  };
}

/** The never-changing tail of a status body by the record's plan object (the store caches it per sweep). */
const fixedJsonByPlan = new WeakMap<object, string>();

/**
 * The status report serialised: the same body as JSON.stringify(statusView(r)), built from the
 * changing fields plus the serialised spec, plan and grids kept per sweep — a status poll then
 * serialises a few hundred bytes instead of the whole record.
 */
export function statusJson(r: SweepRecord, now = Date.now()): string {
  const { plan, betas, times, series, spec, links, ...changing } = statusView(r, now);
  let fixed = fixedJsonByPlan.get(r.plan);
  if (fixed === undefined) {
    fixed = JSON.stringify({ plan, betas, times, series, spec, links }).slice(1);
    fixedJsonByPlan.set(r.plan, fixed);
  }
  return `${JSON.stringify(changing).slice(0, -1)},${fixed}`;
}
