/**
 * latticePermutations — the site permutations a lattice's geometry PROPOSES as symmetries.
 * Nothing here decides that a Hamiltonian has them: spatial-group.ts keeps a candidate only
 * when every Pauli sum involved maps onto itself term by term (invariant-under.ts). So a
 * translation is proposed along every direction whatever its boundary (an open chain with
 * bonds is rejected by its missing boundary bond; a field-only Hamiltonian on it is accepted).
 *
 * Numbering follows buildLattice: site = b + nb·(x + lx·y) with nb basis sites per cell
 * (chain, ladder, square, triangular: nb = 1, lx × ly cells; a chain has ly = 1, a ladder
 * ly = 2; honeycomb nb = 2). An explicit bond list is read as a line of `sites` cells.
 *   translations  a1: x → x + 1 (mod lx), order lx;  a2: y → y + 1 (mod ly), order ly
 *                 (only for lx, ly > 1).
 *   reflections   inversion (b, x, y) → (nb−1−b, lx−1−x, ly−1−y) — the point inversion of the
 *                 finite cluster (for the honeycomb it exchanges the sublattices); on a periodic
 *                 direction it differs from x → −x only by a translation;
 *                 mirror a1 (x → lx−1−x), mirror a2 (y → ly−1−y), diagonal (x ↔ y, lx = ly),
 *                 for one-site cells. Identity maps and duplicates are dropped.
 * Cost: O(N) per candidate.
 */
import type { Lattice } from '../../../shared-types/src/index.js';
import type { SitePermutation } from './site-permutation.js';
import { isIdentityPermutation, permutationKey } from './site-permutation.js';

/** A proposed translation generator. */
export interface TranslationCandidate {
  /** 'a1' or 'a2'. */
  readonly name: string;
  /** The generator T (one cell along the direction). */
  readonly perm: SitePermutation;
  /** Its order (the number of cells along the direction). */
  readonly order: number;
}

/** A proposed reflection (an involution of the sites). */
export interface ReflectionCandidate {
  /** 'inversion', 'mirror a1', 'mirror a2' or 'diagonal'. */
  readonly name: string;
  readonly perm: SitePermutation;
}

/** Candidates of one lattice. */
export interface LatticePermutations {
  readonly translations: readonly TranslationCandidate[];
  /** In order of preference. */
  readonly reflections: readonly ReflectionCandidate[];
}

/** Cell structure of a lattice spec: nb basis sites, lx × ly cells. */
function cells(lattice: Lattice): { nb: number; lx: number; ly: number } {
  switch (lattice.kind) {
    case 'chain': return { nb: 1, lx: lattice.length, ly: 1 };
    case 'ladder': return { nb: 1, lx: lattice.length, ly: 2 };
    case 'square':
    case 'triangular': return { nb: 1, lx: lattice.size[0], ly: lattice.size[1] };
    case 'honeycomb': return { nb: 2, lx: lattice.size[0], ly: lattice.size[1] };
    case 'bonds': return { nb: 1, lx: lattice.sites, ly: 1 };
    default: {
      const never: never = lattice;
      throw new TypeError(`latticePermutations: unknown lattice kind ${JSON.stringify(never)}`);
    }
  }
}

/**
 * The candidate permutations of `lattice` (see the file header).
 * @throws RangeError when `sites` does not match the lattice's cell count.
 */
export function latticePermutations(lattice: Lattice, sites: number): LatticePermutations {
  const { nb, lx, ly } = cells(lattice);
  if (nb * lx * ly !== sites) throw new RangeError(`sites = ${sites} does not match the lattice's ${nb}·${lx}·${ly} sites`);
  const build = (f: (b: number, x: number, y: number) => readonly [number, number, number]): SitePermutation => {
    const perm = new Int32Array(sites);
    for (let y = 0; y < ly; y++) {
      for (let x = 0; x < lx; x++) {
        for (let b = 0; b < nb; b++) {
          const [b2, x2, y2] = f(b, x, y);
          perm[b + nb * (x + lx * y)] = b2 + nb * (x2 + lx * y2);
        }
      }
    }
    return perm;
  };
  const translations: TranslationCandidate[] = [];
  if (lx > 1) translations.push({ name: 'a1', order: lx, perm: build((b, x, y) => [b, (x + 1) % lx, y]) });
  if (ly > 1) translations.push({ name: 'a2', order: ly, perm: build((b, x, y) => [b, x, (y + 1) % ly]) });
  const proposed: ReflectionCandidate[] = [
    { name: 'inversion', perm: build((b, x, y) => [nb - 1 - b, lx - 1 - x, ly - 1 - y]) },
  ];
  if (nb === 1) {
    proposed.push({ name: 'mirror a1', perm: build((b, x, y) => [b, lx - 1 - x, y]) });
    proposed.push({ name: 'mirror a2', perm: build((b, x, y) => [b, x, ly - 1 - y]) });
    if (lx === ly) proposed.push({ name: 'diagonal', perm: build((b, x, y) => [b, y, x]) });
  }
  const seen = new Set<string>();
  const reflections = proposed.filter((r) => {
    const key = permutationKey(r.perm);
    if (isIdentityPermutation(r.perm) || seen.has(key)) return false;
    seen.add(key);
    return true;
  });
  return { translations, reflections };
}
