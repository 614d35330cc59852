/**
 * `betasweep check ID|RESULT.json [--json]` — a sweep against the high-temperature and
 * short-time series of its spec. For a sweep id the report comes from the server (computed when
 * the sweep finished); for a result file (from `betasweep run`) it is computed here, within the
 * same budget. Prints a table per β (series value ± estimate, engine value, verdict) and a
 * summary; exits CHECK_FLAGGED_EXIT when a value disagrees inside the series window.
 */
import { existsSync, readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { SweepResult } from '../../../../shared-types/src/index.js';
// The file, not the queue barrel (which loads BullMQ).
import { computeSweepCheck, summarizeCheck, type SweepCheckDocument } from '../../../../workers/src/queue/sweep-check.js';
import { SWEEP_ID_PATTERN } from '../../../../workers/src/store/new-sweep-id.js';
import { ClientError, action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

/** Exit code when some value disagrees with its series inside the window (1–7 are taken). */
export const CHECK_FLAGGED_EXIT = 8;

/** One entry as read back from JSON (non-finite numbers arrive as null). */
interface ShownEntry {
  betaIndex: number;
  beta: number;
  timeIndex: number | null;
  time: number | null;
  quantity: string;
  seriesValue: number | null;
  seriesError: number | null;
  engineValue: number | null;
  engineError: number | null;
  verdict: string;
}

/** The report as shown (a stored document or one computed here). */
interface ShownReport {
  specHash: string;
  engine: { name: string; version: string };
  series: { kind: string; method: string; thermoOrder: number; quenchOrder: number; seconds: number } | null;
  entries: ShownEntry[];
  summary: { agree: number; disagree: number; outsideWindow: number };
  flagged: boolean;
  error: string | null;
}

const num = (v: number | null, digits = 8) => (v === null || !Number.isFinite(v) ? '—' : v.toPrecision(digits));
const err = (v: number | null) => (v === null || !Number.isFinite(v) ? '∞' : v.toExponential(1));

/** The human-readable report: one table per β, then a summary line. */
export function formatCheck(r: ShownReport): string {
  const lines: string[] = [];
  const s = r.series;
  lines.push(`check of ${r.specHash.slice(0, 12)} (${r.engine.name} ${r.engine.version})` +
    (s ? ` against the ${s.kind} series (${s.method}, ln Z to β^${s.thermoOrder}, observables to order ${s.quenchOrder}, ${s.seconds.toFixed(2)} s)` : ''));
  if (r.error !== null) {
    lines.push(`  error: ${r.error}`);
    return lines.join('\n') + '\n';
  }
  const byBeta = new Map<number, ShownEntry[]>();
  for (const e of r.entries) byBeta.set(e.betaIndex, [...(byBeta.get(e.betaIndex) ?? []), e]);
  const width = Math.max(8, ...r.entries.map((e) => e.quantity.length));
  for (const [, entries] of [...byBeta.entries()].sort((a, b) => a[0] - b[0])) {
    lines.push('', `β = ${entries[0].beta}`);
    lines.push(`  ${'t'.padEnd(8)} ${'quantity'.padEnd(width)} ${'series ± estimate'.padEnd(26)} ${'engine'.padEnd(16)} verdict`);
    for (const e of entries) {
      const t = e.time === null ? '' : String(e.time);
      lines.push(`  ${t.padEnd(8)} ${e.quantity.padEnd(width)} ${`${num(e.seriesValue)} ± ${err(e.seriesError)}`.padEnd(26)} ` +
        `${num(e.engineValue).padEnd(16)} ${e.verdict}`);
    }
  }
  const { agree, disagree, outsideWindow } = r.summary;
  lines.push('', `${r.flagged ? 'FLAGGED' : 'ok'}: ${agree} agree, ${disagree} disagree, ${outsideWindow} outside the series window`);
  return lines.join('\n') + '\n';
}

/** Reads a result file and computes its check here. */
function checkFile(file: string, budgetSeconds: number): SweepCheckDocument {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    throw new ClientError(`${file} is not a readable JSON file: ${(e as Error).message}`, 2);
  }
  const parsed = SweepResult.safeParse(raw);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new ClientError(`${file} is not a betasweep result document: ${first ? `${first.path.join('.')}: ${first.message}` : 'invalid'}`, 2);
  }
  return computeSweepCheck(parsed.data, { budgetSeconds });
}

export const registerCheck: RegisterCommand = (program: Command) => {
  clientOptions(program.command('check'))
    .description('cross-check a sweep (id on the server, or a local result file) against its high-temperature series')
    .argument('<target>', 'sweep id, or a RESULT.json written by `betasweep run`')
    .option('--json', 'print the report as JSON')
    .option('--budget <seconds>', 'time budget of a local check, seconds', '10')
    .action(action(async (target: string, flags: ClientFlags & { json?: boolean; budget: string }) => {
      const budget = Number(flags.budget);
      if (!(budget > 0)) throw new ClientError(`--budget must be a positive number of seconds, got '${flags.budget}'`, 2);
      let report: ShownReport;
      if (existsSync(target)) {
        report = checkFile(target, budget) as unknown as ShownReport;
      } else if (SWEEP_ID_PATTERN.test(target)) {
        report = await withClient(flags).request<ShownReport>('GET', `/v1/sweeps/${encodeURIComponent(target)}/check`, undefined, { sweepId: target });
      } else {
        throw new ClientError(`'${target}' is neither a file nor a sweep id`, 2);
      }
      process.stdout.write(flags.json ? JSON.stringify(report, null, 2) + '\n' : formatCheck(report));
      const summary = summarizeCheck(report as unknown as SweepCheckDocument);
      if (summary.verdict === 'error') process.exitCode = 1;
      else if (summary.flagged) process.exitCode = CHECK_FLAGGED_EXIT;
    }));
};
