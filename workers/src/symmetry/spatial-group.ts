/**
 * chooseSpatialGroup — the lattice symmetry group the spectral engine block-diagonalises with:
 * the translations and (at most one) reflection among the lattice's candidates
 * (lattice-permutations.ts) under which EVERY given operator is invariant, term by term
 * (invariant-under.ts). For a quench these are H0 and H1: ρ = e^{−βH0}/Z and U = e^{−iH1t}
 * must both commute with the group.
 *
 * Translations: per direction the smallest step a (a divisor of the length L, a < L) with T^a a
 * symmetry, so a staggered field keeps T² (order L/2). The group is then the product
 * ⟨T1^a1⟩ × ⟨T2^a2⟩ ≅ Z_n1 × Z_n2 (translations mixing the two directions only, e.g. T1·T2
 * alone, are not searched). Element t(a, b) = T1′^a∘T2′^b is stored at index a + n1·b.
 * Reflection: the first candidate that is a symmetry, is not itself a translation, and
 * normalises the translations (R∘T′∘R is a translation for each generator T′; then
 * R∘t∘R = t(ρ(a, b)) and characters map k → k′, see group-sectors.ts). Elements t∘R follow the
 * translations at index nT + a + n1·b. Group product: (t1∘R)∘(t2∘R) = t1∘(R∘t2∘R).
 * Cost: O(divisors·T·N) invariance checks, O(|G|·N) to tabulate the elements.
 */
import type { LatticePermutations } from './lattice-permutations.js';
import type { TermTable } from './invariant-under.js';
import { invariantUnder } from './invariant-under.js';
import type { SitePermutation } from './site-permutation.js';
import {
  composePermutations, identityPermutation, permutationKey, permutationPower,
} from './site-permutation.js';

/** A finite group of site permutations: translations, optionally times one reflection. */
export interface SpatialGroup {
  readonly sites: number;
  /** Orders n1, n2 of the translation generators used per direction (1: none). */
  readonly orders: readonly [number, number];
  /** nT = n1·n2 translations, then (with a reflection) nT elements t∘R. */
  readonly elements: readonly SitePermutation[];
  /** nT. */
  readonly translationCount: number;
  /** Name of the reflection used, or null. */
  readonly reflection: string | null;
  /** R∘T′_j∘R = t(rho[j][0], rho[j][1]) for the generators j = 0, 1 (null without reflection). */
  readonly rho: readonly (readonly [number, number])[] | null;
}

/** The group and what was kept or dropped, for reports. */
export interface SymmetryChoice {
  readonly group: SpatialGroup;
  /** E.g. 'translation a1 (order 8)', 'reflection inversion'. */
  readonly used: readonly string[];
  /** E.g. 'translation a2: broken by h1'. */
  readonly rejected: readonly string[];
}

/** Which kinds of candidates to try. */
export interface SpatialOptions {
  readonly translations: boolean;
  readonly reflection: boolean;
}

/** Operators that must be invariant, with names for the report. */
export type NamedTables = ReadonlyArray<{ readonly name: string; readonly table: TermTable }>;

/** The group of the identity alone on `sites` sites. */
export function trivialGroup(sites: number): SpatialGroup {
  return { sites, orders: [1, 1], elements: [identityPermutation(sites)], translationCount: 1, reflection: null, rho: null };
}

/** The spatial symmetry group of the operators (see the file header). */
export function chooseSpatialGroup(
  sites: number, candidates: LatticePermutations, operators: NamedTables, options: SpatialOptions,
): SymmetryChoice {
  const used: string[] = [];
  const rejected: string[] = [];
  const breakers = (perm: SitePermutation) => operators.filter((o) => !invariantUnder(o.table, perm)).map((o) => o.name);
  const gens: SitePermutation[] = [identityPermutation(sites), identityPermutation(sites)];
  const orders: [number, number] = [1, 1];
  if (options.translations) {
    for (const c of candidates.translations) {
      const slot = c.name === 'a1' ? 0 : 1;
      let found = false;
      for (let step = 1; step < c.order && !found; step++) {
        if (c.order % step !== 0) continue;
        const perm = permutationPower(c.perm, step);
        if (breakers(perm).length > 0) continue;
        gens[slot] = perm;
        orders[slot] = c.order / step;
        used.push(`translation ${c.name}${step > 1 ? ` by ${step} cells` : ''} (order ${c.order / step})`);
        found = true;
      }
      if (!found) rejected.push(`translation ${c.name}: broken by ${breakers(c.perm).join(' and ')}`);
    }
  }
  const [n1, n2] = orders;
  const elements: SitePermutation[] = [];
  for (let b = 0; b < n2; b++) {
    for (let a = 0; a < n1; a++) elements.push(composePermutations(permutationPower(gens[0], a), permutationPower(gens[1], b)));
  }
  const nT = elements.length;
  const index = new Map(elements.map((p, e) => [permutationKey(p), e]));
  let reflection: string | null = null;
  let rho: Array<[number, number]> | null = null;
  if (options.reflection) {
    for (const r of candidates.reflections) {
      const broken = breakers(r.perm);
      if (broken.length > 0) {
        rejected.push(`reflection ${r.name}: broken by ${broken.join(' and ')}`);
        continue;
      }
      if (index.has(permutationKey(r.perm))) continue; // already a translation (e.g. a ladder's rung swap)
      const images = gens.map((g) => index.get(permutationKey(composePermutations(r.perm, composePermutations(g, r.perm)))));
      if (images.some((e) => e === undefined)) {
        rejected.push(`reflection ${r.name}: does not map the translations used onto translations`);
        continue;
      }
      reflection = r.name;
      rho = images.map((e) => [e! % n1, Math.floor(e! / n1)] as [number, number]);
      for (let e = 0; e < nT; e++) elements.push(composePermutations(elements[e], r.perm));
      used.push(`reflection ${r.name}`);
      break;
    }
  }
  return { group: { sites, orders: [n1, n2], elements, translationCount: nT, reflection, rho }, used, rejected };
}
