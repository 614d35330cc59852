/**
 * A small HTTP client for the betasweep API with messages a person can act on: an
 * unreachable server, a rejected token and an unknown sweep each say what to check.
 */
import type { ClientConfig } from './client-config.js';

/** An error for the command line: `message` is what to print; `exitCode` what to exit with. */
export class ClientError extends Error {
  override readonly name = 'ClientError';
  constructor(message: string, readonly exitCode = 1, readonly status?: number, readonly code?: string) {
    super(message);
  }
}

/** The error body the API sends. */
interface ErrorBody {
  code?: string;
  message?: string;
  issues?: Array<{ path: (string | number)[]; message: string }>;
}

const NETWORK_HINTS: Record<string, string> = {
  ECONNREFUSED: 'connection refused',
  ENOTFOUND: 'host not found',
  EAI_AGAIN: 'host lookup failed',
  ECONNRESET: 'connection reset',
  ETIMEDOUT: 'timed out',
  EHOSTUNREACH: 'host unreachable',
  UND_ERR_CONNECT_TIMEOUT: 'connect timed out',
};

export class ApiClient {
  constructor(readonly config: ClientConfig, private readonly timeoutMs = 30_000) {}

  /** Raw fetch with auth; network failures become a ClientError naming the server. */
  async fetchRaw(path: string, init: RequestInit & { timeoutMs?: number | null } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.config.token) headers.set('authorization', `Bearer ${this.config.token}`);
    const timeout = init.timeoutMs === undefined ? this.timeoutMs : init.timeoutMs;
    const signal = init.signal ?? (timeout ? AbortSignal.timeout(timeout) : undefined);
    try {
      return await fetch(`${this.config.server}${path}`, { ...init, headers, signal });
    } catch (err) {
      const cause = (err as { cause?: { code?: string; message?: string; errors?: Array<{ code?: string }> } }).cause;
      const code = cause?.code ?? cause?.errors?.[0]?.code ?? ((err as Error).name === 'TimeoutError' ? 'ETIMEDOUT' : undefined);
      const why = (code && NETWORK_HINTS[code]) ?? cause?.message ?? (err as Error).message;
      throw new ClientError(
        `cannot reach the betasweep server at ${this.config.server} (${why}). ` +
        `Is it running (betasweep serve), and is the address right? Set it with --server, BETASWEEP_SERVER or \`betasweep config --server URL\`.`,
        3,
      );
    }
  }

  /** A JSON request; non-2xx answers become a ClientError with the server's code and message. */
  async request<T>(method: string, path: string, body?: unknown, what?: { sweepId?: string }): Promise<T> {
    const init: RequestInit = { method };
    if (body !== undefined) {
      init.body = JSON.stringify(body);
      init.headers = { 'content-type': 'application/json' };
    }
    const res = await this.fetchRaw(path, init);
    const text = await res.text();
    if (res.ok) return (text ? JSON.parse(text) : null) as T;
    throw this.errorOf(res, text, what);
  }

  /** A text request (CSV). */
  async text(path: string, what?: { sweepId?: string }): Promise<string> {
    const res = await this.fetchRaw(path);
    const text = await res.text();
    if (!res.ok) throw this.errorOf(res, text, what);
    return text;
  }

  errorOf(res: Response, text: string, what?: { sweepId?: string }): ClientError {
    let body: ErrorBody = {};
    try { body = JSON.parse(text) as ErrorBody; } catch { /* not JSON */ }
    const code = body.code;
    const serverMessage = body.message ?? (text.slice(0, 200) || res.statusText);
    if (res.status === 401) {
      const hint = this.config.token
        ? `the server rejected the token from ${this.config.tokenFrom} (${serverMessage}). Ask the server admin for a valid one (betasweep token create --name NAME).`
        : `no token given: pass --token, set BETASWEEP_TOKEN, or run \`betasweep config --token TOKEN\`.`;
      return new ClientError(hint, 4, 401, code);
    }
    if (res.status === 404 && code === 'BSW_ERR_SWEEP_NOT_FOUND') {
      return new ClientError(`unknown sweep ${what?.sweepId ?? ''}: the server has no such sweep for this token (check the id with \`betasweep list\`).`.replace('  ', ' '), 5, 404, code);
    }
    if (res.status === 429) {
      const after = res.headers.get('retry-after');
      return new ClientError(`${serverMessage}${after ? ` (retry after ${after} s)` : ''}`, 6, 429, code);
    }
    const issues = (body.issues ?? []).map((i) => `  - ${i.message}`).join('\n');
    return new ClientError(`${code ?? `HTTP ${res.status}`}: ${serverMessage}${issues ? `\n${issues}` : ''}`, 1, res.status, code);
  }
}
