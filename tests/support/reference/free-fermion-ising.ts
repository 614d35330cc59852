/**
 * Reference-only free-fermion solution of the OPEN transverse-field Ising chain
 *
 *   H = −J Σ_{i=0}^{L−2} Z_i Z_{i+1} − h Σ_{i=0}^{L−1} X_i      (Pauli matrices, DESIGN.md §2)
 *
 * at inverse temperature β, and its real-time evolution after a field quench h0 → h1.
 * Sources: Lieb, Schultz & Mattis, Ann. Phys. 16, 407 (1961); Pfeuty, Ann. Phys. 57, 79 (1970).
 * The derivation below is ours (written for this file), with X playing the role of the
 * "occupation" direction; it is verified numerically against dense matrices in
 * tests/reference/free-fermion-reference.test.ts.
 *
 * Jordan–Wigner with strings of X:
 *   a_j = (Π_{k<j} X_k) Z_j,   b_j = (Π_{k<j} X_k) Y_j,
 * Hermitian, square to 1, pairwise anticommuting. Then (ZY = −iX, YX = −iZ)
 *   a_j b_j = Z_j Y_j = −i X_j                  ⇒  X_j = i a_j b_j,
 *   b_j a_{j+1} = Y_j X_j Z_{j+1} = −i Z_j Z_{j+1}  ⇒  Z_j Z_{j+1} = i b_j a_{j+1}.
 * On the open chain there is no boundary string, so H is exactly quadratic (no parity sectors).
 *
 * With c = (a_0, b_0, a_1, b_1, …), c_{2j} = a_j, c_{2j+1} = b_j, write H = (i/4) Σ_mn A_mn c_m c_n,
 * A real antisymmetric (2L × 2L):  A_{2j,2j+1} = −2h,  A_{2j+1,2j+2} = −2J  (and A_nm = −A_mn).
 *
 * Covariance Γ_mn = (i/2)⟨[c_m, c_n]⟩ (real antisymmetric), so for m ≠ n, Γ_mn = i⟨c_m c_n⟩ and
 *   ⟨X_j⟩ = Γ_{2j,2j+1},  ⟨Z_j Z_{j+1}⟩ = Γ_{2j+1,2j+2},  ⟨H⟩ = ¼ Σ A_mn Γ_mn.
 *
 * Thermal state: block-diagonalising A = O (⊕_k ε_k [[0,1],[−1,0]]) Oᵀ (ε_k ≥ 0) gives
 * H = Σ_k (ε_k/2) P_k with commuting P_k = ±1, hence
 *   ln Z = Σ_k ln(2 cosh(βε_k/2)),  E = −Σ_k (ε_k/2) tanh(βε_k/2),
 *   C = β² Σ_k (ε_k/2)² sech²(βε_k/2),
 *   Γ(β) = −A · g(AᵀA),  g(s) = tanh(β√s/2)/√s  (g(0) = β/2).
 * AᵀA = −A² is real symmetric with eigenvalues ε_k² (each twice): one real symmetric
 * eigen-decomposition (Jacobi, ./jacobi-eigen.ts) gives everything, degeneracies included.
 *
 * Dynamics (Heisenberg picture, ħ = 1): i[H, c_m] = Σ_n A_mn c_n, so c(t) = R(t) c with
 *   R(t) = e^{A t} = cos(t√S) + A sin(t√S)/√S,   S = AᵀA,
 * and Γ(t) = R(t) Γ(β) R(t)ᵀ, using the quench Hamiltonian's A1 in R.
 *
 * Cost: O(L³) per β and per time. Reference use only (L ≲ 100).
 */
import { symmetricEigen } from './jacobi-eigen.js';

/** Couplings of the open chain H = −J Σ Z_i Z_{i+1} − h Σ X_i. */
export interface OpenTfimChain {
  /** Number of sites L ≥ 1. */
  length: number;
  /** Ising coupling J (default sign: ferromagnetic for J > 0). */
  J: number;
  /** Transverse field h along X. */
  h: number;
}

type Mat = number[][];

function zeros(n: number): Mat {
  return Array.from({ length: n }, () => new Array<number>(n).fill(0));
}

function matmul(x: Mat, y: Mat): Mat {
  const n = x.length;
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    const oi = out[i];
    for (let k = 0; k < n; k++) {
      const xik = x[i][k];
      if (xik === 0) continue;
      const yk = y[k];
      for (let j = 0; j < n; j++) oi[j] += xik * yk[j];
    }
  }
  return out;
}

function transpose(x: Mat): Mat {
  return x[0] === undefined ? [] : x[0].map((_, j) => x.map((row) => row[j]));
}

/** V diag(f(λ)) Vᵀ for a symmetric eigen-decomposition. */
function spectralFunction(vectors: Mat, values: number[], f: (lambda: number) => number): Mat {
  const n = values.length;
  const fv = values.map(f);
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += vectors[i][k] * fv[k] * vectors[j][k];
      out[i][j] = s;
      out[j][i] = s;
    }
  }
  return out;
}

/** Below this, √s is treated by its Taylor series (s = ε² is ≥ 0 up to rounding). */
const SMALL_EIGENVALUE = 1e-12;

