/**
 * A private redis-server on a free loopback port with AOF persistence in a temp directory.
 * Used by the integration tests' global setup and by tests that restart Redis mid-sweep.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface PrivateRedis {
  url: string;
  port: number;
  dir: string;
  /** Kill with SIGKILL (data acknowledged before survives via AOF) and start again on the same port and dir. */
  restart(): Promise<void>;
  stop(): Promise<void>;
}

/** A free TCP port on 127.0.0.1. */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

async function waitReady(port: number, timeoutMs = 10_000): Promise<void> {
  const { Redis } = await import('ioredis');
  const started = Date.now();
  for (;;) {
    const client = new Redis({ port, host: '127.0.0.1', lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
    // Refused connections are expected while the server starts; connect() reports them.
    client.on('error', () => undefined);
    try {
      await client.connect();
      const pong = await client.ping();
      client.disconnect();
      if (pong === 'PONG') return;
    } catch {
      client.disconnect();
    }
    if (Date.now() - started > timeoutMs) throw new Error(`redis-server on port ${port} did not start within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

function launch(port: number, dir: string): ChildProcess {
  const child = spawn('redis-server', [
    '--port', String(port), '--bind', '127.0.0.1', '--dir', dir,
    '--appendonly', 'yes', '--appendfsync', 'everysec', '--save', '',
    '--daemonize', 'no', '--logfile', join(dir, 'redis.log'),
  ], { stdio: 'ignore' });
  child.on('error', (err) => { console.error(`redis-server failed to start: ${err.message}`); });
  return child;
}

export async function startPrivateRedis(): Promise<PrivateRedis> {
  const port = await freePort();
  const dir = mkdtempSync(join(tmpdir(), 'betasweep-redis-'));
  let child = launch(port, dir);
  await waitReady(port);
  const exited = (c: ChildProcess) => new Promise<void>((r) => (c.exitCode !== null || c.signalCode !== null ? r() : c.once('exit', () => r())));
  return {
    url: `redis://127.0.0.1:${port}`,
    port,
    dir,
    async restart() {
      child.kill('SIGKILL');
      await exited(child);
      child = launch(port, dir);
      await waitReady(port);
    },
    async stop() {
      child.kill('SIGTERM');
      await exited(child);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
