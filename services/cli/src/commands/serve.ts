/** `betasweep serve` — the REST API (fastify) against a Redis. */
import type { Command } from 'commander';
import { serverOptions, type ServerFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface ServeFlags extends ServerFlags {
  host: string;
  port: string;
  bodyLimit?: string;
  rateLimit?: string;
  maxActive?: string;
  retentionDays?: string;
  log?: boolean;
}

const int = (v: string | undefined, name: string): number | undefined => {
  if (v === undefined) return undefined;
  const n = Number(v);
  if (!Number.isFinite(n) || n < 0) throw new Error(`--${name} must be a non-negative number, got '${v}'`);
  return n;
};

export const registerServe: RegisterCommand = (program: Command) => {
  serverOptions(program.command('serve'))
    .description('serve the REST API (sweeps, results, live events) backed by Redis')
    .option('--host <host>', 'interface to listen on', process.env.BETASWEEP_HOST ?? '127.0.0.1')
    .option('--port <port>', 'port to listen on', process.env.BETASWEEP_PORT ?? '8080')
    .option('--body-limit <bytes>', 'largest request body (default 2 MiB)')
    .option('--rate-limit <n>', 'requests per token per minute (default 600)')
    .option('--max-active <n>', 'queued or running sweeps per owner, 0 = no cap (default 20)')
    .option('--retention-days <days>', 'keep finished sweeps this long (default 7; 0 = forever)')
    .option('--log', 'log every request')
    .action(async (flags: ServeFlags) => {
      // Loaded here, not at start-up: the other commands should not pay for it.
      const { createApi } = await import('../../../api/src/index.js');
      await (await import('../../../dashboard/build-dashboard.js')).ensureDashboardBuilt((line) => process.stderr.write(`betasweep: ${line}\n`));
      const retentionDays = int(flags.retentionDays, 'retention-days');
      const api = await createApi({
        redisUrl: flags.redis,
        prefix: flags.prefix,
        bodyLimit: int(flags.bodyLimit, 'body-limit'),
        rateLimitMax: int(flags.rateLimit, 'rate-limit'),
        maxActivePerOwner: int(flags.maxActive, 'max-active'),
        retentionSeconds: retentionDays === undefined ? undefined : Math.round(retentionDays * 86400),
        logger: Boolean(flags.log),
      });
      const address = await api.app.listen({ host: flags.host, port: Number(flags.port) });
      process.stdout.write(`betasweep API listening on ${address} (Redis ${flags.redis.replace(/\/\/[^@/]*@/, '//***@')}, prefix ${flags.prefix})\n`);
      const stop = () => { void api.close().then(() => process.exit(0)); };
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    });
};
