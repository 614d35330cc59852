/**
 * sectorModes — the Schur forms of H0 and H1 on each parity sector (one sector when neither
 * Hamiltonian depends on it), the basis change W = O1ᵀ·O0 between them, and the health figures
 * of the decompositions.
 *
 * Per sector p: A0_p = O0(⊕ε⁰J)O0ᵀ and A1_p = O1(⊕ε¹J)O1ᵀ (skew-schur.ts). Decompositions are
 * shared when the matrices coincide (H1 = H0 on the sector: W = 1, stored as null; or a
 * sector-independent Hamiltonian: the same O on both sectors).
 * Health (used for error estimates; see free-fermion-engine.ts):
 *   residual = max_m,j |(A·O − O·Λ)_mj| / max(1, ‖A‖_∞)   (exact, from the sparse A),
 *   defect   = estimate of ‖OᵀO − 1‖₂ (linalg/orthogonality-defect.ts).
 * Chiral (bipartite) models — every Majorana coupling joins an even index (a_j) to an odd one
 * (b_l), as for the transverse-field chain and ZZ + YY + X chains — have O with exact zeros in
 * the (even row, odd column) and (odd row, even column) places: both the Householder reflectors
 * and the SVD keep the two index classes apart. Then O = U ⊕ V (U[j][k] = O[2j][2k],
 * V[j][k] = O[2j+1][2k+1]) and W = (U1ᵀU0) ⊕ (V1ᵀV0): two L × L products instead of one n × n.
 * Cost: one skewSchur per distinct matrix, 2n³ flops for W (n³/4 when chiral), O(nnz·n) for the
 * residuals. Memory: n² doubles per distinct O, plus n² for W per sector with H1 ≠ H0 (n²/2 when chiral).
 */
import { gemmUnchecked } from '../../linalg/gemm.js';
import { orthogonalityDefect } from '../../linalg/orthogonality-defect.js';
import { skewSchur, type SkewSchur } from '../../linalg/skew-schur.js';
import {
  denseLowerTriangle, sectorForm, type MajoranaEntry, type MajoranaHamiltonian,
} from './majorana-hamiltonian.js';

/** A Schur form with its health figures. */
export interface CheckedSchur {
  readonly schur: SkewSchur;
  /** Relative residual max|AO − OΛ| / max(1, ‖A‖_∞). */
  readonly residual: number;
  /** Estimate of ‖OᵀO − 1‖₂. */
  readonly defect: number;
  /** ‖A‖_∞ (largest absolute row sum). */
  readonly norm: number;
  /** U and V (L × L row-major) when O is exactly chiral, else null. */
  readonly chiral: { readonly u: Float64Array; readonly v: Float64Array } | null;
}

/** Everything the dynamics needs on one sector. */
export interface SectorModes {
  /** Parity p of the sector (+1 also for "no sectors"). */
  readonly p: 1 | -1;
  readonly h0: CheckedSchur;
  readonly h1: CheckedSchur;
  /** Constant of H0 on this sector. */
  readonly constant0: number;
  /** W = O1ᵀ·O0 (n × n row-major); null when h1 and h0 share one decomposition (W = 1) or W is chiral. */
  readonly w: Float64Array | null;
  /** W = Wu ⊕ Wv (L × L each: U1ᵀU0, V1ᵀV0) when both forms are chiral and differ, else null. */
  readonly wChiral: { readonly wu: Float64Array; readonly wv: Float64Array } | null;
}

function sameEntries(a: readonly MajoranaEntry[], b: readonly MajoranaEntry[]): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) {
    if (a[k].m !== b[k].m || a[k].n !== b[k].n || a[k].value !== b[k].value) return false;
  }
  return true;
}

