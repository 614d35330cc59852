/**
 * localMpo — a sum of one- and two-site operators on the purified chain as a matrix-product
 * operator (the finite-state construction of McCulloch, J. Stat. Mech. (2007) P10014 and
 * Crosswhite & Bacon, PRA 78, 012356 (2008)):
 *
 *   W = c·1 + Σ_i o_i + Σ_t l_t ⊗ r_t   (o_i on site i, l_t on site a_t, r_t on site c_t > a_t),
 *
 * with every local operator a 4×4 matrix on a purified site (physical ⊗ auxiliary). States of
 * the bond k between sites k−1 and k (1 ≤ k ≤ L−1): 0 = nothing placed yet, 1..T_k = the left
 * half of the k-th term crossing the bond (a_t < k ≤ c_t) placed, T_k + 1 = done; the outer
 * bonds have the single states "nothing yet" (k = 0) and "done" (k = L). Site i carries
 *   before → before: 1,  before → pending t: l_t (a_t = i),  pending t → pending t: 1
 *   (a_t < i < c_t),  pending t → done: r_t (c_t = i),  before → done: o_i (+ c on site 0),
 *   done → done: 1.
 * A term spanning r chain steps adds one state to each of the r bonds it crosses.
 * The physical Hamiltonian H ⊗ 1 uses the 'physical' leg; the quench generator
 * K = H ⊗ 1 − 1 ⊗ Hᵀ adds the 'auxiliary' leg with sign −1 and transposed factors.
 */
import { wordOf, type ChainTerm } from './chain-terms.js';
import { identityMatrix, liftToSite, pauliMatrix, transpose } from './local-operators.js';

/** One MPO entry of a site: from state `from` (left bond) to state `to` (right bond). */
export interface MpoEntry {
  readonly from: number;
  readonly to: number;
  /** 4×4 complex operator on the purified site. */
  readonly op: Float64Array;
}

/** An MPO on a purified chain. */
export interface LocalMpo {
  readonly sites: number;
  /** Bond dimensions, length sites + 1 (1 at both ends). */
  readonly dims: readonly number[];
  /** Entries of each site. */
  readonly entries: readonly (readonly MpoEntry[])[];
}

/** One copy of the terms: on which leg, with which sign, transposed or not. */
export interface LegCopy {
  readonly leg: 'physical' | 'auxiliary';
  readonly sign: number;
  readonly transposed: boolean;
}

/**
 * The MPO of Σ_copies sign·(terms on leg) + shift·1 (see the file header); constant terms count
 * once per copy with their sign.
 * @throws RangeError if a term acts on more than two sites or outside the chain.
 */
export function localMpo(terms: readonly ChainTerm[], sites: number, copies: readonly LegCopy[], shift = 0): LocalMpo {
  const single: (Float64Array | null)[] = Array.from({ length: sites }, () => null);
  const pairs: Array<{ a: number; c: number; l: Float64Array; r: Float64Array }> = [];
  let constant = shift;
  const lift = (letter: 'X' | 'Y' | 'Z', c: LegCopy) => {
    const p = pauliMatrix(letter);
    return liftToSite(c.transposed ? transpose(2, p) : p, c.leg);
  };
  for (const c of copies) {
    for (const t of terms) {
      const w = c.sign * t.weight;
      if (t.factors.some((f) => f.site < 0 || f.site >= sites)) throw new RangeError(`localMpo: the term "${wordOf(t.factors)}" is outside the chain of ${sites}`);
      if (t.factors.length === 0) {
        constant += w;
      } else if (t.factors.length === 1) {
        const i = t.factors[0].site;
        const op = lift(t.factors[0].letter, c);
        const acc = single[i] ?? new Float64Array(32);
        for (let k = 0; k < 32; k++) acc[k] += w * op[k];
        single[i] = acc;
      } else if (t.factors.length === 2 && t.factors[1].site > t.factors[0].site) {
        const l = lift(t.factors[0].letter, c);
        for (let k = 0; k < 32; k++) l[k] *= w;
        pairs.push({ a: t.factors[0].site, c: t.factors[1].site, l, r: lift(t.factors[1].letter, c) });
      } else {
        throw new RangeError(`localMpo: the term "${wordOf(t.factors)}" is not on one or two sites`);
      }
    }
  }
  if (constant !== 0) {
    const id = identityMatrix(4);
    const acc = single[0] ?? new Float64Array(32);
    for (let k = 0; k < 32; k++) acc[k] += constant * id[k];
    single[0] = acc;
  }
  // pending[k].get(t): state of term t on bond k (1-based), for a_t < k ≤ c_t.
  const pending: Map<number, number>[] = Array.from({ length: sites + 1 }, () => new Map());
  pairs.forEach((p, t) => {
    for (let k = p.a + 1; k <= p.c; k++) pending[k].set(t, pending[k].size + 1);
  });
  const dims = [1];
  for (let k = 1; k < sites; k++) dims.push(pending[k].size + 2);
  dims.push(1);
  const done = (k: number) => (k === sites ? 0 : dims[k] - 1);
  const id = identityMatrix(4);
  const entries: MpoEntry[][] = [];
  for (let i = 0; i < sites; i++) {
    const e: MpoEntry[] = [];
    if (i + 1 < sites) e.push({ from: 0, to: 0, op: id });
    pairs.forEach((p, t) => {
      if (p.a === i) e.push({ from: 0, to: pending[i + 1].get(t)!, op: p.l });
      else if (p.a < i && i < p.c) e.push({ from: pending[i].get(t)!, to: pending[i + 1].get(t)!, op: id });
      else if (p.c === i) e.push({ from: pending[i].get(t)!, to: done(i + 1), op: p.r });
    });
    if (i > 0) e.push({ from: done(i), to: done(i + 1), op: id });
    const o = single[i];
    if (o !== null) e.push({ from: 0, to: done(i + 1), op: o });
    entries.push(e);
  }
  return { sites, dims, entries };
}
