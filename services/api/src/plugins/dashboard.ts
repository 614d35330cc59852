/**
 * Serves the dashboard (services/dashboard, built by `npm run build:dashboard` into
 * services/dashboard/dist) at `/`: `index.html` and the hashed files under `/assets/`. No
 * token is needed for the page itself; it asks for one and sends it with every API call.
 * Files are read per request, so a rebuild shows without a restart. When the build is missing,
 * `/` answers 503 with how to build it (`betasweep serve` builds it at start when it can).
 * The routes are hidden from the OpenAPI document (they are not part of the API).
 */
import { readFile } from 'node:fs/promises';
import { extname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { FastifyPluginAsync, FastifyReply } from 'fastify';
import { apiError } from '../errors.js';

/** Where the built dashboard lives. */
export const DASHBOARD_DIST = fileURLToPath(new URL('../../../dashboard/dist/', import.meta.url));

/** Options of {@link dashboardPlugin}. */
export interface DashboardPluginOptions {
  /** The built dashboard's folder. @defaultValue services/dashboard/dist */
  dir?: string;
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
};

/** An asset name as vite writes it (no folders, no dot-files). */
const ASSET = /^[A-Za-z0-9_-][A-Za-z0-9._-]{0,200}$/;

/**
 * Same-origin everything; inline styles are needed by the chart library and by the SVG that
 * the plotting library builds; blob:/data: images for the PNG export.
 */
const CSP = [
  "default-src 'self'", "script-src 'self'", "style-src 'self' 'unsafe-inline'", "img-src 'self' data: blob:",
  "connect-src 'self'", "font-src 'self' data:", "object-src 'none'", "base-uri 'none'", "frame-ancestors 'none'", "form-action 'self'",
].join('; ');

function secure(reply: FastifyReply): FastifyReply {
  return reply.header('content-security-policy', CSP).header('x-content-type-options', 'nosniff')
    .header('referrer-policy', 'no-referrer').header('x-frame-options', 'DENY');
}

const NOT_BUILT = `<!doctype html><html lang="en"><meta charset="utf-8"><title>betasweep: dashboard not built</title>
<body><h1>The dashboard is not built</h1><p>Run <code>npm run build:dashboard</code> in the betasweep checkout
(or restart with <code>betasweep serve</code>, which builds it when it can), then reload. The REST API works without it.</p></body></html>`;

/** The plugin (register at the root, no prefix). */
export function dashboardPlugin(options: DashboardPluginOptions = {}): FastifyPluginAsync {
  const dir = options.dir ?? DASHBOARD_DIST;
  return async (app) => {
    app.get('/', { schema: { hide: true } }, async (_request, reply) => {
      let html: Buffer;
      try {
        html = await readFile(join(dir, 'index.html'));
      } catch {
        return secure(reply).status(503).header('content-type', 'text/html; charset=utf-8').header('cache-control', 'no-store').send(NOT_BUILT);
      }
      return secure(reply).header('content-type', TYPES['.html']).header('cache-control', 'no-cache').send(html);
    });

    app.get('/assets/:name', { schema: { hide: true } }, async (request, reply) => {
      const { name } = request.params as { name: string };
      const type = TYPES[extname(name)];
      if (!ASSET.test(name) || name.includes('..') || !type) throw apiError('BSW_ERR_ROUTE_NOT_FOUND', 'GET', `/assets/${name.slice(0, 100)}`);
      let body: Buffer;
      try {
        body = await readFile(join(dir, 'assets', name));
      } catch {
        throw apiError('BSW_ERR_ROUTE_NOT_FOUND', 'GET', `/assets/${name.slice(0, 100)}`);
      }
      // vite puts a content hash in every asset name: cache them for good.
      return secure(reply).header('content-type', type).header('cache-control', 'public, max-age=31536000, immutable').send(body);
    });
  };
}
