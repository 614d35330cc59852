/**
 * Pauli-string algebra on the two-mask form (types.ts): products with their phase, commutation,
 * transposition, and complex-weighted sums of strings.
 *
 * Phase convention. With X^x Z^z = ⊗_i X_i^{x_i} Z_i^{z_i}, a string is
 *   P(x, z) = i^{popcount(x & z)} · X^x Z^z                      (Y = iXZ),
 * and Z^a X^b = (−1)^{popcount(a & b)} X^b Z^a. Hence
 *   P(xa, za) · P(xb, zb) = i^k · P(xa ⊕ xb, za ⊕ zb),
 *   k = |xa&za| + |xb&zb| + 2|za&xb| − |x&z|  (mod 4),
 * with |·| the popcount. Two strings commute iff |xa&zb| + |za&xb| is even. Since Xᵀ = X,
 * Zᵀ = Z and Yᵀ = −Y, P(x, z)ᵀ = (−1)^{|x&z|} P(x, z). These are standard identities (common
 * practice); the unit tests check them against explicit 2×2 matrix products.
 *
 * Sums are keyed by a combined mask: the BigInt x·2^30 + z. (A plain number cannot hold the 60
 * bits of two 30-site masks exactly: doubles are exact only up to 2^53.)
 */
import type { PauliString, PauliSum, PauliTermMask } from './types.js';

