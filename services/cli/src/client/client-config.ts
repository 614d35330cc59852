/**
 * Where the lab-machine commands find the server and the token: flags, then the environment
 * (BETASWEEP_SERVER, BETASWEEP_TOKEN), then a config file (BETASWEEP_CONFIG, or
 * ~/.config/betasweep/client.json).
 */
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { dirname, join } from 'node:path';

/** Server URL and token, with where each came from. */
export interface ClientConfig {
  server: string;
  token: string | null;
  serverFrom: 'flag' | 'env' | 'file' | 'default';
  tokenFrom: 'flag' | 'env' | 'file' | 'none';
}

/** The server used when nothing else says. */
export const DEFAULT_SERVER = 'http://127.0.0.1:8080';

/** Path of the client config file. */
export function clientConfigPath(env: NodeJS.ProcessEnv = process.env): string {
  return env.BETASWEEP_CONFIG ?? join(env.XDG_CONFIG_HOME ?? join(homedir(), '.config'), 'betasweep', 'client.json');
}

/** Reads the config file (missing file = empty). Throws with the path on malformed JSON. */
export function readClientConfigFile(path = clientConfigPath()): { server?: string; token?: string } {
  if (!existsSync(path)) return {};
  try {
    const v = JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>;
    return {
      server: typeof v.server === 'string' ? v.server : undefined,
      token: typeof v.token === 'string' ? v.token : undefined,
    };
  } catch (err) {
    throw new Error(`the client config ${path} is not valid JSON (${(err as Error).message}); fix or delete it`);
  }
}

/** Writes the config file with mode 0600 (it holds a token). */
export function writeClientConfigFile(values: { server?: string; token?: string }, path = clientConfigPath()): void {
  mkdirSync(dirname(path), { recursive: true });
  const merged = { ...readClientConfigFile(path), ...values };
  writeFileSync(path, JSON.stringify(merged, null, 2) + '\n', { mode: 0o600 });
  chmodSync(path, 0o600);
}

export function resolveClientConfig(flags: { server?: string; token?: string }, env: NodeJS.ProcessEnv = process.env): ClientConfig {
  const file = readClientConfigFile(clientConfigPath(env));
  const [server, serverFrom] = flags.server ? [flags.server, 'flag' as const]
    : env.BETASWEEP_SERVER ? [env.BETASWEEP_SERVER, 'env' as const]
      : file.server ? [file.server, 'file' as const] : [DEFAULT_SERVER, 'default' as const];
  const [token, tokenFrom] = flags.token ? [flags.token, 'flag' as const]
    : env.BETASWEEP_TOKEN ? [env.BETASWEEP_TOKEN, 'env' as const]
      : file.token ? [file.token, 'file' as const] : [null, 'none' as const];
  let url: URL;
  try {
    url = new URL(server);
  } catch {
    throw new Error(`the server URL '${server}' (from ${serverFrom}) is not a URL; expected e.g. ${DEFAULT_SERVER}`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error(`the server URL '${server}' must start with http:// or https://`);
  return { server: server.replace(/\/+$/, ''), token, serverFrom, tokenFrom };
}
