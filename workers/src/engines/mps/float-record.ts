/**
 * FloatWriter / FloatReader — a flat Float64Array record of numbers, number lists and
 * serialised states, written and read in the same order (the checkpoint format of
 * mps-checkpoint.ts). `null` is stored as NaN (only where a value is never NaN otherwise);
 * lists carry their length.
 */
import { deserializeMps, serializeMps, type PurifiedMps } from './purified-mps.js';

/** Appends values; `finish()` returns the record. */
export class FloatWriter {
  readonly #parts: (number[] | Float64Array)[] = [];
  readonly #head: number[] = [];

  /** One number (null as NaN). */
  num(x: number | null): this {
    this.#head.push(x ?? Number.NaN);
    return this;
  }

  /** A list of numbers, preceded by its length. */
  list(xs: readonly number[]): this {
    this.#head.push(xs.length, ...xs);
    return this;
  }

  /** A state (serializeMps). */
  mps(state: PurifiedMps): this {
    this.#flush();
    this.#parts.push(serializeMps(state));
    return this;
  }

  /** The record. */
  finish(): Float64Array {
    this.#flush();
    let n = 0;
    for (const p of this.#parts) n += p.length;
    const out = new Float64Array(n);
    let o = 0;
    for (const p of this.#parts) {
      out.set(p, o);
      o += p.length;
    }
    return out;
  }

  #flush(): void {
    if (this.#head.length > 0) this.#parts.push(this.#head.splice(0));
  }
}

/** Reads what a {@link FloatWriter} wrote, in the same order. */
export class FloatReader {
  #at = 0;

  constructor(readonly data: Float64Array) {}

  /**
   * One number.
   * @throws RangeError past the end of the record.
   */
  num(): number {
    if (this.#at >= this.data.length) throw new RangeError('FloatReader: the record ends early');
    return this.data[this.#at++];
  }

  /** One number, NaN read as null. */
  nullable(): number | null {
    const x = this.num();
    return Number.isNaN(x) ? null : x;
  }

  /**
   * A list written by {@link FloatWriter.list}.
   * @throws RangeError if the length is not a count or the list runs past the end.
   */
  list(): number[] {
    const n = this.num();
    if (!Number.isInteger(n) || n < 0 || this.#at + n > this.data.length) throw new RangeError(`FloatReader: bad list length ${n}`);
    const out = Array.from(this.data.subarray(this.#at, this.#at + n));
    this.#at += n;
    return out;
  }

  /** A state written by {@link FloatWriter.mps}. */
  mps(): PurifiedMps {
    const { mps, next } = deserializeMps(this.data, this.#at);
    this.#at = next;
    return mps;
  }

  /** True when everything was read. */
  get done(): boolean {
    return this.#at === this.data.length;
  }
}
