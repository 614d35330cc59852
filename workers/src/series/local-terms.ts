/**
 * LocalModel — a Hamiltonian as a list of weighted Pauli strings by site lists, for lattices
 * of any size (the series code never needs a 2^N object).
 *
 * Presets (DESIGN.md §2), ⟨ij⟩ over `graph.bonds`:
 *   ising: H = −J Σ Z_iZ_j − hx Σ X_i − hz Σ Z_i
 *   xxz:   H = J Σ (X_iX_j + Y_iY_j + Δ Z_iZ_j) − hz Σ Z_i
 *   pauli-sum: the listed words; identity words go to `shift`.
 * Repeated strings are merged (first appearance order); exact zeros are dropped, as are merged
 * weights that cancel to within CANCEL_RTOL of the merged magnitudes (as physics/build-hamiltonian).
 * Cost: O(terms · sites per term).
 */
import type { Hamiltonian } from '../../../shared-types/src/index.js';
import type { LatticeGraph } from '../physics/types.js';
import { pauliFactors } from '../physics/pauli-word.js';
import { letterCode } from './pauli-masks.js';

/** Relative cancellation threshold for merged weights. */
export const CANCEL_RTOL = 1e-14;

/** One weighted Pauli string: sites ascending, letter codes (1 = X, 2 = Z, 3 = Y) per site. */
export interface LocalTerm {
  readonly sites: readonly number[];
  readonly codes: readonly number[];
  readonly weight: number;
}

/** H = shift·1 + Σ terms on `sites` sites. */
export interface LocalModel {
  readonly sites: number;
  readonly terms: readonly LocalTerm[];
  /** Weight of the identity (constant energy shift). */
  readonly shift: number;
}

/**
 * Builds the local-term form of a Hamiltonian spec on a lattice graph.
 * @throws RangeError if a pauli-sum word names a site outside the lattice or repeats a site.
 */
export function buildLocalModel(h: Hamiltonian, graph: LatticeGraph): LocalModel {
  const n = graph.sites;
  const acc = new Map<string, { sites: number[]; codes: number[]; weight: number; magnitude: number }>();
  let shift = 0;
  const add = (sites: number[], codes: number[], w: number) => {
    if (w === 0) return;
    const order = sites.map((_, k) => k).sort((a, b) => sites[a] - sites[b]);
    const s = order.map((k) => sites[k]);
    const c = order.map((k) => codes[k]);
    const key = `${s.join(',')}|${c.join('')}`;
    const t = acc.get(key);
    if (t === undefined) acc.set(key, { sites: s, codes: c, weight: w, magnitude: Math.abs(w) });
    else {
      t.weight += w;
      t.magnitude += Math.abs(w);
    }
  };
  switch (h.model) {
    case 'ising':
      for (const [i, j] of graph.bonds) add([i, j], [2, 2], -h.J);
      for (let i = 0; i < n; i++) add([i], [1], -h.hx);
      for (let i = 0; i < n; i++) add([i], [2], -h.hz);
      break;
    case 'xxz':
      for (const [i, j] of graph.bonds) {
        add([i, j], [1, 1], h.J);
        add([i, j], [3, 3], h.J);
        add([i, j], [2, 2], h.J * h.delta);
      }
      for (let i = 0; i < n; i++) add([i], [2], -h.hz);
      break;
    case 'pauli-sum':
      for (const term of h.terms) {
        const factors = pauliFactors(term.word);
        if (factors.length === 0) {
          shift += term.weight;
          continue;
        }
        const seen = new Set<number>();
        for (const f of factors) {
          if (f.site >= n) throw new RangeError(`Pauli word "${term.word}": site ${f.site} is outside the lattice (sites 0..${n - 1})`);
          if (seen.has(f.site)) throw new RangeError(`Pauli word "${term.word}": site ${f.site} appears more than once`);
          seen.add(f.site);
        }
        add(factors.map((f) => f.site), factors.map((f) => letterCode(f.letter)), term.weight);
      }
      break;
    default: {
      const never: never = h;
      throw new TypeError(`buildLocalModel: unknown model ${JSON.stringify(never)}`);
    }
  }
  const terms: LocalTerm[] = [];
  for (const t of acc.values()) {
    if (t.weight !== 0 && Math.abs(t.weight) > CANCEL_RTOL * t.magnitude) terms.push({ sites: t.sites, codes: t.codes, weight: t.weight });
  }
  return { sites: n, terms, shift };
}

/** Largest number of sites any term acts on (0 for an empty model). */
export function maxTermSupport(model: LocalModel): number {
  let r = 0;
  for (const t of model.terms) r = Math.max(r, t.sites.length);
  return r;
}
