/**
 * buildQuenchBasis — everything the spectral quench needs per joint symmetry block J, formed
 * once per sweep from the decompositions H0 = ⊕ W·Λ0·Wᴴ (over H0's own blocks, which refine
 * the joint blocks) and H1 = ⊕ V·Λ1·Vᴴ (over the joint blocks), all in one symmetry-adapted
 * basis (symmetry/sector-basis.ts):
 *   mixing X = W_Jᴴ·V_J               rows ↔ H0 eigenpairs inside J, columns ↔ H1 eigenpairs
 *   Õ_k = V_Jᴴ·O_k·V_J (packed)        for every measured operator O_k = Σ w·P of the
 *                                       measurement plan (group-averaged when the basis has
 *                                       spatial symmetry; null: zero block)
 *   H̃1 = V_Jᴴ·H1·V_J (packed)           ≈ Λ1; its off-diagonal part is the residual, so ⟨H1⟩(t)
 *                                       computed from it shows the real drift of the method
 *   G = V_JᴴV_J (packed)                 the identity's image: Tr ρ(t) = ‖ψ(t)‖² (normDrift)
 * W_J is block-diagonal over H0's blocks b ⊂ J, so X is assembled row-block by row-block:
 * X_b = W_bᴴ·V_J[rows of b, :] (a gather of rows when b ≠ J).
 * Real blocks (real W and V, from real symmetric H0 and H1 blocks) keep X real and use real
 * products throughout (transform-operator-real.ts: a quarter of the complex flops).
 * Each block carries the multiplicity of its sector (2 when it also stands for its mirror
 * image, symmetry/group-sectors.ts), by which the quench weights its contributions.
 * Thermal state per β: thermal-overlap(-real).ts; time dependence: phase-rotate.ts.
 *
 * Cost per block of size d: 8·d³ (X) + 4·d³ per operator with a non-zero block + 4·d³ (H̃1)
 * + 8·nnz·d (H1·V), a quarter of the d³ terms for real blocks; memory 16·d² (X; 8·d² real)
 * + 8·d(d+1)/2 per non-zero plane of each packed matrix.
 */
import { complexAdjointProduct } from '../../linalg/complex-adjoint-product.js';
import type { PauliTermMask } from '../../physics/types.js';
import { blockMatrix, blockSector } from '../../symmetry/index.js';
import type { SectorBasis } from '../../symmetry/index.js';
import { applyBlock } from './apply-block.js';
import type { Decomposition } from './decompose-blocks.js';
import type { MeasuredOperator } from './measurement-plan.js';
import { splitPacked } from './packed-planes.js';
import type { PackedPlanes } from './packed-planes.js';
import { realTransposeProduct } from './real-transpose-product.js';
import { transformOperator } from './transform-operator.js';
import { transformOperatorReal } from './transform-operator-real.js';
import { yieldIfDue } from './yield-if-due.js';

/** One joint block of the quench. */
export interface QuenchBlock {
  /** Number of basis vectors d. */
  readonly size: number;
  /** Sectors the block stands for (1, or 2 with its mirror image). */
  readonly multiplicity: number;
  /** H1 eigenvalues of the block (ascending). */
  readonly energies: Float64Array;
  /** X = W_Jᴴ·V_J, column-major complex d×d (complex blocks), or compact real d×d (real blocks). */
  readonly mixing: Float64Array;
  /** True when X, and the eigenvectors it came from, are real (`mixing` is then compact real). */
  readonly real: boolean;
  /** Row k of X ↔ entry rowIndex[k] of the global H0 eigenvalue (and weight) array. */
  readonly rowIndex: Int32Array;
  /** Õ_k per measured operator in packed planes, null when O_k has no entry inside the block. */
  readonly operators: ReadonlyArray<PackedPlanes | null>;
  /** V_Jᴴ·H1·V_J in packed planes. */
  readonly h1: PackedPlanes;
  /** V_JᴴV_J in packed planes. */
  readonly gram: PackedPlanes;
}

/** Inputs of {@link buildQuenchBasis}. */
export interface QuenchBasisInput {
  /** H0 over its own partition (refining the joint one). */
  readonly h0: Decomposition;
  /** Start of each H0 block's eigenvalues in the global H0 eigenvalue array. */
  readonly h0Offsets: Int32Array;
  /** H1 over the joint partition, decomposed with keepGram. */
  readonly h1: Decomposition;
  /** The basis both partitions are over. */
  readonly basis: SectorBasis;
  /** H1's terms (for H1·V). */
  readonly h1Terms: readonly PauliTermMask[];
  /** The operators to measure (measurement-plan.ts). */
  readonly operators: readonly MeasuredOperator[];
  readonly signal?: AbortSignal;
}

