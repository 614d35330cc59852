import { describe, expect, it } from 'vitest';
import { SweepSpec, type SweepSpecInput } from '../../../shared-types/src/index.js';
import { CHECK_SPEC_CODES, checkSpec } from '../../../workers/src/sweep/check-spec.js';

const base: SweepSpecInput = {
  lattice: { kind: 'chain', length: 4 },
  h0: { model: 'ising', hx: 1 },
  h1: { model: 'ising' },
  betas: [1],
  times: { stop: 1, count: 3 },
  observables: [{ kind: 'site', pauli: 'Z' }],
};

/** A schema-valid spec with `patch` applied (parsed, so defaults are in place). */
const spec = (patch: Partial<SweepSpecInput>) => SweepSpec.parse({ ...base, ...patch });

/** A spec the schema would reject, assembled in code (checkSpec must still catch it). */
const raw = (patch: Record<string, unknown>) => ({ ...spec({}), ...patch }) as SweepSpec;

describe('checkSpec', () => {
  it('returns no issues for a valid spec', () => {
    expect(checkSpec(spec({}))).toEqual([]);
  });

  it('reports a Pauli word site outside the lattice with its path and the allowed range', () => {
    const issues = checkSpec(spec({
      h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0' }, { weight: 1, word: 'Z1' }, { weight: 1, word: 'X0 Z7' }] },
    }));
    expect(issues).toHaveLength(1);
    expect(issues[0].code).toBe('site_out_of_range');
    expect(issues[0].path).toEqual(['h1', 'terms', 2, 'word']);
    expect(issues[0].message).toMatch(/h1\.terms\[2\]\.word.*site 7.*sites 0\.\.3/);
  });

  it('reports site lists and explicit pairs outside the lattice, pointing at the entry', () => {
    const issues = checkSpec(spec({
      observables: [
        { kind: 'site', pauli: 'X', sites: [0, 4] },
        { kind: 'pair', paulis: 'XY', pairs: [[0, 1], [2, 9]] },
      ],
    }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([
      ['site_out_of_range', ['observables', 0, 'sites', 1]],
      ['site_out_of_range', ['observables', 1, 'pairs', 1, 1]],
    ]);
  });

  it('treats reversed pairs as duplicates for equal letters only', () => {
    const sym = checkSpec(spec({ observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[0, 1], [1, 0]] }] }));
    expect(sym.map((i) => i.code)).toEqual(['duplicate_pair']);
    expect(checkSpec(spec({ observables: [{ kind: 'pair', paulis: 'XY', pairs: [[0, 1], [1, 0]] }] }))).toEqual([]);
  });

  it('reports bond-list problems assembled without the schema: range, self-bond, duplicate, positions', () => {
    const issues = checkSpec(raw({
      lattice: { kind: 'bonds', sites: 3, bonds: [[0, 1], [1, 0], [2, 2], [0, 5]], farBonds: [[1, 0]], positions: [[0, 0]] },
    }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([
      ['duplicate_bond', ['lattice', 'bonds', 1]],
      ['self_bond', ['lattice', 'bonds', 2]],
      ['site_out_of_range', ['lattice', 'bonds', 3, 1]],
      ['duplicate_bond', ['lattice', 'farBonds', 0]],
      ['positions_mismatch', ['lattice', 'positions']],
    ]);
  });

  it('reports a staggered magnetisation on a non-bipartite lattice and accepts it on a bipartite one', () => {
    const stag = [{ kind: 'magnetisation' as const, pauli: 'Z' as const, pattern: 'staggered' as const }];
    const odd = checkSpec(spec({ lattice: { kind: 'chain', length: 5, boundary: 'periodic' }, observables: stag }));
    expect(odd.map((i) => [i.code, i.path])).toEqual([['lattice_not_bipartite', ['observables', 0, 'pattern']]]);
    expect(checkSpec(spec({ lattice: { kind: 'triangular', size: [3, 3] }, observables: stag }))[0].code).toBe('lattice_not_bipartite');
    expect(checkSpec(spec({ lattice: { kind: 'honeycomb', size: [2, 2], boundary: ['periodic', 'periodic'] }, observables: stag }))).toEqual([]);
  });

  it('accepts structure-factor momenta on any lattice', () => {
    expect(checkSpec(spec({
      lattice: { kind: 'triangular', size: [3, 3] },
      observables: [{ kind: 'structure-factor', paulis: 'ZZ', momenta: [[Math.PI, 0], [0, 0]] }],
    }))).toEqual([]);
  });

  it('reports empty pair selections: nearest on one site, next-nearest on a 2-site chain, by-distance on one site', () => {
    const one = { kind: 'chain' as const, length: 1 };
    expect(checkSpec(spec({ lattice: one, observables: [{ kind: 'pair', paulis: 'ZZ' }] })).map((i) => [i.code, i.path]))
      .toEqual([['empty_pair_selection', ['observables', 0, 'pairs']]]);
    expect(checkSpec(spec({ lattice: { kind: 'chain', length: 2 }, observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'next-nearest' }] }))[0].code)
      .toBe('empty_pair_selection');
    expect(checkSpec(spec({ lattice: one, observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'by-distance' }] }))[0].code)
      .toBe('empty_pair_selection');
  });

  it('refuses per-pair by-distance series beyond LIMITS.maxPairs pairs', () => {
    const issues = checkSpec(spec({
      lattice: { kind: 'chain', length: 200 },
      observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'by-distance', perPair: true }],
    }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([['too_many_pairs', ['observables', 0, 'perPair']]]);
    expect(issues[0].message).toMatch(/19900 pairs.*at most 10000/);
  });

  it('reports a reversed or degenerate time grid assembled without the schema', () => {
    expect(checkSpec(raw({ times: { start: 2, stop: 1, count: 3 } })).map((i) => [i.code, i.path]))
      .toEqual([['time_grid_reversed', ['times', 'stop']]]);
    expect(checkSpec(raw({ times: { start: 1, stop: 1, count: 3 } }))[0].code).toBe('time_grid_degenerate');
  });

  it('reports two observables that produce the same series label, once, at the later one', () => {
    const issues = checkSpec(spec({
      observables: [
        { kind: 'site', pauli: 'Z', perSite: true },
        { kind: 'energy', of: 'h0' },
        { kind: 'site', pauli: 'Z', sites: [0, 1], perSite: true },
      ],
    }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([['duplicate_series', ['observables', 2]]]);
    expect(issues[0].message).toMatch(/"Z:avg".*observables\[0\]/);
  });

  it('reports a lattice larger than LIMITS.maxSites without building it', () => {
    const issues = checkSpec(raw({ lattice: { kind: 'square', size: [100, 100], boundary: ['open', 'open'] } }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([['lattice_too_large', ['lattice', 'size']]]);
  });

  it('uses only codes from CHECK_SPEC_CODES, which are unique', () => {
    expect(new Set(CHECK_SPEC_CODES).size).toBe(CHECK_SPEC_CODES.length);
    const issues = [
      ...checkSpec(raw({ lattice: { kind: 'bonds', sites: 2, bonds: [[0, 0]], farBonds: [] } })),
      ...checkSpec(spec({ h0: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X9' }] } })),
    ];
    expect(issues.length).toBe(2);
    for (const i of issues) expect(CHECK_SPEC_CODES).toContain(i.code);
  });
});
