/**
 * loadResumePoint — reads a branch's checkpoint through the hook (engines/branch-checkpoints.ts)
 * and decides whether the run may start from it. A checkpoint is used only when it fits this
 * run exactly and skips nothing that is not stored:
 *   - it decodes (mps-checkpoint.ts) and has this chain's sites and time-grid length;
 *   - its β index is one of the branch's, with the same β;
 *   - every β of the branch below it has all its points stored (resumeFrom = time count);
 *   - a 'quench' checkpoint restores no point beyond the stored prefix of its β
 *     (nextTimeIndex ≤ resumeFrom[β]) and carries the thermal state when more β follow.
 * Otherwise the run starts from β = 0 and the reason is reported in the diagnostics.
 */
import type { BranchCheckpoints } from '../branch-checkpoints.js';
import { decodeCheckpoint, type MpsCheckpointState } from './mps-checkpoint.js';

/** Where a run starts: a usable checkpoint (or null) and why a loaded one was not used. */
export interface ResumePoint {
  readonly checkpoint: MpsCheckpointState | null;
  readonly ignored: string;
}

/** The run's view of the grids: sites, β values by index, the branch's β order, time count. */
export interface ResumeContext {
  readonly sites: number;
  readonly betas: readonly number[];
  /** The branch's β indices in the order they run (ascending β). */
  readonly order: readonly number[];
  readonly timeCount: number;
  readonly resumeFrom: Readonly<Record<number, number>>;
}

function whyUnusable(c: MpsCheckpointState, ctx: ResumeContext): string | null {
  if (c.sites !== ctx.sites) return `it has ${c.sites} sites, the chain ${ctx.sites}`;
  if (c.timeCount !== ctx.timeCount) return `it has ${c.timeCount} grid times, the spec ${ctx.timeCount}`;
  const k = ctx.order.indexOf(c.betaIndex);
  if (k < 0 || ctx.betas[c.betaIndex] !== c.beta) return `its β index ${c.betaIndex} (β = ${c.beta}) is not one of this branch's`;
  for (const b of ctx.order.slice(0, k)) {
    if ((ctx.resumeFrom[b] ?? 0) < ctx.timeCount) return `β index ${b}, before it, has only ${ctx.resumeFrom[b] ?? 0} stored points`;
  }
  if (c.kind === 'quench') {
    const stored = ctx.resumeFrom[c.betaIndex] ?? 0;
    if (c.progress.nextTimeIndex > stored) return `it restores ${c.progress.nextTimeIndex} points of β index ${c.betaIndex}, ${stored} are stored`;
    if (c.carry === null && k < ctx.order.length - 1) return 'it lacks the thermal state for the β that follow';
  }
  return null;
}

/** Loads and checks the branch's checkpoint (see the file header); never throws on bad bytes. */
export async function loadResumePoint(hook: BranchCheckpoints | undefined, ctx: ResumeContext): Promise<ResumePoint> {
  if (hook === undefined) return { checkpoint: null, ignored: '' };
  const bytes = await hook.load();
  if (bytes === null) return { checkpoint: null, ignored: '' };
  let c: MpsCheckpointState;
  try {
    c = decodeCheckpoint(bytes);
  } catch (e) {
    return { checkpoint: null, ignored: (e as Error).message };
  }
  const why = whyUnusable(c, ctx);
  return why === null ? { checkpoint: c, ignored: '' } : { checkpoint: null, ignored: why };
}
