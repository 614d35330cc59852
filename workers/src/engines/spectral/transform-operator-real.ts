/**
 * transformOperatorReal — transformOperator for a block with REAL eigenvectors V_J: a Pauli
 * string is real (even number of Y factors: phase i^{popcount(x&z)} = ±1) or imaginary (odd:
 * ±i), so O = O_re + i·O_im with real O_re, O_im, and
 *   Õ = V_Jᵀ·O_re·V_J + i·V_Jᵀ·O_im·V_J
 * takes at most two real products (one when every term has the same kind), written straight
 * into the real and imaginary parts of the packed complex result.
 *
 * Cost: 2·d² per term, then ≈ d³ flops per non-empty part (vs 4·d³ complex). Scratch 2d² doubles.
 */
import { parity, popcount } from '../../kernels/index.js';
import type { BasisPartition } from '../../symmetry/index.js';
import type { MeasuredOperator } from './measurement-plan.js';
import { realTransposeProduct } from './real-transpose-product.js';
import { touchesBlock } from './transform-operator.js';

/**
 * Writes V_Jᵀ·O_JJ·V_J packed complex into `out` (≥ d(d+1) doubles) and returns true, or
 * returns false (out untouched) when O has no entry inside block J. `vectors` is V_J as compact
 * real column-major (d² doubles); `scratch` needs 2d² doubles.
 */
export function transformOperatorReal(
  op: MeasuredOperator, partition: BasisPartition, block: number, vectors: Float64Array,
  scratch: Float64Array, out: Float64Array,
): boolean {
  if (!touchesBlock(op, partition, block)) return false;
  const states = partition.blocks[block];
  const d = states.length;
  const { blockOf, position } = partition;
  const re = scratch.subarray(0, d * d);
  const im = scratch.subarray(d * d, 2 * d * d);
  let hasRe = false;
  let hasIm = false;
  re.fill(0);
  im.fill(0);
  for (const { p, w } of op.terms) {
    const q = popcount(p.x & p.z) & 3;
    const target = (q & 1) === 0 ? re : im;
    const phase = q >= 2 ? -w : w; // i^q = ±1 (q even) or ±i (q odd)
    for (let i = 0; i < d; i++) {
      const s = states[i];
      const t = s ^ p.x;
      if (blockOf[t] !== block) continue;
      if ((q & 1) === 0) hasRe = true; else hasIm = true;
      const f = parity(s & p.z) === 0 ? phase : -phase;
      const row = position[t];
      for (let n = 0; n < d; n++) target[row + n * d] += f * vectors[i + n * d];
    }
  }
  out.fill(0, 0, d * (d + 1));
  if (hasRe) realTransposeProduct(d, d, d, vectors, re, out, 'upper-packed', 2, 0);
  if (hasIm) realTransposeProduct(d, d, d, vectors, im, out, 'upper-packed', 2, 1);
  return true;
}
