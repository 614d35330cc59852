/**
 * Calls to the betasweep API from the page, with the bearer token. Error answers become
 * {@link ApiError} with the service's stable code and its issues; a rejected token also
 * fires `bsw:unauthorized` so the page asks for a new one.
 */
import { loadToken } from './token-store.js';

/** One issue of an error body: a field path and a message naming the field and the limit. */
export interface ApiIssue {
  code?: string;
  path: Array<string | number>;
  message: string;
}

/** An error answer of the API (or a network failure, status 0). */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  constructor(message: string, readonly status: number, readonly code: string | null, readonly issues: ApiIssue[] = []) {
    super(message);
  }
}

async function send(path: string, init: RequestInit = {}, token = loadToken()): Promise<Response> {
  const headers = new Headers(init.headers);
  if (token) headers.set('authorization', `Bearer ${token}`);
  let res: Response;
  try {
    res = await fetch(path, { ...init, headers });
  } catch (err) {
    throw new ApiError(`the service does not answer (${(err as Error).message})`, 0, null);
  }
  if (res.ok) return res;
  const text = await res.text();
  let body: { code?: string; message?: string; issues?: ApiIssue[] } = {};
  try { body = JSON.parse(text) as typeof body; } catch { /* not JSON */ }
  if (res.status === 401) window.dispatchEvent(new CustomEvent('bsw:unauthorized', { detail: body.message }));
  const retry = res.headers.get('retry-after');
  const message = (body.message ?? (text.slice(0, 200) || res.statusText)) + (retry ? ` (retry in ${retry} s)` : '');
  throw new ApiError(message, res.status, body.code ?? null, body.issues ?? []);
}

/** A JSON request; returns the parsed body. */
export async function apiJson<T>(method: string, path: string, body?: unknown, token?: string): Promise<T> {
  const init: RequestInit = { method };
  if (body !== undefined) {
    init.body = JSON.stringify(body);
    init.headers = { 'content-type': 'application/json' };
  }
  const res = await send(path, init, token ?? loadToken());
  return (await res.json()) as T;
}

/** A GET returning the raw response (streams, CSV, downloads). */
export function apiFetch(path: string, init: RequestInit = {}): Promise<Response> {
  return send(path, init);
}
