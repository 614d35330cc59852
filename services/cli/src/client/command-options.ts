/** Options shared by the client commands (server, token) and the server-side commands (Redis). */
import type { Command } from 'commander';
import { ApiClient, ClientError } from './api-client.js';
import { resolveClientConfig } from './client-config.js';

export interface ClientFlags {
  server?: string;
  token?: string;
}

export interface ServerFlags {
  redis: string;
  prefix: string;
}

/** Adds --server and --token. */
export function clientOptions(cmd: Command): Command {
  return cmd
    .option('--server <url>', 'API address (else BETASWEEP_SERVER, the config file, http://127.0.0.1:8080)')
    .option('--token <token>', 'bearer token (else BETASWEEP_TOKEN, the config file)');
}

/** Adds --redis and --prefix (defaults from BETASWEEP_REDIS_URL, BETASWEEP_PREFIX). */
export function serverOptions(cmd: Command): Command {
  return cmd
    .option('--redis <url>', 'Redis URL (else BETASWEEP_REDIS_URL)', process.env.BETASWEEP_REDIS_URL ?? 'redis://127.0.0.1:6379')
    .option('--prefix <prefix>', 'key prefix in Redis (else BETASWEEP_PREFIX)', process.env.BETASWEEP_PREFIX ?? 'bsw:');
}

export function withClient(flags: ClientFlags): ApiClient {
  return new ApiClient(resolveClientConfig(flags));
}

/** Wraps an action: a ClientError prints its message and sets its exit code; others propagate. */
export function action<A extends unknown[]>(fn: (...args: A) => Promise<void>): (...args: A) => Promise<void> {
  return async (...args: A) => {
    try {
      await fn(...args);
    } catch (err) {
      if (err instanceof ClientError) {
        process.stderr.write(`betasweep: ${err.message}\n`);
        process.exitCode = err.exitCode;
        return;
      }
      throw err;
    }
  };
}
