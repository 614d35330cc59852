/** `auto` picks a feasible engine meeting the tolerance, explains itself, and refuses honestly. */
import { describe, expect, it } from 'vitest';
import { parseSweepSpec, selectEngine, ENGINES } from '../../../workers/src/sweep/index.js';

function spec(over: Record<string, unknown>) {
  const parsed = parseSweepSpec({
    lattice: { kind: 'chain', length: 6, boundary: 'periodic' },
    h0: { model: 'xxz', J: 1, delta: 0.5 },
    h1: { model: 'xxz', J: 1, delta: 1.5 },
    betas: [0.5, 1],
    times: { start: 0, stop: 2, count: 11 },
    observables: [{ kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
    ...over,
  });
  if (!parsed.success) throw new Error(JSON.stringify(parsed.issues));
  return parsed.spec;
}

describe('selectEngine', () => {
  describe('when the engine is auto', () => {
    it('should choose the feasible engine with the smallest estimated time and say why', () => {
      const s = spec({});
      const { engine, plan } = selectEngine(s);
      expect(plan.feasible).toBe(true);
      expect(plan.accuracy).toBeLessThanOrEqual(s.tolerance);
      const times = [...ENGINES.values()].map((e) => e.plan(s)).filter((p) => p.feasible && p.accuracy <= s.tolerance).map((p) => p.seconds);
      expect(plan.seconds).toBe(Math.min(...times));
      expect(plan.reason).toMatch(new RegExp(`^auto: ${engine.name}`));
      expect(plan.reason).toMatch(/others:/);
    });

    it('should refuse with every engine\'s reason when nothing fits', () => {
      const { plan } = selectEngine(spec({ lattice: { kind: 'square', size: [5, 5], boundary: ['periodic', 'periodic'] } }));
      expect(plan.feasible).toBe(false);
      expect(plan.refusal).not.toBeNull();
      for (const name of ENGINES.keys()) expect(plan.reason).toContain(name);
    });
  });

  describe('when an engine is named', () => {
    it('should use that engine even when another would be faster', () => {
      const { engine, plan } = selectEngine(spec({ engine: 'exact' }));
      expect(engine.name).toBe('exact');
      expect(plan.engine).toBe('exact');
    });
  });
});
