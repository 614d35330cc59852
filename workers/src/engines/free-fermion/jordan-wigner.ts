/**
 * The Jordan–Wigner map along the site order 0, 1, …, L−1 with X as the "occupation"
 * direction (Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); our own sign conventions,
 * derived here and checked against dense matrices in tests/unit/free-fermion):
 *
 *   c_{2j} = a_j = S_j Z_j,   c_{2j+1} = b_j = S_j Y_j,   S_j = X_0 X_1 ⋯ X_{j−1},
 *
 * Hermitian, c_m² = 1, {c_m, c_n} = 2δ_mn. Since ZY = −iX, X_j = i·a_j b_j, hence
 *   S_j = i^j·c_0 c_1 ⋯ c_{2j−1},   P ≡ X_0 ⋯ X_{L−1} = i^L·c_0 c_1 ⋯ c_{2L−1} (fermion parity).
 * Every Pauli string Q is then a Majorana monomial Q = i^k·c_{m_1} c_{m_2} ⋯ c_{m_s}
 * (m ascending), computed site by site (sites ascending): an X_j factor multiplies by
 * i·c_{2j}c_{2j+1}; a Z_j (Y_j) factor multiplies by S_j and then c_{2j} (c_{2j+1}), where for a
 * monomial M of indices below 2j
 *   M · c_0 ⋯ c_{2j−1} = (−1)^{Σ_{m∈M} m} · (the complementary indices in [0, 2j), ascending)
 * (move each c_m of M, largest first, to its partner: m transpositions each).
 * Examples: X_j = i·c_{2j}c_{2j+1}; Z_jZ_{j+1} = i·c_{2j+1}c_{2j+2}; Y_jY_{j+1} = −i·c_{2j}c_{2j+3};
 * Z_iZ_j = i^{j−i}·c_{2i+1} c_{2i+2} ⋯ c_{2j} (a string of 2(j−i) Majoranas).
 * Q·P = i^{k+L}·(−1)^{Σ m}·(complement of {m} in [0, 2L)): on the sector P = p, Q = p·(QP).
 *
 * Monomials are stored as sorted, merged, inclusive index intervals, so strings cost O(number
 * of factors) however long they are.
 */
import type { PauliFactor } from '../../physics/pauli-word.js';

/** A Majorana monomial i^phase · Π c_m over the intervals [lo_r, hi_r] (ascending). */
export interface MajoranaMonomial {
  /** Power of i, 0..3. */
  readonly phase: number;
  /** Interval starts (ascending, intervals disjoint and not adjacent). */
  readonly lo: readonly number[];
  /** Interval ends (inclusive). */
  readonly hi: readonly number[];
  /** Number of Majorana operators. */
  readonly count: number;
  /** Parity of the sum of the indices (0 or 1). */
  readonly indexSumParity: number;
}

/** Mutable builder state. */
interface Builder {
  phase: number;
  lo: number[];
  hi: number[];
  count: number;
  parity: number;
}

/** Parity of lo + (lo+1) + … + hi. */
function rangeSumParity(lo: number, hi: number): number {
  // Sum = (lo + hi)(hi − lo + 1)/2; its parity from the two factors without overflow.
  const a = lo + hi;
  const b = hi - lo + 1;
  const half = a % 2 === 0 ? (a / 2) * b : a * (b / 2);
  return half % 2;
}

function append(st: Builder, lo: number, hi: number): void {
  const last = st.hi.length - 1;
  if (last >= 0 && st.hi[last] + 1 === lo) st.hi[last] = hi;
  else {
    st.lo.push(lo);
    st.hi.push(hi);
  }
  st.count += hi - lo + 1;
  st.parity = (st.parity + rangeSumParity(lo, hi)) % 2;
}

