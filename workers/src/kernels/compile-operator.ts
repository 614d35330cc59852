/**
 * compileOperator — tabulate a real-weighted Pauli sum for matrix-free application.
 *
 * Formula: a Pauli string with masks (x, z) acts as
 *   P|s⟩ = i^{popcount(x&z)} · (−1)^{popcount(s&z)} · |s⊕x⟩          (DESIGN.md §2)
 * so all terms sharing one flip mask x form one "group" with matrix elements
 *   ⟨s⊕x|H|s⟩ = Σ_{terms with mask x} w · i^{popcount(x&z)} · (−1)^{popcount(s&z)}.
 * The x = 0 group is real (⟨s|H|s⟩) and is stored as the real `diagonal` table.
 * Duplicate (x, z) terms are summed first; terms whose combined weight is exactly 0 are dropped.
 *
 * Each group also keeps its terms in compact form (z masks and complex coefficients
 * w·i^{popcount(x&z)}), from which the kernels can recompute table entries on the fly.
 *
 * Cost: O(T) to combine T terms, O(dim · T) flops to fill the tables; memory
 * 8·dim bytes (diagonal) + 16·dim bytes per distinct flip mask.
 * Caveat: at N = 24 each group table is 256 MiB. For single vectors on large N compile with
 * `{ tables: false }`: the kernels then evaluate Σ_k c_k·(−1)^{popcount(s&z_k)} per entry
 * (slower per pass, no table memory). The diagonal is always tabulated.
 */
import type { PauliSum } from '../physics/types.js';
import { parity, popcount } from './parity.js';

/** Largest number of sites a compiled operator supports (masks are 32-bit integers, dim = 2^N). */
export const MAX_COMPILED_SITES = 30;

/** All terms of a Pauli sum that flip the same bits `x`, tabulated as matrix elements. */
export interface CompiledGroup {
  /** Flip mask shared by the group's terms (never 0). */
  readonly x: number;
  /**
   * Complex interleaved (re, im), length 2·dim: entry s is
   * ⟨s⊕x|H|s⟩ = Σ_terms w · i^{popcount(x&z)} · (−1)^{popcount(s&z)}.
   * Length 0 when compiled with `{ tables: false }` (use `zMasks`/`coefficients`).
   */
  readonly table: Float64Array;
  /** z masks of the group's combined terms (x is shared), one per term. */
  readonly zMasks: Int32Array;
  /** Complex interleaved c_k = w_k · i^{popcount(x&z_k)}, one per term: entry s = Σ_k c_k·(−1)^{popcount(s&z_k)}. */
  readonly coefficients: Float64Array;
  /** True when every coefficient is real (then every table entry is real). */
  readonly real: boolean;
}

/** Options of compileOperator. */
export interface CompileOptions {
  /**
   * Tabulate every flip group (16·dim bytes each). With false, `table` is empty and the
   * kernels compute entries from `zMasks`/`coefficients` on the fly.
   * @defaultValue true
   */
  readonly tables?: boolean;
}

/**
 * A Pauli sum compiled for matrix-free application: H = diag(diagonal) + Σ_groups F_x·diag(table),
 * where F_x|s⟩ = |s⊕x⟩. States are complex vectors stored interleaved (re, im) in a
 * Float64Array; a vector has `dim = 2^sites` complex entries, site i = bit i of the index.
 */
export interface CompiledOperator {
  /** Number of sites N. */
  readonly sites: number;
  /** Hilbert-space dimension 2^N. */
  readonly dim: number;
  /** Weight of the identity term after combining duplicates (0 if none). */
  readonly shift: number;
  /**
   * Σ|w| over the combined non-identity terms, so the spectrum lies in
   * [shift − normBound, shift + normBound].
   */
  readonly normBound: number;
  /** Real, length dim: ⟨s|H|s⟩ including `shift`; null when H has no x = 0 term at all. */
  readonly diagonal: Float64Array | null;
  /** One group per distinct non-zero flip mask, sorted by ascending `x`. */
  readonly groups: readonly CompiledGroup[];
}

function checkMask(value: unknown, name: string, dim: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0 || value >= dim) {
    throw new RangeError(`${name} must be an integer in [0, ${dim}) (a bit mask on the sum's sites); got ${String(value)}`);
  }
  return value;
}

/**
 * Compile a real-weighted Pauli sum into a diagonal table and one complex table per distinct
 * flip mask (see the file header for the formula).
 *
 * @param sum - the operator; `sum.sites` ≤ 30, every mask < 2^sites, every weight finite.
 * @param options - see CompileOptions (default: tabulate every group).
 * @returns the compiled operator (fresh tables, owned by the caller).
 * @throws RangeError naming the offending field (`sum.sites`, `sum.terms[k].x|z|weight`).
 */
export function compileOperator(sum: PauliSum, options: CompileOptions = {}): CompiledOperator {
  const { tables = true } = options;
  const sites = sum.sites;
  if (typeof sites !== 'number' || !Number.isInteger(sites) || sites < 0 || sites > MAX_COMPILED_SITES) {
    throw new RangeError(`sum.sites must be an integer in [0, ${MAX_COMPILED_SITES}]; got ${String(sites)}`);
  }
  const dim = 1 << sites; // integer, not a double: keeps kernel index arithmetic in small integers

  // Combine duplicates: flip mask → (z mask → weight).
  const byX = new Map<number, Map<number, number>>();
  sum.terms.forEach((term, k) => {
    const x = checkMask(term.x, `sum.terms[${k}].x`, dim);
    const z = checkMask(term.z, `sum.terms[${k}].z`, dim);
    const w = term.weight;
    if (typeof w !== 'number' || !Number.isFinite(w)) {
      throw new RangeError(`sum.terms[${k}].weight must be a finite number; got ${String(w)}`);
    }
    let byZ = byX.get(x);
    if (byZ === undefined) { byZ = new Map(); byX.set(x, byZ); }
    byZ.set(z, (byZ.get(z) ?? 0) + w);
  });

  let shift = 0;
  let normBound = 0;
  let diagonal: Float64Array | null = null;
  const groups: CompiledGroup[] = [];
  const masks = [...byX.keys()].sort((p, q) => p - q);
  for (const x of masks) {
    const terms = [...byX.get(x)!.entries()].filter(([, w]) => w !== 0);
    if (terms.length === 0) continue;
    if (x === 0) {
      const diag = new Float64Array(dim);
      for (const [z, w] of terms) {
        if (z === 0) shift += w; else normBound += Math.abs(w);
        const wm = -w;
        for (let s = 0; s < dim; s++) diag[s] += parity(s & z) === 0 ? w : wm;
      }
      diagonal = diag;
    } else {
      const table = new Float64Array(tables ? 2 * dim : 0);
      const zMasks = new Int32Array(terms.length);
      const coefficients = new Float64Array(2 * terms.length);
      let real = true;
      terms.forEach(([z, w], k) => {
        normBound += Math.abs(w);
        // i^{popcount(x&z)}: 0 → +1, 1 → +i, 2 → −1, 3 → −i.
        const q = popcount(x & z) & 3;
        const part = q & 1; // 0: real part, 1: imaginary part
        const c = q >= 2 ? -w : w;
        zMasks[k] = z;
        coefficients[2 * k + part] = c;
        if (part === 1) real = false;
        if (!tables) return;
        const cm = -c;
        for (let s = 0; s < dim; s++) table[2 * s + part] += parity(s & z) === 0 ? c : cm;
      });
      groups.push({ x, table, zMasks, coefficients, real });
    }
  }
  return { sites, dim, shift, normBound, diagonal, groups };
}
