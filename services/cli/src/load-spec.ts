/**
 * Reads a spec file for the local commands: JSON parse errors and validation issues become
 * one readable message listing each field path and its limit. Nothing is written on failure.
 */
import { readFile } from 'node:fs/promises';
import type { SpecIssue, SweepSpec } from '../../../shared-types/src/index.js';
import { parseSweepSpec } from '../../../workers/src/sweep/index.js';

/** A spec file could not be used; the message lists every problem. Exit code 2. */
export class SpecFileError extends Error {
  override readonly name = 'SpecFileError';
  constructor(message: string, readonly issues: SpecIssue[] = []) {
    super(message);
  }
}

/** Formats an issue path as `betas[2]` / `h0.terms[1].word`. */
export function formatPath(path: ReadonlyArray<string | number>): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out ? `.${p}` : p;
  return out || '(spec)';
}

export async function loadSpec(file: string): Promise<{ spec: SweepSpec; hash: string }> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (err) {
    throw new SpecFileError(`cannot read spec file '${file}': ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    throw new SpecFileError(`spec file '${file}' is not valid JSON: ${(err as Error).message}`);
  }
  const parsed = parseSweepSpec(json);
  if (!parsed.success) {
    const lines = parsed.issues.map((i) => `  ${i.message} [${i.code}]`);
    throw new SpecFileError(`spec file '${file}' is invalid:\n${lines.join('\n')}`, parsed.issues);
  }
  return { spec: parsed.spec, hash: parsed.hash };
}
