/**
 * Bearer tokens. The secret is shown once, at creation; Redis keeps only its SHA-256. A token
 * belongs to an owner (by default its name); every sweep belongs to the owner of the token
 * that submitted it, so tokens of one owner share sweeps.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { Redis } from 'ioredis';
import { storeKeys, type StoreKeys } from './keys.js';
import { STORE_DEFAULTS, type StoreOptions } from './store-options.js';

/** What is stored about a token (never the secret). */
export interface TokenInfo {
  id: string;
  name: string;
  owner: string;
  createdAt: string;
  revokedAt: string | null;
}

/** Token names and owners: short, printable, no spaces (they appear in keys and logs). */
export const TOKEN_NAME_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._@-]{0,63}$/;

/** SHA-256 (hex) of a token secret. */
export function hashToken(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

export class TokenStore {
  private readonly keys: StoreKeys;

  constructor(private readonly redis: Redis, options: Pick<StoreOptions, 'prefix'> = {}) {
    this.keys = storeKeys(options.prefix ?? STORE_DEFAULTS.prefix);
  }

  /**
   * Creates a token and returns its secret (shown once). Throws a RangeError for a malformed
   * name or owner, or when an active token already has this name.
   */
  async create(name: string, owner: string = name): Promise<{ secret: string; info: TokenInfo }> {
    if (!TOKEN_NAME_PATTERN.test(name)) throw new RangeError(`token name '${name}' must match ${TOKEN_NAME_PATTERN}`);
    if (!TOKEN_NAME_PATTERN.test(owner)) throw new RangeError(`owner '${owner}' must match ${TOKEN_NAME_PATTERN}`);
    const id = `tok_${randomBytes(6).toString('hex')}`;
    const secret = `bsw_${randomBytes(32).toString('base64url')}`;
    const sha = hashToken(secret);
    const info: TokenInfo = { id, name, owner, createdAt: new Date().toISOString(), revokedAt: null };
    const claimed = await this.redis.set(this.keys.tokenName(name), id, 'NX');
    if (claimed !== 'OK') throw new RangeError(`an active token named '${name}' exists; revoke it first or pick another name`);
    await this.redis.multi()
      .hset(this.keys.token(id), { id, name, owner, sha, createdAt: info.createdAt, revokedAt: '' })
      // The lookup key carries what a request needs, so verifying is one round trip.
      .hset(this.keys.tokenHash(sha), { id, name, owner })
      .zadd(this.keys.tokens(), Date.now(), id)
      .exec();
    return { secret, info };
  }

  /** The active token for a secret, or null (unknown or revoked). One HGETALL. */
  async verify(secret: string): Promise<Pick<TokenInfo, 'id' | 'name' | 'owner'> | null> {
    const h = await this.redis.hgetall(this.keys.tokenHash(hashToken(secret)));
    return h.id ? { id: h.id, name: h.name, owner: h.owner } : null;
  }

  async get(id: string): Promise<TokenInfo | null> {
    const h = await this.redis.hgetall(this.keys.token(id));
    if (!h.id) return null;
    return { id: h.id, name: h.name, owner: h.owner, createdAt: h.createdAt, revokedAt: h.revokedAt || null };
  }

  /** All tokens (active and revoked), oldest first. */
  async list(): Promise<TokenInfo[]> {
    const ids = await this.redis.zrange(this.keys.tokens(), 0, -1);
    const all = await Promise.all(ids.map((id) => this.get(id)));
    return all.filter((t): t is TokenInfo => t !== null);
  }

  /** Revokes by id or by the name of an active token. Returns the revoked token, or null if none matched. */
  async revoke(idOrName: string): Promise<TokenInfo | null> {
    let id: string | null = idOrName.startsWith('tok_') ? idOrName : null;
    if (!id && TOKEN_NAME_PATTERN.test(idOrName)) id = await this.redis.get(this.keys.tokenName(idOrName));
    if (!id) return null;
    const sha = await this.redis.hget(this.keys.token(id), 'sha');
    const info = await this.get(id);
    if (!info || !sha || info.revokedAt) return null;
    const revokedAt = new Date().toISOString();
    await this.redis.multi()
      .hset(this.keys.token(id), 'revokedAt', revokedAt)
      .del(this.keys.tokenHash(sha))
      .eval(`if redis.call('GET', KEYS[1]) == ARGV[1] then return redis.call('DEL', KEYS[1]) end return 0`, 1, this.keys.tokenName(info.name), id)
      .exec();
    return { ...info, revokedAt };
  }
}
