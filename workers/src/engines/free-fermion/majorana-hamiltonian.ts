/**
 * majoranaHamiltonian — recognises a Hamiltonian that is quadratic in the Jordan–Wigner
 * Majoranas (jordan-wigner.ts) and writes it as
 *
 *   H = (i/4) Σ_mn A_mn c_m c_n + c₀        (A real antisymmetric, 2L × 2L)
 *
 * on each fermion-parity sector P = p (p = ±1): A_p = A_base + p·A_parity, c_p = c_base + p·c_parity.
 * A term w·Q with monomial Q = i^k·c_{m_1}⋯c_{m_s} is
 *   s = 0:        a constant w·i^k;
 *   s = 2 (m<n):  a bilinear: w·i^k·c_m c_n = (i/2)·A_mn·c_m c_n ⇒ A_mn = 2w·i^{k−1} (= ±2w);
 *   s = 2L − 2 or 2L: on the sector P = p, Q = p·(QP) with QP of 2 or 0 Majoranas (a
 *                  boundary term of a ring, e.g. Z_{L−1}Z_0 — LSM's "c-cyclic" vs "c-acyclic"
 *                  problem, Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961), §2 — or Q ∝ P);
 *   otherwise:     not quadratic: refused, with the reason (odd s: the term changes fermion
 *                  parity, e.g. a Z_i field; even s ≥ 4: a many-body interaction, e.g. X_iX_{i+1}).
 * For the transverse-field Ising chain this gives A_{2j,2j+1} = −2h (X_j = i c_{2j}c_{2j+1})
 * and A_{2j+1,2j+2} = −2J (Z_jZ_{j+1} = i c_{2j+1}c_{2j+2}); on a ring the boundary bond
 * picks up −p: antiperiodic fermions in the even sector, periodic in the odd one.
 * Cost: O(number of terms × factors per term).
 */
import { pauliToMajorana, timesParity, type MajoranaMonomial } from './jordan-wigner.js';
import type { SiteTerm } from '../../physics/site-terms.js';

/** One entry A_mn (m < n) of a Majorana matrix; A_nm = −A_mn. */
export interface MajoranaEntry {
  readonly m: number;
  readonly n: number;
  readonly value: number;
}

/** A Hamiltonian quadratic in the Majoranas, per parity sector. */
export interface MajoranaHamiltonian {
  /** Sites L (2L Majoranas). */
  readonly sites: number;
  /** Sector-independent entries (merged, m < n). */
  readonly base: readonly MajoranaEntry[];
  /** Constant part. */
  readonly baseConstant: number;
  /** Entries multiplied by the parity p on sector P = p (merged, m < n). */
  readonly parity: readonly MajoranaEntry[];
  /** Constant multiplied by p. */
  readonly parityConstant: number;
  /** True if any term depends on the sector (a ring's boundary bond, or a term ∝ P). */
  readonly sectorDependent: boolean;
}

/** Why a Hamiltonian is not quadratic: the first offending term. */
export interface NotQuadratic {
  readonly word: string;
  readonly weight: number;
  readonly majoranas: number;
  readonly message: string;
}

/** i^e for e ∈ {0, 2} as ±1; throws for an imaginary power (a non-Hermitian combination). */
function realPower(e: number, what: string): 1 | -1 {
  const r = ((e % 4) + 4) % 4;
  if (r === 0) return 1;
  if (r === 2) return -1;
  throw new RangeError(`${what}: the Majorana form has an imaginary coefficient (not Hermitian)`);
}

function addEntry(map: Map<number, number>, n2: number, q: MajoranaMonomial, w: number, what: string): void {
  const m = q.lo[0];
  const n = q.lo.length === 2 ? q.lo[1] : q.hi[0];
  // w·i^k c_m c_n = (i/2)·A_mn c_m c_n  ⇒  A_mn = 2w·i^{k−1}.
  const value = 2 * w * realPower(q.phase - 1, what);
  const key = m * n2 + n;
  map.set(key, (map.get(key) ?? 0) + value);
}

