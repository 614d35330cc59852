/**
 * Bearer-token authentication for the /v1 routes. The caller's owner scopes every sweep
 * lookup; a sweep of another owner is reported as not found.
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import type { TokenStore } from '../../../workers/src/store/index.js';
import { apiError } from './errors.js';

/** Who is calling. */
export interface Caller {
  owner: string;
  tokenId: string;
  tokenName: string;
}

declare module 'fastify' {
  interface FastifyRequest {
    /** Set by the auth hook on /v1 routes. */
    caller: Caller | null;
  }
  interface FastifyContextConfig {
    /** The route accepts a stream token in the query instead of a bearer token. */
    allowStreamToken?: boolean;
  }
}

const BEARER = /^Bearer\s+([A-Za-z0-9._~+/=-]{1,256})\s*$/i;

/** Adds the hook to `app` (call inside the /v1 plugin). */
export function installAuth(app: FastifyInstance, tokens: TokenStore): void {
  app.addHook('onRequest', async (request: FastifyRequest) => {
    const header = request.headers.authorization;
    if (!header) {
      const q = request.query as Record<string, unknown> | undefined;
      if (request.routeOptions.config?.allowStreamToken && typeof q?.streamToken === 'string') return;
      throw apiError('BSW_ERR_UNAUTHORIZED');
    }
    const m = BEARER.exec(header);
    if (!m) throw apiError('BSW_ERR_UNAUTHORIZED');
    const info = await tokens.verify(m[1]);
    if (!info) throw apiError('BSW_ERR_TOKEN_REJECTED');
    request.caller = { owner: info.owner, tokenId: info.id, tokenName: info.name };
  });
}

/** The caller of an authenticated route (throws 401 if the hook did not run). */
export function callerOf(request: FastifyRequest): Caller {
  if (!request.caller) throw apiError('BSW_ERR_UNAUTHORIZED');
  return request.caller;
}
