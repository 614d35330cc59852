/** Human-readable rendering of an engine plan. */
import type { SweepPlan } from '../../../shared-types/src/index.js';

export function formatBytes(n: number): string {
  const units = ['B', 'KiB', 'MiB', 'GiB', 'TiB'];
  let u = 0;
  while (n >= 1024 && u < units.length - 1) { n /= 1024; u++; }
  return `${n.toFixed(u ? 1 : 0)} ${units[u]}`;
}

export function formatSeconds(s: number): string {
  if (!Number.isFinite(s)) return 'unknown';
  if (s < 1) return `${(s * 1000).toFixed(0)} ms`;
  if (s < 120) return `${s.toFixed(1)} s`;
  if (s < 7200) return `${(s / 60).toFixed(1)} min`;
  return `${(s / 3600).toFixed(1)} h`;
}

export function formatPlan(plan: SweepPlan, hash: string): string {
  const lines = [
    `engine      ${plan.engine}`,
    `why         ${plan.reason}`,
    `sites       ${plan.sites}`,
    `feasible    ${plan.feasible ? 'yes' : 'no'}`,
  ];
  if (plan.refusal) {
    lines.push(`refused     ${plan.refusal.message}`);
    lines.push(`            (${plan.refusal.field}: estimate ${plan.refusal.estimate} > limit ${plan.refusal.limit})`);
  }
  lines.push(
    `memory      ${formatBytes(plan.memoryBytes)} per branch`,
    `work        ${plan.flops.toExponential(2)} flop`,
    `time        ~${formatSeconds(plan.seconds)} on one core`,
    `accuracy    ${plan.accuracy.toExponential(1)} (absolute, every observable)`,
    `branches    ${plan.branches.length}`,
    `spec hash   ${hash}`,
  );
  return lines.join('\n');
}