/** Number of set bits of a 32-bit integer (Hamming weight, SWAR form). */
export function popcount(n: number): number {
  let v = n - ((n >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

/** A product of two strings: a·b = i^phase · P(x, z), phase ∈ {0, 1, 2, 3}. */
export interface PauliProduct extends PauliString {
  readonly phase: number;
}

/** Product a·b of two Pauli strings with its phase i^k. */
export function multiplyPauli(a: PauliString, b: PauliString): PauliProduct {
  const x = a.x ^ b.x;
  const z = a.z ^ b.z;
  const k = popcount(a.x & a.z) + popcount(b.x & b.z) + 2 * popcount(a.z & b.x) - popcount(x & z);
  return { x, z, phase: ((k % 4) + 4) % 4 };
}

/** True if the two strings commute, false if they anticommute. */
export function pauliCommutes(a: PauliString, b: PauliString): boolean {
  return ((popcount(a.x & b.z) + popcount(a.z & b.x)) & 1) === 0;
}

/** Sign s with Pᵀ = s·P: (−1)^{number of Y factors}. */
export function transposeSign(p: PauliString): 1 | -1 {
  return (popcount(p.x & p.z) & 1) === 0 ? 1 : -1;
}

const SHIFT = 2n ** 30n;

/** Combined map key of a string: the BigInt x·2^30 + z (exact for masks below 2^30). */
export function pauliKey(p: PauliString): bigint {
  return BigInt(p.x) * SHIFT + BigInt(p.z);
}

/** Inverse of {@link pauliKey}. */
export function pauliFromKey(key: bigint): PauliString {
  return { x: Number(key / SHIFT), z: Number(key % SHIFT) };
}

/** The identity string. */
export const IDENTITY: PauliString = Object.freeze({ x: 0, z: 0 });

/** A complex-weighted Pauli string: (re + i·im)·P(x, z). */
export interface ComplexPauliTerm extends PauliString {
  re: number;
  im: number;
}

/** A complex-weighted sum of Pauli strings on `sites` sites, keyed by {@link pauliKey}. */
export interface ComplexPauliSum {
  readonly sites: number;
  readonly terms: Map<bigint, ComplexPauliTerm>;
}

/** An empty sum on `sites` sites. */
export function createComplexSum(sites: number): ComplexPauliSum {
  return { sites, terms: new Map() };
}

/** Accumulates (re + i·im)·p into `sum` in place (entries that reach zero are kept until {@link simplifyComplexSum}). */
export function addComplexTerm(sum: ComplexPauliSum, p: PauliString, re: number, im = 0): void {
  const key = pauliKey(p);
  const t = sum.terms.get(key);
  if (t === undefined) sum.terms.set(key, { x: p.x, z: p.z, re, im });
  else {
    t.re += re;
    t.im += im;
  }
}

/** a + (cRe + i·cIm)·b, as a new sum. */
export function addComplexSums(a: ComplexPauliSum, b: ComplexPauliSum, cRe = 1, cIm = 0): ComplexPauliSum {
  const out = createComplexSum(Math.max(a.sites, b.sites));
  for (const t of a.terms.values()) addComplexTerm(out, t, t.re, t.im);
  for (const t of b.terms.values()) addComplexTerm(out, t, cRe * t.re - cIm * t.im, cRe * t.im + cIm * t.re);
  return out;
}

/** (cRe + i·cIm)·a, as a new sum. */
export function scaleComplexSum(a: ComplexPauliSum, cRe: number, cIm = 0): ComplexPauliSum {
  return addComplexSums(createComplexSum(a.sites), a, cRe, cIm);
}

// i^k as (re, im) for k = 0..3.
const PHASE_RE = [1, 0, -1, 0];
const PHASE_IM = [0, 1, 0, -1];

function accumulateProduct(out: ComplexPauliSum, s: ComplexPauliTerm, t: ComplexPauliTerm, factor: number): void {
  const p = multiplyPauli(s, t);
  const wr = s.re * t.re - s.im * t.im;
  const wi = s.re * t.im + s.im * t.re;
  const pr = PHASE_RE[p.phase];
  const pi = PHASE_IM[p.phase];
  addComplexTerm(out, p, factor * (pr * wr - pi * wi), factor * (pr * wi + pi * wr));
}

/** The operator product a·b (cost |a|·|b| string products). */
export function multiplyComplexSums(a: ComplexPauliSum, b: ComplexPauliSum): ComplexPauliSum {
  const out = createComplexSum(Math.max(a.sites, b.sites));
  for (const s of a.terms.values()) for (const t of b.terms.values()) accumulateProduct(out, s, t, 1);
  return out;
}

/** The commutator [a, b] = ab − ba. Only anticommuting pairs contribute, each as 2·s·t. */
export function commutator(a: ComplexPauliSum, b: ComplexPauliSum): ComplexPauliSum {
  const out = createComplexSum(Math.max(a.sites, b.sites));
  for (const s of a.terms.values()) {
    for (const t of b.terms.values()) {
      if (!pauliCommutes(s, t)) accumulateProduct(out, s, t, 2);
    }
  }
  return out;
}

/** The transpose aᵀ (weights unchanged, each string times its {@link transposeSign}). */
export function transposeComplexSum(a: ComplexPauliSum): ComplexPauliSum {
  const out = createComplexSum(a.sites);
  for (const t of a.terms.values()) {
    const s = transposeSign(t);
    addComplexTerm(out, t, s * t.re, s * t.im);
  }
  return out;
}

/** A copy without the terms whose modulus is ≤ eps (eps = 0 drops exact zeros only). */
export function simplifyComplexSum(a: ComplexPauliSum, eps = 0): ComplexPauliSum {
  const out = createComplexSum(a.sites);
  for (const t of a.terms.values()) {
    if (Math.hypot(t.re, t.im) > eps) addComplexTerm(out, t, t.re, t.im);
  }
  return out;
}

/**
 * True if the sum is Hermitian within eps: Pauli strings are Hermitian and linearly
 * independent, so this holds iff every weight is real (|im| ≤ eps).
 */
export function isHermitian(a: ComplexPauliSum, eps = 0): boolean {
  for (const t of a.terms.values()) if (Math.abs(t.im) > eps) return false;
  return true;
}

/** A real {@link PauliSum} as a complex sum (repeated strings are merged). */
export function fromPauliSum(p: PauliSum): ComplexPauliSum {
  const out = createComplexSum(p.sites);
  for (const t of p.terms) addComplexTerm(out, t, t.weight, 0);
  return out;
}

/**
 * A Hermitian complex sum as a real {@link PauliSum}; terms with |re| ≤ eps are dropped.
 * @throws RangeError naming the string if an imaginary weight exceeds eps in modulus.
 */
export function toPauliSum(a: ComplexPauliSum, eps = 0): PauliSum {
  const terms: PauliTermMask[] = [];
  for (const t of a.terms.values()) {
    if (Math.abs(t.im) > eps) {
      throw new RangeError(`toPauliSum: string (x=${t.x}, z=${t.z}) has imaginary weight ${t.im} (allowed |im| ≤ ${eps})`);
    }
    if (Math.abs(t.re) > eps) terms.push({ x: t.x, z: t.z, weight: t.re });
  }
  return { sites: a.sites, terms };
}