/** Replaces the index set by its complement in [0, k) (all current indices are < k). */
function complementBelow(st: Builder, k: number): void {
  const lo: number[] = [];
  const hi: number[] = [];
  let next = 0;
  for (let r = 0; r < st.lo.length; r++) {
    if (st.lo[r] > next) { lo.push(next); hi.push(st.lo[r] - 1); }
    next = st.hi[r] + 1;
  }
  if (next < k) { lo.push(next); hi.push(k - 1); }
  st.lo = lo;
  st.hi = hi;
  st.count = k - st.count;
  st.parity = (rangeSumParity(0, k - 1) + st.parity) % 2;
  if (k === 0) st.parity = 0;
}

/**
 * The Majorana monomial of the Pauli string with these factors (any order; each site once).
 * @throws RangeError if a site repeats or is negative / not an integer.
 */
export function pauliToMajorana(factors: readonly PauliFactor[]): MajoranaMonomial {
  const sorted = [...factors].sort((p, q) => p.site - q.site);
  const st: Builder = { phase: 0, lo: [], hi: [], count: 0, parity: 0 };
  let prev = -1;
  for (const { letter, site } of sorted) {
    if (!Number.isInteger(site) || site < 0) throw new RangeError(`pauliToMajorana: site ${site} is not a non-negative integer`);
    if (site === prev) throw new RangeError(`pauliToMajorana: site ${site} appears more than once`);
    prev = site;
    if (letter === 'X') {
      st.phase += 1;
      append(st, 2 * site, 2 * site + 1);
    } else {
      // × S_j = i^j c_0 ⋯ c_{2j−1}: phase i^j (−1)^{Σ m}, indices → complement in [0, 2j).
      st.phase += site + 2 * st.parity;
      complementBelow(st, 2 * site);
      const m = letter === 'Z' ? 2 * site : 2 * site + 1;
      append(st, m, m);
    }
  }
  return { phase: ((st.phase % 4) + 4) % 4, lo: st.lo, hi: st.hi, count: st.count, indexSumParity: st.parity };
}

/** The monomial of Q·P on L sites (P = X_0 ⋯ X_{L−1}); on the sector P = p, Q = p·(Q·P). */
export function timesParity(q: MajoranaMonomial, sites: number): MajoranaMonomial {
  const st: Builder = { phase: q.phase, lo: [...q.lo], hi: [...q.hi], count: q.count, parity: q.indexSumParity };
  if (st.count > 0 && st.hi[st.hi.length - 1] >= 2 * sites) {
    throw new RangeError(`timesParity: the monomial reaches index ${st.hi[st.hi.length - 1]}, outside 0..${2 * sites - 1}`);
  }
  st.phase += sites + 2 * st.parity;
  complementBelow(st, 2 * sites);
  return { phase: ((st.phase % 4) + 4) % 4, lo: st.lo, hi: st.hi, count: st.count, indexSumParity: st.parity };
}

/** The indices of a monomial, ascending. */
export function monomialIndices(q: MajoranaMonomial): Int32Array {
  const out = new Int32Array(q.count);
  let k = 0;
  for (let r = 0; r < q.lo.length; r++) for (let m = q.lo[r]; m <= q.hi[r]; m++) out[k++] = m;
  return out;
}

/**
 * The real sign s with ⟨Q⟩ = s·Pf(Γ_sub) for a Gaussian state of covariance Γ_mn = (i/2)⟨[c_m, c_n]⟩:
 * ⟨c_{m_1} ⋯ c_{m_2r}⟩ = Pf(⟨c c⟩) with ⟨c_m c_n⟩ = −iΓ_mn (m ≠ n), so ⟨Q⟩ = i^{k−r}·Pf(Γ_sub).
 * @throws RangeError if the count is odd or i^{k−r} is not real (Q not Hermitian).
 */
export function pfaffianSign(q: MajoranaMonomial): 1 | -1 {
  if (q.count % 2 !== 0) throw new RangeError(`pfaffianSign: a monomial of ${q.count} Majoranas (odd) has no Pfaffian`);
  const e = (((q.phase - q.count / 2) % 4) + 4) % 4;
  if (e === 1 || e === 3) throw new RangeError('pfaffianSign: the monomial is not Hermitian (phase i^(k−r) is imaginary)');
  return e === 0 ? 1 : -1;
}
