/** The example specs in shared-types/examples: valid, small enough for the exact engine, documented. */
import { describe, expect, it } from 'vitest';
import { canonicalSpec, parseSpecInput } from '../../../shared-types/src/index.js';
import { exampleSpecs, examplesReadme, siteCount } from './spec-fixtures.js';

/** The exact engine's reach (DESIGN.md §3). */
const EXACT_MAX_SITES = 12;

describe('example specs', () => {
  const examples = exampleSpecs();

  it('should include at least the four documented scenarios', () => {
    expect(examples.map(([name]) => name)).toEqual(expect.arrayContaining([
      'chain8-field-quench.json', 'square-2x4-ising-quench.json', 'xxz-ladder-2x3.json', 'ring6-y-terms.json',
    ]));
  });

  describe.each(examples)('%s', (name, input) => {
    const parsed = parseSpecInput(input);

    it('should parse without issues', () => {
      expect(parsed.success ? [] : parsed.issues).toEqual([]);
    });

    it('should carry a short label', () => {
      expect(parsed.success && parsed.spec.label.length).toBeGreaterThan(0);
      expect(parsed.success && parsed.spec.label.length).toBeLessThanOrEqual(80);
    });

    it(`should fit the exact engine (≤ ${EXACT_MAX_SITES} sites) with every Pauli-word site on the lattice`, () => {
      if (!parsed.success) throw new Error('invalid example');
      const n = siteCount(parsed.spec.lattice);
      expect(n).toBeLessThanOrEqual(EXACT_MAX_SITES);
      for (const h of [parsed.spec.h0, parsed.spec.h1]) {
        if (h.model !== 'pauli-sum') continue;
        const sites = h.terms.flatMap((t) => [...t.word.matchAll(/\d+/g)].map((m) => Number(m[0])));
        expect(Math.max(...sites)).toBeLessThan(n);
      }
    });

    it('should be described in the examples README', () => {
      expect(examplesReadme()).toContain(`\`${name}\``);
    });

    it('should keep its β grid (sorted) and its observables under canonicalisation', () => {
      if (!parsed.success) throw new Error('invalid example');
      const c = canonicalSpec(parsed.spec);
      expect(c.betas).toEqual([...parsed.spec.betas].sort((a, b) => a - b));
      expect(c.observables.length).toBe(parsed.spec.observables.length);
    });
  });

  it('should list no file in the README that does not exist', () => {
    const named = [...examplesReadme().matchAll(/`([\w.-]+\.json)`/g)].map((m) => m[1]);
    expect(named.sort()).toEqual(examples.map(([name]) => name).sort());
  });
});
