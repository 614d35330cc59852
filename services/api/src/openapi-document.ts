/**
 * The OpenAPI document without a running service: builds the app on an inert context (no
 * connections; routes are registered, never called) and asks @fastify/swagger for the
 * document. `npx tsx services/api/src/write-openapi.ts` writes it to docs/openapi.json.
 */
import type { ApiContext } from './context.js';
import { API_DEFAULTS } from './context.js';
import { buildApp, type BuildAppHooks } from './app.js';
import { Metrics } from './metrics.js';
import { storeKeys } from '../../../workers/src/store/index.js';

export async function openApiDocument(hooks: BuildAppHooks = {}): Promise<Record<string, unknown>> {
  const inert = new Proxy({}, { get: () => { throw new Error('the inert context is only for building the document'); } });
  // The gate defines its script on the connection at registration: give it somewhere to.
  const redis = { defineCommand: () => undefined };
  const ctx = {
    redis, tokens: inert, queue: inert, planner: inert,
    store: { keys: storeKeys() },
    metrics: new Metrics(),
    options: API_DEFAULTS,
  } as unknown as ApiContext;
  const app = await buildApp(ctx, hooks);
  await app.ready();
  const doc = app.swagger() as unknown as Record<string, unknown>;
  await app.close();
  return doc;
}
