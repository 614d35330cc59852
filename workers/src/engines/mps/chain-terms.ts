/**
 * chainTerms — a Hamiltonian spec as merged, weighted Pauli strings with explicit site factors,
 * on lattices of any size (the two-mask PauliSum of physics/build-hamiltonian.ts stops at 30
 * sites). Same presets and merging rule as buildHamiltonian (DESIGN.md §2):
 *   ising: H = −J Σ⟨ij⟩ Z_i Z_j − hx Σ_i X_i − hz Σ_i Z_i
 *   xxz:   H = J Σ⟨ij⟩ (X_i X_j + Y_i Y_j + Δ Z_i Z_j) − hz Σ_i Z_i
 *   pauli-sum: the listed words ("" is a constant).
 * Repeated strings merge in first-appearance order; a merged weight is dropped when it is 0 or
 * cancels below CANCEL_RTOL of the magnitudes merged into it.
 * (The free-fermion engine keeps an equivalent list; the two could move to the physics layer.)
 */
import type { Hamiltonian } from '../../../../shared-types/src/index.js';
import { CANCEL_RTOL } from '../../physics/build-hamiltonian.js';
import { pauliFactors, type PauliFactor } from '../../physics/pauli-word.js';
import type { LatticeGraph } from '../../physics/types.js';

/** One weighted Pauli string, factors ascending by site (empty: a constant). */
export interface ChainTerm {
  readonly weight: number;
  readonly factors: readonly PauliFactor[];
}

/** Canonical word of sorted factors, e.g. "X0 Z3". */
export function wordOf(factors: readonly PauliFactor[]): string {
  return factors.map((f) => `${f.letter}${f.site}`).join(' ');
}

/**
 * The merged terms of `h` on `graph` (see the file header).
 * @throws RangeError if a pauli-sum word names a site outside the lattice or repeats a site;
 *   TypeError if a word is malformed.
 */
export function chainTerms(h: Hamiltonian, graph: LatticeGraph): ChainTerm[] {
  const n = graph.sites;
  const acc = new Map<string, { factors: PauliFactor[]; weight: number; magnitude: number }>();
  const add = (factors: PauliFactor[], w: number) => {
    if (w === 0) return;
    const sorted = [...factors].sort((p, q) => p.site - q.site);
    for (let k = 0; k < sorted.length; k++) {
      const s = sorted[k].site;
      if (s >= n) throw new RangeError(`chainTerms: site ${s} is outside the lattice (sites 0..${n - 1})`);
      if (k > 0 && sorted[k - 1].site === s) throw new RangeError(`chainTerms: site ${s} appears more than once in "${wordOf(sorted)}"`);
    }
    const word = wordOf(sorted);
    const t = acc.get(word);
    if (t === undefined) acc.set(word, { factors: sorted, weight: w, magnitude: Math.abs(w) });
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
      for (const term of h.terms) add(pauliFactors(term.word), term.weight);
      break;
    default: {
      const never: never = h;
      throw new TypeError(`chainTerms: unknown model ${JSON.stringify(never)}`);
    }
  }
  const out: ChainTerm[] = [];
  for (const t of acc.values()) {
    if (t.weight !== 0 && Math.abs(t.weight) > CANCEL_RTOL * t.magnitude) out.push({ weight: t.weight, factors: t.factors });
  }
  return out;
}
