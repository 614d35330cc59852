/**
 * bondModel — a chain Hamiltonian split into bond Hamiltonians for TEBD:
 *
 *   H = c·1 + Σ_{b=0}^{L−2} h_b,   h_b acting on the physical spins (b, b+1),
 *
 * each h_b a 4×4 complex matrix in the two-spin index s_b + 2·s_{b+1}. Two-site terms must join
 * neighbours in the chain order (|i − j| = 1); single-site terms of site i go to bond i
 * (i < L − 1) or to the last bond (i = L − 1). The constant c is kept apart (it only shifts
 * ln Z by −βc and the energy by c; in real time its phases cancel between the physical and the
 * auxiliary half). A single site (L = 1) keeps its 2×2 Hamiltonian in `site`.
 * Terms on more than two sites, or on two sites that are not neighbours in the chain order,
 * are refused ({@link unsupportedTerm}): they need swap gates, which this engine does not have.
 */
import type { ChainTerm } from './chain-terms.js';
import { wordOf } from './chain-terms.js';
import { identityMatrix, kron, pauliMatrix } from './local-operators.js';

/** The Hamiltonian as bond terms (see the file header). */
export interface BondModel {
  readonly sites: number;
  /** Weight of the identity term. */
  readonly constant: number;
  /** h_b for b = 0..L−2, 4×4 complex row-major, index s_b + 2·s_{b+1}. */
  readonly bonds: readonly Float64Array[];
  /** L = 1: the 2×2 single-site Hamiltonian; else null. */
  readonly site: Float64Array | null;
  /** Largest Σ|w| over the terms of one bond (or of the single site): a bound on ‖h_b‖. */
  readonly localNorm: number;
}

/** Why the terms cannot be split into nearest-neighbour bonds, or null if they can. */
export function unsupportedTerm(terms: readonly ChainTerm[]): string | null {
  for (const t of terms) {
    if (t.factors.length > 2) {
      return `the term "${wordOf(t.factors)}" acts on ${t.factors.length} sites; the mps engine applies one- and two-site gates only`;
    }
    if (t.factors.length === 2 && t.factors[1].site - t.factors[0].site !== 1) {
      return `the term "${wordOf(t.factors)}" joins sites ${t.factors[0].site} and ${t.factors[1].site}, which are not neighbours in the chain order (swap gates are not implemented)`;
    }
  }
  return null;
}

/**
 * Builds the {@link BondModel} of `terms` on a chain of `sites` sites.
 * @throws RangeError with the reason of {@link unsupportedTerm}, or if a site is out of range.
 */
export function bondModel(terms: readonly ChainTerm[], sites: number): BondModel {
  const why = unsupportedTerm(terms);
  if (why !== null) throw new RangeError(`bondModel: ${why}`);
  const nb = Math.max(sites - 1, 0);
  const bonds = Array.from({ length: nb }, () => new Float64Array(32));
  const norms = new Float64Array(Math.max(nb, 1));
  const site = sites === 1 ? new Float64Array(8) : null;
  const id2 = identityMatrix(2);
  let constant = 0;
  const addTo = (target: Float64Array, w: number, m: Float64Array) => {
    for (let k = 0; k < target.length; k++) target[k] += w * m[k];
  };
  for (const t of terms) {
    for (const f of t.factors) {
      if (f.site < 0 || f.site >= sites) throw new RangeError(`bondModel: site ${f.site} is outside the chain (sites 0..${sites - 1})`);
    }
    if (t.factors.length === 0) {
      constant += t.weight;
      continue;
    }
    if (site !== null) {
      addTo(site, t.weight, pauliMatrix(t.factors[0].letter));
      norms[0] += Math.abs(t.weight);
      continue;
    }
    if (t.factors.length === 1) {
      const i = t.factors[0].site;
      const b = i < sites - 1 ? i : sites - 2;
      const p = pauliMatrix(t.factors[0].letter);
      // Index s_b + 2·s_{b+1}: the factor on site b+1 is the HIGH digit of kron.
      addTo(bonds[b], t.weight, i === b ? kron(2, id2, 2, p) : kron(2, p, 2, id2));
      norms[b] += Math.abs(t.weight);
    } else {
      const b = t.factors[0].site;
      addTo(bonds[b], t.weight, kron(2, pauliMatrix(t.factors[1].letter), 2, pauliMatrix(t.factors[0].letter)));
      norms[b] += Math.abs(t.weight);
    }
  }
  let localNorm = 0;
  for (const x of norms) localNorm = Math.max(localNorm, x);
  return { sites, constant, bonds, site, localNorm };
}
