/**
 * Reference-only dense complex matrices of Pauli strings and Pauli sums, built directly from
 * the Pauli matrices with the conventions of DESIGN.md §2 (site i = bit i of the basis index,
 * Z|0⟩ = +|0⟩, Y|0⟩ = i|1⟩, Y|1⟩ = −i|0⟩), and thermal / quench expectation values computed
 * with the matrix exponential of the general-purpose library mathjs (`expm`, Padé scaling and
 * squaring). Independent of the engine's kernels by construction. Meant for ≤ 5 qubits.
 */
import * as math from 'mathjs';
import type { Complex, Matrix } from 'mathjs';

/** One weighted Pauli word, e.g. { weight: 0.7, word: 'X0 Y1' } ("" is the identity). */
export interface DenseTerm {
  weight: number;
  word: string;
}

/** Parse "X0 Y1 Z3" into [letter, site] factors (left to right). */
export function parseWord(word: string): Array<['X' | 'Y' | 'Z', number]> {
  const out: Array<['X' | 'Y' | 'Z', number]> = [];
  for (const tok of word.trim().split(/\s+/).filter((t) => t.length > 0)) {
    const m = /^([XYZ])(\d+)$/.exec(tok);
    if (!m) throw new RangeError(`parseWord: bad factor "${tok}" in "${word}"`);
    out.push([m[1] as 'X' | 'Y' | 'Z', Number(m[2])]);
  }
  return out;
}

/** Re/Im arrays (row-major, dim × dim) of Σ_k w_k P_k. */
export function pauliSumArrays(terms: readonly DenseTerm[], sites: number): { re: number[][]; im: number[][] } {
  const dim = 2 ** sites;
  const re = Array.from({ length: dim }, () => new Array<number>(dim).fill(0));
  const im = Array.from({ length: dim }, () => new Array<number>(dim).fill(0));
  for (const { weight, word } of terms) {
    const factors = parseWord(word);
    for (const [, site] of factors) if (site >= sites) throw new RangeError(`pauliSumArrays: site ${site} ≥ ${sites}`);
    for (let s = 0; s < dim; s++) {
      // Apply the factors right to left to |s⟩: amplitude (pr + i pi) on basis state r.
      let r = s, pr = 1, pi = 0;
      for (let f = factors.length - 1; f >= 0; f--) {
        const [letter, site] = factors[f];
        const bit = (r >> site) & 1;
        if (letter === 'X') { r ^= 1 << site; }
        else if (letter === 'Z') { if (bit) { pr = -pr; pi = -pi; } }
        else {
          // Y|0⟩ = i|1⟩, Y|1⟩ = −i|0⟩: multiply by ±i.
          const sgn = bit ? -1 : 1;
          const nr = -sgn * pi, ni = sgn * pr;
          pr = nr; pi = ni; r ^= 1 << site;
        }
      }
      re[r][s] += weight * pr;
      im[r][s] += weight * pi;
    }
  }
  return { re, im };
}

/** Dense complex mathjs matrix of Σ_k w_k P_k on `sites` qubits. */
export function pauliSumMatrix(terms: readonly DenseTerm[], sites: number): Matrix {
  const { re, im } = pauliSumArrays(terms, sites);
  return math.matrix(re.map((row, i) => row.map((v, j) => math.complex(v, im[i][j]))));
}

/** Real part of Tr(M). */
export function traceRe(m: Matrix): number {
  return (math.complex(math.trace(m) as unknown as Complex)).re;
}

/** Largest |imaginary part| of the trace (for Hermiticity sanity checks). */
export function traceIm(m: Matrix): number {
  return (math.complex(math.trace(m) as unknown as Complex)).im;
}

/** Thermal state ρ = e^{−βH}/Z from mathjs expm, with ln Z, E = ⟨H⟩ and C = β²(⟨H²⟩ − ⟨H⟩²). */
export interface DenseThermal {
  rho: Matrix;
  lnZ: number;
  energy: number;
  heatCapacity: number;
}

/** Gershgorin lower bound on the spectrum of a Hermitian matrix (used to keep e^{−βH} finite). */
function gershgorinLower(h: Matrix): number {
  const arr = h.toArray() as unknown as Complex[][];
  let lo = Infinity;
  arr.forEach((row, i) => {
    let radius = 0;
    row.forEach((v, j) => { if (i !== j) radius += math.abs(math.complex(v)) as unknown as number; });
    lo = Math.min(lo, math.complex(row[i]).re - radius);
  });
  return lo;
}

/** ρ, ln Z, E, C of H at β by mathjs expm of −β(H − c), c a spectral lower bound. */
export function denseThermal(h: Matrix, beta: number): DenseThermal {
  const dim = h.size()[0];
  const shift = gershgorinLower(h);
  const shifted = math.subtract(h, math.multiply(shift, math.identity(dim))) as Matrix;
  const w = math.expm(math.multiply(-beta, shifted) as Matrix);
  const tr = traceRe(w);
  const rho = math.divide(w, tr) as Matrix;
  const rhoH = math.multiply(rho, h) as Matrix;
  const energy = traceRe(rhoH);
  const h2 = traceRe(math.multiply(rhoH, h) as Matrix);
  return { rho, lnZ: Math.log(tr) - beta * shift, energy, heatCapacity: beta * beta * (h2 - energy * energy) };
}

/** U = e^{−iHt} by mathjs expm. */
export function denseUnitary(h: Matrix, t: number): Matrix {
  return math.expm(math.multiply(math.complex(0, -t), h) as Matrix);
}

/** Re Tr(ρ U† O U) for each operator O. */
export function heisenbergExpectations(rho: Matrix, u: Matrix, ops: readonly Matrix[]): number[] {
  const rhoT = math.multiply(math.multiply(u, rho), math.ctranspose(u)) as Matrix;
  return ops.map((o) => traceRe(math.multiply(rhoT, o) as Matrix));
}
