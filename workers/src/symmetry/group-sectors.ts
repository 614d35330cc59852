/**
 * groupSectors — the one-dimensional characters (symmetry sectors) a spatial group's basis is
 * split by, and which of them the spectral engine has to diagonalise.
 *
 * Translations t(a, b) = T1′^a∘T2′^b ≅ Z_n1 × Z_n2 have the characters
 *   χ_m(t(a, b)) = exp(−2πi·(m1·a/n1 + m2·b/n2)),   m = (m1, m2), 0 ≤ m_j < n_j
 * (momentum k_j = 2π·m_j/n_j per generator step). With a reflection R, R∘t∘R = t(ρ(a, b)) maps
 * sector m to m′ with χ_m′(t) = χ_m(R∘t∘R):
 *   m1′ = (m1·α1·n2 + m2·β1·n1)/n2 mod n1,   m2′ = (m1·α2·n2 + m2·β2·n1)/n1 mod n2
 * for R∘T′_j∘R = t(α_j, β_j) (spatial-group.ts).
 *   m′ = m   (e.g. k = 0, π on a chain): R commutes with the sector; it splits into parities
 *            p = ±1, characters of the whole group χ(t) = χ_m(t), χ(t∘R) = p·χ_m(t);
 *   m′ ≠ m   R maps sector m unitarily onto m′ and commutes with every operator the engine
 *            uses (H0, H1 and group-averaged observables), so both sectors contribute the same
 *            eigenvalues and the same Tr(ρ·U†OU): only the one with the smaller index
 *            m1 + n1·m2 is kept, with multiplicity 2, symmetrised over the translations only.
 * Characters that are exactly ±1 or ±i are stored exactly (cos π/2 is 6e−17 in floating point,
 * which would make real sectors look complex and miss the real eigensolver path).
 * Cost: O(|G|) per sector, |G| sectors.
 */
import type { SpatialGroup } from './spatial-group.js';

/** One symmetry sector. */
export interface Sector {
  /** E.g. 'k=(1/8,0/1)' or 'k=(0/8,0/1) P=-1'. */
  readonly label: string;
  /** (m1, m2). */
  readonly momentum: readonly [number, number];
  /** Reflection parity, or 0 when R is not used in this sector. */
  readonly parity: -1 | 0 | 1;
  /** How many sectors this one stands for (2: itself and its mirror image). */
  readonly multiplicity: 1 | 2;
  /** True: symmetrised over all elements (translations and t∘R); false: translations only. */
  readonly full: boolean;
  /** χ(g), interleaved complex, for g = 0 .. (full ? 2nT : nT) − 1. */
  readonly characters: Float64Array;
  /** True when every character is real. */
  readonly real: boolean;
}

// exp(−2πi·q/4) for q = 0..3.
const QUARTER_RE = [1, 0, -1, 0];
const QUARTER_IM = [0, -1, 0, 1];

/** χ_m(t(a, b)) as [re, im] (exact at quarter turns). */
function translationCharacter(n1: number, n2: number, m1: number, m2: number, a: number, b: number): [number, number] {
  const den = n1 * n2;
  const num = (m1 * a * n2 + m2 * b * n1) % den;
  if ((4 * num) % den === 0) {
    const q = (4 * num) / den;
    return [QUARTER_RE[q], QUARTER_IM[q]];
  }
  const angle = (-2 * Math.PI * num) / den;
  return [Math.cos(angle), Math.sin(angle)];
}

/** The sectors to diagonalise (see the file header), ordered by m1 + n1·m2, then parity +1, −1. */
export function groupSectors(group: SpatialGroup): Sector[] {
  const [n1, n2] = group.orders;
  const nT = group.translationCount;
  const out: Sector[] = [];
  const make = (m1: number, m2: number, parity: -1 | 0 | 1, multiplicity: 1 | 2): Sector => {
    const full = parity !== 0;
    const characters = new Float64Array(2 * (full ? 2 * nT : nT));
    for (let b = 0; b < n2; b++) {
      for (let a = 0; a < n1; a++) {
        const e = a + n1 * b;
        const [re, im] = translationCharacter(n1, n2, m1, m2, a, b);
        characters[2 * e] = re;
        characters[2 * e + 1] = im;
        if (full) {
          characters[2 * (nT + e)] = parity * re;
          characters[2 * (nT + e) + 1] = parity * im;
        }
      }
    }
    let real = true;
    for (let k = 1; k < characters.length; k += 2) if (characters[k] !== 0) real = false;
    const label = `k=(${m1}/${n1},${m2}/${n2})${parity === 0 ? '' : ` P=${parity > 0 ? '+1' : '-1'}`}`;
    return { label, momentum: [m1, m2], parity, multiplicity, full, characters, real };
  };
  for (let m2 = 0; m2 < n2; m2++) {
    for (let m1 = 0; m1 < n1; m1++) {
      if (group.rho === null) {
        out.push(make(m1, m2, 0, 1));
        continue;
      }
      const [[a1, b1], [a2, b2]] = group.rho;
      const num1 = m1 * a1 * n2 + m2 * b1 * n1;
      const num2 = m1 * a2 * n2 + m2 * b2 * n1;
      if (num1 % n2 !== 0 || num2 % n1 !== 0) {
        throw new Error(`groupSectors: the reflection does not map momentum (${m1}, ${m2}) to a momentum (orders ${n1}, ${n2})`);
      }
      const p1 = (((num1 / n2) % n1) + n1) % n1;
      const p2 = (((num2 / n1) % n2) + n2) % n2;
      if (p1 === m1 && p2 === m2) {
        out.push(make(m1, m2, 1, 1), make(m1, m2, -1, 1));
      } else if (p1 + n1 * p2 > m1 + n1 * m2) {
        out.push(make(m1, m2, 0, 2));
      }
    }
  }
  return out;
}
