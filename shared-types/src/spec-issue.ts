/**
 * One problem found in a submitted spec, in the form every boundary reports it (HTTP 400
 * bodies, CLI messages, job failures). The `code` is stable and machine-readable; the
 * `message` is for people and may be reworded between releases.
 */
import { z } from 'zod';

/**
 * Stable issue codes. Append only: a code, once published, keeps its meaning and is never
 * reused. Semantic checks outside this package (e.g. a site outside the lattice) may report
 * codes of their own; clients must tolerate codes they do not know.
 */
export const SPEC_ISSUE_CODES = [
  /** Wrong JSON type, or a required field is missing. */
  'invalid_type',
  /** A number is NaN or ±Infinity. */
  'not_finite',
  /** A number must be a whole number. */
  'not_integer',
  /** Below a minimum: a number, or the length of a list or string. */
  'too_small',
  /** Above a maximum: a number, or the length of a list or string. */
  'too_big',
  /** Not one of the allowed values (an enum, or a `kind`/`model` tag). */
  'invalid_value',
  /** A field the schema does not know (often a misspelling). */
  'unknown_field',
  /** A string does not have the required form (a Pauli word, a label). */
  'invalid_format',
  /** The value matches none of the accepted alternative shapes. */
  'no_match',
  /** A rule across fields is broken that has no code of its own below. */
  'custom',
  /** The input could not be read at all (e.g. a property getter threw). */
  'unreadable',
  /** More issues were found than are reported; the last issue says how many were left out. */
  'too_many_issues',
  // Rules across fields. The sweep runner's semantic checks (CHECK_SPEC_CODES in
  // workers/src/sweep/check-spec.ts) use the same names for the same problems, so a problem
  // has one code whichever layer finds it.
  /** A site index is beyond what the lattice (or the schema's site limit) allows. */
  'site_out_of_range',
  /** A lattice has more than LIMITS.maxSites sites. */
  'lattice_too_large',
  /** A bond or a correlator pair joins a site to itself. */
  'self_bond',
  /** A bond is listed twice (in either order, in bonds or farBonds). */
  'duplicate_bond',
  /** A site appears twice in a Pauli word or a site list. */
  'duplicate_site',
  /** A correlator pair is listed twice. */
  'duplicate_pair',
  /** A structure-factor momentum is listed twice. */
  'duplicate_momentum',
  /** `positions` does not have one entry per site. */
  'positions_mismatch',
  /** An even time grid has stop < start. */
  'time_grid_reversed',
  /** An even time grid has count > 1 but stop = start. */
  'time_grid_degenerate',
] as const;

/** One of {@link SPEC_ISSUE_CODES}. */
export type SpecIssueCode = (typeof SPEC_ISSUE_CODES)[number];

/** One spec problem: a stable code, the path to the offending value, a readable message. */
export const SpecIssue = z.object({
  /** Stable code (see {@link SPEC_ISSUE_CODES}; others may appear from semantic checks). */
  code: z.string(),
  /** Path from the spec root, e.g. ["betas", 2] or ["h0", "terms", 1, "word"]; [] is the root. */
  path: z.array(z.union([z.string(), z.number()])),
  /** Readable text naming the field path (e.g. "betas[2]") and the limit that was broken. */
  message: z.string(),
}).strict().meta({ id: 'SpecIssue' });
export type SpecIssue = z.infer<typeof SpecIssue>;
