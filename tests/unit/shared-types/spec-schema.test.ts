/**
 * The SweepSpec schema itself (zod safeParse, as fastify-type-provider-zod uses it): edge
 * values, limits, defaults, refinements and the inferred types.
 */
import { describe, expect, expectTypeOf, it } from 'vitest';
import {
  LIMITS, PauliWord, SweepSpec, type Hamiltonian, type Lattice, type Observable, type SweepSpecInput,
  type TimeGrid,
} from '../../../shared-types/src/index.js';
import { minimalSpec } from './spec-fixtures.js';

type Input = Record<string, unknown>;

/** Parses a variant of the minimal spec. */
function parseWith(patch: Input) {
  return SweepSpec.safeParse({ ...minimalSpec(), ...patch });
}

/** Paths (joined with '.') of the issues, or [] if the spec is valid. */
function issuePaths(patch: Input): string[] {
  const r = parseWith(patch);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
}

/** The first issue of an invalid spec (fails the test if the spec is valid). */
function firstIssue(patch: Input) {
  const r = parseWith(patch);
  expect(r.success).toBe(false);
  if (r.success) throw new Error('unreachable');
  return r.error.issues[0];
}

describe('SweepSpec', () => {
  describe('when optional fields are left out', () => {
    it('should apply every documented default', () => {
      const r = SweepSpec.safeParse({
        ...minimalSpec(),
        observables: [
          { kind: 'site', pauli: 'X' },
          { kind: 'pair', paulis: 'ZZ' },
          { kind: 'magnetisation', pauli: 'Z' },
          { kind: 'structure-factor', paulis: 'ZZ', momenta: [[0, 0]] },
        ],
        h1: { model: 'xxz' },
      });
      expect(r.success).toBe(true);
      if (!r.success) return;
      const s = r.data;
      expect(s.label).toBe('');
      expect(s.engine).toBe('auto');
      expect(s.tolerance).toBe(1e-8);
      expect(s.seed).toBe(1);
      expect(s.lattice).toEqual({ kind: 'chain', length: 4, boundary: 'open' });
      expect(s.h0).toEqual({ model: 'ising', J: 1, hx: 0.5, hz: 0 });
      expect(s.h1).toEqual({ model: 'xxz', J: 1, delta: 1, hz: 0 });
      expect(s.times).toEqual({ start: 0, stop: 2, count: 5 });
      expect(s.observables).toEqual([
        { kind: 'site', pauli: 'X', perSite: false },
        { kind: 'pair', paulis: 'ZZ', pairs: 'nearest', perPair: false, connected: false },
        { kind: 'magnetisation', pauli: 'Z', pattern: 'uniform' },
        { kind: 'structure-factor', paulis: 'ZZ', momenta: [[0, 0]], connected: false },
      ]);
    });

    it('should default two-direction boundaries to open and farBonds to empty', () => {
      const ladder = parseWith({ lattice: { kind: 'ladder', length: 2 } });
      const bonds = parseWith({ lattice: { kind: 'bonds', sites: 2, bonds: [[0, 1]] } });
      expect(ladder.success && ladder.data.lattice).toEqual({ kind: 'ladder', length: 2, boundary: ['open', 'open'] });
      expect(bonds.success && bonds.data.lattice).toEqual({ kind: 'bonds', sites: 2, bonds: [[0, 1]], farBonds: [] });
    });
  });

  describe('when a number is NaN or infinite', () => {
    it.each([
      ['betas', { betas: [1, Number.NaN] }, 'betas.1'],
      ['betas', { betas: [Number.POSITIVE_INFINITY] }, 'betas.0'],
      // A type error inside the time-grid union is reported on the union by zod; parseSpecInput
      // narrows it to the field (parse-spec.test.ts).
      ['times.stop', { times: { stop: Number.NaN, count: 3 } }, 'times'],
      ['times.values', { times: { values: [Number.NaN] } }, 'times'],
      ['h0.J', { h0: { model: 'ising', J: Number.NEGATIVE_INFINITY } }, 'h0.J'],
      ['tolerance', { tolerance: Number.NaN }, 'tolerance'],
      ['h1 term weight', { h1: { model: 'pauli-sum', terms: [{ weight: Number.NaN, word: 'X0' }] } }, 'h1.terms.0.weight'],
      ['momentum', { observables: [{ kind: 'structure-factor', paulis: 'ZZ', momenta: [[0, Number.POSITIVE_INFINITY]] }] },
        'observables.0.momenta.0.1'],
    ])('should reject it in %s', (_name, patch, path) => {
      expect(issuePaths(patch)).toEqual([path]);
    });

    it('should say the number must be finite', () => {
      expect(firstIssue({ betas: [Number.NaN] }).message).toBe('must be a finite number, got NaN');
    });
  });

  describe('when a number is −0', () => {
    it('should accept −0 wherever 0 is allowed', () => {
      const r = parseWith({ betas: [-0], times: { start: -0, stop: 1, count: 2 }, seed: -0 });
      expect(r.success).toBe(true);
    });
  });

  describe('when the lattice is empty', () => {
    it.each([
      [{ kind: 'chain', length: 0 }, 'lattice.length'],
      [{ kind: 'ladder', length: 0 }, 'lattice.length'],
      [{ kind: 'square', size: [0, 3] }, 'lattice.size.0'],
      [{ kind: 'honeycomb', size: [2, 0] }, 'lattice.size.1'],
      [{ kind: 'bonds', sites: 0, bonds: [] }, 'lattice.sites'],
    ])('should reject %j', (lattice, path) => {
      expect(issuePaths({ lattice })).toEqual([path]);
    });

    it('should accept isolated spins (a bond list with no bonds)', () => {
      expect(issuePaths({ lattice: { kind: 'bonds', sites: 1, bonds: [] } })).toEqual([]);
    });
  });

  describe('when betas are out of range', () => {
    it('should reject a negative β and name the bound β ≥ 0', () => {
      const iss = firstIssue({ betas: [0, 1, -0.5] });
      expect(iss.path).toEqual(['betas', 2]);
      expect(iss.message).toBe('expected β ≥ 0, got -0.5');
    });

    it('should accept the edges 0 and maxBeta and reject just beyond maxBeta', () => {
      expect(issuePaths({ betas: [0, LIMITS.maxBeta] })).toEqual([]);
      expect(issuePaths({ betas: [LIMITS.maxBeta * (1 + 1e-15)] })).toEqual(['betas.0']);
    });

    it('should reject an empty list', () => {
      expect(firstIssue({ betas: [] }).message).toBe('at least 1 inverse temperature required, got 0');
    });

    it('should allow 64 inverse temperatures and say "at most 64 inverse temperatures" for 65', () => {
      expect(issuePaths({ betas: Array.from({ length: 64 }, (_, k) => k) })).toEqual([]);
      expect(firstIssue({ betas: Array.from({ length: 65 }, (_, k) => k) }).message)
        .toBe('at most 64 inverse temperatures, got 65');
    });

    it('should accept repeated and unsorted betas (the canonical form fixes them)', () => {
      expect(issuePaths({ betas: [2, 1, 2] })).toEqual([]);
    });
  });

  describe('when the time grid is out of range', () => {
    it('should accept 10001 points and reject 10002 with the limit in the message', () => {
      expect(issuePaths({ times: { stop: 1, count: LIMITS.maxTimePoints } })).toEqual([]);
      const iss = firstIssue({ times: { stop: 1, count: LIMITS.maxTimePoints + 1 } });
      expect(iss.path).toEqual(['times', 'count']);
      expect(iss.message).toBe('at most 10001 time points, got 10002');
    });

    it('should reject a huge count such as 1e9', () => {
      expect(issuePaths({ times: { stop: 1, count: 1e9 } })).toEqual(['times.count']);
    });

    it('should reject stop < start on the path of stop', () => {
      const iss = firstIssue({ times: { start: 2, stop: 1, count: 3 } });
      expect(iss.path).toEqual(['times', 'stop']);
      expect(iss.message).toBe('expected stop ≥ start (2), got 1');
    });

    it('should reject several points at one time but allow a single point', () => {
      expect(issuePaths({ times: { start: 1, stop: 1, count: 3 } })).toEqual(['times.stop']);
      expect(issuePaths({ times: { start: 1, stop: 1, count: 1 } })).toEqual([]);
      expect(issuePaths({ times: { stop: 0, count: 1 } })).toEqual([]);
    });

    it('should reject times beyond maxTime and negative times', () => {
      expect(issuePaths({ times: { stop: LIMITS.maxTime + 1, count: 2 } })).toEqual(['times.stop']);
      expect(issuePaths({ times: { values: [0, -1] } })).toEqual(['times.values.1']);
      expect(issuePaths({ times: { values: [] } })).toEqual(['times.values']);
    });

    it('should reject a fractional count (on the union: parseSpecInput narrows it to times.count)', () => {
      expect(issuePaths({ times: { stop: 1, count: 2.5 } })).toEqual(['times']);
    });

    it('should reject a grid that mixes the two forms', () => {
      expect(issuePaths({ times: { stop: 1, count: 3, values: [0] } })).toEqual(['times']);
    });
  });

  describe('when keys are unknown', () => {
    it.each([
      [{ betaz: [1] }],
      [{ lattice: { kind: 'chain', length: 4, boundry: 'open' } }],
      [{ observables: [{ kind: 'site', pauli: 'X', per_site: true }] }],
      [{ h0: { model: 'ising', Jz: 1 } }],
    ])('should reject %j', (patch) => {
      const r = parseWith(patch);
      expect(r.success).toBe(false);
      expect(r.success ? [] : r.error.issues.map((i) => i.code)).toContain('unrecognized_keys');
    });
  });

  describe('when values have the wrong type', () => {
    it.each([
      [{ betas: '1,2' }, 'betas', 'must be a list of inverse temperatures, got a string'],
      [{ betas: ['1'] }, 'betas.0', 'must be a finite number, got a string'],
      [{ seed: '3' }, 'seed', 'must be a whole number, got a string'],
      [{ seed: 1.5 }, 'seed', 'must be a whole number, got 1.5'],
      [{ lattice: { kind: 'chain', length: 4, boundary: 'twisted' } }, 'lattice.boundary',
        'must be one of "open", "periodic", got "twisted"'],
      [{ engine: 'fast' }, 'engine', 'must be one of "auto", "exact", "spectral", "free-fermion", "typical", "mps", "series", got "fast"'],
      [{ lattice: { kind: 'square', size: [2] } }, 'lattice.size', 'must be a size [Lx, Ly], got 1 entries'],
    ])('should reject %j', (patch, path, message) => {
      const iss = firstIssue(patch);
      expect(iss.path.join('.')).toBe(path);
      expect(iss.message).toBe(message);
    });
  });

  describe('for each lattice kind', () => {
    it.each<[string, Input]>([
      ['chain', { kind: 'chain', length: 6, boundary: 'periodic' }],
      ['ladder', { kind: 'ladder', length: 3, boundary: ['periodic', 'open'] }],
      ['square', { kind: 'square', size: [2, 4], boundary: ['periodic', 'periodic'] }],
      ['triangular', { kind: 'triangular', size: [3, 3] }],
      ['honeycomb', { kind: 'honeycomb', size: [2, 2], boundary: ['open', 'periodic'] }],
      ['bonds', { kind: 'bonds', sites: 3, bonds: [[0, 1], [2, 1]], farBonds: [[0, 2]], positions: [[0, 0], [1, 0], [2, 0]] }],
    ])('should accept a %s lattice', (_kind, lattice) => {
      expect(issuePaths({ lattice })).toEqual([]);
    });

    it('should cap planar lattices at maxSites sites (honeycomb counts 2 per cell)', () => {
      expect(issuePaths({ lattice: { kind: 'square', size: [64, 64] } })).toEqual([]);
      expect(issuePaths({ lattice: { kind: 'square', size: [64, 65] } })).toEqual(['lattice.size']);
      expect(issuePaths({ lattice: { kind: 'honeycomb', size: [32, 64] } })).toEqual([]);
      expect(firstIssue({ lattice: { kind: 'honeycomb', size: [33, 64] } }).message)
        .toBe('a 33×64 honeycomb lattice has 4224 sites; at most 4096 sites');
    });

    it('should cap a ladder at maxSites/2 rungs', () => {
      expect(issuePaths({ lattice: { kind: 'ladder', length: LIMITS.maxSites / 2 } })).toEqual([]);
      expect(issuePaths({ lattice: { kind: 'ladder', length: LIMITS.maxSites / 2 + 1 } })).toEqual(['lattice.length']);
    });

    it('should reject an unknown kind on the path of the tag', () => {
      expect(issuePaths({ lattice: { kind: 'kagome', size: [2, 2] } })).toEqual(['lattice.kind']);
    });
  });

  describe('when a bond list is inconsistent', () => {
    const bonds = (extra: Input) => issuePaths({ lattice: { kind: 'bonds', sites: 3, bonds: [[0, 1]], ...extra } });

    it('should reject a site outside 0..sites−1 on the path of that end', () => {
      expect(bonds({ bonds: [[0, 3]] })).toEqual(['lattice.bonds.0.1']);
    });

    it('should reject a bond from a site to itself', () => {
      expect(bonds({ bonds: [[1, 1]] })).toEqual(['lattice.bonds.0']);
    });

    it('should reject a bond repeated in reverse order or across the two lists', () => {
      expect(bonds({ bonds: [[0, 1], [1, 0]] })).toEqual(['lattice.bonds.1']);
      expect(bonds({ farBonds: [[1, 0]] })).toEqual(['lattice.farBonds.0']);
    });

    it('should require one position per site', () => {
      expect(bonds({ positions: [[0, 0], [1, 0]] })).toEqual(['lattice.positions']);
    });
  });

  describe('PauliWord', () => {
    it.each(['', 'X0', 'Z3 X0', '  X0   Y2  ', 'Y4095', 'X10 Z2'])('should accept %j', (word) => {
      expect(PauliWord.safeParse(word).success).toBe(true);
    });

    it.each([
      ['X0Z1', 'missing space'], ['x0', 'lower case'], ['X01', 'leading zero'], ['X-1', 'negative site'],
      ['W0', 'unknown letter'], ['X 0', 'split factor'], ['X0,Z1', 'comma'], ['X0\tZ1', 'tab'],
      ['I0', 'identity letter'], ['X1.5', 'fraction'],
    ])('should reject %j (%s) as a format error', (word) => {
      const r = PauliWord.safeParse(word);
      expect(r.success).toBe(false);
      expect(r.success ? '' : r.error.issues[0].code).toBe('invalid_format');
    });

    it('should reject a site repeated within a word', () => {
      const r = PauliWord.safeParse('X0 Z0');
      expect(r.success ? '' : r.error.issues[0].message).toBe('site 0 appears more than once; write each site once (e.g. "X0 Z3")');
    });

    it('should reject a site above maxSites − 1', () => {
      const r = PauliWord.safeParse('X4096');
      expect(r.success ? '' : r.error.issues[0].message).toBe('site 4096 in "X4096" is above the largest site index 4095');
    });

    it('should reject an empty Pauli sum', () => {
      expect(issuePaths({ h1: { model: 'pauli-sum', terms: [] } })).toEqual(['h1.terms']);
    });
  });

  describe('tolerance, seed and label', () => {
    it('should accept tolerance in [1e-13, 1] only', () => {
      expect(issuePaths({ tolerance: 1e-13 })).toEqual([]);
      expect(issuePaths({ tolerance: 1 })).toEqual([]);
      expect(firstIssue({ tolerance: 1e-14 }).message).toBe('expected tolerance ≥ 1e-13, got 1e-14');
      expect(firstIssue({ tolerance: 2 }).message).toBe('expected tolerance ≤ 1, got 2');
    });

    it('should accept seeds 0..2³¹−1', () => {
      expect(issuePaths({ seed: 0 })).toEqual([]);
      expect(issuePaths({ seed: 2 ** 31 - 1 })).toEqual([]);
      expect(issuePaths({ seed: 2 ** 31 })).toEqual(['seed']);
      expect(issuePaths({ seed: -1 })).toEqual(['seed']);
    });

    it('should accept printable labels up to 200 characters, any script', () => {
      expect(issuePaths({ label: 'a'.repeat(200) })).toEqual([]);
      expect(issuePaths({ label: 'β-sweep №3 — 格子 ✓ "quoted" <tag>' })).toEqual([]);
      expect(firstIssue({ label: 'a'.repeat(201) }).message).toBe('may have at most 200 characters, got 201');
    });

    it.each([
      ['a newline', 'a\nb'], ['a tab', 'a\tb'], ['NUL', 'a\u0000'], ['DEL', 'a\u007f'],
      ['a right-to-left override', 'abc\u202Edef'], ['a lone surrogate', 'a\uD800b'], ['a line separator', 'a\u2028b'],
    ])('should reject a label with %s', (_what, label) => {
      expect(issuePaths({ label })).toEqual(['label']);
    });
  });

  describe('observables', () => {
    it('should keep the order within an explicit pair and reject a pair on one site', () => {
      expect(issuePaths({ observables: [{ kind: 'pair', paulis: 'XY', pairs: [[1, 0]] }] })).toEqual([]);
      expect(issuePaths({ observables: [{ kind: 'pair', paulis: 'XY', pairs: [[2, 2]] }] }))
        .toEqual(['observables.0.pairs.0']);
    });

    it('should reject repeated pairs, sites and momenta (−0 equals 0)', () => {
      expect(issuePaths({ observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[0, 1], [0, 1]] }] }))
        .toEqual(['observables.0.pairs.1']);
      expect(issuePaths({ observables: [{ kind: 'site', pauli: 'Z', sites: [1, 2, 1] }] }))
        .toEqual(['observables.0.sites.2']);
      expect(issuePaths({ observables: [{ kind: 'structure-factor', paulis: 'ZZ', momenta: [[0, 1], [-0, 1]] }] }))
        .toEqual(['observables.0.momenta.1']);
    });

    it('should reject an empty observable list and more than maxObservables', () => {
      expect(issuePaths({ observables: [] })).toEqual(['observables']);
      const many = Array.from({ length: LIMITS.maxObservables + 1 }, () => ({ kind: 'energy', of: 'h0' }));
      expect(issuePaths({ observables: many })).toEqual(['observables']);
    });

    it('should reject an unknown pair selection', () => {
      expect(issuePaths({ observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'farthest' }] }))
        .toEqual(['observables.0.pairs']);
    });
  });

  describe('inferred types', () => {
    it('should infer the parsed spec with defaults filled in', () => {
      expectTypeOf<SweepSpec['betas']>().toEqualTypeOf<number[]>();
      expectTypeOf<SweepSpec['label']>().toEqualTypeOf<string>();
      expectTypeOf<SweepSpec['engine']>().toEqualTypeOf<'auto' | 'exact' | 'spectral' | 'free-fermion' | 'typical' | 'mps' | 'series'>();
      expectTypeOf<SweepSpec['tolerance']>().toEqualTypeOf<number>();
      expectTypeOf<SweepSpec['seed']>().toEqualTypeOf<number>();
      expectTypeOf<Lattice['kind']>()
        .toEqualTypeOf<'chain' | 'ladder' | 'square' | 'triangular' | 'honeycomb' | 'bonds'>();
      expectTypeOf<Hamiltonian['model']>().toEqualTypeOf<'ising' | 'xxz' | 'pauli-sum'>();
      expectTypeOf<Observable['kind']>()
        .toEqualTypeOf<'site' | 'pair' | 'energy' | 'magnetisation' | 'structure-factor'>();
      expectTypeOf<TimeGrid>()
        .toEqualTypeOf<{ start: number; stop: number; count: number } | { values: number[] }>();
      expectTypeOf<Extract<Lattice, { kind: 'bonds' }>['farBonds']>().toEqualTypeOf<[number, number][]>();
      expectTypeOf<Extract<Lattice, { kind: 'bonds' }>['positions']>().toEqualTypeOf<[number, number][] | undefined>();
      expectTypeOf<Extract<Observable, { kind: 'pair' }>['pairs']>()
        .toEqualTypeOf<'nearest' | 'next-nearest' | 'by-distance' | [number, number][]>();
    });

    it('should infer the input with defaulted fields optional', () => {
      expectTypeOf<SweepSpecInput['label']>().toEqualTypeOf<string | undefined>();
      expectTypeOf<SweepSpecInput['seed']>().toEqualTypeOf<number | undefined>();
      expectTypeOf<SweepSpecInput['betas']>().toEqualTypeOf<number[]>();
      expectTypeOf(SweepSpec.parse).returns.toEqualTypeOf<SweepSpec>();
    });
  });
});
