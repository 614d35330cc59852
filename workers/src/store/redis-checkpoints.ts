/**
 * Engine checkpoints on Redis: one hash per sweep (`keys.checkpoints(id)`, field = branch
 * index, value = the engine's bytes as a binary string). A save is one Lua step that checks
 * the sweep is still queued or running, so a late writer (a zombie sandbox, a branch racing a
 * cancel) cannot re-create the hash after the sweep ended. The hash gets the sweep's retention
 * TTL with every other per-sweep key at the terminal transition and is deleted when the sweep
 * succeeds (queue/finalize-sweep.ts).
 */
import type { Redis } from 'ioredis';
import type { StoreKeys } from './keys.js';

/**
 * KEYS: record, checkpoints
 * ARGV: branch index, bytes
 * Returns 1 when stored, 0 when the sweep is not queued or running.
 */
export const SAVE_CHECKPOINT = `
local st = redis.call('HGET', KEYS[1], 'status')
if st ~= 'queued' and st ~= 'running' then return 0 end
redis.call('HSET', KEYS[2], ARGV[1], ARGV[2])
return 1
`;

type SaveFn = (...args: (string | number | Buffer)[]) => Promise<number>;

/** Checkpoint reads and writes of the Redis job store (see the file header). */
export class RedisCheckpoints {
  readonly #save: SaveFn;

  /** Uses (does not own) `redis`; defines the save script on it once. */
  constructor(private readonly redis: Redis, private readonly keys: StoreKeys) {
    const r = redis as unknown as Record<string, unknown>;
    if (typeof r.bswSaveCheckpoint !== 'function') redis.defineCommand('bswSaveCheckpoint', { lua: SAVE_CHECKPOINT });
    this.#save = (r.bswSaveCheckpoint as SaveFn).bind(redis);
  }

  /** Stores (replaces) the branch's checkpoint; false when the sweep is over. */
  async save(id: string, branchIndex: number, data: Uint8Array): Promise<boolean> {
    const bytes = Buffer.from(data.buffer, data.byteOffset, data.byteLength);
    return (await this.#save(2, this.keys.sweep(id), this.keys.checkpoints(id), String(branchIndex), bytes)) === 1;
  }

  /** The branch's checkpoint (a fresh copy), or null. */
  async load(id: string, branchIndex: number): Promise<Uint8Array | null> {
    const b = await this.redis.hgetBuffer(this.keys.checkpoints(id), String(branchIndex));
    return b === null ? null : new Uint8Array(b);
  }

  /** Deletes the sweep's checkpoints. */
  async deleteAll(id: string): Promise<void> {
    await this.redis.del(this.keys.checkpoints(id));
  }
}