/** Builds the quench blocks (see the file header). Rejects with an AbortError when aborted. */
export async function buildQuenchBasis(input: QuenchBasisInput): Promise<QuenchBlock[]> {
  const { h0, h0Offsets, h1, basis, h1Terms, operators, signal } = input;
  const joint = h1.partition;
  const members: number[][] = joint.blocks.map(() => []);
  h0.blocks.forEach((b, k) => members[joint.blockOf[b.states[0]]].push(k));
  const big = h1.largestBlock;
  const gathered = new Float64Array(2 * big * big);
  const partial = new Float64Array(2 * big * big);
  const packed = new Float64Array(big * (big + 1));
  const out: QuenchBlock[] = [];
  for (let J = 0; J < joint.blocks.length; J++) {
    await yieldIfDue(signal);
    const hb = h1.blocks[J];
    const d = hb.states.length;
    const real = hb.realVectors !== null && members[J].every((k) => h0.blocks[k].realVectors !== null);
    // Real blocks work on compact real copies (d² doubles) inside the same scratch buffers.
    const v = real ? hb.realVectors! : hb.vectors;
    const width = real ? 1 : 2; // doubles per entry
    const mixing = new Float64Array(width * d * d);
    const rowIndex = new Int32Array(d);
    let row = 0;
    for (const k of members[J]) {
      const wb = h0.blocks[k];
      const db = wb.states.length;
      let rows: Float64Array = v;
      if (db !== d) {
        // Gather the rows of V_J belonging to b's states.
        for (let n = 0; n < d; n++) {
          for (let i = 0; i < db; i++) {
            const src = width * (joint.position[wb.states[i]] + n * d);
            const dst = width * (i + n * db);
            gathered[dst] = v[src];
            if (!real) gathered[dst + 1] = v[src + 1];
          }
        }
        rows = gathered;
      }
      if (real) realTransposeProduct(db, db, d, wb.realVectors!, rows, partial, 'full');
      else complexAdjointProduct(db, db, d, wb.vectors, rows, partial, 'full');
      for (let n = 0; n < d; n++) {
        mixing.set(partial.subarray(width * n * db, width * (n + 1) * db), width * (row + n * d));
      }
      for (let i = 0; i < db; i++) rowIndex[row + i] = h0Offsets[k] + i;
      row += db;
    }
    if (row !== d) throw new RangeError(`H0's blocks do not tile joint block ${J}: ${row} of ${d} states`);
    const ops: (PackedPlanes | null)[] = [];
    for (const op of operators) {
      await yieldIfDue(signal);
      const block = blockMatrix(basis, joint, J, op.terms, false);
      if (block === null) {
        ops.push(null);
        continue;
      }
      if (real) transformOperatorReal(block, v, partial, packed);
      else transformOperator(block, v, partial, packed);
      ops.push(splitPacked(d, packed));
    }
    // H̃1 = Vᴴ·(H1·V): H1·V by the sparse block product on the complex vectors.
    const h1Block = blockMatrix(basis, joint, J, h1Terms, true);
    if (h1Block === null) partial.fill(0, 0, 2 * d * d);
    else applyBlock(h1Block, hb.vectors, partial, d);
    if (real) {
      for (let k = 0; k < d * d; k++) gathered[k] = partial[2 * k]; // H1 real: imaginary parts are 0
      packed.fill(0, 0, d * (d + 1));
      realTransposeProduct(d, d, d, v, gathered, packed, 'upper-packed', 2, 0);
    } else {
      complexAdjointProduct(d, d, d, v, partial, packed, 'upper-packed');
    }
    const h1Planes = splitPacked(d, packed);
    let gramPacked = hb.gram;
    if (gramPacked === null) {
      complexAdjointProduct(d, d, d, hb.vectors, hb.vectors, packed, 'upper-packed');
      gramPacked = packed;
    }
    const gram = splitPacked(d, gramPacked);
    const multiplicity = blockSector(basis, joint, J).multiplicity;
    out.push({ size: d, multiplicity, energies: hb.values, mixing, real, rowIndex, operators: ops, h1: h1Planes, gram });
  }
  return out;
}
