/**
 * The local `betasweep run` / `plan` commands as a user meets them: a bad spec is refused with
 * a message naming the field and its limit, the exit code says why, and no output file appears.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const cli = join(__dirname, '../../../services/cli/bin/betasweep.mjs');
const dir = mkdtempSync(join(tmpdir(), 'betasweep-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const goodSpec = {
  lattice: { kind: 'chain', length: 4, boundary: 'open' },
  h0: { model: 'ising', J: 1, hx: 0.5 },
  h1: { model: 'ising', J: 1, hx: 1.5 },
  betas: [0.5, 1],
  times: { start: 0, stop: 1, count: 5 },
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ', pairs: 'nearest' }],
};

function runCli(args: string[]): { status: number | null; stderr: string; stdout: string } {
  const r = spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stderr: r.stderr, stdout: r.stdout };
}

function specFile(name: string, body: unknown): string {
  const file = join(dir, `${name}.json`);
  writeFileSync(file, typeof body === 'string' ? body : JSON.stringify(body));
  return file;
}

describe('betasweep run', () => {
  describe('when the spec is bad', () => {
    const cases: Array<{ name: string; body: unknown; expect: RegExp; code: number }> = [
      { name: 'wrong-type', body: { ...goodSpec, betas: 'hot' }, expect: /betas/, code: 2 },
      { name: 'nan-literal', body: JSON.stringify(goodSpec).replace('[0.5,1]', '[NaN]'), expect: /not valid JSON/, code: 2 },
      { name: 'nan-string', body: { ...goodSpec, betas: [0.5, 'NaN'] }, expect: /betas\[1\]/, code: 2 },
      { name: 'negative-beta', body: { ...goodSpec, betas: [0.5, -1] }, expect: /betas\[1\].*(≥ 0|>= 0|at least 0)/, code: 2 },
      {
        name: 'site-outside',
        body: { ...goodSpec, h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0 Z7' }] } },
        expect: /h1\.terms\[0\]\.word.*7/, code: 2,
      },
      { name: 'too-many-times', body: { ...goodSpec, times: { start: 0, stop: 1, count: 20_000 } }, expect: /times\.count.*10001/, code: 2 },
      {
        name: 'too-big',
        body: { ...goodSpec, lattice: { kind: 'chain', length: 20, boundary: 'open' }, engine: 'exact' },
        expect: /12/, code: 3,
      },
    ];
    for (const c of cases) {
      it(`should refuse ${c.name} with a message naming the field and write nothing`, () => {
        const out = join(dir, `${c.name}.result.json`);
        const csv = join(dir, `${c.name}.csv`);
        const r = runCli(['run', specFile(c.name, c.body), '--out', out, '--csv', csv, '--quiet']);
        expect(r.status).toBe(c.code);
        expect(r.stderr).toMatch(c.expect);
        expect(existsSync(out)).toBe(false);
        expect(existsSync(csv)).toBe(false);
      });
    }
  });

  describe('when the spec is good', () => {
    it('should write a result document and a CSV whose rows match it', () => {
      const out = join(dir, 'good.result.json');
      const csv = join(dir, 'good.csv');
      const r = runCli(['run', specFile('good', goodSpec), '--out', out, '--csv', csv, '--quiet']);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      const result = JSON.parse(readFileSync(out, 'utf8'));
      expect(result.format).toBe('betasweep.result/1');
      expect(result.series.map((s: { label: string }) => s.label)).toEqual(['X:avg', 'ZZ:nearest']);
      expect(result.thermo).toHaveLength(2);
      const rows = readFileSync(csv, 'utf8').trim().split('\n');
      expect(rows[0]).toBe('beta,time,series,value,error');
      // 2 β × 5 times × 2 series quench rows + 5 thermodynamic rows per β.
      expect(rows.length - 1).toBe(2 * 5 * 2 + 2 * 5);
      const [beta, time, label, value] = rows[1].split(',');
      expect(Number(beta)).toBe(result.betas[0]);
      expect(Number(time)).toBe(result.times[0]);
      expect(label).toBe('X:avg');
      expect(Number(value)).toBe(result.series[0].values[0][0]);
    });
  });
});

describe('betasweep plan', () => {
  it('should print the refusal with the estimate for a lattice too big for the exact engine', () => {
    const r = runCli(['plan', specFile('plan-big', { ...goodSpec, lattice: { kind: 'square', size: [4, 4] }, engine: 'exact' }), '--json']);
    expect(r.status).toBe(3);
    const { plan } = JSON.parse(r.stdout);
    expect(plan.feasible).toBe(false);
    expect(plan.refusal.field).toBe('lattice');
    expect(plan.refusal.estimate).toBe(16);
    expect(plan.refusal.limit).toBe(12);
  });
});
