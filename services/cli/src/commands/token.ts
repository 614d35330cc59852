/** `betasweep token create|list|revoke` — admin commands on the Redis the API uses. */
import type { Command } from 'commander';
import type { TokenStore } from '../../../../workers/src/store/index.js';
import { serverOptions, type ServerFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

async function withTokens<T>(flags: ServerFlags, fn: (tokens: TokenStore) => Promise<T>): Promise<T> {
  // Loaded here, not at start-up: the other commands should not pay for it.
  const [{ Redis }, { TokenStore }] = await Promise.all([import('ioredis'), import('../../../../workers/src/store/index.js')]);
  const redis = new Redis(flags.redis, { maxRetriesPerRequest: 1, retryStrategy: () => null, lazyConnect: true });
  redis.on('error', () => undefined);
  try {
    await redis.connect().catch((err: Error) => {
      throw new Error(`cannot reach Redis at ${flags.redis} (${err.message}); pass --redis or set BETASWEEP_REDIS_URL`);
    });
    return await fn(new TokenStore(redis, { prefix: flags.prefix }));
  } finally {
    redis.disconnect();
  }
}

export const registerToken: RegisterCommand = (program: Command) => {
  const token = program.command('token').description('create, list and revoke API tokens (admin; talks to Redis directly)');

  serverOptions(token.command('create'))
    .description('create a token and print it once (only its SHA-256 is stored)')
    .requiredOption('--name <name>', 'token name (unique among active tokens)')
    .option('--owner <owner>', 'owner of the sweeps this token submits (default: the name)')
    .option('--json', 'print JSON')
    .action(async (flags: ServerFlags & { name: string; owner?: string; json?: boolean }) => {
      const { secret, info } = await withTokens(flags, (t) => t.create(flags.name, flags.owner ?? flags.name));
      if (flags.json) process.stdout.write(JSON.stringify({ token: secret, ...info }) + '\n');
      else {
        process.stdout.write(`${secret}\n`);
        process.stderr.write(`token ${info.id} '${info.name}' for owner '${info.owner}' created; it is shown only this once\n`);
      }
    });

  serverOptions(token.command('list'))
    .description('list tokens (never their secrets)')
    .option('--json', 'print JSON')
    .action(async (flags: ServerFlags & { json?: boolean }) => {
      const list = await withTokens(flags, (t) => t.list());
      if (flags.json) {
        process.stdout.write(JSON.stringify(list) + '\n');
        return;
      }
      if (list.length === 0) process.stdout.write('no tokens\n');
      for (const t of list) {
        const state = t.revokedAt ? `revoked ${t.revokedAt}` : 'active';
        process.stdout.write(`${t.id}  ${t.name.padEnd(20)} owner=${t.owner.padEnd(16)} created ${t.createdAt}  ${state}\n`);
      }
    });

  serverOptions(token.command('revoke'))
    .description('revoke a token by id (tok_…) or name; it stops working at once')
    .argument('<idOrName>', 'token id or name')
    .action(async (idOrName: string, flags: ServerFlags) => {
      const revoked = await withTokens(flags, (t) => t.revoke(idOrName));
      if (!revoked) {
        process.stderr.write(`betasweep: no active token '${idOrName}'\n`);
        process.exitCode = 1;
        return;
      }
      process.stdout.write(`revoked ${revoked.id} '${revoked.name}'\n`);
    });
};
