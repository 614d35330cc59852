/** `betasweep status ID` — status, per-branch progress, timings and plan of one sweep. */
import type { Command } from 'commander';
import { action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface StatusReply {
  id: string;
  status: string;
  label: string;
  engine: string;
  error: string | null;
  pointsDone: number;
  pointsTotal: number;
  progress: number;
  branches: Array<{
    index: number; betaIndices: number[]; state: string; attempts: number; pointsDone: number; pointsTotal: number; worker: string | null; error: string | null;
    /** Sampled engines (typical): samples stored of the current round's target. */
    samples?: { stored: number; target: number; final: boolean };
  }>;
  timings: { createdAt: string; startedAt: string | null; finishedAt: string | null; queuedSeconds: number; runSeconds: number | null };
  plan: { engine: string; reason: string; seconds: number; memoryBytes: number; accuracy: number };
  betas: number[];
  check?: { verdict: string; flagged: boolean; counts: { agree: number; disagree: number; outsideWindow: number }; note: string | null } | null;
}

/** Human-readable status lines. */
export function formatStatus(s: StatusReply): string {
  const lines = [
    `${s.id}  ${s.status}${s.label ? `  "${s.label}"` : ''}`,
    `  engine   ${s.engine}: ${s.plan.reason}`,
    `  plan     ~${s.plan.seconds.toPrecision(3)} s on one core, ${(s.plan.memoryBytes / 2 ** 20).toFixed(1)} MiB per branch, accuracy ${s.plan.accuracy}`,
    `  points   ${s.pointsDone}/${s.pointsTotal} (${(100 * s.progress).toFixed(1)} %)`,
    `  timings  queued ${s.timings.queuedSeconds.toFixed(2)} s${s.timings.runSeconds !== null ? `, running ${s.timings.runSeconds.toFixed(2)} s` : ''}${s.timings.finishedAt ? `, finished ${s.timings.finishedAt}` : ''}`,
  ];
  if (s.error) lines.push(`  error    ${s.error}`);
  if (s.check) {
    const c = s.check.counts;
    lines.push(`  check    ${s.check.verdict}${s.check.flagged ? ' (FLAGGED)' : ''}: ${c.agree} agree, ${c.disagree} disagree, ${c.outsideWindow} outside the series window` +
      `${s.check.note ? ` (${s.check.note})` : ''}; betasweep check ${s.id}`);
  }
  for (const b of s.branches) {
    const betas = b.betaIndices.map((i) => s.betas[i]).join(', ');
    const samples = !b.samples ? '' : b.samples.final ? `  ${b.samples.stored} samples (final)` : `  samples ${b.samples.stored}/${b.samples.target} so far`;
    lines.push(`  branch ${String(b.index).padStart(3)}  β=${betas.padEnd(12)} ${b.state.padEnd(9)} ${b.pointsDone}/${b.pointsTotal}${samples}` +
      `${b.attempts > 1 ? `  attempt ${b.attempts}` : ''}${b.worker ? `  on ${b.worker}` : ''}${b.error ? `  (${b.error})` : ''}`);
  }
  return lines.join('\n') + '\n';
}

export const registerStatus: RegisterCommand = (program: Command) => {
  clientOptions(program.command('status'))
    .description('show a sweep: status, per-branch progress, timings, plan')
    .argument('<id>', 'sweep id')
    .option('--json', 'print JSON')
    .action(action(async (id: string, flags: ClientFlags & { json?: boolean }) => {
      const s = await withClient(flags).request<StatusReply>('GET', `/v1/sweeps/${encodeURIComponent(id)}`, undefined, { sweepId: id });
      process.stdout.write(flags.json ? JSON.stringify(s) + '\n' : formatStatus(s));
    }));
};
