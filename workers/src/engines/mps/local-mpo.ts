/**
 * localMpo — a sum of one- and nearest-neighbour two-site operators on the purified chain as a
 * matrix-product operator (the finite-state construction of McCulloch, J. Stat. Mech. (2007)
 * P10014 and Crosswhite & Bacon, PRA 78, 012356 (2008)):
 *
 *   W = c·1 + Σ_i o_i + Σ_b Σ_t l_{b,t} ⊗ r_{b,t}   (o_i on site i, l ⊗ r on sites b, b+1),
 *
 * with every local operator a 4×4 matrix on a purified site (physical ⊗ auxiliary). States of
 * the bond left of site k (1 ≤ k ≤ L−1): 0 = nothing placed yet, 1..T = the left half of term t
 * of bond k−1 placed, T+1 = done; the outer bonds have the single states "nothing yet" (k = 0)
 * and "done" (k = L). Site i carries the entries
 *   before → before: 1,  before → pending t: l_{i,t},  pending t → done: r_{i−1,t},
 *   before → done: o_i (+ c on site 0),  done → done: 1.
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
 * @throws RangeError if a term is not on one site or two neighbouring sites.
 */
export function localMpo(terms: readonly ChainTerm[], sites: number, copies: readonly LegCopy[], shift = 0): LocalMpo {
  const single: (Float64Array | null)[] = Array.from({ length: sites }, () => null);
  const pairs: Array<Array<[Float64Array, Float64Array]>> = Array.from({ length: Math.max(sites - 1, 0) }, () => []);
  let constant = shift;
  const lift = (letter: 'X' | 'Y' | 'Z', c: LegCopy) => {
    const p = pauliMatrix(letter);
    return liftToSite(c.transposed ? transpose(2, p) : p, c.leg);
  };
  for (const c of copies) {
    for (const t of terms) {
      const w = c.sign * t.weight;
      if (t.factors.length === 0) {
        constant += w;
      } else if (t.factors.length === 1) {
        const i = t.factors[0].site;
        const op = lift(t.factors[0].letter, c);
        const acc = single[i] ?? new Float64Array(32);
        for (let k = 0; k < 32; k++) acc[k] += w * op[k];
        single[i] = acc;
      } else if (t.factors.length === 2 && t.factors[1].site === t.factors[0].site + 1) {
        const l = lift(t.factors[0].letter, c);
        for (let k = 0; k < 32; k++) l[k] *= w;
        pairs[t.factors[0].site].push([l, lift(t.factors[1].letter, c)]);
      } else {
        throw new RangeError(`localMpo: the term "${wordOf(t.factors)}" is not on one site or two neighbouring sites`);
      }
    }
  }
  if (constant !== 0) {
    const id = identityMatrix(4);
    const acc = single[0] ?? new Float64Array(32);
    for (let k = 0; k < 32; k++) acc[k] += constant * id[k];
    single[0] = acc;
  }
  const dims = [1];
  for (let k = 1; k < sites; k++) dims.push(pairs[k - 1].length + 2);
  dims.push(1);
  const done = (k: number) => (k === sites ? 0 : dims[k] - 1);
  const id = identityMatrix(4);
  const entries: MpoEntry[][] = [];
  for (let i = 0; i < sites; i++) {
    const e: MpoEntry[] = [];
    const rightInternal = i + 1 < sites;
    if (rightInternal) {
      e.push({ from: 0, to: 0, op: id });
      pairs[i].forEach(([l], t) => e.push({ from: 0, to: 1 + t, op: l }));
    }
    if (i > 0) {
      pairs[i - 1].forEach(([, r], t) => e.push({ from: 1 + t, to: done(i + 1), op: r }));
      e.push({ from: done(i), to: done(i + 1), op: id });
    }
    const o = single[i];
    if (o !== null) e.push({ from: 0, to: done(i + 1), op: o });
    entries.push(e);
  }
  return { sites, dims, entries };
}
