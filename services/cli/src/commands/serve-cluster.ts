/**
 * The primary of `betasweep serve --processes N`: forks N API processes that share the
 * listening port (node:cluster; the primary hands out connections round-robin), prints one
 * "listening" line when all are up, replaces a process that dies later (a process that dies
 * before all are up stops the lot, exit code 1), and on SIGTERM/SIGINT stops them all (each
 * closes its server and connections) before exiting.
 * Each process keeps its own per-process counters (/metrics request counts and latency); the
 * rate limits, tokens and sweeps live in Redis and are shared.
 */
import cluster, { type Worker } from 'node:cluster';

/** Delay before a process that died is replaced, ms (no tight fork loop on a failing start). */
export const RESPAWN_DELAY_MS = 1000;

/** Message an API process sends the primary once it listens. */
export interface ListeningMessage {
  readonly betasweepListening: string;
}

/** Runs the primary (see file header); `describe` turns the address into the line to print. */
export function runServePrimary(processes: number, describe: (address: string) => string): void {
  let stopping = false;
  let announced = false;
  const listening = new Set<number>();
  const fork = (): Worker => {
    const w = cluster.fork();
    w.on('message', (m: Partial<ListeningMessage>) => {
      if (typeof m?.betasweepListening !== 'string') return;
      listening.add(w.id);
      if (!announced && listening.size === processes) {
        announced = true;
        process.stdout.write(`${describe(m.betasweepListening)} (${processes} processes)\n`);
      }
    });
    return w;
  };
  cluster.on('exit', (w, code, signal) => {
    listening.delete(w.id);
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit();
      return;
    }
    if (!announced) {
      // A start-up failure (bad Redis URL, port taken): replacing it would fail the same way.
      process.stderr.write(`betasweep: API process ${w.process.pid} exited (${signal ?? code}) before all processes were listening; stopping\n`);
      stop();
      process.exitCode = 1;
      return;
    }
    process.stderr.write(`betasweep: API process ${w.process.pid} exited (${signal ?? code}); starting another\n`);
    setTimeout(() => { if (!stopping) fork(); }, RESPAWN_DELAY_MS).unref();
  });
  function stop(): void {
    stopping = true;
    const workers = Object.values(cluster.workers ?? {}).filter((w): w is Worker => w !== undefined);
    if (workers.length === 0) process.exit();
    for (const w of workers) w.process.kill('SIGTERM');
  }
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
  for (let i = 0; i < processes; i++) fork();
}
