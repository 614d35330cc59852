/**
 * multiplyTables — the operator product A·B of two sparse Pauli sums (or, with the
 * `commutator` flag, [A, B] = AB − BA), accumulated into a new or given table.
 *
 * Formula (pauli-masks.ts): P(xa,za)·P(xb,zb) = i^k P(xa⊕xb, za⊕zb) with
 *   k = |xa∧za| + |xb∧zb| + 2|za∧xb| − |x∧z| (mod 4);
 * for the commutator only anticommuting pairs survive, each as 2·i^k·P (common practice).
 * Cost: |A|·|B| string products of O(W) word operations plus one hash insert each;
 * memory: the output table (at most min(|A|·|B|, 4^N) terms).
 */
import { PauliTable } from './pauli-table.js';

/** i^k as (re, im), k = 0..3. */
const PHASE_RE = [1, 0, -1, 0];
const PHASE_IM = [0, 1, 0, -1];

// Local copy of the SWAR popcount (pauli-masks.ts): a module-local function is inlined in the
// hot loop, an imported binding may not be under every loader.
function pc(v: number): number {
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

/** Options of {@link multiplyTables}. */
export interface MultiplyOptions {
  /** Compute [A, B] = AB − BA instead of AB. @defaultValue false */
  commutator?: boolean;
  /** Accumulate into this table instead of a new one (same word count). */
  into?: PauliTable;
  /** Overall factor (re, im) applied to every product. @defaultValue [1, 0] */
  factor?: readonly [number, number];
}

/**
 * A·B (or [A, B]) as a Pauli table.
 * @throws RangeError if the tables (or `into`) have different word counts.
 */
export function multiplyTables(a: PauliTable, b: PauliTable, options: MultiplyOptions = {}): PauliTable {
  const { commutator = false, into, factor = [1, 0] } = options;
  if (a.words !== b.words) throw new RangeError(`multiplyTables: word counts differ (a: ${a.words}, b: ${b.words})`);
  const W = a.words;
  const stride = 2 * W;
  const out = into ?? new PauliTable(W, Math.min(a.size * b.size, 2 * (a.size + b.size) + 16));
  if (out.words !== W) throw new RangeError(`multiplyTables: into has ${out.words} words, expected ${W}`);
  const scratch = new Uint32Array(stride);
  const ak = a.keys, bk = b.keys;
  const fr = factor[0] * (commutator ? 2 : 1);
  const fi = factor[1] * (commutator ? 2 : 1);

  // |x∧z| of each term of b, reused for every term of a.
  const gb = new Uint8Array(b.size);
  for (let j = 0; j < b.size; j++) {
    let g = 0;
    const base = j * stride;
    for (let w = 0; w < W; w++) g += pc(bk[base + w] & bk[base + W + w]);
    gb[j] = g & 3;
  }

  for (let i = 0; i < a.size; i++) {
    const ar = a.re[i], ai = a.im[i];
    if (ar === 0 && ai === 0) continue;
    const abase = i * stride;
    let ga = 0;
    for (let w = 0; w < W; w++) ga += pc(ak[abase + w] & ak[abase + W + w]);
    // (ar + i·ai)·factor once per term of a.
    const cr = ar * fr - ai * fi;
    const ci = ar * fi + ai * fr;
    for (let j = 0; j < b.size; j++) {
      const br = b.re[j], bi = b.im[j];
      if (br === 0 && bi === 0) continue;
      const bbase = j * stride;
      let cross = 0; // |za∧xb|
      let anti = 0;  // |xa∧zb| + |za∧xb|
      let gr = 0;    // |x∧z| of the product
      for (let w = 0; w < W; w++) {
        const xa = ak[abase + w], za = ak[abase + W + w];
        const xb = bk[bbase + w], zb = bk[bbase + W + w];
        const x = xa ^ xb, z = za ^ zb;
        scratch[w] = x;
        scratch[W + w] = z;
        const c = pc(za & xb);
        cross += c;
        anti += c + pc(xa & zb);
        gr += pc(x & z);
      }
      if (commutator && (anti & 1) === 0) continue;
      const k = (ga + gb[j] + 2 * cross - gr) & 3;
      const pr = PHASE_RE[k], pi = PHASE_IM[k];
      // (cr + i·ci)(br + i·bi)·(pr + i·pi)
      const wr = cr * br - ci * bi;
      const wi = cr * bi + ci * br;
      out.add(scratch, 0, wr * pr - wi * pi, wr * pi + wi * pr);
    }
  }
  return out;
}
