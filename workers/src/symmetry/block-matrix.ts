/**
 * blockMatrix — one diagonal block of a group-invariant Pauli sum A = Σ_k w_k·P_k in a
 * symmetry-adapted basis (sector-basis.ts), as a sparse matrix by columns (CSC):
 *   A(q′, q) = ⟨q′|A|q⟩ = Σ_k c_k(r)·χ_σ(g_s)·√(|O_q|/|O_q′|),   s = r ⊕ x_k ∈ O_q′, s = g_s·rep(O_q′)
 * with r the representative of vector q and c_k(r) = w_k·i^{popcount(x&z)}·(−1)^{popcount(r&z)}
 * the amplitude of P_k|r⟩ = c_k(r)·|r ⊕ x_k⟩ (DESIGN.md §2). Derivation: |q⟩ = P_χ|r⟩/‖P_χ|r⟩‖
 * with ‖P_χ|r⟩‖ = |O_q|^{−1/2}; A commutes with the projector P_χ, so
 * ⟨q′|A|q⟩ = |O_q|^{1/2}·⟨q′|A|r⟩ and ⟨q′|s⟩ = χ(g_s)·|O_q′|^{−1/2}. This needs A invariant
 * under the sector's group: Hamiltonians are checked (spatial-group.ts), observables are
 * group-averaged first (symmetrise-terms.ts).
 * Terms are grouped by flip mask x first (as compile-operator.ts does), so the amplitude of
 * ⟨r ⊕ x|A|r⟩ is summed before anything else: X_iX_j + Y_iY_j cancels exactly on |00⟩ and
 * never reaches another magnetisation block. Targets in orbits the sector's character does not
 * admit are dropped (their total contribution is zero after projection). A non-zero amplitude
 * into another block: with `strict` that is an error (a Hamiltonian must not couple blocks);
 * otherwise it belongs to an off-diagonal block of an observable, which never enters
 * Tr(ρ·U†OU) when ρ and U are block-diagonal, and is dropped. Entries from several masks on
 * one (q′, q) are summed; entries summing to exactly 0 are dropped.
 *
 * Cost: O(d·T) for d vectors and T terms, no trigonometry; memory 24 bytes per entry.
 */
import { parity, popcount } from '../kernels/parity.js';
import type { PauliTermMask } from '../physics/types.js';
import type { BasisPartition } from './basis-partition.js';
import type { SectorBasis } from './sector-basis.js';
import { sectorOrbits } from './sector-basis.js';

/** A sparse complex d×d block by columns: entries colStart[j] .. colStart[j+1]−1 of column j. */
export interface SparseBlock {
  readonly size: number;
  readonly colStart: Int32Array;
  readonly row: Int32Array;
  readonly re: Float64Array;
  readonly im: Float64Array;
  /** True when every imaginary part is exactly 0. */
  readonly real: boolean;
}

// i^q for q = 0..3.
const PHASE_RE = [1, 0, -1, 0];
const PHASE_IM = [0, 1, 0, -1];

/**
 * Block `block` of the partition (over the basis vectors) of Σ terms, or null when it has no
 * entry (see the file header).
 * @throws RangeError with `strict` when a term couples the block to another block.
 */
export function blockMatrix(
  basis: SectorBasis, partition: BasisPartition, block: number, terms: readonly PauliTermMask[], strict: boolean,
): SparseBlock | null {
  const vectors = partition.blocks[block];
  const d = vectors.length;
  const { blockOf, position } = partition;
  // Terms sorted by flip mask; group k spans sorted terms gStart[k] .. gStart[k+1]−1.
  const sorted = [...terms].filter((t) => t.weight !== 0).sort((a, b) => a.x - b.x);
  const gx: number[] = [];
  const gStart: number[] = [];
  sorted.forEach((t, k) => {
    if (k === 0 || t.x !== sorted[k - 1].x) {
      gx.push(t.x);
      gStart.push(k);
    }
  });
  gStart.push(sorted.length);
  const tz = Int32Array.from(sorted, (t) => t.z);
  const cr = Float64Array.from(sorted, (t) => t.weight * PHASE_RE[popcount(t.x & t.z) & 3]);
  const ci = Float64Array.from(sorted, (t) => t.weight * PHASE_IM[popcount(t.x & t.z) & 3]);
  const accRe = new Float64Array(d);
  const accIm = new Float64Array(d);
  const mark = new Uint8Array(d);
  const touched = new Int32Array(d);
  const colStart = new Int32Array(d + 1);
  let cap = Math.max(16, 4 * d);
  let row = new Int32Array(cap);
  let re = new Float64Array(cap);
  let im = new Float64Array(cap);
  let nnz = 0;
  let real = true;
  for (let j = 0; j < d; j++) {
    const q = vectors[j];
    const sigma = basis.sectorOf[q];
    const table = sectorOrbits(basis, sigma);
    const map = basis.vectorOf[sigma];
    const chi = basis.sectors[sigma].characters;
    const r = basis.rep[q];
    const size = basis.orbitSize[q];
    let nt = 0;
    for (let k = 0; k < gx.length; k++) {
      let ar = 0;
      let ai = 0;
      for (let t = gStart[k]; t < gStart[k + 1]; t++) {
        if (parity(r & tz[t]) === 0) {
          ar += cr[t];
          ai += ci[t];
        } else {
          ar -= cr[t];
          ai -= ci[t];
        }
      }
      if (ar === 0 && ai === 0) continue;
      const s = r ^ gx[k];
      const q2 = map[table.orbitOf[s]];
      if (q2 < 0) continue;
      if (blockOf[q2] !== block) {
        if (strict) throw new RangeError(`the operator couples basis vectors ${q} and ${q2} across blocks ${block} and ${blockOf[q2]}: the partition is not a symmetry`);
        continue;
      }
      const g = table.elementOf[s];
      const size2 = basis.orbitSize[q2];
      const f = size === size2 ? 1 : Math.sqrt(size / size2);
      const xr = chi[2 * g], xi = chi[2 * g + 1];
      const i2 = position[q2];
      if (mark[i2] === 0) {
        mark[i2] = 1;
        touched[nt++] = i2;
      }
      accRe[i2] += f * (ar * xr - ai * xi);
      accIm[i2] += f * (ar * xi + ai * xr);
    }
    if (nnz + nt > cap) {
      cap = Math.max(2 * cap, nnz + nt);
      row = grow(row, new Int32Array(cap));
      re = grow(re, new Float64Array(cap));
      im = grow(im, new Float64Array(cap));
    }
    touched.subarray(0, nt).sort();
    for (let t = 0; t < nt; t++) {
      const i2 = touched[t];
      if (accRe[i2] !== 0 || accIm[i2] !== 0) {
        row[nnz] = i2;
        re[nnz] = accRe[i2];
        im[nnz] = accIm[i2];
        if (accIm[i2] !== 0) real = false;
        nnz++;
      }
      accRe[i2] = 0;
      accIm[i2] = 0;
      mark[i2] = 0;
    }
    colStart[j + 1] = nnz;
  }
  if (nnz === 0) return null;
  return { size: d, colStart, row: row.slice(0, nnz), re: re.slice(0, nnz), im: im.slice(0, nnz), real };
}

function grow<T extends Int32Array | Float64Array>(from: T, to: T): T {
  to.set(from);
  return to;
}
