/**
 * canonicalSpec and specHash: same physics → same canonical object and hash; different
 * physics → different hash.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  SweepSpec, canonicalSpec, canonicalSpecText, parseSpecInput, specHash,
} from '../../../shared-types/src/index.js';
import { exampleSpecs, minimalSpec, richSpec } from './spec-fixtures.js';

type Input = Record<string, unknown>;

/** Parses an input that must be valid. */
function parse(input: unknown): SweepSpec {
  const r = parseSpecInput(input);
  if (!r.success) throw new Error(`invalid test spec: ${JSON.stringify(r.issues)}`);
  return r.spec;
}

const hashOf = (input: unknown): string => specHash(parse(input));
const withPatch = (patch: Input, base: Input = minimalSpec()): Input => ({ ...base, ...patch });

/** The same JSON value with object keys in reverse order at every level. */
function reverseKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(reverseKeys);
  if (v !== null && typeof v === 'object') {
    return Object.fromEntries(Object.entries(v).reverse().map(([k, x]) => [k, reverseKeys(x)]));
  }
  return v;
}

/** Freezes a value and everything inside it. */
function deepFreeze<T>(v: T): T {
  if (v !== null && typeof v === 'object') {
    Object.values(v).forEach(deepFreeze);
    Object.freeze(v);
  }
  return v;
}

