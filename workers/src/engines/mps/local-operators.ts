/**
 * Local operators of the purified chain (DESIGN.md §2 conventions): the Pauli matrices on one
 * spin (Z|0⟩ = +|0⟩), and their lifts to the 4-dimensional site space of the MPS.
 *
 * Site space: the physical spin s and its auxiliary partner s̃ in the interleaved order (i, ĩ),
 * local index p = s + 2·s̃ (physical = low bit, as "site i = bit i"). An operator O on the
 * physical spin acts as O ⊗ 1 (O[p, p'] = O[s, s']·δ(s̃, s̃')); on the auxiliary spin as
 * 1 ⊗ O. All matrices are complex row-major, interleaved (re, im).
 */

/** Local dimension of one purified site (physical ⊗ auxiliary). */
export const LOCAL_DIM = 4;

/** A Pauli letter. */
export type PauliLetter = 'X' | 'Y' | 'Z';

/** The 2×2 Pauli matrix of a letter (fresh array). */
export function pauliMatrix(letter: PauliLetter): Float64Array {
  switch (letter) {
    case 'X': return new Float64Array([0, 0, 1, 0, 1, 0, 0, 0]);
    case 'Y': return new Float64Array([0, 0, 0, -1, 0, 1, 0, 0]);
    case 'Z': return new Float64Array([1, 0, 0, 0, 0, 0, -1, 0]);
    default: {
      const never: never = letter;
      throw new TypeError(`pauliMatrix: unknown letter ${String(never)}`);
    }
  }
}

/** The n×n identity (complex). */
export function identityMatrix(n: number): Float64Array {
  const m = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) m[2 * (i * n + i)] = 1;
  return m;
}

/** A 2×2 operator lifted to the site space: O ⊗ 1 ('physical') or 1 ⊗ O ('auxiliary'). */
export function liftToSite(op2: Float64Array, leg: 'physical' | 'auxiliary'): Float64Array {
  const out = new Float64Array(2 * 16);
  for (let p = 0; p < 4; p++) {
    for (let q = 0; q < 4; q++) {
      const [a, b, keepA, keepB] = leg === 'physical'
        ? [p & 1, q & 1, p >> 1, q >> 1]
        : [p >> 1, q >> 1, p & 1, q & 1];
      if (keepA !== keepB) continue;
      out[2 * (p * 4 + q)] = op2[2 * (a * 2 + b)];
      out[2 * (p * 4 + q) + 1] = op2[2 * (a * 2 + b) + 1];
    }
  }
  return out;
}

/** Kronecker product A ⊗ B of an m×m and an n×n matrix; index (a·n + b) — A's index is the HIGH digit. */
export function kron(m: number, a: Float64Array, n: number, b: Float64Array): Float64Array {
  const d = m * n;
  const out = new Float64Array(2 * d * d);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const ar = a[2 * (i * m + j)];
      const ai = a[2 * (i * m + j) + 1];
      if (ar === 0 && ai === 0) continue;
      for (let k = 0; k < n; k++) {
        for (let l = 0; l < n; l++) {
          const br = b[2 * (k * n + l)];
          const bi = b[2 * (k * n + l) + 1];
          const o = 2 * ((i * n + k) * d + (j * n + l));
          out[o] = ar * br - ai * bi;
          out[o + 1] = ar * bi + ai * br;
        }
      }
    }
  }
  return out;
}

/** Transpose of an n×n matrix (no conjugation). */
export function transpose(n: number, a: Float64Array): Float64Array {
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out[2 * (j * n + i)] = a[2 * (i * n + j)];
      out[2 * (j * n + i) + 1] = a[2 * (i * n + j) + 1];
    }
  }
  return out;
}
