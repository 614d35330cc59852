/**
 * Test-only dense reference: complex 2^N × 2^N matrices of Pauli sums built directly from the
 * 2×2 Pauli matrices (DESIGN.md §2: site i = bit i, Z|0⟩ = +|0⟩, Y|0⟩ = i|1⟩, Y|1⟩ = −i|0⟩),
 * products, traces, and thermal/quench expectations through the matrix exponential of the
 * general-purpose library mathjs (`expm`). Independent of workers/src/series by construction.
 * Meant for N ≤ 6 (expm) and N ≤ 8 (products).
 */
import * as math from 'mathjs';

/** A dense complex matrix, row-major, split into real and imaginary parts. */
export interface Dense {
  readonly dim: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/** One weighted Pauli word such as { weight: 0.5, word: 'X0 Y3' }. */
export interface Word {
  readonly weight: number;
  readonly word: string;
}

/** Σ w·P as a dense matrix on n sites. */
export function dense(terms: readonly Word[], n: number): Dense {
  const dim = 2 ** n;
  const re = new Float64Array(dim * dim);
  const im = new Float64Array(dim * dim);
  for (const { weight, word } of terms) {
    const factors = word.trim().split(/\s+/).filter((t) => t).map((t) => [t[0], Number(t.slice(1))] as const);
    for (let s = 0; s < dim; s++) {
      let r = s, pr = 1, pi = 0;
      for (let f = factors.length - 1; f >= 0; f--) {
        const [letter, site] = factors[f];
        const bit = (r >> site) & 1;
        if (letter === 'X') r ^= 1 << site;
        else if (letter === 'Z') { if (bit) { pr = -pr; pi = -pi; } }
        else {
          // Y|0⟩ = i|1⟩, Y|1⟩ = −i|0⟩.
          r ^= 1 << site;
          const sgn = bit ? -1 : 1;
          [pr, pi] = [-sgn * pi, sgn * pr];
        }
      }
      re[r * dim + s] += weight * pr;
      im[r * dim + s] += weight * pi;
    }
  }
  return { dim, re, im };
}

/** A·B. */
export function mul(a: Dense, b: Dense): Dense {
  const d = a.dim;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let i = 0; i < d; i++) {
    for (let k = 0; k < d; k++) {
      const ar = a.re[i * d + k], ai = a.im[i * d + k];
      if (ar === 0 && ai === 0) continue;
      for (let j = 0; j < d; j++) {
        const br = b.re[k * d + j], bi = b.im[k * d + j];
        re[i * d + j] += ar * br - ai * bi;
        im[i * d + j] += ar * bi + ai * br;
      }
    }
  }
  return { dim: d, re, im };
}

/** Tr(A)/dim as [re, im]. */
export function normTrace(a: Dense): [number, number] {
  let r = 0, i = 0;
  for (let k = 0; k < a.dim; k++) { r += a.re[k * a.dim + k]; i += a.im[k * a.dim + k]; }
  return [r / a.dim, i / a.dim];
}

function toMath(a: Dense): math.Matrix {
  const rows: math.Complex[][] = [];
  for (let i = 0; i < a.dim; i++) {
    const row: math.Complex[] = [];
    for (let j = 0; j < a.dim; j++) row.push(math.complex(a.re[i * a.dim + j], a.im[i * a.dim + j]));
    rows.push(row);
  }
  return math.matrix(rows);
}

function fromMath(m: math.Matrix, dim: number): Dense {
  const re = new Float64Array(dim * dim);
  const im = new Float64Array(dim * dim);
  const arr = m.toArray() as unknown as Array<Array<math.Complex | number>>;
  for (let i = 0; i < dim; i++) {
    for (let j = 0; j < dim; j++) {
      const v = arr[i][j];
      if (typeof v === 'number') re[i * dim + j] = v;
      else { re[i * dim + j] = v.re; im[i * dim + j] = v.im; }
    }
  }
  return { dim, re, im };
}

/** exp(c·A) for a complex scalar c = (cr + i·ci), via mathjs expm. */
export function expScaled(a: Dense, cr: number, ci: number): Dense {
  const scaled: Dense = {
    dim: a.dim,
    re: a.re.map((v, k) => cr * v - ci * a.im[k]),
    im: a.im.map((v, k) => cr * v + ci * a.re[k]),
  };
  return fromMath(math.expm(toMath(scaled)) as math.Matrix, a.dim);
}

/** The conjugate transpose. */
export function dagger(a: Dense): Dense {
  const d = a.dim;
  const re = new Float64Array(d * d);
  const im = new Float64Array(d * d);
  for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) { re[j * d + i] = a.re[i * d + j]; im[j * d + i] = -a.im[i * d + j]; }
  return { dim: d, re, im };
}

/** ln Tr e^{−βH} and ⟨O(t)⟩_β = Tr(e^{−βH0} U† O U)/Z with U = e^{−iH1 t}. */
export function denseQuench(h0: Dense, h1: Dense, o: Dense, beta: number, t: number): { lnZ: number; value: number } {
  const rho = expScaled(h0, -beta, 0);
  const z = normTrace(rho)[0] * rho.dim;
  const u = expScaled(h1, 0, -t);
  const ot = mul(mul(dagger(u), o), u);
  const v = normTrace(mul(rho, ot))[0] * rho.dim / z;
  return { lnZ: Math.log(z), value: v };
}
