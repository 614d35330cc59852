/** `betasweep work` — a queue worker; branches run in sandboxed child processes. */
import { resolve } from 'node:path';
import type { Command } from 'commander';
import { serverOptions, type ServerFlags } from '../client/index.js';
import type { RegisterCommand } from './index.js';

interface WorkFlags extends ServerFlags {
  concurrency: string;
  graceSeconds: string;
  lockMs: string;
  stalledMs: string;
  pollMs: string;
  id?: string;
  processor?: string;
  prewarm: boolean;
}

const positive = (v: string, name: string) => {
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) throw new Error(`--${name} must be a positive whole number, got '${v}'`);
  return n;
};

export const registerWork: RegisterCommand = (program: Command) => {
  serverOptions(program.command('work'))
    .description('run queued sweep branches (any number of workers on any machines may share one Redis)')
    .option('--concurrency <n>', 'branches at once (one sandboxed process each; one per core is sensible)', '1')
    .option('--grace-seconds <s>', 'on SIGTERM/SIGINT, wait this long for branches in hand, then hand them back', '30')
    .option('--lock-ms <ms>', 'job lock duration', '30000')
    .option('--stalled-ms <ms>', 'how often to look for branches of dead workers', '30000')
    .option('--poll-ms <ms>', 'cancel poll interval inside a branch', '200')
    .option('--id <id>', 'worker id shown in branch states (default host-pid-random)')
    .option('--processor <file>', 'sandboxed processor file (default: the built-in one, loaded through tsx; a compiled dist/…/branch-processor.js skips tsx)')
    .option('--no-prewarm', 'do not start the sandbox processes before the first job')
    .action(async (flags: WorkFlags) => {
      // Loaded here, not at start-up: the other commands should not pay for it.
      const { startBranchWorker } = await import('../../../../workers/src/queue/index.js');
      const handle = await startBranchWorker({
        redisUrl: flags.redis,
        prefix: flags.prefix,
        concurrency: positive(flags.concurrency, 'concurrency'),
        lockDuration: positive(flags.lockMs, 'lock-ms'),
        stalledInterval: positive(flags.stalledMs, 'stalled-ms'),
        pollMs: positive(flags.pollMs, 'poll-ms'),
        workerId: flags.id,
        processorFile: flags.processor ? resolve(flags.processor) : undefined,
        prewarm: flags.prewarm,
      });
      process.stdout.write(`betasweep worker ${handle.workerId} ready (concurrency ${flags.concurrency})\n`);
      const grace = Number(flags.graceSeconds) * 1000;
      let stopping = false;
      const stop = (signal: string) => {
        if (stopping) {
          process.stderr.write('betasweep worker: second signal, exiting now (branches in hand will be retried)\n');
          process.exit(1);
        }
        stopping = true;
        process.stdout.write(`betasweep worker: ${signal}, finishing branches in hand (up to ${flags.graceSeconds} s, then handing back)\n`);
        void handle.close(grace).then(() => process.exit(0), () => process.exit(1));
      };
      process.on('SIGINT', () => stop('SIGINT'));
      process.on('SIGTERM', () => stop('SIGTERM'));
    });
};
