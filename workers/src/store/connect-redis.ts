/**
 * Opens an ioredis connection whose errors are reported (throttled) instead of surfacing as
 * "Unhandled error event": while Redis restarts, ioredis reconnects by itself and queued
 * commands wait (maxRetriesPerRequest null) or fail after their retries.
 */
import { Redis, type RedisOptions } from 'ioredis';

/** At most one error line per connection in this window, ms. */
const REPORT_EVERY_MS = 5000;

export function connectRedis(url: string, options: RedisOptions = {}, label = 'redis', report: (line: string) => void = (l) => process.stderr.write(l)): Redis {
  const redis = new Redis(url, options);
  let last = 0;
  redis.on('error', (err: Error) => {
    const now = Date.now();
    if (now - last < REPORT_EVERY_MS) return;
    last = now;
    report(`betasweep ${label}: ${err.message} (reconnecting)\n`);
  });
  return redis;
}
