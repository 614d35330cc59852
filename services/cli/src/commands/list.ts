/** `betasweep list` — the caller's sweeps, newest first. */
import type { Command } from 'commander';
import { action, clientOptions, withClient, type ClientFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface ListReply {
  items: Array<{ id: string; status: string; label: string; engine: string; createdAt: string; pointsDone: number; pointsTotal: number }>;
  nextCursor: string | null;
}

export const registerList: RegisterCommand = (program: Command) => {
  clientOptions(program.command('list'))
    .description("list this token's sweeps, newest first")
    .option('--status <status>', 'only queued, running, succeeded, failed or cancelled')
    .option('--limit <n>', 'how many', '20')
    .option('--json', 'print JSON')
    .action(action(async (flags: ClientFlags & { status?: string; limit: string; json?: boolean }) => {
      const q = new URLSearchParams({ limit: flags.limit });
      if (flags.status) q.set('status', flags.status);
      const page = await withClient(flags).request<ListReply>('GET', `/v1/sweeps?${q}`);
      if (flags.json) {
        process.stdout.write(JSON.stringify(page) + '\n');
        return;
      }
      if (page.items.length === 0) process.stdout.write('no sweeps\n');
      for (const s of page.items) {
        process.stdout.write(`${s.id}  ${s.status.padEnd(9)} ${String(s.pointsDone).padStart(6)}/${String(s.pointsTotal).padEnd(6)} ${s.createdAt}  ${s.engine}  ${s.label}\n`);
      }
    }));
};
