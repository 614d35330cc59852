/**
 * The API bodies the page reads (a structural subset of services/api/src/schemas/sweep-bodies.ts;
 * tests/unit/plot/dashboard-types.test.ts checks that the API's types still fit these).
 */
import type { DiagnosticsRecord, SweepPlan, ThermoRecord } from '../../../shared-types/src/result.js';

export type SweepStatusName = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

/** GET /v1/sweeps/{id}. */
export interface SweepStatusReport {
  id: string;
  status: SweepStatusName;
  label: string;
  engine: string;
  error: string | null;
  pointsDone: number;
  pointsTotal: number;
  progress: number;
  timings: { createdAt: string; startedAt: string | null; finishedAt: string | null; queuedSeconds: number; runSeconds: number | null };
  plan: SweepPlan;
  betas: number[];
  times: number[];
  series: Array<{ label: string; observable: number }>;
}

/** One item of GET /v1/sweeps. */
export interface SweepSummary {
  id: string;
  status: SweepStatusName;
  label: string;
  engine: string;
  createdAt: string;
  finishedAt: string | null;
  error: string | null;
  pointsDone: number;
  pointsTotal: number;
  /** The series cross-check in brief; null until computed. */
  check: { verdict: string; flagged: boolean; counts: { agree: number; disagree: number; outsideWindow: number } } | null;
}

/** GET /v1/sweeps. */
export interface SweepList {
  items: SweepSummary[];
  nextCursor: string | null;
}

/** POST /v1/plan. */
export interface PlanReply {
  feasible: boolean;
  plan: SweepPlan;
  points: number;
}

/** The result document fields the page reads. */
export interface ResultDocument {
  spec: { label?: string };
  betas: number[];
  times: number[];
  series: Array<{ label: string; values: number[][]; errors: number[][] }>;
  thermo: ThermoRecord[];
  diagnostics: DiagnosticsRecord[];
  plan: SweepPlan;
}

/** True for the statuses that do not change any more. */
export const isFinished = (s: SweepStatusName) => s === 'succeeded' || s === 'failed' || s === 'cancelled';
