/**
 * symmetryZero — whether ⟨P(t)⟩_β vanishes identically by a symmetry that the series cannot
 * see from a finite number of coefficients (an all-zero series says nothing about the next
 * order; a symmetry does).
 *
 * Symmetries checked (common practice):
 * - complex conjugation: H0 is real iff every term has an even number of Y factors; then
 *   e^{−βH0} is real and ⟨P⟩_β = 0 for a string with an odd number of Y (Tr of a real matrix
 *   times an imaginary one is imaginary, yet ⟨P⟩ is real). With H1 real as well this only
 *   makes ⟨P(t)⟩ odd in t, so it is a static zero only;
 * - global flips U = Π_i σ^a_i, a ∈ {X, Y, Z}: a string commutes with U iff it has an even
 *   number of sites whose letter is not a. If H0 commutes with U and P anticommutes,
 *   ⟨P⟩_β = 0; if H1 commutes too, ⟨P(t)⟩_β = 0 for all t.
 * Cost: O(terms · sites per term).
 */
import type { SitePauli } from './cluster-expansion.js';
import type { LocalModel } from './local-terms.js';

/** 'all': zero for every (β, t); 'static': zero at t = 0 for every β; 'none': no symmetry found. */
export type SymmetryZero = 'all' | 'static' | 'none';

const Y = 3;

function oddY(codes: readonly number[]): boolean {
  let n = 0;
  for (const c of codes) if (c === Y) n++;
  return n % 2 === 1;
}

/** True if the string anticommutes with Π_i σ^a_i (a = letter code 1, 2 or 3). */
function anticommutesWithFlip(codes: readonly number[], a: number): boolean {
  let n = 0;
  for (const c of codes) if (c !== a) n++;
  return n % 2 === 1;
}

function commutesWithFlip(m: LocalModel, a: number): boolean {
  return m.terms.every((t) => !anticommutesWithFlip(t.codes, a));
}

/** The symmetry zero of ⟨P(t)⟩_β for H0, H1 (see file header). */
export function symmetryZero(p: SitePauli, h0: LocalModel, h1: LocalModel): SymmetryZero {
  let result: SymmetryZero = 'none';
  for (const a of [1, 2, 3]) {
    if (!anticommutesWithFlip(p.codes, a) || !commutesWithFlip(h0, a)) continue;
    if (commutesWithFlip(h1, a)) return 'all';
    result = 'static';
  }
  if (oddY(p.codes) && h0.terms.every((t) => !oddY(t.codes))) result = 'static';
  return result;
}
