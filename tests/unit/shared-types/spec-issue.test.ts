/** The stable issue codes and the SpecIssue schema. */
import { describe, expect, expectTypeOf, it } from 'vitest';
import { SPEC_ISSUE_CODES, SpecIssue, type SpecIssueCode } from '../../../shared-types/src/index.js';

describe('SPEC_ISSUE_CODES', () => {
  it('should hold unique snake_case codes', () => {
    expect(new Set(SPEC_ISSUE_CODES).size).toBe(SPEC_ISSUE_CODES.length);
    for (const code of SPEC_ISSUE_CODES) expect(code).toMatch(/^[a-z]+(_[a-z]+)*$/);
  });

  it('should keep the published codes (append only: none may disappear)', () => {
    expect(SPEC_ISSUE_CODES).toEqual(expect.arrayContaining([
      'invalid_type', 'not_finite', 'not_integer', 'too_small', 'too_big', 'invalid_value', 'unknown_field',
      'invalid_format', 'no_match', 'custom', 'unreadable', 'too_many_issues', 'site_out_of_range',
      'lattice_too_large', 'self_bond', 'duplicate_bond', 'duplicate_site', 'duplicate_pair', 'duplicate_momentum',
      'positions_mismatch', 'time_grid_reversed', 'time_grid_degenerate',
    ]));
    expectTypeOf<'not_finite'>().toMatchTypeOf<SpecIssueCode>();
  });
});

describe('SpecIssue', () => {
  it('should accept an issue and reject extra fields or a bad path', () => {
    const issue = { code: 'too_small', path: ['betas', 2], message: 'betas[2]: expected β ≥ 0, got -1' };
    expect(SpecIssue.safeParse(issue).success).toBe(true);
    expect(SpecIssue.safeParse({ ...issue, hint: 'x' }).success).toBe(false);
    expect(SpecIssue.safeParse({ ...issue, path: [true] }).success).toBe(false);
  });

  it('should infer { code, path, message }', () => {
    expectTypeOf<SpecIssue>().toEqualTypeOf<{ code: string; path: (string | number)[]; message: string }>();
  });
});
