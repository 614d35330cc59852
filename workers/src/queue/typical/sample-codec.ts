/**
 * The stored form of one random sample of a branch: its records at every β of the branch
 * (typical-samples.ts), as little-endian doubles. Exact: every field is a double (indices and
 * counts are small integers), so decoding gives back the very numbers the sample computed and
 * a merge of stored samples estimates bit for bit what the local run estimates.
 *
 * Layout (doubles): [FORMAT, sample, records m, times nt, primitives np], then per record
 *   betaIndex, lnWeight, energy, energyVariance, thermalError, h1Drift, normDrift, matvecs,
 *   stateErrors[nt], primitives[nt·np]
 * Size: 8·(5 + m·(8 + nt + nt·np)) bytes (4 × 4 lattice, 100 times, 64 primitives: 52 kB per β).
 */
import type { TypicalSampleRecord } from '../../engines/typical/index.js';

/** Format tag of the encoding (first double). */
export const SAMPLE_FORMAT = 1;
const HEAD = 5;
const FIXED = 8;

/** The shape every record of a sweep shares. */
export interface SampleShape {
  readonly times: number;
  readonly primitives: number;
}

/**
 * Encodes one sample's records (all of the same sample index, each of `shape`).
 * @throws RangeError when the records are empty, of several samples, or of another shape.
 */
export function encodeSample(records: readonly TypicalSampleRecord[], shape: SampleShape): Buffer {
  const { times: nt, primitives: np } = shape;
  if (records.length === 0) throw new RangeError('a sample needs at least one record');
  const sample = records[0].sample;
  const stride = FIXED + nt + nt * np;
  const out = new Float64Array(HEAD + records.length * stride);
  out.set([SAMPLE_FORMAT, sample, records.length, nt, np]);
  records.forEach((r, i) => {
    if (r.sample !== sample) throw new RangeError(`records[${i}] belongs to sample ${r.sample}, records[0] to ${sample}`);
    if (r.stateErrors.length !== nt || r.primitives.length !== nt * np) {
      throw new RangeError(`records[${i}] holds ${r.stateErrors.length} times × ${r.primitives.length} values; the shape is ${nt} × ${nt * np}`);
    }
    const o = HEAD + i * stride;
    out.set([r.betaIndex, r.lnWeight, r.energy, r.energyVariance, r.thermalError, r.h1Drift, r.normDrift, r.matvecs], o);
    out.set(r.stateErrors, o + FIXED);
    out.set(r.primitives, o + FIXED + nt);
  });
  return Buffer.from(out.buffer, out.byteOffset, out.byteLength);
}

/**
 * Decodes what {@link encodeSample} wrote. The bytes are copied first (a Buffer from Redis
 * need not be 8-byte aligned).
 * @throws RangeError when the bytes are not a sample of this shape (format, length, header).
 */
export function decodeSample(bytes: Uint8Array, shape: SampleShape): TypicalSampleRecord[] {
  const { times: nt, primitives: np } = shape;
  if (bytes.byteLength % 8 !== 0 || bytes.byteLength < 8 * HEAD) throw new RangeError(`a stored sample has a length of whole doubles ≥ ${8 * HEAD} bytes; got ${bytes.byteLength}`);
  const f = new Float64Array(bytes.byteLength / 8);
  new Uint8Array(f.buffer).set(bytes);
  const [format, sample, m, times, prims] = f;
  if (format !== SAMPLE_FORMAT) throw new RangeError(`stored sample format ${format}; this build reads ${SAMPLE_FORMAT}`);
  if (times !== nt || prims !== np) throw new RangeError(`stored sample holds ${times} times × ${prims} primitives; the spec needs ${nt} × ${np}`);
  const stride = FIXED + nt + nt * np;
  if (!Number.isInteger(m) || m < 1 || f.length !== HEAD + m * stride) throw new RangeError(`stored sample of ${f.length} doubles does not hold ${m} records of ${stride}`);
  const records: TypicalSampleRecord[] = [];
  for (let i = 0; i < m; i++) {
    const o = HEAD + i * stride;
    records.push({
      sample,
      betaIndex: f[o],
      lnWeight: f[o + 1],
      energy: f[o + 2],
      energyVariance: f[o + 3],
      thermalError: f[o + 4],
      h1Drift: f[o + 5],
      normDrift: f[o + 6],
      matvecs: f[o + 7],
      stateErrors: f.slice(o + FIXED, o + FIXED + nt),
      primitives: f.slice(o + FIXED + nt, o + stride),
    });
  }
  return records;
}
