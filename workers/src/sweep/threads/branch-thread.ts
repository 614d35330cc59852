/**
 * Body of a local branch worker thread: runs one engine branch and posts every record to the
 * parent as it is computed. The parent aborts it with {kind: 'abort'}.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { ENGINES } from '../select-engine.js';
import type { ThreadMessage } from './thread-messages.js';

interface BranchJob {
  spec: SweepSpec;
  engine: string;
  betaIndices: number[];
}

const port = parentPort;
if (!port) throw new Error('branch-thread must run in a worker thread');
const job = workerData as BranchJob;
const controller = new AbortController();
port.on('message', (m: { kind: string }) => { if (m.kind === 'abort') controller.abort(); });
const post = (m: ThreadMessage) => port.postMessage(m);

const engine = ENGINES.get(job.engine);
try {
  if (!engine) throw new Error(`engine '${job.engine}' not registered`);
  await engine.runBranch(job.spec, job.betaIndices, {
    thermo: (data) => post({ kind: 'thermo', data }),
    point: (data) => post({ kind: 'point', data }),
    diagnostics: (data) => post({ kind: 'diagnostics', data }),
  }, { signal: controller.signal });
  post({ kind: 'done' });
} catch (err) {
  const e = err instanceof Error ? err : new Error(String(err));
  post({ kind: 'error', name: e.name, message: e.message });
} finally {
  port.close();
}