/** The 2L × 2L real antisymmetric matrix A of H = (i/4) cᵀ A c (Majorana order a_0, b_0, a_1, …). */
export function majoranaMatrix(chain: OpenTfimChain): Mat {
  const { length: L, J, h } = chain;
  if (!Number.isInteger(L) || L < 1) throw new RangeError(`majoranaMatrix: length must be a positive integer, got ${L}`);
  const a = zeros(2 * L);
  for (let j = 0; j < L; j++) {
    a[2 * j][2 * j + 1] = -2 * h;
    a[2 * j + 1][2 * j] = 2 * h;
    if (j + 1 < L) {
      a[2 * j + 1][2 * j + 2] = -2 * J;
      a[2 * j + 2][2 * j + 1] = 2 * J;
    }
  }
  return a;
}

/** Thermodynamics of H0 at β: ln Z (Z = Tr e^{−βH0} over 2^L states), E and C, plus the modes ε_k ≥ 0. */
export interface FreeFermionThermo {
  lnZ: number;
  energy: number;
  heatCapacity: number;
  /** Single-particle energies ε_k (ascending), L of them. */
  modes: number[];
}

/** Thermal covariance Γ(β) and thermodynamics of one open chain. */
export function thermalState(chain: OpenTfimChain, beta: number): { gamma: Mat; thermo: FreeFermionThermo } {
  const a = majoranaMatrix(chain);
  const s = matmul(transpose(a), a);
  const { values, vectors } = symmetricEigen(s);
  // Eigenvalues of AᵀA come in equal pairs ε_k²: take every second one of the sorted list.
  const modes: number[] = [];
  for (let k = 0; k < values.length; k += 2) modes.push(Math.sqrt(Math.max(0, 0.5 * (values[k] + values[k + 1]))));
  let lnZ = 0, energy = 0, heatCapacity = 0;
  for (const e of modes) {
    const x = 0.5 * beta * e;
    // ln(2 cosh x) = |x| + ln(1 + e^{−2|x|}), stable for large βε.
    lnZ += Math.abs(x) + Math.log1p(Math.exp(-2 * Math.abs(x)));
    energy -= 0.5 * e * Math.tanh(x);
    const sech = 1 / Math.cosh(x);
    heatCapacity += x * x * sech * sech;
  }
  const g = spectralFunction(vectors, values, (lam) => {
    const e = Math.sqrt(Math.max(0, lam));
    if (e < SMALL_EIGENVALUE) return 0.5 * beta;
    return Math.tanh(0.5 * beta * e) / e;
  });
  const gamma = matmul(a, g).map((row) => row.map((v) => -v));
  return { gamma, thermo: { lnZ, energy, heatCapacity, modes } };
}

/** R(t) = e^{A t} for a real antisymmetric A, via the spectral decomposition of S = AᵀA. */
export function majoranaPropagator(a: Mat, t: number): Mat {
  const s = matmul(transpose(a), a);
  const { values, vectors } = symmetricEigen(s);
  const cos = spectralFunction(vectors, values, (lam) => Math.cos(t * Math.sqrt(Math.max(0, lam))));
  const sinc = spectralFunction(vectors, values, (lam) => {
    const w = Math.sqrt(Math.max(0, lam));
    return w < SMALL_EIGENVALUE ? t : Math.sin(t * w) / w;
  });
  const as = matmul(a, sinc);
  return cos.map((row, i) => row.map((v, j) => v + as[i][j]));
}

/** Γ(t) = R Γ Rᵀ. */
export function evolveCovariance(gamma: Mat, propagator: Mat): Mat {
  return matmul(matmul(propagator, gamma), transpose(propagator));
}

/** ⟨X_j⟩ from a covariance. */
export function siteX(gamma: Mat, j: number): number {
  return gamma[2 * j][2 * j + 1];
}

/** ⟨Z_j Z_{j+1}⟩ from a covariance. */
export function bondZZ(gamma: Mat, j: number): number {
  return gamma[2 * j + 1][2 * j + 2];
}

/** ⟨H⟩ = ¼ Σ A_mn Γ_mn for the Hamiltonian whose Majorana matrix is `a`. */
export function majoranaEnergy(a: Mat, gamma: Mat): number {
  let e = 0;
  for (let m = 0; m < a.length; m++) for (let n = 0; n < a.length; n++) e += a[m][n] * gamma[m][n];
  return 0.25 * e;
}

/** Result of one finite-β field quench h0 → h1 on the open chain. */
export interface OpenTfimQuench {
  thermo: FreeFermionThermo;
  /** x[t][j] = ⟨X_j⟩(t). */
  x: number[][];
  /** zz[t][j] = ⟨Z_j Z_{j+1}⟩(t), j = 0 … L−2. */
  zz: number[][];
  /** ⟨H1⟩(t) (must be constant: a built-in check). */
  h1Energy: number[];
}

/**
 * Thermal state of H0 = (J, h0) at β, then ⟨X_j⟩(t), ⟨Z_jZ_{j+1}⟩(t) under H1 = (J, h1) at each time.
 */
export function openTfimQuench(
  params: { length: number; J: number; h0: number; h1: number; beta: number; times: readonly number[] },
): OpenTfimQuench {
  const { length: L, J, h0, h1, beta, times } = params;
  const { gamma, thermo } = thermalState({ length: L, J, h: h0 }, beta);
  const a1 = majoranaMatrix({ length: L, J, h: h1 });
  const x: number[][] = [], zz: number[][] = [], h1Energy: number[] = [];
  for (const t of times) {
    const g = evolveCovariance(gamma, majoranaPropagator(a1, t));
    x.push([...Array(L).keys()].map((j) => siteX(g, j)));
    zz.push([...Array(Math.max(0, L - 1)).keys()].map((j) => bondZZ(g, j)));
    h1Energy.push(majoranaEnergy(a1, g));
  }
  return { thermo, x, zz, h1Energy };
}
