/** `betasweep fetch ID` — the result as JSON or CSV, to stdout or a file. */
import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { ClientError, action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

export const registerFetch: RegisterCommand = (program: Command) => {
  clientOptions(program.command('fetch'))
    .description("fetch a finished sweep's result")
    .argument('<id>', 'sweep id')
    .option('--format <format>', 'json or csv', 'json')
    .option('--out <file>', 'write to a file instead of stdout')
    .action(action(async (id: string, flags: ClientFlags & { format: string; out?: string }) => {
      if (flags.format !== 'json' && flags.format !== 'csv') throw new ClientError(`--format must be json or csv, got '${flags.format}'`, 2);
      const body = await withClient(flags).text(`/v1/sweeps/${encodeURIComponent(id)}/result?format=${flags.format}`, { sweepId: id });
      if (flags.out) {
        writeFileSync(flags.out, body);
        process.stderr.write(`wrote ${flags.out} (${body.length} bytes)\n`);
      } else {
        process.stdout.write(body.endsWith('\n') ? body : body + '\n');
      }
    }));
};
