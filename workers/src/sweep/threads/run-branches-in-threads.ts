/**
 * Runs the branches of a local sweep on a pool of worker threads (one branch per thread at a
 * time), forwarding every record to `sink` on the calling thread. Parallelism is across
 * branches, never inside one memory-bound pass (two threads on one pass gave no speed-up on
 * the 2-core machines this targets). An abort terminates the pool; the first branch error
 * rejects the whole run.
 */
import { Worker } from 'node:worker_threads';
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import type { BranchSink } from '../../engines/engine.js';
import type { ThreadMessage } from './thread-messages.js';

const BOOT = new URL('./branch-thread.boot.mjs', import.meta.url);

export async function runBranchesInThreads(
  spec: SweepSpec,
  engine: string,
  branches: number[][],
  threads: number,
  sink: BranchSink,
  signal?: AbortSignal,
): Promise<void> {
  const queue = branches.map((b, i) => ({ b, i }));
  const live = new Set<Worker>();
  let failure: Error | undefined;

  const runOne = (betaIndices: number[]) => new Promise<void>((resolve, reject) => {
    const worker = new Worker(BOOT, { workerData: { spec, engine, betaIndices } });
    live.add(worker);
    let settled = false;
    const settle = (err?: Error) => {
      if (settled) return;
      settled = true;
      live.delete(worker);
      if (err) reject(err); else resolve();
    };
    worker.on('message', (m: ThreadMessage) => {
      switch (m.kind) {
        case 'thermo': sink.thermo(m.data); break;
        case 'point': sink.point(m.data); break;
        case 'diagnostics': sink.diagnostics(m.data); break;
        case 'done': settle(); break;
        case 'error': {
          const e = new Error(m.message);
          e.name = m.name;
          settle(e);
          break;
        }
      }
    });
    worker.on('error', (e) => settle(e));
    worker.on('exit', (code) => settle(code === 0 ? undefined : new Error(`branch thread exited with code ${code}`)));
  });

  const onAbort = () => { for (const w of live) w.postMessage({ kind: 'abort' }); };
  signal?.addEventListener('abort', onAbort);
  const lane = async () => {
    for (;;) {
      const next = queue.shift();
      if (!next || failure) return;
      try {
        await runOne(next.b);
      } catch (err) {
        failure ??= err as Error;
        for (const w of live) void w.terminate();
        return;
      }
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.max(1, Math.min(threads, branches.length)) }, lane));
  } finally {
    signal?.removeEventListener('abort', onAbort);
  }
  if (failure) throw failure;
  signal?.throwIfAborted();
}
