/**
 * Test-only dense reference for small spin chains (L ≤ 7): thermal ln Z, E, C and quench
 * expectations ⟨O⟩(t) = Re Tr(e^{−βH0}U†OU)/Z, U = e^{−iH1t}, by exact diagonalisation.
 * Independent of the engine's numerics: Hamiltonians are built from the Pauli matrices
 * (DESIGN.md §2: site i = bit i, P|s⟩ = i^{|x∧z|}(−1)^{|s∧z|}|s⊕x⟩ with x = X/Y sites, z = Z/Y
 * sites), a complex Hermitian H = Hr + iHi is embedded as the real symmetric
 * φ(H) = [[Hr, −Hi], [Hi, Hr]] (φ is an algebra homomorphism: φ(f(H)) = f(φ(H)), traces
 * double), and φ(H) is diagonalised by the cyclic Jacobi method of
 * tests/support/reference/jacobi-eigen.ts (Golub & Van Loan §8.5). Common practice.
 * φ(e^{−iHt}) = cos(φ(H)t) + φ(−i)·sin(φ(H)t), φ(−i) = [[0, 1], [−1, 0]].
 */
import { symmetricEigen } from '../../support/reference/jacobi-eigen.js';

/** A weighted Pauli word such as { weight: −1, word: 'Z0 Z1' }. */
export interface DenseTerm {
  weight: number;
  word: string;
}

/** x/z masks and the phase power of i of a Pauli word. */
export function pauliMasks(word: string): { x: number; z: number; y: number } {
  let x = 0, z = 0, y = 0;
  for (const tok of word.trim().split(/\s+/).filter(Boolean)) {
    const m = /^([XYZ])(\d+)$/.exec(tok);
    if (!m) throw new RangeError(`bad factor ${tok}`);
    const bit = 1 << Number(m[2]);
    if (m[1] !== 'Z') x |= bit;
    if (m[1] !== 'X') z |= bit;
    if (m[1] === 'Y') y++;
  }
  return { x, z, y };
}

function popcount(v: number): number {
  let c = 0;
  while (v) { v &= v - 1; c++; }
  return c;
}

/** Complex phase i^y · (−1)^{|s∧z|} as [re, im]. */
function phase(y: number, s: number, z: number): [number, number] {
  const sign = popcount(s & z) % 2 === 0 ? 1 : -1;
  switch (y % 4) {
    case 0: return [sign, 0];
    case 1: return [0, sign];
    case 2: return [-sign, 0];
    default: return [0, -sign];
  }
}

/** φ(H) for H = Σ w P on L sites (size D = d, or 2d when H has an odd number of Y's somewhere). */
export function embeddedHamiltonian(terms: readonly DenseTerm[], L: number, complex: boolean): number[][] {
  const d = 2 ** L;
  const D = complex ? 2 * d : d;
  const h = Array.from({ length: D }, () => new Array<number>(D).fill(0));
  for (const { weight, word } of terms) {
    const { x, z, y } = pauliMasks(word);
    for (let s = 0; s < d; s++) {
      const [re, im] = phase(y, s, z);
      const r = s ^ x;
      if (!complex) {
        if (im !== 0) throw new RangeError('embeddedHamiltonian: imaginary entry in a real Hamiltonian');
        h[r][s] += weight * re;
      } else {
        h[r][s] += weight * re;
        h[r + d][s + d] += weight * re;
        h[r + d][s] += weight * im;
        h[r][s + d] -= weight * im;
      }
    }
  }
  return h;
}

/** True when the word has an odd number of Y factors (imaginary matrix). */
export function isImaginary(word: string): boolean {
  return pauliMasks(word).y % 2 === 1;
}

function matmul(a: number[][], b: number[][]): number[][] {
  const n = a.length;
  const out = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    const oi = out[i];
    for (let k = 0; k < n; k++) {
      const aik = a[i][k];
      if (aik === 0) continue;
      const bk = b[k];
      for (let j = 0; j < n; j++) oi[j] += aik * bk[j];
    }
  }
  return out;
}

function transpose(a: number[][]): number[][] {
  return a[0].map((_, j) => a.map((row) => row[j]));
}

