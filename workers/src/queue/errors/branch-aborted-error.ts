/** Thrown inside a branch run when it stops early: the sweep was cancelled, or the worker hands the branch back. */
export class BranchAbortedError extends Error {
  override readonly name = 'BranchAbortedError';
  constructor(readonly reason: 'cancelled' | 'handback' | 'orphaned') {
    super(`branch stopped: ${reason}`);
  }
}
