/** Every branch reported done but stored records are missing; the sweep fails with this message. */
export class SweepIncompleteError extends Error {
  override readonly name = 'SweepIncompleteError';
}
