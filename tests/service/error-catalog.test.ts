/** The API's error catalog: each key is its code, statuses are HTTP errors, every code is documented. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BetasweepApiError, ERRORS, apiError } from '../../services/api/src/index.js';

const README = readFileSync(new URL('../../services/api/README.md', import.meta.url), 'utf8');

describe('error catalog', () => {
  describe('when listed', () => {
    it('should hold exactly the known codes', () => {
      // Adding a code means adding it here, to the README table and to a test that triggers it.
      expect(Object.keys(ERRORS)).toHaveLength(20);
    });

    it.each(Object.entries(ERRORS))('should have %s keyed by its own code, with a 4xx/5xx status', (key, def) => {
      expect(def.code).toBe(key);
      expect(key).toMatch(/^BSW_ERR_[A-Z_]+$/);
      expect(def.statusCode).toBeGreaterThanOrEqual(400);
      expect(def.statusCode).toBeLessThan(600);
      expect(def.message.length).toBeGreaterThan(10);
    });

    it.each(Object.keys(ERRORS))('should document %s in the API README with its status', (code) => {
      const row = README.split('\n').find((l) => l.startsWith(`| \`${code}\``));
      expect(row, `README row for ${code}`).toBeDefined();
      expect(row).toContain(`| ${ERRORS[code as keyof typeof ERRORS].statusCode} |`);
    });
  });

  describe('when an error is built', () => {
    it('should fill the template slots in order and carry the status', () => {
      const e = apiError('BSW_ERR_RESULT_NOT_READY', 'sw_x', 'running');
      expect(e).toBeInstanceOf(BetasweepApiError);
      expect(e.message).toBe("sweep 'sw_x' is running: a result exists once it has succeeded");
      expect(e.statusCode).toBe(409);
      expect(e.code).toBe('BSW_ERR_RESULT_NOT_READY');
    });

    it('should keep issues and Retry-After', () => {
      const e = new BetasweepApiError('BSW_ERR_TOO_MANY_ACTIVE', [3, 3], { retryAfter: 30, issues: [{ code: 'x', path: ['a'], message: 'a: bad' }] });
      expect(e.retryAfter).toBe(30);
      expect(e.issues).toHaveLength(1);
      expect(e.message).toMatch(/3 queued or running sweeps \(the cap is 3\)/);
    });
  });
});