describe('canonicalSpec', () => {
  describe('betas', () => {
    it('should sort ascending and compute a repeated β once', () => {
      expect(canonicalSpec(parse(withPatch({ betas: [2, 0.5, 1, 0.5, 2] }))).betas).toEqual([0.5, 1, 2]);
    });

    it('should turn −0 into 0 and merge it with 0', () => {
      const betas = canonicalSpec(parse(withPatch({ betas: [-0, 1, 0] }))).betas;
      expect(betas).toHaveLength(2);
      expect(Object.is(betas[0], 0)).toBe(true);
    });
  });

  describe('explicit Pauli sums', () => {
    it('should sort factors by site, merge like terms, drop zeros and sort terms', () => {
      const h0 = canonicalSpec(parse(richSpec())).h0;
      // "X3 Y1" and "Y1  X3" are one term (0.25 + 0.75); terms by factor count, then site.
      expect(h0).toEqual({
        model: 'pauli-sum',
        terms: [
          { weight: -0.5, word: 'X2' },
          { weight: 1, word: 'Z0 Z1' },
          { weight: 1, word: 'Y1 X3' },
        ],
      });
    });

    it('should order letters on the same site as X, Y, Z and identity first', () => {
      const h = { model: 'pauli-sum', terms: ['Z0', 'Y0', '', 'X0', 'X0 X1'].map((word) => ({ weight: 1, word })) };
      const terms = canonicalSpec(parse(withPatch({ h1: h }))).h1;
      expect(terms.model === 'pauli-sum' && terms.terms.map((t) => t.word)).toEqual(['', 'X0', 'Y0', 'Z0', 'X0 X1']);
    });

    it('should drop terms that cancel, and write an all-zero sum as the single term 0·""', () => {
      const h = { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0' }, { weight: -1, word: 'X0' }, { weight: 0, word: 'Z1' }] };
      expect(canonicalSpec(parse(withPatch({ h1: h }))).h1).toEqual({ model: 'pauli-sum', terms: [{ weight: 0, word: '' }] });
    });

    it('should merge weights to the same double whatever the term order', () => {
      // Left to right, (0.1 + 0.2) + 0.3 = 0.6000000000000001 but (0.3 + 0.2) + 0.1 = 0.6.
      const sum = (weights: number[]) => {
        const h = canonicalSpec(parse(withPatch({ h1: { model: 'pauli-sum', terms: weights.map((weight) => ({ weight, word: 'X1' })) } }))).h1;
        return h.model === 'pauli-sum' ? h.terms[0].weight : Number.NaN;
      };
      expect(sum([0.1, 0.2, 0.3])).toBe(sum([0.3, 0.2, 0.1]));
      expect(sum([0.2, 0.3, 0.1])).toBe(sum([0.3, 0.2, 0.1]));
    });

    it('should leave the preset models as they are (−0 → 0)', () => {
      const h = canonicalSpec(parse(withPatch({ h0: { model: 'ising', J: 1, hx: -0 } }))).h0;
      expect(h).toEqual({ model: 'ising', J: 1, hx: 0, hz: 0 });
      expect(h.model === 'ising' && Object.is(h.hx, 0)).toBe(true);
    });
  });

  describe('lattice, pairs, sites, momenta and times', () => {
    const c = () => canonicalSpec(parse(richSpec()));

    it('should write each explicit bond as [i, j] with i < j and sort the lists', () => {
      const l = c().lattice;
      expect(l.kind === 'bonds' && [l.bonds, l.farBonds]).toEqual([[[0, 1], [1, 2], [2, 3]], [[0, 2]]]);
      expect(l.kind === 'bonds' && l.positions).toEqual([[0, 0], [1, 0], [2, 0], [3, 0]]);
    });

    it('should sort explicit pairs but keep the order within each mixed pair (XY)', () => {
      const o = c().observables[0];
      expect(o.kind === 'pair' && o.pairs).toEqual([[0, 2], [1, 0], [2, 3]]);
    });

    it('should write each symmetric pair (equal letters) as [i, j] with i < j', () => {
      const o = canonicalSpec(parse(withPatch({ observables: [{ kind: 'pair', paulis: 'ZZ', pairs: [[3, 1], [0, 2], [2, 1]] }] })))
        .observables[0];
      expect(o.kind === 'pair' && o.pairs).toEqual([[0, 2], [1, 2], [1, 3]]);
    });

    it('should sort observable sites and momenta and keep the observable order', () => {
      const obs = c().observables;
      expect(obs.map((o) => o.kind)).toEqual(['pair', 'site', 'structure-factor']);
      expect(obs[1].kind === 'site' && obs[1].sites).toEqual([1, 3]);
      expect(obs[2].kind === 'structure-factor' && obs[2].momenta).toEqual([[0, 0], [3.14, 0]]);
    });

    it('should sort explicit times and drop repeats, and keep an even grid', () => {
      expect(c().times).toEqual({ values: [0, 0.5, 1] });
      expect(canonicalSpec(parse(minimalSpec())).times).toEqual({ start: 0, stop: 2, count: 5 });
    });

    it('should set stop to start when the grid has one point', () => {
      expect(canonicalSpec(parse(withPatch({ times: { start: 1, stop: 3, count: 1 } }))).times)
        .toEqual({ start: 1, stop: 1, count: 1 });
    });
  });

  describe('as a function', () => {
    it('should keep the label, engine, tolerance and seed', () => {
      const s = canonicalSpec(parse({ ...richSpec(), engine: 'exact', tolerance: 1e-6 }));
      expect([s.label, s.engine, s.tolerance, s.seed]).toEqual(['rich', 'exact', 1e-6, 7]);
    });

    it('should not change its argument', () => {
      const spec = deepFreeze(parse(richSpec()));
      const before = JSON.stringify(spec);
      expect(() => canonicalSpec(spec)).not.toThrow();
      expect(JSON.stringify(spec)).toBe(before);
    });

    it.each(exampleSpecs().concat([['rich', richSpec()]]))(
      'should be idempotent and give a valid spec (%s)',
      (_name, input) => {
        const once = canonicalSpec(parse(input));
        expect(canonicalSpec(once)).toEqual(once);
        const reparsed = SweepSpec.safeParse(JSON.parse(JSON.stringify(once)));
        expect(reparsed.success).toBe(true);
        expect(reparsed.success && reparsed.data).toEqual(once);
      },
    );
  });
});

describe('specHash', () => {
  it('should be 64 lowercase hex digits: SHA-256 of the canonical text', () => {
    const spec = parse(richSpec());
    const hash = specHash(spec);
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    expect(hash).toBe(createHash('sha256').update(canonicalSpecText(spec)).digest('hex'));
  });

  it('should hash JSON with sorted keys and without the label', () => {
    const text = canonicalSpecText(parse(minimalSpec()));
    expect(text.startsWith('{"betas":[0.5,1,2],"engine":"auto","h0":{"J":1,"hx":0.5,"hz":0,"model":"ising"}')).toBe(true);
    expect(text).not.toContain('label');
    expect(text).not.toMatch(/\s/);
  });

  it('should keep a pinned value for an example (a change invalidates stored results: bump it knowingly)', () => {
    const chain8 = exampleSpecs().find(([name]) => name === 'chain8-field-quench.json');
    expect(chain8).toBeDefined();
    expect(hashOf(chain8?.[1])).toBe('2e9a8b9dfad5715b43de01158d488c1acca942b91fd6e0ccf6c1c0e9ea2c3007');
  });

  describe('when only the writing changes', () => {
    const base = hashOf(richSpec());

    it.each<[string, () => unknown]>([
      ['object keys in another order', () => reverseKeys(richSpec())],
      ['another label', () => ({ ...richSpec(), label: 'something else entirely' })],
      ['no label', () => { const { label: _l, ...rest } = richSpec(); return rest; }],
      ['betas reordered and repeated', () => ({ ...richSpec(), betas: [1, 0.5, 2, 2] })],
      ['terms reordered', () => {
        const s = richSpec();
        return { ...s, h0: { model: 'pauli-sum', terms: [...(s.h0 as { terms: unknown[] }).terms].reverse() } };
      }],
      ['factors of a word reordered and re-spaced', () => ({
        ...richSpec(),
        h0: {
          model: 'pauli-sum',
          terms: [
            { weight: 1, word: ' Z0 Z1 ' }, { weight: -0.5, word: 'X2' }, { weight: 0.25, word: 'Y1 X3' },
            { weight: 0.75, word: 'X3   Y1' },
          ],
        },
      })],
      ['a like term merged by hand', () => ({
        ...richSpec(),
        h0: { model: 'pauli-sum', terms: [{ weight: 1, word: 'Z0 Z1' }, { weight: -0.5, word: 'X2' }, { weight: 1, word: 'X3 Y1' }] },
      })],
      ['a zero-weight term added', () => {
        const s = richSpec();
        return { ...s, h0: { model: 'pauli-sum', terms: [...(s.h0 as { terms: unknown[] }).terms, { weight: 0, word: 'Y0 Y2' }] } };
      }],
      ['bonds reversed and reordered', () => ({
        ...richSpec(),
        lattice: { ...(richSpec().lattice as Input), bonds: [[2, 3], [0, 1], [1, 2]], farBonds: [[0, 2]] },
      })],
      ['explicit pairs reordered', () => {
        const s = richSpec();
        return { ...s, observables: [{ kind: 'pair', paulis: 'XY', pairs: [[0, 2], [2, 3], [1, 0]] }, ...s.observables.slice(1)] };
      }],
      ['times reordered and repeated', () => ({ ...richSpec(), times: { values: [0, 1, 0.5, 0.5] } })],
      ['defaults written out', () => ({
        ...richSpec(), engine: 'auto', tolerance: 1e-8,
        h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 },
      })],
      ['−0 for 0', () => ({ ...richSpec(), times: { values: [1, 0.5, -0] } })],
    ])('should not change for %s', (_what, make) => {
      expect(hashOf(make())).toBe(base);
    });
  });

  describe('when the physics changes', () => {
    const base = hashOf(minimalSpec());

    it.each<[string, Input]>([
      ['a field one ulp larger', { h0: { model: 'ising', hx: 0.5000000000000001 } }],
      ['another β', { betas: [0.5, 1, 2, 3] }],
      ['H0 and H1 swapped', { h0: { model: 'ising', hx: 1.5 }, h1: { model: 'ising', hx: 0.5 } }],
      ['a periodic boundary', { lattice: { kind: 'chain', length: 4, boundary: 'periodic' } }],
      ['a longer chain', { lattice: { kind: 'chain', length: 5 } }],
      ['a longer time grid', { times: { stop: 2, count: 6 } }],
      ['another observable', { observables: [{ kind: 'site', pauli: 'Z' }] }],
      ['observables in another order (series order)', { observables: [{ kind: 'energy', of: 'h0' }, { kind: 'site', pauli: 'X' }] }],
      ['another engine', { engine: 'exact' }],
      ['another tolerance', { tolerance: 1e-6 }],
      ['another seed', { seed: 2 }],
    ])('should change for %s', (_what, patch) => {
      expect(hashOf(withPatch(patch))).not.toBe(base);
    });

    it('should change when the order within a mixed pair changes (XY on [0, 1] ≠ on [1, 0])', () => {
      const pair = (pairs: number[][]) => withPatch({ observables: [{ kind: 'pair', paulis: 'XY', pairs }] });
      expect(hashOf(pair([[0, 1]]))).not.toBe(hashOf(pair([[1, 0]])));
    });

    it('should not change when the order within a symmetric pair changes (ZZ on [0, 1] = on [1, 0])', () => {
      const pair = (pairs: number[][]) => withPatch({ observables: [{ kind: 'pair', paulis: 'ZZ', pairs }] });
      expect(hashOf(pair([[0, 1]]))).toBe(hashOf(pair([[1, 0]])));
    });

    it('should change when a Pauli letter changes (Y terms are not X terms)', () => {
      const h = (word: string) => withPatch({ h1: { model: 'pauli-sum', terms: [{ weight: 1, word }] } });
      expect(hashOf(h('X0 Y1'))).not.toBe(hashOf(h('Y0 X1')));
    });

    it('should give every example its own hash', () => {
      const hashes = exampleSpecs().map(([, input]) => hashOf(input));
      expect(new Set(hashes).size).toBe(hashes.length);
    });
  });
});
