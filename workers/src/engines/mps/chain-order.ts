/**
 * chainOrder — the order in which the mps engine lines the lattice's sites up as a chain, and
 * the remapping of strings from lattice sites to chain positions.
 *
 *   chain, open; explicit bond list:  site order (position = site);
 *   chain, periodic (L ≥ 3):  folded, 0, L−1, 1, L−2, 2, … so that every bond of the ring,
 *     the closing one included, spans at most two chain steps;
 *   ladder (site = x + L·y):  rung by rung, (x, 0), (x, 1) at positions 2x, 2x + 1 — rungs span
 *     one step, leg bonds two, plaquette diagonals one or three; with periodic legs the rungs
 *     follow the folded order of a ring, so that legs span at most four steps.
 * Terms joining sites more than one chain step apart are applied through swap gates
 * (apply-long-gate.ts); their cost grows with the span. Two-dimensional lattices (square,
 * triangular, honeycomb) are refused: lined up as a chain their bond dimension grows
 * exponentially with the width, beyond the reach of the engine.
 */
import type { Lattice } from '../../../../shared-types/src/index.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import type { ChainTerm } from './chain-terms.js';

/** A bijection between lattice sites and chain positions. */
export interface ChainOrder {
  /** Chain position of each lattice site. */
  readonly position: readonly number[];
  /** Lattice site at each chain position. */
  readonly site: readonly number[];
  /** How the order was chosen (for the plan's reason). */
  readonly name: string;
}

/** A refusal: the spec field and why. */
export interface OrderRefusal {
  readonly field: string;
  readonly message: string;
}

/** 0, n−1, 1, n−2, … (the folded order of a ring of n). */
function folded(n: number): number[] {
  const out: number[] = [];
  for (let a = 0, b = n - 1; a <= b; a++, b--) {
    out.push(a);
    if (b !== a) out.push(b);
  }
  return out;
}

function fromSites(site: number[], name: string): ChainOrder {
  const position = new Array<number>(site.length);
  site.forEach((s, p) => { position[s] = p; });
  return { position, site, name };
}

/** The chain order of a lattice of `sites` sites (see the file header), or a refusal. */
export function chainOrder(lattice: Lattice, sites: number): ChainOrder | OrderRefusal {
  const identity = () => fromSites(Array.from({ length: sites }, (_, i) => i), 'site order');
  switch (lattice.kind) {
    case 'bonds':
      return identity();
    case 'chain':
      return lattice.boundary === 'periodic' && sites >= 3 ? fromSites(folded(sites), 'folded ring') : identity();
    case 'ladder': {
      const L = lattice.length;
      const ring = lattice.boundary[0] === 'periodic' && L >= 3;
      const xs = ring ? folded(L) : Array.from({ length: L }, (_, x) => x);
      return fromSites(xs.flatMap((x) => [x, x + L]), ring ? 'rung by rung, rungs in folded ring order' : 'rung by rung');
    }
    case 'square':
    case 'triangular':
    case 'honeycomb':
      return {
        field: 'lattice.kind',
        message: `the mps engine lines sites up as a chain and runs chains, ladders and explicit bond lists; a ${lattice.kind} lattice would need a bond dimension growing exponentially with its width (use kind 'ladder' for two legs)`,
      };
    default: {
      const never: never = lattice;
      throw new TypeError(`chainOrder: unknown lattice kind ${JSON.stringify(never)}`);
    }
  }
}

/** Factors moved to chain positions, sorted by position. */
export function remapFactors(factors: readonly PauliFactor[], order: ChainOrder): PauliFactor[] {
  return factors.map((f) => ({ letter: f.letter, site: order.position[f.site] })).sort((p, q) => p.site - q.site);
}

/** Terms moved to chain positions. */
export function remapTerms(terms: readonly ChainTerm[], order: ChainOrder): ChainTerm[] {
  return terms.map((t) => ({ weight: t.weight, factors: remapFactors(t.factors, order) }));
}
