/**
 * The lab-machine commands against a listening API: submit, watch, status, fetch, cancel;
 * server and token from flags, environment or the config file; clear messages for an
 * unreachable server, a bad token and an unknown sweep; the admin token commands.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Api } from '../../services/api/src/index.js';
import { parseSseChunk, resolveClientConfig } from '../../services/cli/src/client/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { freePort } from '../support/private-redis.js';
import { CLI, REPO_ROOT, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix } from './support/harness.js';

interface CliRun { code: number; stdout: string; stderr: string }

function runCli(args: string[], env: NodeJS.ProcessEnv = {}): Promise<CliRun> {
  return new Promise((resolve) => {
    execFile(process.execPath, [CLI, ...args], {
      cwd: REPO_ROOT,
      env: { PATH: process.env.PATH, HOME: process.env.HOME, ...env },
      timeout: 60_000,
    }, (err, stdout, stderr) => {
      resolve({ code: err ? (typeof err.code === 'number' ? err.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('client commands', () => {
  const prefix = uniquePrefix('cli');
  const dir = mkdtempSync(join(tmpdir(), 'bsw-cli-'));
  let api: Api;
  let worker: BranchWorkerHandle;
  let server: string;
  let token: string;

  beforeAll(async () => {
    api = await startTestApi({ prefix });
    server = await api.app.listen({ host: '127.0.0.1', port: 0 });
    token = await makeToken(testRedisUrl(), prefix, 'cli-user');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix });
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  describe('when the server cannot be reached', () => {
    it('should say so, name the address, and exit 3', async () => {
      const port = await freePort();
      writeFileSync(join(dir, 'spec.json'), JSON.stringify(smallSpec()));
      const r = await runCli(['submit', join(dir, 'spec.json'), '--server', `http://127.0.0.1:${port}`, '--token', 'x']);
      expect(r.code).toBe(3);
      expect(r.stderr).toContain(`cannot reach the betasweep server at http://127.0.0.1:${port} (connection refused)`);
    });
  });

  describe('when the token is wrong or the sweep unknown', () => {
    it('should explain a rejected token (exit 4) and an unknown sweep (exit 5)', async () => {
      const bad = await runCli(['status', 'sw_aaaaaaaaaaaaaaaa'], { BETASWEEP_SERVER: server, BETASWEEP_TOKEN: 'bsw_wrong' });
      expect(bad.code).toBe(4);
      expect(bad.stderr).toMatch(/rejected the token from env/);
      const unknown = await runCli(['status', 'sw_aaaaaaaaaaaaaaaa'], { BETASWEEP_SERVER: server, BETASWEEP_TOKEN: token });
      expect(unknown.code).toBe(5);
      expect(unknown.stderr).toMatch(/unknown sweep sw_aaaaaaaaaaaaaaaa/);
    });
  });

  describe('when a sweep is submitted, watched and fetched', () => {
    it('should print the id, stream its events to the end, and fetch the same CSV as the API', async () => {
      const specPath = join(dir, 'cli-spec.json');
      writeFileSync(specPath, JSON.stringify(smallSpec({ label: 'from-cli', betas: [0.4, 0.9] })));
      const cfg = join(dir, 'client.json');
      const setup = await runCli(['config', '--server', server, '--token', token], { BETASWEEP_CONFIG: cfg });
      expect(setup.code).toBe(0);
      expect(statSync(cfg).mode & 0o777).toBe(0o600);
      const env = { BETASWEEP_CONFIG: cfg };
      const sub = await runCli(['submit', specPath], env);
      expect(sub.code, sub.stderr).toBe(0);
      const id = sub.stdout.trim();
      expect(id).toMatch(/^sw_[a-z2-7]{16}$/);
      const watch = await runCli(['watch', id, '--json'], env);
      expect(watch.code, watch.stderr).toBe(0);
      const events = watch.stdout.trim().split('\n').map((l) => JSON.parse(l));
      expect(events.filter((e) => e.type === 'point')).toHaveLength(10);
      expect(events.at(-1).type).toBe('end');
      const status = await runCli(['status', id], env);
      expect(status.stdout).toMatch(new RegExp(`${id}\\s+succeeded\\s+"from-cli"`));
      expect(status.stdout).toMatch(/points\s+10\/10/);
      const csv = await runCli(['fetch', id, '--format', 'csv'], env);
      const viaApi = await fetch(`${server}/v1/sweeps/${id}/result.csv`, { headers: { authorization: `Bearer ${token}` } });
      expect(csv.stdout).toBe(await viaApi.text());
      const json = await runCli(['fetch', id, '--out', join(dir, 'r.json')], env);
      expect(json.code).toBe(0);
      const cancel = await runCli(['cancel', id], env);
      expect(cancel.code).toBe(1);
      expect(cancel.stderr).toMatch(/BSW_ERR_SWEEP_FINISHED/);
    });
  });

  describe('when an admin manages tokens', () => {
    it('should print a new token once, list it without the secret, and revoke it', async () => {
      const redisFlags = ['--redis', testRedisUrl(), '--prefix', prefix];
      const created = await runCli(['token', 'create', '--name', 'night-shift', '--owner', 'cli-user', ...redisFlags]);
      expect(created.code, created.stderr).toBe(0);
      const secret = created.stdout.trim();
      expect(secret).toMatch(/^bsw_[A-Za-z0-9_-]{43}$/);
      const list = await runCli(['token', 'list', ...redisFlags]);
      expect(list.stdout).toMatch(/night-shift\s+owner=cli-user/);
      expect(list.stdout).not.toContain(secret);
      const ok = await fetch(`${server}/v1/sweeps`, { headers: { authorization: `Bearer ${secret}` } });
      expect(ok.status).toBe(200);
      const revoked = await runCli(['token', 'revoke', 'night-shift', ...redisFlags]);
      expect(revoked.stdout).toMatch(/revoked tok_[0-9a-f]+ 'night-shift'/);
      expect((await fetch(`${server}/v1/sweeps`, { headers: { authorization: `Bearer ${secret}` } })).status).toBe(401);
    });
  });
});

describe('client configuration', () => {
  describe('when settings come from several places', () => {
    it('should prefer flags, then the environment, then the file', () => {
      const dir = mkdtempSync(join(tmpdir(), 'bsw-cfg-'));
      const file = join(dir, 'c.json');
      writeFileSync(file, JSON.stringify({ server: 'http://file:1', token: 'from-file' }));
      try {
        expect(resolveClientConfig({}, { BETASWEEP_CONFIG: file })).toMatchObject({ server: 'http://file:1', token: 'from-file', serverFrom: 'file', tokenFrom: 'file' });
        expect(resolveClientConfig({}, { BETASWEEP_CONFIG: file, BETASWEEP_TOKEN: 'env' })).toMatchObject({ token: 'env', tokenFrom: 'env' });
        expect(resolveClientConfig({ server: 'http://flag:2/' }, { BETASWEEP_CONFIG: file, BETASWEEP_SERVER: 'http://env:3' })).toMatchObject({ server: 'http://flag:2', serverFrom: 'flag' });
        expect(resolveClientConfig({}, { BETASWEEP_CONFIG: join(dir, 'none.json') })).toMatchObject({ server: 'http://127.0.0.1:8080', token: null, tokenFrom: 'none' });
        expect(() => resolveClientConfig({ server: 'ftp://x' }, { BETASWEEP_CONFIG: file })).toThrow(/http:\/\/ or https:\/\//);
        writeFileSync(file, '{oops');
        expect(() => resolveClientConfig({}, { BETASWEEP_CONFIG: file })).toThrow(/not valid JSON/);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    });
  });

  describe('when server-sent events arrive in pieces', () => {
    it('should parse complete events and keep the rest', () => {
      const { events, rest } = parseSseChunk('retry: 2000\n\nid: 1-0\nevent: point\ndata: {"a":1}\n\n: keepalive\n\nid: 2-0\nevent: sta');
      expect(events).toEqual([{ id: '1-0', type: 'point', data: '{"a":1}' }]);
      expect(rest).toBe('id: 2-0\nevent: sta');
    });
  });
});