/** max |(A·O − O·Λ)_mj| and ‖A‖_∞ from the sparse entries of A. */
export function schurResidual(entries: readonly MajoranaEntry[], schur: SkewSchur): { residual: number; norm: number } {
  const { n, o, eps } = schur;
  const rows: Array<Array<[number, number]>> = Array.from({ length: n }, () => []);
  const rowSum = new Float64Array(n);
  for (const e of entries) {
    rows[e.m].push([e.n, e.value]);
    rows[e.n].push([e.m, -e.value]);
    rowSum[e.m] += Math.abs(e.value);
    rowSum[e.n] += Math.abs(e.value);
  }
  const acc = new Float64Array(n);
  let residual = 0;
  for (let m = 0; m < n; m++) {
    acc.fill(0);
    for (const [l, v] of rows[m]) {
      const ol = l * n;
      for (let j = 0; j < n; j++) acc[j] += v * o[ol + j];
    }
    const om = m * n;
    for (let k = 0; k < n / 2; k++) {
      // (OΛ)[m, 2k] = −ε_k O[m, 2k+1];  (OΛ)[m, 2k+1] = ε_k O[m, 2k].
      residual = Math.max(residual,
        Math.abs(acc[2 * k] + eps[k] * o[om + 2 * k + 1]),
        Math.abs(acc[2 * k + 1] - eps[k] * o[om + 2 * k]));
    }
  }
  let norm = 0;
  for (const s of rowSum) norm = Math.max(norm, s);
  return { residual, norm };
}

/** U, V of an exactly chiral O (zeros wherever row and column parities differ), else null. */
export function chiralBlocks(schur: SkewSchur): { u: Float64Array; v: Float64Array } | null {
  const { n, o } = schur;
  const m = n / 2;
  for (let r = 0; r < n; r++) {
    const row = r * n;
    for (let c = 1 - (r % 2); c < n; c += 2) if (o[row + c] !== 0) return null;
  }
  const u = new Float64Array(m * m);
  const v = new Float64Array(m * m);
  for (let j = 0; j < m; j++) {
    for (let k = 0; k < m; k++) {
      u[j * m + k] = o[2 * j * n + 2 * k];
      v[j * m + k] = o[(2 * j + 1) * n + 2 * k + 1];
    }
  }
  return { u, v };
}

function decompose(entries: readonly MajoranaEntry[], n: number): CheckedSchur {
  const a = new Float64Array(n * n);
  denseLowerTriangle(entries, n, a);
  const schur = skewSchur(n, a);
  const { residual, norm } = schurResidual(entries, schur);
  return {
    schur, residual: residual / Math.max(1, norm), defect: orthogonalityDefect(n, schur.o), norm,
    chiral: chiralBlocks(schur),
  };
}

/**
 * Decomposes H0 and H1 per sector: two sectors (p = +1, −1) when either depends on the parity,
 * else one (p = +1).
 */
export function sectorModes(h0: MajoranaHamiltonian, h1: MajoranaHamiltonian): SectorModes[] {
  if (h0.sites !== h1.sites) throw new RangeError(`sectorModes: H0 has ${h0.sites} sites, H1 has ${h1.sites}`);
  const n = 2 * h0.sites;
  const parities: Array<1 | -1> = h0.sectorDependent || h1.sectorDependent ? [1, -1] : [1];
  const cache: Array<{ entries: readonly MajoranaEntry[]; checked: CheckedSchur }> = [];
  const get = (entries: readonly MajoranaEntry[]) => {
    for (const c of cache) if (sameEntries(c.entries, entries)) return c.checked;
    const checked = decompose(entries, n);
    cache.push({ entries, checked });
    return checked;
  };
  return parities.map((p) => {
    const f0 = sectorForm(h0, p);
    const f1 = sectorForm(h1, p);
    const d0 = get(f0.entries);
    const d1 = get(f1.entries);
    let w: Float64Array | null = null;
    let wChiral: SectorModes['wChiral'] = null;
    if (d0 !== d1 && d0.chiral !== null && d1.chiral !== null) {
      const m = n / 2;
      const wu = new Float64Array(m * m);
      const wv = new Float64Array(m * m);
      gemmUnchecked(true, false, m, m, m, 1, d1.chiral.u, m, d0.chiral.u, m, 0, wu, m);
      gemmUnchecked(true, false, m, m, m, 1, d1.chiral.v, m, d0.chiral.v, m, 0, wv, m);
      wChiral = { wu, wv };
    } else if (d0 !== d1) {
      w = new Float64Array(n * n);
      gemmUnchecked(true, false, n, n, n, 1, d1.schur.o, n, d0.schur.o, n, 0, w, n);
    }
    return { p, h0: d0, h1: d1, constant0: f0.constant, w, wChiral };
  });
}
