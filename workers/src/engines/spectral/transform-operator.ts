/**
 * transformOperator — the block of a Pauli sum O = Σ_k w_k·P_k in an eigenbasis:
 * Õ = V_Jᴴ·O_JJ·V_J, packed upper (column n holds Õ_mn for m ≤ n at 2·(n(n+1)/2 + m); Õ is
 * Hermitian for real w_k).
 *
 * P|s⟩ = φ(s)·|s ⊕ x⟩ with φ(s) = i^{popcount(x&z)}·(−1)^{popcount(s&z)} (DESIGN.md §2), so
 * (P·V)(pos(s ⊕ x), n) = φ(s)·V(pos(s), n) for the states s of block J whose image s ⊕ x is in
 * J too. Images in other blocks belong to off-diagonal blocks of O, which never contribute to
 * Tr(ρU†OU) when ρ and U are block-diagonal, and are dropped. When no term has an entry inside
 * J the block is zero: nothing is computed and the function returns false.
 *
 * Cost: 8·d² per term to accumulate O·V, then complexAdjointProduct packed: ≈ 4·d³ flops.
 * Scratch 2d² doubles.
 */
import { complexAdjointProduct } from '../../linalg/complex-adjoint-product.js';
import { parity, popcount } from '../../kernels/index.js';
import type { BasisPartition } from '../../symmetry/index.js';
import type { MeasuredOperator } from './measurement-plan.js';

// i^q for q = 0..3.
const PHASE_RE = [1, 0, -1, 0];
const PHASE_IM = [0, 1, 0, -1];

/** True when some term of `op` maps a state of block J into J. */
export function touchesBlock(op: MeasuredOperator, partition: BasisPartition, block: number): boolean {
  const states = partition.blocks[block];
  for (const { p } of op.terms) {
    for (let i = 0; i < states.length; i++) if (partition.blockOf[states[i] ^ p.x] === block) return true;
  }
  return false;
}

/**
 * Writes V_Jᴴ·O_JJ·V_J packed into `out` (≥ d(d+1) doubles) and returns true, or returns false
 * (out untouched) when O has no entry inside block J. `vectors` is V_J (2d² doubles,
 * column-major); `scratch` needs 2d² doubles.
 */
export function transformOperator(
  op: MeasuredOperator, partition: BasisPartition, block: number, vectors: Float64Array,
  scratch: Float64Array, out: Float64Array,
): boolean {
  if (!touchesBlock(op, partition, block)) return false;
  const states = partition.blocks[block];
  const d = states.length;
  const { blockOf, position } = partition;
  scratch.fill(0, 0, 2 * d * d);
  for (const { p, w } of op.terms) {
    const q = popcount(p.x & p.z) & 3;
    for (let i = 0; i < d; i++) {
      const s = states[i];
      const t = s ^ p.x;
      if (blockOf[t] !== block) continue;
      const sign = parity(s & p.z) === 0 ? w : -w;
      const fr = sign * PHASE_RE[q];
      const fi = sign * PHASE_IM[q];
      const row = position[t];
      for (let n = 0; n < d; n++) {
        const src = 2 * (i + n * d);
        const dst = 2 * (row + n * d);
        const vr = vectors[src], vi = vectors[src + 1];
        scratch[dst] += fr * vr - fi * vi;
        scratch[dst + 1] += fr * vi + fi * vr;
      }
    }
  }
  complexAdjointProduct(d, d, d, vectors, scratch, out, 'upper-packed');
  return true;
}
