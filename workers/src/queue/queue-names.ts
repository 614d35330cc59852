/** Queue names and the BullMQ key prefix derived from the store prefix. */

/** The queue of branch jobs: one job per branch of a sweep. */
export const BRANCH_QUEUE = 'bsw-branches';

/** BullMQ key prefix for a store prefix: 'bsw:' → 'bsw:q' (queue keys then read 'bsw:q:bsw-branches:…'). */
export function queuePrefix(storePrefix: string): string {
  return `${storePrefix.replace(/:$/, '')}:q`;
}

/**
 * Job id of a branch: `${sweepId}.${branchIndex}`, and of a sample block of a sampled engine's
 * branch `${sweepId}.${branchIndex}.${start}+${count}`. BullMQ forbids ':' in custom ids; the
 * id makes a second enqueue of the same branch or block a no-op (dedupe).
 */
export function branchJobId(sweepId: string, branchIndex: number, samples?: { start: number; count: number }): string {
  return samples ? `${sweepId}.${branchIndex}.${samples.start}+${samples.count}` : `${sweepId}.${branchIndex}`;
}
