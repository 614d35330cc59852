/**
 * bondModel — a Hamiltonian on chain positions (chain-order.ts) split into bond Hamiltonians
 * for TEBD:
 *
 *   H = c·1 + Σ_{b=0}^{L−2} h_b + Σ_k g_k,
 *
 * h_b acting on the neighbouring spins (b, b+1), g_k on a pair (i_k, j_k) more than one chain
 * step apart (a "long bond", applied through swap gates: apply-long-gate.ts). Each is a 4×4
 * complex matrix in the two-spin index s_left + 2·s_right. Two-site terms go to the bond of
 * their pair; single-site terms of site i go to bond i (i < L − 1) or to the last bond
 * (i = L − 1). The constant c is kept apart (it only shifts ln Z by −βc and the energy by c;
 * in real time its phases cancel between the physical and the auxiliary half). A single site
 * (L = 1) keeps its 2×2 Hamiltonian in `site`.
 * Long bonds are grouped into layers of bonds with no site in common (greedy, by left then
 * right end), so that the gates of one layer commute and the layer's exponential is exact.
 * Terms on more than two sites are refused ({@link unsupportedTerm}).
 */
import type { ChainTerm } from './chain-terms.js';
import { wordOf } from './chain-terms.js';
import { identityMatrix, kron, pauliMatrix } from './local-operators.js';

/** A bond between chain positions left < right − 1. */
export interface LongBond {
  readonly left: number;
  readonly right: number;
  /** 4×4 complex row-major, index s_left + 2·s_right. */
  readonly h: Float64Array;
}

/** The Hamiltonian as bond terms (see the file header). */
export interface BondModel {
  readonly sites: number;
  /** Weight of the identity term. */
  readonly constant: number;
  /** h_b for b = 0..L−2, 4×4 complex row-major, index s_b + 2·s_{b+1}. */
  readonly bonds: readonly Float64Array[];
  /** The long bonds, ascending by (left, right). */
  readonly long: readonly LongBond[];
  /** Indices into `long`, grouped into layers of bonds without a common site. */
  readonly longLayers: readonly (readonly number[])[];
  /** L = 1: the 2×2 single-site Hamiltonian; else null. */
  readonly site: Float64Array | null;
  /** Largest Σ|w| over the terms of one bond (or of the single site): a bound on ‖h_b‖. */
  readonly localNorm: number;
}

/** Why the terms cannot be split into two-site bonds, or null if they can. */
export function unsupportedTerm(terms: readonly ChainTerm[]): string | null {
  for (const t of terms) {
    if (t.factors.length > 2) {
      return `the term "${wordOf(t.factors)}" acts on ${t.factors.length} sites; the mps engine applies one- and two-site gates only`;
    }
  }
  return null;
}

/** Greedy layers of long bonds with disjoint sites (indices into `long`). */
function layersOf(long: readonly LongBond[]): number[][] {
  const layers: { used: Set<number>; members: number[] }[] = [];
  long.forEach((g, k) => {
    let layer = layers.find((l) => !l.used.has(g.left) && !l.used.has(g.right));
    if (layer === undefined) {
      layer = { used: new Set(), members: [] };
      layers.push(layer);
    }
    layer.used.add(g.left).add(g.right);
    layer.members.push(k);
  });
  return layers.map((l) => l.members);
}

/**
 * Builds the {@link BondModel} of `terms` (sites = chain positions) on a chain of `sites` sites.
 * @throws RangeError with the reason of {@link unsupportedTerm}, or if a site is out of range.
 */
export function bondModel(terms: readonly ChainTerm[], sites: number): BondModel {
  const why = unsupportedTerm(terms);
  if (why !== null) throw new RangeError(`bondModel: ${why}`);
  const nb = Math.max(sites - 1, 0);
  const bonds = Array.from({ length: nb }, () => new Float64Array(32));
  const norms = new Float64Array(Math.max(nb, 1));
  const longByKey = new Map<number, { left: number; right: number; h: Float64Array; norm: number }>();
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
      continue;
    }
    const [a, c] = t.factors;
    const pair = kron(2, pauliMatrix(c.letter), 2, pauliMatrix(a.letter));
    if (c.site - a.site === 1) {
      addTo(bonds[a.site], t.weight, pair);
      norms[a.site] += Math.abs(t.weight);
      continue;
    }
    const key = a.site * sites + c.site;
    let g = longByKey.get(key);
    if (g === undefined) {
      g = { left: a.site, right: c.site, h: new Float64Array(32), norm: 0 };
      longByKey.set(key, g);
    }
    addTo(g.h, t.weight, pair);
    g.norm += Math.abs(t.weight);
  }
  const long = [...longByKey.entries()].sort((p, q) => p[0] - q[0]).map(([, g]) => g);
  let localNorm = 0;
  for (const x of norms) localNorm = Math.max(localNorm, x);
  for (const g of long) localNorm = Math.max(localNorm, g.norm);
  return {
    sites, constant, bonds, site, localNorm,
    long: long.map(({ left, right, h }) => ({ left, right, h })),
    longLayers: layersOf(long),
  };
}

/**
 * Two-site updates to apply each Trotter layer of the model once (trotter-schedule.ts): the
 * even and odd neighbour bonds (one layer when the chain has at most one bond), then each
 * layer of long bonds at 2·(span − 1) swaps + 1 gate per bond. Its length is the layer count.
 */
export function layerCosts(model: BondModel): number[] {
  const nb = Math.max(model.sites - 1, 0);
  const costs = nb <= 1 ? [nb] : [Math.ceil(nb / 2), Math.floor(nb / 2)];
  for (const layer of model.longLayers) {
    let c = 0;
    for (const k of layer) c += 2 * (model.long[k].right - model.long[k].left - 1) + 1;
    costs.push(c);
  }
  return costs;
}
