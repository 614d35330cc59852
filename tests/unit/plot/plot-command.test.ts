/**
 * `betasweep plot RESULT.json --out FILE`: the same figures as the dashboard, without a
 * browser. (The `plot ID` form against a server is in tests/browser/dashboard.redis.test.ts.)
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseHTML } from 'linkedom';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';
import type { SweepResult } from '../../../shared-types/src/index.js';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const CLI = join(ROOT, 'services/cli/bin/betasweep.mjs');

function runCli(args: string[]): Promise<{ code: number; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [CLI, ...args], { cwd: ROOT, timeout: 120_000 }, (err, _stdout, stderr) =>
      resolve({ code: err ? (typeof err.code === 'number' ? err.code : 1) : 0, stderr }));
  });
}

describe('betasweep plot', () => {
  const dir = mkdtempSync(join(tmpdir(), 'bsw-plot-'));
  const resultFile = join(dir, 'result.json');
  let result: SweepResult;

  beforeAll(async () => {
    const parsed = parseSweepSpec({
      label: 'plot test', lattice: { kind: 'chain', length: 3 }, h0: { model: 'ising', J: 1, hx: 0.5 }, h1: { model: 'ising', J: 1, hx: 1.5 },
      betas: [0.25, 1], times: { stop: 1, count: 6 }, observables: [{ kind: 'site', pauli: 'Z' }, { kind: 'energy', of: 'h1' }], engine: 'exact',
    });
    if (!parsed.success) throw new Error(JSON.stringify(parsed.issues));
    result = await runSweep(parsed.spec);
    writeFileSync(resultFile, JSON.stringify(result));
  });

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  describe('when given a result file and a cross-check report', () => {
    it('should write every figure with one path per β, legend entries, axis labels and the overlay', async () => {
      // A hand-made report: ⟨Z⟩ judged at β index 0 for the first three times, one disagreement.
      const entries = [0, 1, 2, 3, 4, 5].map((t) => ({
        betaIndex: 0, beta: 0.25, timeIndex: t, time: result.times[t], quantity: 'Z:avg',
        seriesValue: t < 3 ? result.series[0].values[0][t] + (t === 2 ? 0.05 : 0) : 0, seriesError: t < 3 ? 1e-6 : null,
        engineValue: result.series[0].values[0][t], engineError: 1e-12, verdict: t < 2 ? 'agree' : t === 2 ? 'disagree' : 'outside-window',
      }));
      writeFileSync(join(dir, 'check.json'), JSON.stringify({ entries, summary: { agree: 2, disagree: 1, outsideWindow: 3 }, flagged: true }));
      const out = join(dir, 'figures.svg');
      const r = await runCli(['plot', resultFile, '--out', out, '--check', join(dir, 'check.json')]);
      expect(r.stderr).toContain('wrote');
      expect(r.code).toBe(0);
      const { document } = parseHTML(`<!doctype html><html><body>${readFileSync(out, 'utf8')}</body></html>`);
      const ids = [...document.querySelectorAll('svg.bsw-figure')].map((s) => s.getAttribute('data-figure'));
      expect(ids).toEqual(['series:Z:avg', 'series:E:h1', 'thermo:energy', 'thermo:heatCapacity', 'thermo:entropy', 'thermo:freeEnergy']);
      const z = document.querySelector('svg[data-figure="series:Z:avg"]')!;
      expect([...z.querySelectorAll('g.bsw-beta-lines path')].map((p) => p.getAttribute('aria-label'))).toEqual(['β = 0.25 (T = 4)', 'β = 1 (T = 1)']);
      expect([...z.querySelectorAll('g.bsw-legend-entry')].map((g) => g.textContent)).toEqual(['β = 0.25 (T = 4)', 'β = 1 (T = 1)']);
      expect(z.querySelector('g[aria-label="x-axis label"]')?.textContent).toBe('time t →');
      expect(z.querySelector('g[aria-label="y-axis label"]')?.textContent).toBe('↑ ⟨Z⟩, site average');
      expect(z.querySelectorAll('g.bsw-check-lines path')).toHaveLength(1);
      expect(z.querySelectorAll('g.bsw-check-disagree path')).toHaveLength(1);
      expect(z.querySelector('text.bsw-figure-note')?.textContent).toBe('series check trusted for t in [0, 0.4]: 2 agree, 1 disagree, 3 outside the window');
      // Figures without comparisons in the report say so.
      expect(document.querySelector('svg[data-figure="series:E:h1"] text.bsw-figure-note')?.textContent).toBe('series check: no comparisons for this figure');
    });
  });

  describe('when asked for a PNG of one figure without the check', () => {
    it('should write a PNG twice the figure width, and say the cross-check is off', async () => {
      const out = join(dir, 'z.png');
      const r = await runCli(['plot', resultFile, '--out', out, '--figure', 'series:Z:avg', '--no-check', '--width', '600']);
      expect(r.code).toBe(0);
      expect(r.stderr).toContain('cross-check not available (--no-check)');
      const png = readFileSync(out);
      expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
      expect(png.readUInt32BE(16)).toBe(1200);
    });
  });

  describe('when the input is wrong', () => {
    it('should name the problem, exit 2 and write nothing', async () => {
      writeFileSync(join(dir, 'not-result.json'), JSON.stringify({ format: 'something else' }));
      const out = join(dir, 'never.svg');
      const a = await runCli(['plot', join(dir, 'not-result.json'), '--out', out, '--no-check']);
      expect(a.code).toBe(2);
      expect(a.stderr).toMatch(/is not a betasweep result document \(format: /);
      const b = await runCli(['plot', resultFile, '--out', out, '--figure', 'series:nope', '--no-check']);
      expect(b.code).toBe(2);
      expect(b.stderr).toContain("no figure 'series:nope'; this sweep has: series:Z:avg, series:E:h1, thermo:energy");
      const c = await runCli(['plot', 'not-a-file-nor-id', '--out', out]);
      expect(c.code).toBe(2);
      expect(c.stderr).toContain("'not-a-file-nor-id' is neither a file nor a sweep id");
      expect(existsSync(out)).toBe(false);
    });
  });
});
