/** Options shared by the Redis stores. */
export interface StoreOptions {
  /** Prefix of every key. @defaultValue 'bsw:' */
  prefix?: string;
  /** Seconds a finished (succeeded, failed or cancelled) sweep is kept; 0 keeps it forever. @defaultValue 604800 (7 days) */
  retentionSeconds?: number;
  /**
   * Approximate cap on entries of one sweep's event stream (MAXLEN ~). The points hash, not the
   * stream, is the record of truth; a reader that resumes from a trimmed id gets what is left
   * and can always fetch the result. @defaultValue 100000
   */
  streamMaxLen?: number;
}

/** Defaults of {@link StoreOptions}. */
export const STORE_DEFAULTS = {
  prefix: 'bsw:',
  retentionSeconds: 7 * 24 * 3600,
  streamMaxLen: 100_000,
} as const;
