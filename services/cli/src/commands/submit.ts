/** `betasweep submit SPEC.json` — send a sweep to the server; prints its id. */
import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { ClientError, action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface SubmitReply {
  id: string;
  status: string;
  deduplicated: boolean;
  specHash: string;
}

/** Reads a spec file as JSON, with the path in any error. */
export function readSpecFile(path: string): unknown {
  let text: string;
  try {
    text = path === '-' ? readFileSync(0, 'utf8') : readFileSync(path, 'utf8');
  } catch (err) {
    throw new ClientError(`cannot read ${path}: ${(err as Error).message}`, 2);
  }
  try {
    return JSON.parse(text);
  } catch (err) {
    throw new ClientError(`${path} is not valid JSON: ${(err as Error).message}`, 2);
  }
}

export const registerSubmit: RegisterCommand = (program: Command) => {
  clientOptions(program.command('submit'))
    .description('submit a sweep spec to the server (prints the sweep id)')
    .argument('<spec>', 'spec file (JSON), or - for stdin')
    .option('--fresh', 'run again even if an identical sweep exists')
    .option('--json', 'print the full reply as JSON')
    .action(action(async (specPath: string, flags: ClientFlags & { fresh?: boolean; json?: boolean }) => {
      const spec = readSpecFile(specPath);
      const client = withClient(flags);
      const reply = await client.request<SubmitReply>('POST', `/v1/sweeps${flags.fresh ? '?fresh=true' : ''}`, spec);
      if (flags.json) {
        process.stdout.write(JSON.stringify(reply) + '\n');
        return;
      }
      process.stdout.write(`${reply.id}\n`);
      process.stderr.write(reply.deduplicated
        ? `an identical sweep already exists (${reply.status}); pass --fresh to run it again\n`
        : `queued; follow it with: betasweep watch ${reply.id}\n`);
    }));
};
