/**
 * Schema validation of an untrusted spec (HTTP body, job payload, spec file), with zod's
 * issues mapped to our stable codes (spec-issue.ts). Lattice-dependent checks and the
 * canonical form come after this step (the sweep runner's parseSweepSpec).
 */
import { SweepSpec } from './spec.js';
import { SPEC_ISSUE_CODES, type SpecIssue } from './spec-issue.js';
import { genericMessage, oneOf, showValue, typeName } from './spec-messages.js';

/** At most this many issues are reported; one more issue (`too_many_issues`) counts the rest. */
export const MAX_SPEC_ISSUES = 100;

/** The result of {@link parseSpecInput}: a spec with defaults applied, or the issues. */
export type ParseSpecResult =
  | { success: true; spec: SweepSpec }
  | { success: false; issues: SpecIssue[] };

type Path = (string | number)[];

/** The fields of a finalised zod issue that the mapping reads. */
interface ZodIssueLike {
  code?: string;
  path?: PropertyKey[];
  message?: string;
  input?: unknown;
  expected?: string;
  keys?: string[];
  errors?: ZodIssueLike[][];
  discriminator?: string;
  options?: unknown[];
  params?: { code?: unknown };
  issues?: ZodIssueLike[];
}

const KNOWN_CODES: ReadonlySet<string> = new Set(SPEC_ISSUE_CODES);

/**
 * Formats an issue path the way a user writes it: `betas[2]`, `h0.terms[1].word`; the root
 * is `spec`.
 */
export function formatSpecPath(path: ReadonlyArray<string | number>): string {
  let out = '';
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`;
    else if (/^[A-Za-z_$][\w$]*$/.test(p)) out += out ? `.${p}` : p;
    else out += `[${JSON.stringify(p)}]`;
  }
  return out === '' ? 'spec' : out;
}

/**
 * Validates `input` against {@link SweepSpec} and applies its defaults.
 *
 * Never throws: any input (undefined, a string, an object whose getters throw, keys such as
 * "__proto__") gives either a spec or a non-empty list of issues. Each issue has a stable code
 * from SPEC_ISSUE_CODES, the path from the spec root, and a message that starts with the
 * dotted path (e.g. "betas[2]: expected β ≥ 0, got -1") and names the limit. At most
 * MAX_SPEC_ISSUES issues are listed.
 */
export function parseSpecInput(input: unknown): ParseSpecResult {
  let issues: SpecIssue[];
  try {
    const result = SweepSpec.safeParse(input, { error: genericMessage, reportInput: true });
    if (result.success) return { success: true, spec: result.data };
    issues = [];
    for (const iss of result.error.issues) mapIssue(iss as ZodIssueLike, [], issues);
  } catch (err) {
    // A throwing getter or proxy in the input; report it rather than crash the caller.
    const why = err instanceof Error ? err.message : String(err);
    return { success: false, issues: [{ code: 'unreadable', path: [], message: `spec: the input could not be read (${why})` }] };
  }
  if (issues.length === 0) {
    issues.push({ code: 'custom', path: [], message: 'spec: invalid spec' });
  }
  if (issues.length > MAX_SPEC_ISSUES) {
    const rest = issues.length - (MAX_SPEC_ISSUES - 1);
    issues = issues.slice(0, MAX_SPEC_ISSUES - 1);
    issues.push({ code: 'too_many_issues', path: [], message: `spec: ${rest} more issues not shown` });
  }
  return { success: false, issues };
}

/** Keeps the path segments JSON can express (zod paths may hold symbols in theory). */
function cleanPath(path: PropertyKey[] | undefined): Path {
  return (path ?? []).map((p) => (typeof p === 'number' ? p : String(p)));
}

function push(out: SpecIssue[], code: string, path: Path, message: string): void {
  out.push({ code, path, message: `${formatSpecPath(path)}: ${message}` });
}

/** Maps one zod issue (found under `base`, for issues nested in a union branch) to ours. */
function mapIssue(iss: ZodIssueLike, base: Path, out: SpecIssue[]): void {
  const path = [...base, ...cleanPath(iss.path)];
  const message = iss.message ?? '';
  switch (iss.code) {
    case 'invalid_type': {
      const v = iss.input;
      if (path.length === 0) {
        push(out, 'invalid_type', path, `must be a spec object (JSON), got ${typeName(v)}`);
        return;
      }
      if (typeof v === 'number' && !Number.isFinite(v)) push(out, 'not_finite', path, message);
      else if (typeof v === 'number' && iss.expected === 'int') push(out, 'not_integer', path, message);
      else push(out, 'invalid_type', path, message);
      return;
    }
    case 'too_small':
    case 'too_big':
    case 'invalid_value':
    case 'invalid_format':
      push(out, iss.code, path, message);
      return;
    case 'not_multiple_of':
      push(out, 'invalid_value', path, message);
      return;
    case 'unrecognized_keys':
      for (const key of iss.keys ?? []) {
        push(out, 'unknown_field', [...path, key], `unknown field ${JSON.stringify(key)}; check its spelling and where it is placed`);
      }
      return;
    case 'invalid_union':
      mapUnion(iss, path, out);
      return;
    case 'invalid_key':
    case 'invalid_element':
      if (iss.issues?.length) for (const inner of iss.issues) mapIssue(inner, path, out);
      else push(out, 'invalid_value', path, message);
      return;
    case 'custom': {
      const code = iss.params?.code;
      push(out, typeof code === 'string' && KNOWN_CODES.has(code) ? code : 'custom', path, message);
      return;
    }
    default:
      push(out, 'custom', path, message);
  }
}

/** True if an issue says the value has the wrong shape for this branch (not a bad detail inside it). */
function isShapeMismatch(iss: ZodIssueLike): boolean {
  const depth = iss.path?.length ?? 0;
  switch (iss.code) {
    case 'unrecognized_keys':
      return true;
    case 'invalid_type':
      return depth === 0 || iss.input === undefined;
    case 'invalid_value':
    case 'invalid_union':
      return depth === 0;
    default:
      return false;
  }
}

/**
 * A tagged union with a bad tag gives one issue naming the allowed tags; any other union
 * descends into the one branch the value fits in shape, or else reports `no_match` with the
 * union's own message (which lists the accepted forms).
 */
function mapUnion(iss: ZodIssueLike, path: Path, out: SpecIssue[]): void {
  if (iss.discriminator !== undefined) {
    const parent = iss.input;
    const tag = parent !== null && typeof parent === 'object' && Object.hasOwn(parent, iss.discriminator)
      ? (parent as Record<string, unknown>)[iss.discriminator]
      : undefined;
    const allowed = oneOf(iss.options ?? []);
    if (tag === undefined) {
      push(out, 'invalid_type', path, `is required (${allowed})`);
    } else {
      push(out, 'invalid_value', path, `must be ${allowed}, got ${showValue(tag)}`);
    }
    return;
  }
  if (iss.input === undefined) {
    push(out, 'invalid_type', path, `is required: ${iss.message ?? 'see the accepted forms'}`);
    return;
  }
  const branches = iss.errors ?? [];
  const fitting = branches.filter((b) => b.length > 0 && !b.some(isShapeMismatch));
  if (fitting.length === 1) {
    for (const inner of fitting[0]) mapIssue(inner, path, out);
    return;
  }
  push(out, 'no_match', path, iss.message ?? 'matches none of the accepted forms');
}
