/**
 * Site permutations — a relabelling of lattice sites i → π(i) — and how they act:
 *   on basis states   (π·s) has bit π(i) equal to bit i of s (DESIGN.md §2: site i = bit i);
 *   on Pauli strings  π·P(x, z)·π† = P(π·x, π·z), with no phase (a permutation of tensor
 *                     factors moves each Pauli matrix to its new site unchanged).
 * Composition a∘b applies b first: (a∘b)(i) = a(b(i)), so (a∘b)·s = a·(b·s) and the state
 * action is a group action (what the characters of sector bases rely on).
 * stateMapper tabulates π·s by bytes: four 256-entry tables whose entries are OR-ed, O(1) per
 * state instead of O(N) (the orbit tables map every state by every group element).
 * Common practice; cost O(N) per mask, O(1) per state with a mapper (4 KiB of tables).
 */

/** A permutation of sites: perm[i] is the image of site i. */
export type SitePermutation = Int32Array;

/**
 * Checks that `perm` is a permutation of 0..sites−1.
 * @throws RangeError naming the first bad entry.
 */
export function checkPermutation(perm: SitePermutation, sites: number): void {
  if (perm.length !== sites) throw new RangeError(`perm must have ${sites} entries; got ${perm.length}`);
  const seen = new Uint8Array(sites);
  perm.forEach((p, i) => {
    if (!Number.isInteger(p) || p < 0 || p >= sites || seen[p] === 1) {
      throw new RangeError(`perm[${i}] = ${p} is not a free site of 0..${sites - 1}: not a permutation`);
    }
    seen[p] = 1;
  });
}

/** π·mask: bit π(i) of the result is bit i of mask. Unchecked. */
export function permuteMask(perm: SitePermutation, mask: number): number {
  let out = 0;
  for (let m = mask, i = 0; m !== 0; m >>>= 1, i++) if ((m & 1) !== 0) out |= 1 << perm[i];
  return out;
}

/** a∘b (apply b first). */
export function composePermutations(a: SitePermutation, b: SitePermutation): SitePermutation {
  return Int32Array.from(b, (bi) => a[bi]);
}

/** The identity on `sites` sites. */
export function identityPermutation(sites: number): SitePermutation {
  return Int32Array.from({ length: sites }, (_, i) => i);
}

/** True when perm fixes every site. */
export function isIdentityPermutation(perm: SitePermutation): boolean {
  return perm.every((p, i) => p === i);
}

/** π^k for k ≥ 0. */
export function permutationPower(perm: SitePermutation, k: number): SitePermutation {
  let out = identityPermutation(perm.length);
  for (let j = 0; j < k; j++) out = composePermutations(perm, out);
  return out;
}

/** A map key for a permutation (its images joined). */
export function permutationKey(perm: SitePermutation): string {
  return perm.join(',');
}

/** Lengths of the cycles of perm (fixed points are cycles of length 1). */
export function cycleLengths(perm: SitePermutation): number[] {
  const seen = new Uint8Array(perm.length);
  const out: number[] = [];
  for (let i = 0; i < perm.length; i++) {
    if (seen[i] === 1) continue;
    let len = 0;
    for (let j = i; seen[j] === 0; j = perm[j]) {
      seen[j] = 1;
      len++;
    }
    out.push(len);
  }
  return out;
}

/** Byte tables of π·s (see file header): 4·256 Int32 entries. */
export function stateMapper(perm: SitePermutation): Int32Array {
  const t = new Int32Array(1024);
  for (let c = 0; c < 4; c++) {
    for (let v = 0; v < 256; v++) {
      let out = 0;
      for (let b = 0; b < 8; b++) {
        const site = 8 * c + b;
        if ((v >>> b) & 1 && site < perm.length) out |= 1 << perm[site];
      }
      t[256 * c + v] = out;
    }
  }
  return t;
}

/** π·s from a {@link stateMapper} table at offset `off` (several mappers may share one array). */
export function mapState(t: Int32Array, off: number, s: number): number {
  return t[off + (s & 255)] | t[off + 256 + ((s >>> 8) & 255)] | t[off + 512 + ((s >>> 16) & 255)] | t[off + 768 + (s >>> 24)];
}
