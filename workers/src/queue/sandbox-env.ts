/**
 * Configuration a sandboxed processor reads from its environment (set by the worker through
 * BullMQ's fork options, so several workers in one process can differ).
 */

/** Environment variable names. */
export const SANDBOX_ENV = {
  redisUrl: 'BETASWEEP_SANDBOX_REDIS_URL',
  prefix: 'BETASWEEP_SANDBOX_PREFIX',
  workerId: 'BETASWEEP_SANDBOX_WORKER_ID',
  pollMs: 'BETASWEEP_SANDBOX_POLL_MS',
  retentionSeconds: 'BETASWEEP_SANDBOX_RETENTION_SECONDS',
} as const;

export interface SandboxConfig {
  redisUrl: string;
  prefix: string;
  workerId: string;
  pollMs: number;
  retentionSeconds: number | undefined;
}

export function readSandboxEnv(env: NodeJS.ProcessEnv = process.env): SandboxConfig {
  const redisUrl = env[SANDBOX_ENV.redisUrl];
  if (!redisUrl) throw new Error(`${SANDBOX_ENV.redisUrl} is not set: sandboxed processors are started by startBranchWorker`);
  const retention = env[SANDBOX_ENV.retentionSeconds];
  return {
    redisUrl,
    prefix: env[SANDBOX_ENV.prefix] ?? 'bsw:',
    workerId: env[SANDBOX_ENV.workerId] ?? `pid-${process.ppid}`,
    pollMs: Number(env[SANDBOX_ENV.pollMs] ?? 200),
    retentionSeconds: retention !== undefined ? Number(retention) : undefined,
  };
}