function entries(map: Map<number, number>, n2: number): MajoranaEntry[] {
  const out: MajoranaEntry[] = [];
  for (const [key, value] of [...map.entries()].sort((a, b) => a[0] - b[0])) {
    if (value !== 0) out.push({ m: Math.floor(key / n2), n: key % n2, value });
  }
  return out;
}

/**
 * The Majorana form of the terms on L sites, or the first term that is not quadratic.
 * @throws RangeError if a term names a site outside 0..L−1.
 */
export function majoranaHamiltonian(terms: readonly SiteTerm[], sites: number): MajoranaHamiltonian | NotQuadratic {
  const n2 = 2 * sites;
  const base = new Map<number, number>();
  const parity = new Map<number, number>();
  let baseConstant = 0;
  let parityConstant = 0;
  let sectorDependent = false;
  for (const t of terms) {
    for (const f of t.factors) {
      if (f.site >= sites) throw new RangeError(`majoranaHamiltonian: the term "${t.word}" names site ${f.site}, outside 0..${sites - 1}`);
    }
    const q = pauliToMajorana(t.factors);
    const what = `term ${t.weight}·"${t.word}"`;
    if (q.count === 0) {
      baseConstant += t.weight * realPower(q.phase, what);
    } else if (q.count === 2) {
      addEntry(base, n2, q, t.weight, what);
    } else if (q.count === n2 - 2 || q.count === n2) {
      const r = timesParity(q, sites);
      sectorDependent = true;
      if (r.count === 0) parityConstant += t.weight * realPower(r.phase, what);
      else addEntry(parity, n2, r, t.weight, what);
    } else {
      const word = t.word;
      const message = q.count % 2 === 1
        ? `the term ${t.weight}·"${word}" is odd in the Jordan–Wigner Majoranas (${q.count} of them): it changes the fermion parity (as a Z or Y field does), so H is not quadratic`
        : `the term ${t.weight}·"${word}" is a product of ${q.count} Majoranas under the Jordan–Wigner map along the site order: an interaction, not a free-fermion term (allowed: X_i fields and couplings A_i X_{i+1}⋯X_{j−1} B_j with A, B ∈ {Y, Z}, e.g. nearest-neighbour ZZ, YY, ZY, YZ; on a ring also the boundary bond)`;
      return { word, weight: t.weight, majoranas: q.count, message };
    }
  }
  return {
    sites, base: entries(base, n2), baseConstant, parity: entries(parity, n2), parityConstant,
    sectorDependent,
  };
}

/** True for the refusal branch of {@link majoranaHamiltonian}. */
export function isNotQuadratic(x: MajoranaHamiltonian | NotQuadratic): x is NotQuadratic {
  return (x as NotQuadratic).message !== undefined;
}

/** A_p's entries and constant on sector p (p = 1 also serves a sector-independent H). */
export function sectorForm(h: MajoranaHamiltonian, p: 1 | -1): { entries: MajoranaEntry[]; constant: number } {
  const map = new Map<number, number>();
  const n2 = 2 * h.sites;
  for (const e of h.base) map.set(e.m * n2 + e.n, e.value);
  for (const e of h.parity) {
    const key = e.m * n2 + e.n;
    map.set(key, (map.get(key) ?? 0) + p * e.value);
  }
  return { entries: entries(map, n2), constant: h.baseConstant + p * h.parityConstant };
}

/**
 * Writes the strictly lower triangle of the dense 2L × 2L matrix A (row-major; A_nm = −A_mn for
 * the stored m < n entries) into `out` (zeroed first), the input skewSchur expects.
 */
export function denseLowerTriangle(entries: readonly MajoranaEntry[], n2: number, out: Float64Array): void {
  out.fill(0, 0, n2 * n2);
  for (const e of entries) out[e.n * n2 + e.m] = -e.value;
}
