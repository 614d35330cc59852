import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Fastify, { type FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dashboardPlugin } from '../../../services/api/src/plugins/dashboard.js';

describe('dashboardPlugin', () => {
  const built = mkdtempSync(join(tmpdir(), 'bsw-dash-'));
  const empty = mkdtempSync(join(tmpdir(), 'bsw-dash-empty-'));
  let app: FastifyInstance;
  let bare: FastifyInstance;

  beforeAll(async () => {
    mkdirSync(join(built, 'assets'));
    writeFileSync(join(built, 'index.html'), '<!doctype html><title>page</title>');
    writeFileSync(join(built, 'assets', 'index-abc123.js'), 'console.log(1)');
    writeFileSync(join(built, 'secret.txt'), 'not an asset');
    app = Fastify();
    await app.register(dashboardPlugin({ dir: built }));
    bare = Fastify();
    await bare.register(dashboardPlugin({ dir: empty }));
  });

  afterAll(async () => {
    await app.close();
    await bare.close();
    rmSync(built, { recursive: true, force: true });
    rmSync(empty, { recursive: true, force: true });
  });

  describe('when the dashboard is built', () => {
    it('should serve the page at / with a same-origin content-security policy and no caching', async () => {
      const res = await app.inject({ method: 'GET', url: '/' });
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.headers['content-security-policy']).toMatch(/default-src 'self'.*script-src 'self';.*connect-src 'self'/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.body).toContain('<title>page</title>');
    });

    it('should serve hashed assets with their type, cached for good', async () => {
      const res = await app.inject({ method: 'GET', url: '/assets/index-abc123.js' });
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
      expect(res.headers['cache-control']).toContain('immutable');
      expect(res.body).toBe('console.log(1)');
    });

    it('should serve nothing outside the assets folder, nor unknown types', async () => {
      for (const url of ['/assets/..%2Fsecret.txt', '/assets/%2e%2e%2findex.html', '/assets/missing.js', '/assets/.hidden.js', '/secret.txt', '/assets/x.exe']) {
        const res = await app.inject({ method: 'GET', url });
        expect(res.statusCode, url).toBe(404);
        expect(res.body).not.toContain('not an asset');
      }
    });
  });

  describe('when the dashboard is not built', () => {
    it('should answer / with 503 and how to build it', async () => {
      const res = await bare.inject({ method: 'GET', url: '/' });
      expect(res.statusCode).toBe(503);
      expect(res.body).toContain('npm run build:dashboard');
      expect(res.headers['cache-control']).toBe('no-store');
    });
  });
});
