/**
 * parseSpecInput: zod issues mapped to stable codes, paths and messages that name the field
 * and the limit; never throws.
 */
import { describe, expect, expectTypeOf, it } from 'vitest';
import {
  MAX_SPEC_ISSUES, SPEC_ISSUE_CODES, formatSpecPath, parseSpecInput, type SpecIssue, type SweepSpec,
} from '../../../shared-types/src/index.js';
import { minimalSpec } from './spec-fixtures.js';

type Input = Record<string, unknown>;

/** The issues of the minimal spec with `patch` applied (fails the test if it is valid). */
function issuesWith(patch: Input): SpecIssue[] {
  const r = parseSpecInput({ ...minimalSpec(), ...patch });
  expect(r.success).toBe(false);
  return r.success ? [] : r.issues;
}

describe('parseSpecInput', () => {
  describe('when the spec is valid', () => {
    it('should return the spec with defaults applied', () => {
      const r = parseSpecInput(minimalSpec());
      expect(r.success).toBe(true);
      if (!r.success) return;
      expect(r.spec.engine).toBe('auto');
      expect(r.spec.lattice).toEqual({ kind: 'chain', length: 4, boundary: 'open' });
      expectTypeOf(r.spec).toEqualTypeOf<SweepSpec>();
    });

    it('should return a fresh object with the ordinary prototype', () => {
      const input = minimalSpec();
      const r = parseSpecInput(input);
      expect(r.success && r.spec).not.toBe(input);
      expect(r.success && Object.getPrototypeOf(r.spec)).toBe(Object.prototype);
    });
  });

  describe('when a field breaks a rule', () => {
    it.each<[string, Input, string, (string | number)[], string]>([
      ['a negative β', { betas: [0, 1, -0.5] }, 'too_small', ['betas', 2], 'betas[2]: expected β ≥ 0, got -0.5'],
      ['a β above the limit', { betas: [1001] }, 'too_big', ['betas', 0], 'betas[0]: expected β ≤ 1000, got 1001'],
      ['too many betas', { betas: Array.from({ length: 65 }, (_, k) => k / 10) }, 'too_big', ['betas'],
        'betas: at most 64 inverse temperatures, got 65'],
      ['no betas', { betas: [] }, 'too_small', ['betas'], 'betas: at least 1 inverse temperature required, got 0'],
      ['a NaN β', { betas: [Number.NaN] }, 'not_finite', ['betas', 0], 'betas[0]: must be a finite number, got NaN'],
      ['an infinite J', { h0: { model: 'ising', J: Number.POSITIVE_INFINITY } }, 'not_finite', ['h0', 'J'],
        'h0.J: must be a finite number, got Infinity'],
      ['a fractional seed', { seed: 2.5 }, 'not_integer', ['seed'], 'seed: must be a whole number, got 2.5'],
      ['betas as a string', { betas: '0.5' }, 'invalid_type', ['betas'],
        'betas: must be a list of inverse temperatures, got a string'],
      ['a missing field', { betas: undefined }, 'invalid_type', ['betas'],
        'betas: is required (a list of inverse temperatures)'],
      ['a misspelt field', { seeds: 3 }, 'unknown_field', ['seeds'],
        'seeds: unknown field "seeds"; check its spelling and where it is placed'],
      ['an unknown lattice kind', { lattice: { kind: 'cubic', size: [2, 2] } }, 'invalid_value', ['lattice', 'kind'],
        'lattice.kind: must be one of "chain", "ladder", "square", "triangular", "honeycomb", "bonds", got "cubic"'],
      ['a lattice without kind', { lattice: { length: 4 } }, 'invalid_type', ['lattice', 'kind'],
        'lattice.kind: is required (one of "chain", "ladder", "square", "triangular", "honeycomb", "bonds")'],
      ['an unknown engine', { engine: 'gpu' }, 'invalid_value', ['engine'], 'engine: must be one of "auto", "exact", "spectral", "free-fermion", "typical", "mps", "series", got "gpu"'],
      ['a malformed Pauli word', { h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0Y1' }] } }, 'invalid_format',
        ['h1', 'terms', 0, 'word'],
        'h1.terms[0].word: a Pauli word is space-separated factors like "X0 Z3": a letter X, Y or Z, then a site index ("" is the identity)'],
      ['a site repeated in a word', { h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'Z2 X2' }] } }, 'duplicate_site',
        ['h1', 'terms', 0, 'word'], 'h1.terms[0].word: site 2 appears more than once; write each site once (e.g. "X0 Z3")'],
      ['stop before start', { times: { start: 3, stop: 1, count: 4 } }, 'time_grid_reversed', ['times', 'stop'],
        'times.stop: expected stop ≥ start (3), got 1'],
      ['a huge time count', { times: { stop: 1, count: 100_000 } }, 'too_big', ['times', 'count'],
        'times.count: at most 10001 time points, got 100000'],
      ['a fractional time count', { times: { stop: 1, count: 2.5 } }, 'not_integer', ['times', 'count'],
        'times.count: must be a whole number, got 2.5'],
      ['a string among explicit times', { times: { values: [0, 'one'] } }, 'invalid_type', ['times', 'values', 1],
        'times.values[1]: must be a finite number, got a string'],
      ['an unknown field in an explicit grid', { times: { values: [0], count: 3 } }, 'unknown_field', ['times', 'count'],
        'times.count: unknown field "count"; check its spelling and where it is placed'],
      ['a time grid of neither form', { times: { stop: 1 } }, 'no_match', ['times'],
        'times: a time grid is either { start?, stop, count } or { values: [t, …] }'],
      ['a missing time grid', { times: undefined }, 'invalid_type', ['times'],
        'times: is required: a time grid is either { start?, stop, count } or { values: [t, …] }'],
      ['an unknown pair selection', { observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'all' }] }, 'no_match',
        ['observables', 0, 'pairs'],
        'observables[0].pairs: pairs must be "nearest", "next-nearest", "by-distance" or a list of site pairs [[i, j], …]'],
      ['a bad site in an explicit pair', { observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[0, 1], [1, 'b']] }] },
        'invalid_type', ['observables', 0, 'pairs', 1, 1], 'observables[0].pairs[1][1]: must be a whole number, got a string'],
      ['a pair on one site', { observables: [{ kind: 'pair', paulis: 'XY', pairs: [[3, 3]] }] }, 'self_bond',
        ['observables', 0, 'pairs', 0], 'observables[0].pairs[0]: a pair joins two different sites, got [3, 3]'],
      ['a repeated bond', { lattice: { kind: 'bonds', sites: 3, bonds: [[0, 1], [1, 0]] } }, 'duplicate_bond',
        ['lattice', 'bonds', 1], 'lattice.bonds[1]: the bond 0–1 is already listed as bonds[0]'],
      ['a bond to a missing site', { lattice: { kind: 'bonds', sites: 3, bonds: [[0, 7]] } }, 'site_out_of_range',
        ['lattice', 'bonds', 0, 1], 'lattice.bonds[0][1]: site 7 does not exist: this lattice has sites 0..2'],
      ['a lattice too large', { lattice: { kind: 'triangular', size: [100, 100] } }, 'lattice_too_large', ['lattice', 'size'],
        'lattice.size: a 100×100 triangular lattice has 10000 sites; at most 4096 sites'],
      ['a label with a line break', { label: 'one\ntwo' }, 'invalid_format', ['label'],
        'label: must be printable text on one line (no control characters, line breaks or direction overrides)'],
      ['a pair repeated', { observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[0, 1], [0, 1]] }] },
        'duplicate_pair', ['observables', 0, 'pairs', 1],
        'observables[0].pairs[1]: repeats the pair at index 0; list each pair once'],
      ['a repeated momentum', { observables: [{ kind: 'structure-factor', paulis: 'XX', momenta: [[0, 0], [0, 0]] }] },
        'duplicate_momentum', ['observables', 0, 'momenta', 1],
        'observables[0].momenta[1]: repeats the momentum at index 0; list each momentum once'],
      ['positions of the wrong length', { lattice: { kind: 'bonds', sites: 2, bonds: [], positions: [[0, 0]] } },
        'positions_mismatch', ['lattice', 'positions'], 'lattice.positions: one position per site: expected 2, got 1'],
      ['several points at one time', { times: { start: 1, stop: 1, count: 3 } }, 'time_grid_degenerate', ['times', 'stop'],
        'times.stop: 3 points need stop > start; use count 1 for the single time 1'],
      ['a tolerance of zero', { tolerance: 0 }, 'too_small', ['tolerance'], 'tolerance: expected tolerance ≥ 1e-13, got 0'],
      ['an unknown observable kind', { observables: [{ kind: 'entropy' }] }, 'invalid_value', ['observables', 0, 'kind'],
        'observables[0].kind: must be one of "site", "pair", "energy", "magnetisation", "structure-factor", got "entropy"'],
    ])('should report %s', (_what, patch, code, path, message) => {
      const issues = issuesWith(patch);
      expect(issues).toEqual([{ code, path, message }]);
    });

    it('should accept a mixed pair in both orders (XY on [0, 1] and on [1, 0] differ)', () => {
      const r = parseSpecInput({ ...minimalSpec(), observables: [{ kind: 'pair', paulis: 'XY', pairs: [[0, 1], [1, 0]] }] });
      expect(r.success).toBe(true);
    });

    it('should report every problem of a spec, each with its own path', () => {
      const issues = issuesWith({ betas: [-1, Number.NaN], seed: -2, colour: 'red' });
      expect(issues.map((i) => [i.code, formatSpecPath(i.path)])).toEqual([
        ['too_small', 'betas[0]'],
        ['not_finite', 'betas[1]'],
        ['too_small', 'seed'],
        ['unknown_field', 'colour'],
      ]);
    });

    it('should use only codes from SPEC_ISSUE_CODES', () => {
      const bad: Input = {
        label: 7, lattice: { kind: 'bonds', sites: 2, bonds: [[0, 0]], positions: [] },
        h0: { model: 'pauli-sum', terms: [{ weight: '1', word: 'Q1' }] }, h1: 'ising',
        betas: [Number.NaN, -1, 1e9], times: { values: [] }, observables: [{ kind: 'site', pauli: 'W', sites: [1.5] }],
        engine: 3, tolerance: Number.POSITIVE_INFINITY, seed: 0.5, more: true,
      };
      const issues = issuesWith(bad);
      expect(issues.length).toBeGreaterThanOrEqual(14);
      for (const issue of issues) {
        expect(SPEC_ISSUE_CODES).toContain(issue.code);
        expect(issue.message.startsWith(`${formatSpecPath(issue.path)}: `)).toBe(true);
      }
    });
  });

  describe('when there are very many problems', () => {
    it(`should list at most ${MAX_SPEC_ISSUES} issues and count the rest in the last one`, () => {
      const terms = Array.from({ length: 500 }, (_, k) => ({ weight: 1, word: `x${k}` }));
      const issues = issuesWith({ h1: { model: 'pauli-sum', terms } });
      // 500 malformed words: 99 listed, 401 counted.
      expect(issues[0].path).toEqual(['h1', 'terms', 0, 'word']);
      expect(issues).toHaveLength(MAX_SPEC_ISSUES);
      expect(issues[MAX_SPEC_ISSUES - 1]).toEqual({ code: 'too_many_issues', path: [], message: 'spec: 401 more issues not shown' });
    });
  });

  describe('when the input is not a spec object', () => {
    it.each<[string, unknown]>([
      ['undefined', undefined], ['null', null], ['a number', 42], ['a string', '{"betas":[1]}'], ['a list', []],
      ['a boolean', true], ['a bigint', 10n], ['a symbol', Symbol('spec')], ['a function', () => 1],
    ])('should report invalid_type at the root for %s', (_what, input) => {
      const r = parseSpecInput(input);
      expect(r.success).toBe(false);
      expect(r.success ? [] : r.issues.map((i) => [i.code, i.path])).toEqual([['invalid_type', []]]);
      expect(r.success ? '' : r.issues[0].message).toMatch(/^spec: must be a spec object \(JSON\), got /);
    });

    it('should not throw when a getter or a proxy throws', () => {
      const getter = { ...minimalSpec(), get betas(): number[] { throw new Error('no betas today'); } };
      const proxy = new Proxy({}, { ownKeys() { throw new Error('trap'); }, get() { throw new Error('trap'); } });
      for (const input of [getter, proxy]) {
        const r = parseSpecInput(input);
        expect(r.success).toBe(false);
        expect(r.success ? '' : r.issues[0].code).toBe('unreadable');
      }
    });

    it('should not throw on a cyclic object', () => {
      const cyclic: Input = { ...minimalSpec() };
      cyclic.self = cyclic;
      (cyclic.lattice as Input).parent = cyclic;
      const r = parseSpecInput(cyclic);
      expect(r.success ? [] : r.issues.map((i) => i.path)).toEqual([['lattice', 'parent'], ['self']]);
    });
  });

  describe('when keys try to reach the prototype', () => {
    it('should report "__proto__" as an unknown field and pollute nothing', () => {
      const text = JSON.stringify({ ...minimalSpec(), lattice: { kind: 'chain', length: 4 } })
        .replace('{"lattice":{', '{"__proto__":{"polluted":true},"lattice":{"__proto__":{"polluted":true},');
      const input: unknown = JSON.parse(text);
      const r = parseSpecInput(input);
      expect(r.success ? [] : r.issues.map((i) => [i.code, i.path])).toEqual([
        ['unknown_field', ['lattice', '__proto__']],
        ['unknown_field', ['__proto__']],
      ]);
      expect(({} as Input).polluted).toBeUndefined();
      expect(Object.prototype).not.toHaveProperty('polluted');
    });

    it('should report "constructor" and "prototype" as unknown fields', () => {
      const r = parseSpecInput({ ...minimalSpec(), constructor: { prototype: { polluted: true } }, prototype: 1 });
      expect(r.success ? [] : r.issues.map((i) => i.path)).toEqual([['constructor'], ['prototype']]);
      expect(({} as Input).polluted).toBeUndefined();
    });
  });
});

describe('formatSpecPath', () => {
  it.each<[(string | number)[], string]>([
    [[], 'spec'],
    [['betas', 2], 'betas[2]'],
    [['h0', 'terms', 1, 'word'], 'h0.terms[1].word'],
    [['lattice', 'bonds', 0, 1], 'lattice.bonds[0][1]'],
    [['odd key', 0], '["odd key"][0]'],
    [['a', 'b-c'], 'a["b-c"]'],
  ])('should write %j as %s', (path, text) => {
    expect(formatSpecPath(path)).toBe(text);
  });
});
