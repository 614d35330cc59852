/**
 * siteTerms — a Hamiltonian spec as a merged list of weighted Pauli strings with explicit site
 * factors, for lattices of ANY size (the two-mask PauliSum of physics/build-hamiltonian.ts stops
 * at 30 sites). Same presets and merging rule as buildHamiltonian (DESIGN.md §2):
 * - ising: H = −J Σ⟨ij⟩ Z_i Z_j − hx Σ_i X_i − hz Σ_i Z_i
 * - xxz:   H = J Σ⟨ij⟩ (X_i X_j + Y_i Y_j + Δ Z_i Z_j) − hz Σ_i Z_i
 * - pauli-sum: the listed words ("" is a constant).
 * Repeated strings merge in first-appearance order; a merged weight is dropped when it is 0 or
 * cancels below CANCEL_RTOL of the magnitudes merged into it. Used by the engines that work on
 * lattices beyond the mask form (free-fermion, mps).
 */
import type { Hamiltonian } from '../../../shared-types/src/index.js';
import { CANCEL_RTOL } from './build-hamiltonian.js';
import { pauliFactors, type PauliFactor } from './pauli-word.js';
import type { LatticeGraph } from './types.js';

/** One weighted Pauli string with its factors sorted by site. */
export interface SiteTerm {
  readonly weight: number;
  /** Factors in ascending site order (empty: the identity). */
  readonly factors: readonly PauliFactor[];
  /** Canonical word, e.g. "X0 Z3" ("" for the identity). */
  readonly word: string;
}

/** Canonical word of sorted factors. */
export function factorsWord(factors: readonly PauliFactor[]): string {
  return factors.map((f) => `${f.letter}${f.site}`).join(' ');
}

/**
 * Sorted factors of a Pauli string on `sites` sites.
 * @throws RangeError naming the word if a site is outside the lattice or repeated.
 */
export function sortedFactors(factors: readonly PauliFactor[], sites: number, what: string): PauliFactor[] {
  const out = [...factors].sort((p, q) => p.site - q.site);
  for (let k = 0; k < out.length; k++) {
    const s = out[k].site;
    if (s >= sites) throw new RangeError(`${what}: site ${s} is outside the lattice (sites 0..${sites - 1})`);
    if (k > 0 && out[k - 1].site === s) throw new RangeError(`${what}: site ${s} appears more than once`);
  }
  return out;
}

/**
 * The merged terms of `h` on `graph` (see the file header).
 * @throws RangeError if a pauli-sum word names a site outside the lattice or repeats a site;
 *   TypeError if a word is malformed.
 */
export function siteTerms(h: Hamiltonian, graph: LatticeGraph): SiteTerm[] {
  const n = graph.sites;
  const acc = new Map<string, { factors: PauliFactor[]; weight: number; magnitude: number }>();
  const add = (unsorted: PauliFactor[], w: number) => {
    if (w === 0) return;
    const factors = unsorted.length > 1 && unsorted[0].site > unsorted[1].site ? [...unsorted].sort((p, q) => p.site - q.site) : unsorted;
    const word = factorsWord(factors);
    const t = acc.get(word);
    if (t === undefined) acc.set(word, { factors, weight: w, magnitude: Math.abs(w) });
    else {
      t.weight += w;
      t.magnitude += Math.abs(w);
    }
  };
  switch (h.model) {
    case 'ising':
      for (const [i, j] of graph.bonds) add([{ letter: 'Z', site: i }, { letter: 'Z', site: j }], -h.J);
      for (let i = 0; i < n; i++) add([{ letter: 'X', site: i }], -h.hx);
      for (let i = 0; i < n; i++) add([{ letter: 'Z', site: i }], -h.hz);
      break;
    case 'xxz':
      for (const [i, j] of graph.bonds) {
        add([{ letter: 'X', site: i }, { letter: 'X', site: j }], h.J);
        add([{ letter: 'Y', site: i }, { letter: 'Y', site: j }], h.J);
        add([{ letter: 'Z', site: i }, { letter: 'Z', site: j }], h.J * h.delta);
      }
      for (let i = 0; i < n; i++) add([{ letter: 'Z', site: i }], -h.hz);
      break;
    case 'pauli-sum':
      for (const term of h.terms) add(sortedFactors(pauliFactors(term.word), n, `Pauli word "${term.word}"`), term.weight);
      break;
    default: {
      const never: never = h;
      throw new TypeError(`siteTerms: unknown model ${JSON.stringify(never)}`);
    }
  }
  const out: SiteTerm[] = [];
  for (const [word, t] of acc) {
    if (t.weight !== 0 && Math.abs(t.weight) > CANCEL_RTOL * t.magnitude) out.push({ weight: t.weight, factors: t.factors, word });
  }
  return out;
}
