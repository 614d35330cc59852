/** `betasweep cancel ID` — stop a queued or running sweep. */
import type { Command } from 'commander';
import { action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

export const registerCancel: RegisterCommand = (program: Command) => {
  clientOptions(program.command('cancel'))
    .description('cancel a queued or running sweep (running branches stop within 2 s)')
    .argument('<id>', 'sweep id')
    .action(action(async (id: string, flags: ClientFlags) => {
      const r = await withClient(flags).request<{ id: string; status: string; changed: boolean }>(
        'POST', `/v1/sweeps/${encodeURIComponent(id)}/cancel`, undefined, { sweepId: id });
      process.stdout.write(r.changed ? `cancelled ${r.id}\n` : `${r.id} was already cancelled\n`);
    }));
};
