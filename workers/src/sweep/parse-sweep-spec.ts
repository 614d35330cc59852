/**
 * The one entry point for untrusted specs (HTTP body, job payload, CLI file): schema
 * validation, semantic checks against the lattice, canonical form and the physics hash.
 * Never throws; branch on `success`.
 */
import {
  parseSpecInput, canonicalSpec, specHash, type SpecIssue, type SweepSpec,
} from '../../../shared-types/src/index.js';
import { checkSpec } from './check-spec.js';

export type ParsedSweepSpec =
  | { success: true; spec: SweepSpec; hash: string }
  | { success: false; issues: SpecIssue[] };

export function parseSweepSpec(input: unknown): ParsedSweepSpec {
  const parsed = parseSpecInput(input);
  if (!parsed.success) return parsed;
  let issues: SpecIssue[];
  try {
    issues = checkSpec(parsed.spec);
  } catch (err) {
    issues = [{ code: 'invalid_value', path: [], message: err instanceof Error ? err.message : String(err) }];
  }
  if (issues.length) return { success: false, issues };
  const spec = canonicalSpec(parsed.spec);
  return { success: true, spec, hash: specHash(spec) };
}
