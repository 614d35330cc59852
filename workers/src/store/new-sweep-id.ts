/** Sweep ids: `sw_` and 16 characters of lowercase base32 (80 random bits). */
import { randomBytes } from 'node:crypto';

const ALPHABET = 'abcdefghijklmnopqrstuvwxyz234567';

/** The form every sweep id has; anything else is rejected before touching the store. */
export const SWEEP_ID_PATTERN = /^sw_[a-z2-7]{16}$/;

/** A new random sweep id. */
export function newSweepId(): string {
  const bytes = randomBytes(10);
  let bits = 0;
  let value = 0;
  let out = 'sw_';
  for (const byte of bytes) {
    value = (value << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      out += ALPHABET[(value >>> (bits - 5)) & 31];
      bits -= 5;
    }
  }
  return out;
}
