/** `betasweep serve` — the REST API (fastify) against a Redis, in one or several processes. */
import cluster from 'node:cluster';
import type { Command } from 'commander';
import { serverOptions, type ServerFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';
import { runServePrimary, type ListeningMessage } from './serve-cluster.js';

interface ServeFlags extends ServerFlags {
  host: string;
  port: string;
  bodyLimit?: string;
  rateLimit?: string;
  maxActive?: string;
  retentionDays?: string;
  log?: boolean;
  processes: string;
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
    .option('--processes <n>', 'API processes sharing the port (per-process /metrics counters; leave a core for Redis)', '1')
    .action(async (flags: ServeFlags) => {
      const processes = Number(flags.processes);
      if (!Number.isInteger(processes) || processes < 1 || processes > 64) throw new Error(`--processes must be a whole number from 1 to 64, got '${flags.processes}'`);
      const describe = (address: string) => `betasweep API listening on ${address} (Redis ${flags.redis.replace(/\/\/[^@/]*@/, '//***@')}, prefix ${flags.prefix})`;
      if (!cluster.isWorker) {
        await (await import('../../../dashboard/build-dashboard.js')).ensureDashboardBuilt((line) => process.stderr.write(`betasweep: ${line}\n`));
        if (processes > 1) {
          runServePrimary(processes, describe);
          return;
        }
      }
      // Loaded here, not at start-up: the other commands should not pay for it.
      const { createApi } = await import('../../../api/src/index.js');
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
      let address: string;
      try {
        address = await api.app.listen({ host: flags.host, port: Number(flags.port) });
      } catch (err) {
        // Without this the open Redis connections would keep a process that cannot serve alive.
        await api.close().catch(() => undefined);
        if (cluster.isWorker) {
          // The IPC channel to the primary would keep this process alive: leave now.
          process.stderr.write(`betasweep: ${(err as Error).message}\n`);
          process.exit(1);
        }
        throw err;
      }
      if (cluster.isWorker) process.send?.({ betasweepListening: address } satisfies ListeningMessage);
      else process.stdout.write(`${describe(address)}\n`);
      const stop = () => { void api.close().then(() => process.exit(0)); };
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    });
};
