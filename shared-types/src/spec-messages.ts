/**
 * Internal (not exported from index.ts): message builders for the spec schemas, so that each
 * message names the quantity and the limit it broke ("expected β ≥ 0, got -1", "at most 64
 * inverse temperatures, got 65"). Messages are for people; the stable part of an issue is its
 * code (see spec-issue.ts).
 */

/** The fields of a zod raw issue that the builders read (all optional: issues differ). */
export interface RawIssueLike {
  readonly code?: string;
  readonly input?: unknown;
  readonly expected?: string;
  readonly minimum?: number | bigint;
  readonly maximum?: number | bigint;
  readonly inclusive?: boolean;
  readonly values?: readonly unknown[];
  readonly origin?: string;
}

/** A zod `error` customisation: a message, or undefined to fall through to the next map. */
export type MessageFn = (iss: RawIssueLike) => string | undefined;

/** Longest quoted string shown in a message. */
const MAX_QUOTED = 40;

/** The JSON type of a value in words ("a string", "a list", "nothing"). */
export function typeName(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'a list';
  switch (typeof v) {
    case 'string': return 'a string';
    case 'number': return Number.isFinite(v) ? 'a number' : String(v);
    case 'boolean': return 'a boolean';
    case 'object': return 'an object';
    default: return `a ${typeof v}`;
  }
}

/** A short rendering of a value for a message: numbers as written (−0 as "-0"), strings quoted and cut. */
export function showValue(v: unknown): string {
  if (typeof v === 'number') return Object.is(v, -0) ? '-0' : String(v);
  if (typeof v === 'string') {
    const cut = v.length > MAX_QUOTED ? `${v.slice(0, MAX_QUOTED)}…` : v;
    return JSON.stringify(cut);
  }
  if (Array.isArray(v)) return `a list of ${v.length}`;
  return typeName(v);
}

/** "one of "a", "b", "c"". */
export function oneOf(values: readonly unknown[]): string {
  return values.length === 1 ? JSON.stringify(values[0]) : `one of ${values.map((x) => JSON.stringify(x)).join(', ')}`;
}

const lengthOf = (v: unknown): number | undefined =>
  Array.isArray(v) || typeof v === 'string' ? v.length : undefined;

/**
 * Messages for a type mismatch or a missing field, shared by every builder. They have no
 * subject: the field path is put in front of them (parseSpecInput) or beside them (zod's path).
 */
function typeMessage(iss: RawIssueLike, expected: string): string {
  if (iss.input === undefined) return 'is required';
  if (typeof iss.input === 'number' && !Number.isFinite(iss.input)) {
    return `must be a finite number, got ${iss.input}`;
  }
  if (iss.expected === 'int' && typeof iss.input === 'number') {
    return `must be a whole number, got ${showValue(iss.input)}`;
  }
  return `must be ${expected}, got ${typeName(iss.input)}`;
}

/**
 * Messages for a number field. `symbol` names it in comparisons ("β" → "expected β ≥ 0"),
 * `integer` makes the type message ask for a whole number.
 */
export function numberMessage(symbol: string, integer = false): MessageFn {
  return (iss) => {
    switch (iss.code) {
      case 'invalid_type':
        return typeMessage(iss, integer ? 'a whole number' : 'a finite number');
      case 'too_small':
        return `expected ${symbol} ${iss.inclusive === false ? '>' : '≥'} ${String(iss.minimum)}, got ${showValue(iss.input)}`;
      case 'too_big':
        return `expected ${symbol} ${iss.inclusive === false ? '<' : '≤'} ${String(iss.maximum)}, got ${showValue(iss.input)}`;
      default:
        return undefined;
    }
  };
}

/** Messages for a list of `plural` (singular `singular`), naming the length limits. */
export function listMessage(plural: string, singular: string): MessageFn {
  const count = (n: number | bigint | undefined) => `${String(n)} ${n === 1 || n === 1n ? singular : plural}`;
  return (iss) => {
    switch (iss.code) {
      case 'invalid_type':
        return iss.input === undefined
          ? `is required (a list of ${plural})`
          : `must be a list of ${plural}, got ${typeName(iss.input)}`;
      case 'too_small':
        return `at least ${count(iss.minimum)} required, got ${String(lengthOf(iss.input) ?? '?')}`;
      case 'too_big':
        return `at most ${count(iss.maximum)}, got ${String(lengthOf(iss.input) ?? '?')}`;
      default:
        return undefined;
    }
  };
}

/** Messages for a fixed-length list (a tuple) such as a site pair [i, j]. */
export function tupleMessage(shape: string): MessageFn {
  return (iss) => {
    switch (iss.code) {
      case 'invalid_type':
        return iss.input === undefined ? `is required (${shape})` : `must be ${shape}, got ${typeName(iss.input)}`;
      case 'too_small':
      case 'too_big':
        return `must be ${shape}, got ${String(lengthOf(iss.input) ?? '?')} entries`;
      default:
        return undefined;
    }
  };
}

/** Messages for a string field, naming its length limit. */
export function stringMessage(): MessageFn {
  return (iss) => {
    switch (iss.code) {
      case 'invalid_type':
        return typeMessage(iss, 'a string');
      case 'too_big':
        return `may have at most ${String(iss.maximum)} characters, got ${String(lengthOf(iss.input) ?? '?')}`;
      default:
        return undefined; // a pattern check words its own message
    }
  };
}

/** Messages for an enum or literal: "must be one of …, got …". */
export function choiceMessage(): MessageFn {
  return (iss) => {
    if (iss.code === 'invalid_value' && iss.values) {
      return iss.input === undefined
        ? `is required (${oneOf(iss.values)})`
        : `must be ${oneOf(iss.values)}, got ${showValue(iss.input)}`;
    }
    if (iss.code === 'invalid_type') return typeMessage(iss, 'a string');
    return undefined;
  };
}

/**
 * The fallback for issues no schema words itself (used by parseSpecInput as the per-parse
 * map): generic, but still with the limit.
 */
export const genericMessage: MessageFn = (iss) => {
  switch (iss.code) {
    case 'invalid_type': {
      const expected = iss.expected === 'int' ? 'a whole number'
        : iss.expected === 'array' || iss.expected === 'tuple' ? 'a list'
          : iss.expected === 'object' ? 'an object'
            : iss.expected === 'number' ? 'a finite number'
              : `${iss.expected === 'boolean' ? 'a boolean' : iss.expected === 'string' ? 'a string' : String(iss.expected)}`;
      return typeMessage(iss, expected);
    }
    case 'too_small':
      return iss.origin === 'number' || iss.origin === 'int'
        ? `must be ${iss.inclusive === false ? '>' : '≥'} ${String(iss.minimum)}, got ${showValue(iss.input)}`
        : `needs at least ${String(iss.minimum)} ${iss.origin === 'string' ? 'characters' : 'entries'}, got ${String(lengthOf(iss.input) ?? '?')}`;
    case 'too_big':
      return iss.origin === 'number' || iss.origin === 'int'
        ? `must be ${iss.inclusive === false ? '<' : '≤'} ${String(iss.maximum)}, got ${showValue(iss.input)}`
        : `may have at most ${String(iss.maximum)} ${iss.origin === 'string' ? 'characters' : 'entries'}, got ${String(lengthOf(iss.input) ?? '?')}`;
    case 'invalid_value':
      return iss.values ? `must be ${oneOf(iss.values)}, got ${showValue(iss.input)}` : undefined;
    case 'invalid_union':
      return `${showValue(iss.input)} matches none of the accepted forms`;
    default:
      return undefined;
  }
};
