import { UnrecoverableError } from 'bullmq';

/**
 * A branch job whose payload or stored spec is invalid, or whose engine refuses the spec.
 * Never retried. The name stays 'UnrecoverableError' on purpose: a sandboxed processor's
 * error crosses the process boundary as JSON and BullMQ recognises it by that name.
 */
export class BranchJobInvalidError extends UnrecoverableError {
  /** Stable code for logs and the sweep's error message. */
  readonly code = 'BSW_ERR_BRANCH_INVALID';
  constructor(message: string) {
    super(message);
    this.name = 'UnrecoverableError';
  }
}
