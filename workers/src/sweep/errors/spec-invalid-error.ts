import type { SpecIssue } from '../../../../shared-types/src/index.js';

/** A spec failed validation; `issues` name each bad field and its limit. Never retried. */
export class SpecInvalidError extends Error {
  override readonly name = 'SpecInvalidError';
  constructor(readonly issues: SpecIssue[]) {
    super(`invalid sweep spec: ${issues.map((i) => i.message).join('; ')}`);
  }
}
