/**
 * mpoSquareNorm — ‖W·ψ‖² = ⟨ψ|W†W|ψ⟩ for a local MPO W (local-mpo.ts) and a purified MPS,
 * by a left-to-right double-layer contraction (no gauge assumed):
 *
 *   F_{i+1}[m', n'] = Σ_{e1: m→m', e2: n→n'} (O_{e1}·A_i)ᴴ-contracted with F_i[m, n]·(O_{e2}·A_i),
 *
 * F_0 = [[1]], result F_L[0, 0]. Used for the energy variance (W = H0 ⊗ 1 − E) and the
 * stationarity residual (W = K = H1 ⊗ 1 − 1 ⊗ H1ᵀ when H1 = H0). Standard MPO contraction
 * (McCulloch 2007). Cost per site ≈ (#entries·D + #entries²)·64·χ³ flops; memory 2·D²·χ²
 * complex for the environments.
 */
import { complexGemmUnchecked } from '../../tensor/complex-gemm.js';
import type { LocalMpo } from './local-mpo.js';
import { LOCAL_DIM } from './local-operators.js';
import type { PurifiedMps } from './purified-mps.js';

function applyLocal(op: Float64Array, a: Float64Array, chiL: number, chiR: number): Float64Array {
  const out = new Float64Array(2 * chiL * LOCAL_DIM * chiR);
  for (let al = 0; al < chiL; al++) {
    for (let p = 0; p < LOCAL_DIM; p++) {
      const o = 2 * (al * LOCAL_DIM + p) * chiR;
      for (let pp = 0; pp < LOCAL_DIM; pp++) {
        const gr = op[2 * (p * LOCAL_DIM + pp)];
        const gi = op[2 * (p * LOCAL_DIM + pp) + 1];
        if (gr === 0 && gi === 0) continue;
        const io = 2 * (al * LOCAL_DIM + pp) * chiR;
        for (let be = 0; be < 2 * chiR; be += 2) {
          out[o + be] += gr * a[io + be] - gi * a[io + be + 1];
          out[o + be + 1] += gr * a[io + be + 1] + gi * a[io + be];
        }
      }
    }
  }
  return out;
}

/**
 * ⟨ψ|W†W|ψ⟩ (real part; the imaginary part is rounding).
 * @throws RangeError if the MPO and the state have different lengths.
 */
export function mpoSquareNorm(mps: PurifiedMps, mpo: LocalMpo): number {
  if (mpo.sites !== mps.sites) throw new RangeError(`mpoSquareNorm: the MPO has ${mpo.sites} sites, the state ${mps.sites}`);
  let env: (Float64Array | null)[] = [new Float64Array([1, 0])];
  for (let i = 0; i < mps.sites; i++) {
    const chiL = mps.dims[i];
    const chiR = mps.dims[i + 1];
    const dl = mpo.dims[i];
    const dr = mpo.dims[i + 1];
    const a = mps.tensors[i];
    const entries = mpo.entries[i];
    const bs = entries.map((e) => applyLocal(e.op, a, chiL, chiR));
    const next: (Float64Array | null)[] = Array.from({ length: dr * dr }, () => null);
    const t = new Float64Array(2 * chiL * LOCAL_DIM * chiR);
    for (let e2 = 0; e2 < entries.length; e2++) {
      const n = entries[e2].from;
      const nn = entries[e2].to;
      for (let m = 0; m < dl; m++) {
        const f = env[m * dl + n];
        if (f === null) continue;
        complexGemmUnchecked('N', chiL, LOCAL_DIM * chiR, chiL, f, chiL, bs[e2], LOCAL_DIM * chiR, t, LOCAL_DIM * chiR, false);
        for (let e1 = 0; e1 < entries.length; e1++) {
          if (entries[e1].from !== m) continue;
          const key = entries[e1].to * dr + nn;
          let g = next[key];
          if (g === null) {
            g = new Float64Array(2 * chiR * chiR);
            next[key] = g;
          }
          complexGemmUnchecked('C', chiR, chiR, LOCAL_DIM * chiL, bs[e1], chiR, t, chiR, g, chiR, true);
        }
      }
    }
    env = next;
  }
  const last = env[0];
  return last === null ? 0 : last[0];
}
