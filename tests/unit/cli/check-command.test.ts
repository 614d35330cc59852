/**
 * `betasweep check RESULT.json` on a local result: a correct result agrees with its series
 * (exit 0); a value shifted by 0.1 at small β and t = 0, where the series is accurate to
 * ~1e-8, is reported as a disagreement and flags the run (exit 8).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SweepResult } from '../../../shared-types/src/index.js';
import { CHECK_FLAGGED_EXIT } from '../../../services/cli/src/commands/check.js';
import { parseSweepSpec, runSweep } from '../../../workers/src/sweep/index.js';

const cli = join(__dirname, '../../../services/cli/bin/betasweep.mjs');
const dir = mkdtempSync(join(tmpdir(), 'betasweep-check-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Small βs, so the series window holds every thermodynamic value and the t = 0 points. */
const spec = {
  lattice: { kind: 'chain', length: 4, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.05, 0.2],
  times: { start: 0, stop: 0.4, count: 3 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
  engine: 'exact',
};

function runCli(args: string[]): { status: number | null; stderr: string; stdout: string } {
  const r = spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stderr: r.stderr, stdout: r.stdout };
}

describe('betasweep check', () => {
  let result: SweepResult;
  let goodFile: string;

  beforeAll(async () => {
    const parsed = parseSweepSpec(spec);
    if (!parsed.success) throw new Error(`spec invalid: ${JSON.stringify(parsed.issues)}`);
    result = await runSweep(parsed.spec);
    goodFile = join(dir, 'good.result.json');
    writeFileSync(goodFile, JSON.stringify(result));
  }, 60_000);

  describe('when the result file is correct', () => {
    it('should exit 0 and show agree verdicts for every β', () => {
      const r = runCli(['check', goodFile]);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(r.stdout).toMatch(/β = 0\.05/);
      expect(r.stdout).toMatch(/β = 0\.2/);
      expect(r.stdout).toMatch(/thermo:lnZ .* agree/);
      expect(r.stdout).toMatch(/X:avg .* agree/);
      expect(r.stdout).not.toMatch(/disagree\s*$/m);
      expect(r.stdout).toMatch(/^ok: \d+ agree, 0 disagree/m);
    }, 60_000);

    it('should print the report as JSON with one thermodynamic entry per β and quantity', () => {
      const r = runCli(['check', goodFile, '--json']);
      expect(r.status).toBe(0);
      const report = JSON.parse(r.stdout) as { entries: Array<{ betaIndex: number; quantity: string; verdict: string }>; flagged: boolean; error: string | null };
      expect(report.error).toBeNull();
      expect(report.flagged).toBe(false);
      for (const b of [0, 1]) {
        const lnZ = report.entries.filter((e) => e.betaIndex === b && e.quantity === 'thermo:lnZ');
        expect(lnZ).toHaveLength(1);
        expect(lnZ[0].verdict).toBe('agree');
      }
    }, 60_000);
  });

  describe('when a value is shifted by 0.1 at small β and time 0', () => {
    it('should report disagree and exit with the flagged code', () => {
      const tampered = structuredClone(result) as { series: Array<{ label: string; values: number[][] }> };
      const first = tampered.series[0];
      first.values[0][0] += 0.1;
      const file = join(dir, 'tampered.result.json');
      writeFileSync(file, JSON.stringify(tampered));
      const r = runCli(['check', file]);
      expect(r.status).toBe(CHECK_FLAGGED_EXIT);
      expect(r.stdout).toMatch(new RegExp(`^\\s+0\\s+${first.label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\s.*disagree$`, 'm'));
      expect(r.stdout).toMatch(/^FLAGGED: \d+ agree, 1 disagree/m);
    }, 60_000);
  });

  describe('when the target is neither a file nor a sweep id', () => {
    it('should exit 2 naming it', () => {
      const r = runCli(['check', join(dir, 'missing.json')]);
      expect(r.status).toBe(2);
      expect(r.stderr).toMatch(/missing\.json/);
    }, 60_000);
  });
});
