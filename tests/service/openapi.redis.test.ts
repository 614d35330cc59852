/**
 * The OpenAPI document is true: it lists every route with its response codes, the served
 * document equals the one built from the schemas, and real responses validate against the
 * documented schemas. (`npx tsx services/api/src/write-openapi.ts` writes a copy to
 * docs/openapi.json for readers without a running service.)
 */
import { Ajv } from 'ajv';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openApiDocument, type Api } from '../../services/api/src/index.js';
import { startBranchWorker, type BranchWorkerHandle } from '../../workers/src/queue/index.js';
import { bearer, makeToken, smallSpec, startTestApi, testRedisUrl, uniquePrefix, waitFor } from './support/harness.js';

type Doc = { openapi: string; paths: Record<string, Record<string, { responses: Record<string, unknown> }>>; components: { schemas: Record<string, unknown> } };

const pointer = (...segments: string[]) => segments.map((s) => encodeURIComponent(s.replace(/~/g, '~0').replace(/\//g, '~1'))).join('/');
const docPath = (url: string) => url.replace(/:([A-Za-z]+)/g, '{$1}');

/**
 * OpenAPI 3.0 writes "may be null" as `nullable: true`, also beside `anyOf`; Ajv accepts
 * `nullable` only next to `type`. Rewrite the other case as `anyOf [schema, null]`.
 */
function forAjv(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(forAjv);
  if (!node || typeof node !== 'object') return node;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(node)) out[k] = forAjv(v);
  if (out.nullable === true && !('type' in out)) {
    const { nullable: _ignored, ...rest } = out;
    return { anyOf: [rest, { type: 'null' }] };
  }
  return out;
}

describe('OpenAPI document', () => {
  const prefix = uniquePrefix('openapi');
  const routes: Array<{ method: string; url: string; hidden: boolean }> = [];
  let doc: Doc;
  let api: Api;
  let worker: BranchWorkerHandle;
  let token: string;
  let ajv: Ajv;

  beforeAll(async () => {
    doc = (await openApiDocument({
      onRoute: (r) => { for (const m of [r.method].flat()) if (m !== 'HEAD') routes.push({ method: m.toLowerCase(), url: r.url, hidden: r.hidden }); },
    })) as unknown as Doc;
    api = await startTestApi({ prefix });
    token = await makeToken(testRedisUrl(), prefix, 'lab');
    worker = await startBranchWorker({ redisUrl: testRedisUrl(), prefix });
    ajv = new Ajv({ strict: false, allErrors: true });
    ajv.addSchema(forAjv(doc) as object, 'openapi');
  });

  afterAll(async () => {
    await worker?.close(500);
    await api?.close();
  });

  /** Validates a body against the documented response schema; returns the errors. */
  const check = (url: string, method: string, status: number, body: unknown) => {
    const ref = `openapi#/${pointer('paths', docPath(url), method, 'responses', String(status), 'content', 'application/json', 'schema')}`;
    const ok = ajv.validate({ $ref: ref }, body);
    return ok ? null : ajv.errorsText(ajv.errors);
  };

  describe('when built from the schemas', () => {
    it('should be OpenAPI 3 and list every route, with at least one response each', () => {
      expect(doc.openapi).toMatch(/^3\./);
      const visible = routes.filter((r) => !r.hidden);
      expect(visible.length).toBeGreaterThanOrEqual(13);
      for (const r of visible) {
        const entry = doc.paths[docPath(r.url)]?.[r.method];
        expect(entry, `${r.method.toUpperCase()} ${r.url} in the document`).toBeDefined();
        expect(Object.keys(entry.responses).length).toBeGreaterThan(0);
      }
      const documented = Object.entries(doc.paths).flatMap(([p, ms]) => Object.keys(ms).map((m) => `${m} ${p}`));
      expect(documented.sort()).toEqual(visible.map((r) => `${r.method} ${docPath(r.url)}`).sort());
    });

    it('should declare the error answers each /v1 route can give', () => {
      for (const [p, methods] of Object.entries(doc.paths)) {
        if (!p.startsWith('/v1/')) continue;
        for (const [m, op] of Object.entries(methods)) {
          expect(Object.keys(op.responses), `${m} ${p}`).toEqual(expect.arrayContaining(['401', '429']));
          if (p.includes('{id}')) expect(Object.keys(op.responses), `${m} ${p}`).toEqual(expect.arrayContaining(['400', '404']));
        }
      }
    });

    it('should equal the document the running service serves', async () => {
      const served = (await api.app.inject({ method: 'GET', url: '/openapi.json' })).json();
      expect(served).toEqual(doc);
      // The shared schemas are named components, referenced rather than inlined.
      expect(Object.keys(doc.components.schemas)).toEqual(expect.arrayContaining(['SweepSpecInput', 'SweepResult', 'SweepPlan', 'Error', 'SweepStatusReport']));
    });
  });

  describe('when real responses are checked against it', () => {
    it('should validate submit, status, list, result, plan, engines, cancel and error bodies', async () => {
      const h = bearer(token);
      const submit = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: h, payload: smallSpec({ label: 'doc' }) });
      expect(check('/v1/sweeps', 'post', 201, submit.json())).toBeNull();
      const id = submit.json().id;
      const status = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: h });
      expect(check('/v1/sweeps/:id', 'get', 200, status.json())).toBeNull();
      await waitFor(async () => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: h })).json().status === 'succeeded', 'the sweep');
      const done = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: h });
      expect(check('/v1/sweeps/:id', 'get', 200, done.json())).toBeNull();
      const list = await api.app.inject({ method: 'GET', url: '/v1/sweeps', headers: h });
      expect(check('/v1/sweeps', 'get', 200, list.json())).toBeNull();
      const result = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: h });
      expect(check('/v1/sweeps/:id/result', 'get', 200, result.json())).toBeNull();
      const plan = await api.app.inject({ method: 'POST', url: '/v1/plan', headers: h, payload: smallSpec() });
      expect(check('/v1/plan', 'post', 200, plan.json())).toBeNull();
      const engines = await api.app.inject({ method: 'GET', url: '/v1/engines', headers: h });
      expect(check('/v1/engines', 'get', 200, engines.json())).toBeNull();
      const again = await api.app.inject({ method: 'POST', url: `/v1/sweeps/${id}/cancel`, headers: h });
      expect(again.statusCode).toBe(409);
      expect(check('/v1/sweeps/:id/cancel', 'post', 409, again.json())).toBeNull();
      const bad = await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: h, payload: smallSpec({ betas: [-1] }) });
      expect(check('/v1/sweeps', 'post', 400, bad.json())).toBeNull();
      const ready = await api.app.inject({ method: 'GET', url: '/readyz' });
      expect(check('/readyz', 'get', 200, ready.json())).toBeNull();
      // The check itself can fail: a wrong body is rejected.
      expect(check('/v1/sweeps/:id', 'get', 200, { ...(done.json() as object), status: 'exploded' })).toMatch(/status|enum/);
    });

    it('should validate the status of a typical sweep, whose branches report their samples', async () => {
      const h = bearer(token);
      const spec = smallSpec({ label: 'doc-typical', lattice: { kind: 'chain', length: 6 }, engine: 'typical', tolerance: 0.05 });
      const id = (await api.app.inject({ method: 'POST', url: '/v1/sweeps', headers: h, payload: spec })).json().id;
      await waitFor(async () => (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: h })).json().status === 'succeeded', 'the typical sweep');
      const done = (await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}`, headers: h })).json();
      expect(done.branches[0].samples).toMatchObject({ final: true });
      expect(check('/v1/sweeps/:id', 'get', 200, done)).toBeNull();
      const result = await api.app.inject({ method: 'GET', url: `/v1/sweeps/${id}/result`, headers: h });
      expect(check('/v1/sweeps/:id/result', 'get', 200, result.json())).toBeNull();
      const samples = done.branches[0].samples;
      expect(check('/v1/sweeps/:id', 'get', 200, { ...done, branches: [{ ...done.branches[0], samples: { ...samples, stored: -1 } }] })).not.toBeNull();
    });
  });
});