/** V·diag(f)·Vᵀ. */
function spectral(vectors: number[][], f: number[]): number[][] {
  const n = f.length;
  const vf = vectors.map((row) => row.map((v, k) => v * f[k]));
  void n;
  return matmul(vf, transpose(vectors));
}

/** Re Tr(ρ O) from the real and imaginary parts of ρ (d × d each). */
function expectation(rr: number[][], ri: number[][], word: string, L: number): number {
  const d = 2 ** L;
  const { x, z, y } = pauliMasks(word);
  let acc = 0;
  for (let s = 0; s < d; s++) {
    // (ρO)_ss = ρ[s][s⊕x]·O[s⊕x][s].
    const u = s ^ x;
    const [ore, oim] = phase(y, s, z);
    acc += rr[s][u] * ore - ri[s][u] * oim;
  }
  return acc;
}

/** Inputs of {@link denseQuench}. */
export interface DenseQuenchInput {
  L: number;
  h0: DenseTerm[];
  h1: DenseTerm[];
  betas: number[];
  times: number[];
  /** Pauli words to measure. */
  observables: string[];
}

/** Thermodynamics per β and values[b][t][o]. */
export interface DenseQuench {
  thermo: Array<{ lnZ: number; energy: number; heatCapacity: number }>;
  values: number[][][];
}

/** Exact thermal quench by diagonalisation (see the file header). */
export function denseQuench(input: DenseQuenchInput): DenseQuench {
  const { L, h0, h1, betas, times, observables } = input;
  const complex = [...h0, ...h1].some((t) => isImaginary(t.word));
  const kappa = complex ? 2 : 1;
  const e0 = symmetricEigen(embeddedHamiltonian(h0, L, complex));
  const sameH = JSON.stringify(h0) === JSON.stringify(h1);
  const e1 = sameH ? e0 : symmetricEigen(embeddedHamiltonian(h1, L, complex));
  const d = 2 ** L;
  const lmin = Math.min(...e0.values);
  const thermo: DenseQuench['thermo'] = [];
  const values: number[][][] = [];
  // φ(−i) for the complex embedding.
  const minusI = (m: number[][]) => {
    // φ(−i)·M with φ(−i) = [[0, 1], [−1, 0]] blocks: rows [M_bottom; −M_top].
    return m.map((_, r) => (r < d ? m[r + d].slice() : m[r - d].map((v) => -v)));
  };
  for (const beta of betas) {
    const w = e0.values.map((l) => Math.exp(-beta * (l - lmin)));
    const zsum = w.reduce((a, b) => a + b, 0);
    const e = e0.values.reduce((s, l, k) => s + l * w[k], 0) / zsum;
    const e2 = e0.values.reduce((s, l, k) => s + l * l * w[k], 0) / zsum;
    thermo.push({ lnZ: Math.log(zsum / kappa) - beta * lmin, energy: e, heatCapacity: beta * beta * (e2 - e * e) });
    const rho = spectral(e0.vectors, w.map((v) => v / zsum * kappa));
    const perTime: number[][] = [];
    for (const t of times) {
      const c = spectral(e1.vectors, e1.values.map((l) => Math.cos(l * t)));
      const s = spectral(e1.vectors, e1.values.map((l) => Math.sin(l * t)));
      // φ(U) = C + φ(−i)S (real case: U = C − iS handled as ρ(t) = CρC + SρS).
      let rr: number[][];
      let ri: number[][];
      if (complex) {
        const ms = minusI(s);
        const u = c.map((row, i) => row.map((v, j) => v + ms[i][j]));
        const rt = matmul(matmul(u, rho), transpose(u));
        rr = rt.slice(0, d).map((row) => row.slice(0, d));
        ri = rt.slice(d).map((row) => row.slice(0, d));
      } else {
        // U = C − iS: UρU† = CρC + SρS + i(CρS − SρC).
        const a = matmul(matmul(c, rho), c);
        const b = matmul(matmul(s, rho), s);
        const p = matmul(matmul(c, rho), s);
        const q = matmul(matmul(s, rho), c);
        rr = a.map((row, i) => row.map((v, j) => v + b[i][j]));
        ri = p.map((row, i) => row.map((v, j) => v - q[i][j]));
      }
      perTime.push(observables.map((o) => expectation(rr, ri, o, L)));
    }
    values.push(perTime);
  }
  return { thermo, values };
}
