/**
 * Test support (not a test): dense forms of a purified MPS for small chains — the full 4^L
 * amplitude vector (site 0 = the most significant local index in the contraction order, which
 * the helpers below use consistently) and Pauli-string expectations on it.
 */
import type { PurifiedMps } from '../../../workers/src/engines/mps/purified-mps.js';
import type { PauliFactor } from '../../../workers/src/physics/pauli-word.js';

/** ψ[p_0, p_1, …, p_{L−1}] as a flat complex vector, index Σ p_i·4^{L−1−i}. */
export function denseVector(mps: PurifiedMps): Float64Array {
  let cur = new Float64Array([1, 0]);
  let rows = 1;
  for (let i = 0; i < mps.sites; i++) {
    const chiL = mps.dims[i];
    const chiR = mps.dims[i + 1];
    const t = mps.tensors[i];
    const next = new Float64Array(2 * rows * 4 * chiR);
    for (let r = 0; r < rows; r++) for (let a = 0; a < chiL; a++) {
      const cr = cur[2 * (r * chiL + a)];
      const ci = cur[2 * (r * chiL + a) + 1];
      if (cr === 0 && ci === 0) continue;
      for (let p = 0; p < 4; p++) for (let b = 0; b < chiR; b++) {
        const o = 2 * ((a * 4 + p) * chiR + b);
        const q = 2 * ((r * 4 + p) * chiR + b);
        next[q] += cr * t[o] - ci * t[o + 1];
        next[q + 1] += cr * t[o + 1] + ci * t[o];
      }
    }
    cur = next;
    rows *= 4;
  }
  return cur;
}

/** ⟨ψ|P ⊗ 1|ψ⟩/⟨ψ|ψ⟩ from the dense vector ([re, im]). */
export function denseExpectation(vec: Float64Array, sites: number, factors: readonly PauliFactor[]): [number, number] {
  const dim = 4 ** sites;
  let re = 0;
  let im = 0;
  let n2 = 0;
  for (let x = 0; x < dim; x++) {
    n2 += vec[2 * x] ** 2 + vec[2 * x + 1] ** 2;
    // (P ψ)[x] = Σ_y P[x, y] ψ[y]; P acts on the physical bit (p & 1) of each factor's site.
    let y = x;
    let cr = 1;
    let ci = 0;
    for (const f of factors) {
      const shift = 4 ** (sites - 1 - f.site);
      const p = Math.floor(x / shift) % 4;
      const s = p & 1;
      let mr = 1;
      let mi = 0;
      if (f.letter === 'X') y += (s === 0 ? 1 : -1) * shift;
      else if (f.letter === 'Z') mr = s === 0 ? 1 : -1;
      else {
        y += (s === 0 ? 1 : -1) * shift;
        mr = 0;
        mi = s === 0 ? -1 : 1; // Y[0,1] = −i, Y[1,0] = i
      }
      const tr = cr * mr - ci * mi;
      ci = cr * mi + ci * mr;
      cr = tr;
    }
    // ⟨ψ|x⟩·coef·⟨y|ψ⟩ summed: conj(ψ[x])·c·ψ[y]
    const pr = cr * vec[2 * y] - ci * vec[2 * y + 1];
    const pi = cr * vec[2 * y + 1] + ci * vec[2 * y];
    re += vec[2 * x] * pr + vec[2 * x + 1] * pi;
    im += vec[2 * x] * pi - vec[2 * x + 1] * pr;
  }
  return [re / n2, im / n2];
}
