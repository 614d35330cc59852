/**
 * Builds the two-mask {@link PauliSum} of a Hamiltonian spec on a built lattice.
 *
 * Presets (DESIGN.md §2):
 * - ising: H = −J Σ⟨ij⟩ Z_i Z_j − hx Σ_i X_i − hz Σ_i Z_i
 * - xxz:   H = J Σ⟨ij⟩ (X_i X_j + Y_i Y_j + Δ Z_i Z_j) − hz Σ_i Z_i
 * - pauli-sum: the listed weighted words (an identity word "" is kept as a constant shift).
 * ⟨ij⟩ runs over `graph.bonds` (nearest neighbours, each once).
 *
 * Repeated strings are merged in first-appearance order. A merged weight is dropped when it is
 * exactly zero or cancels to within {@link CANCEL_RTOL} of the magnitudes merged into it
 * (0.1 + 0.2 − 0.3 leaves 5.6e−17, which is rounding, not physics).
 */
import type { Hamiltonian } from '../../../shared-types/src/index.js';
import type { LatticeGraph, PauliSum, PauliString, PauliTermMask } from './types.js';
import { MAX_MASK_SITE, parsePauliWord } from './pauli-word.js';
import { pauliKey } from './pauli-algebra.js';

/** Relative cancellation threshold for merged weights (a few ulps of the summed magnitudes). */
export const CANCEL_RTOL = 1e-14;

/** Most sites the two-mask form can hold. */
export const MAX_MASK_SITES = MAX_MASK_SITE + 1;

/**
 * Builds H as a real-weighted Pauli sum on `graph.sites` sites.
 * @throws RangeError if graph.sites > 30 (the mask form's limit), or a pauli-sum word names a
 *   site outside the lattice or repeats a site.
 */
export function buildHamiltonian(h: Hamiltonian, graph: LatticeGraph): PauliSum {
  const n = graph.sites;
  if (n > MAX_MASK_SITES) {
    throw new RangeError(`buildHamiltonian: ${n} sites exceeds the mask form's limit of ${MAX_MASK_SITES} sites`);
  }
  const acc = new Map<bigint, { x: number; z: number; weight: number; magnitude: number }>();
  const add = (p: PauliString, w: number) => {
    if (w === 0) return;
    const key = pauliKey(p);
    const t = acc.get(key);
    if (t === undefined) acc.set(key, { x: p.x, z: p.z, weight: w, magnitude: Math.abs(w) });
    else {
      t.weight += w;
      t.magnitude += Math.abs(w);
    }
  };

  switch (h.model) {
    case 'ising':
      for (const [i, j] of graph.bonds) add({ x: 0, z: (1 << i) | (1 << j) }, -h.J);
      for (let i = 0; i < n; i++) add({ x: 1 << i, z: 0 }, -h.hx);
      for (let i = 0; i < n; i++) add({ x: 0, z: 1 << i }, -h.hz);
      break;
    case 'xxz':
      for (const [i, j] of graph.bonds) {
        const m = (1 << i) | (1 << j);
        add({ x: m, z: 0 }, h.J);
        add({ x: m, z: m }, h.J);
        add({ x: 0, z: m }, h.J * h.delta);
      }
      for (let i = 0; i < n; i++) add({ x: 0, z: 1 << i }, -h.hz);
      break;
    case 'pauli-sum':
      for (const term of h.terms) add(parsePauliWord(term.word, n), term.weight);
      break;
    default: {
      const never: never = h;
      throw new TypeError(`buildHamiltonian: unknown model ${JSON.stringify(never)}`);
    }
  }

  const terms: PauliTermMask[] = [];
  for (const t of acc.values()) {
    if (t.weight !== 0 && Math.abs(t.weight) > CANCEL_RTOL * t.magnitude) {
      terms.push({ x: t.x, z: t.z, weight: t.weight });
    }
  }
  return { sites: n, terms };
}
