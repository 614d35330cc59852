/**
 * Starts a private redis-server (AOF on, temp dir, free loopback port) for the integration
 * project and stops it afterwards. Tests read its URL from process.env.BETASWEEP_TEST_REDIS_URL
 * (provided through vitest's `provide`/`inject` as 'redisUrl' too).
 */
import { startPrivateRedis, type PrivateRedis } from './private-redis.js';
import type { TestProject } from 'vitest/node';

let redis: PrivateRedis | undefined;

export async function setup(project: TestProject): Promise<void> {
  redis = await startPrivateRedis();
  process.env.BETASWEEP_TEST_REDIS_URL = redis.url;
  project.provide('redisUrl', redis.url);
}

export async function teardown(): Promise<void> {
  await redis?.stop();
}

declare module 'vitest' {
  export interface ProvidedContext {
    redisUrl: string;
  }
}
