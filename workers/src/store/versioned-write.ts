/**
 * The record-version rule of the in-memory store, the same as the Redis script's
 * (lua/scripts.ts WRITE_RECORDS): version 0 is write-once; a version v > 0 replaces a stored
 * record of a lower version, never a version-0 record, and is ignored otherwise.
 */

/** What a write did: stored a key that was absent, replaced an older version, or nothing. */
export type VersionedOutcome = 'fresh' | 'replaced' | null;

/**
 * Applies one write to `map` (values) and `versions` (by `versionKey`); see the file header.
 */
export function writeVersioned<K>(
  map: Map<K, string>, versions: Map<string, number>, key: K, versionKey: string, json: string, version = 0,
): VersionedOutcome {
  const exists = map.has(key);
  if (version === 0) {
    if (exists) return null;
    map.set(key, json);
    return 'fresh';
  }
  const old = versions.get(versionKey);
  if (old === undefined ? exists : old >= version) return null;
  map.set(key, json);
  versions.set(versionKey, version);
  return exists ? 'replaced' : 'fresh';
}
