/**
 * gaussianComponents — the Gaussian components whose weighted sum is the thermal state at one β,
 * each as a covariance in the mode basis of H1 (so the quench is a rotation of mode pairs):
 *
 *   Γ(t) = F(t)·Γ''·F(t)ᵀ,  F(t) = O1·E(t)  (rotate-mode-pairs.ts),  Γ'' = W·Γ'₀·Wᵀ,  W = O1ᵀO0,
 *
 * where Γ'₀ = ⊕_k d_k J in the mode basis of H0 and Γ_mn = (i/2)⟨[c_m, c_n]⟩. Heisenberg
 * evolution c(t) = e^{A1 t}c (from i[H1, c_m] = Σ_n A1_mn c_n) gives Γ(t) = e^{A1t}Γ(0)e^{A1t}ᵀ.
 *
 * - thermal ("plain"), weight u_p: d_k = −tanh(βε_k/2) (⟨n_k⟩ = −tanh x_k);
 * - twisted (rings only), weight v_p = u_p q_p Π_k τ_k: d_k = −coth(βε_k/2), the normalised
 *   P·e^{−βH_p}; Wick's theorem holds for it too (it is a product of (1 + g_k n_k)/2 factors,
 *   polynomial in the g_k). Modes with τ_k < TAU_SPLIT (near-zero βε_k, where coth blows up)
 *   are NOT put into Γ'': they are carried exactly by a bordered Pfaffian
 *     Π_{k∈Z} τ_k · Pf(Γ̃_sub) = Pf([[⊕_{k∈Z} τ_k J, Q_Zᵀ], [−Q_Z, C]]),  Q_Z = F·W_Z (rows),
 *   (Schur complement: Pf([[A, B], [−Bᵀ, C]]) = Pf(A)·Pf(C + BᵀA⁻¹B); derived here), so
 *   v_p·Pf(Γ̃_sub) = u_p q_p Π_{k∉Z} τ_k · Pf(bordered) has no 0·∞ even at β = 0.
 *   A twisted component is skipped when the rigorous bound of twisted-bound.ts puts its
 *   contribution below TWISTED_SKIP for every string measured; the bound is then added to
 *   the error estimate.
 * Cost per component: 2n³ flops (Γ'' = (WΓ'₀)Wᵀ) when W ≠ 1; n³/4 when W is chiral
 * (sector-modes.ts: only the L × L block G = Wu·diag(d)·Wvᵀ is non-zero); O(n) when W = 1 (Γ'' = Γ'₀
 * kept as its 2 × 2 blocks). Memory: n² doubles per dense component, n²/4 per chiral one.
 */
import { gemmUnchecked } from '../../linalg/gemm.js';
import type { SectorModes } from './sector-modes.js';
import type { SectorThermo } from './sector-thermo.js';
import { logTwistedBounds } from './twisted-bound.js';

/** Modes with tanh(βε/2) below this go into the bordered part of a twisted component. */
export const TAU_SPLIT = 0.5;
/** A twisted component whose contribution is provably below this is skipped. */
export const TWISTED_SKIP = 1e-18;

/**
 * A covariance Γ'' in the H1 mode basis: its 2 × 2 blocks (W = 1), chiral (only
 * Γ''[2k][2k'+1] = G[k][k'] = (Wu·diag(d)·Wvᵀ)[k][k'] and its mirror are non-zero; L × L), or dense.
 */
export type ModeCovariance =
  | { readonly kind: 'blocks'; readonly d: Float64Array }
  | { readonly kind: 'chiral'; readonly g: Float64Array }
  | { readonly kind: 'dense'; readonly g: Float64Array };

/** One Gaussian component. */
export interface GaussianComponent {
  /** Index of the sector (0: p = +1 or no sectors; 1: p = −1). */
  readonly sector: number;
  readonly twisted: boolean;
  /** Sign of the weight. */
  readonly weightSign: number;
  /** ln |weight| (for a twisted component: of u_p Π_{k∉Z} τ_k, the bordered Pfaffian supplies the rest). */
  readonly logWeight: number;
  /** Γ'' (the R part for a twisted component). */
  readonly covariance: ModeCovariance;
  /** τ_k of the bordered modes (twisted only; empty otherwise). */
  readonly borderTau: Float64Array;
  /** W_Z: n × 2|Z| columns (2k, 2k+1 of W for k ∈ Z), row-major; null when W = 1 (then the columns are unit vectors). */
  readonly borderW: Float64Array | null;
  /** The bordered modes' indices k (used when borderW is null). */
  readonly borderModes: Int32Array;
  /** Largest |d_k| in Γ'' (1 for thermal; ≤ coth of TAU_SPLIT's argument for twisted). */
  readonly scale: number;
}

/** Components at one β, and the error allowance for skipped twisted components. */
export interface ComponentSet {
  readonly components: GaussianComponent[];
  /** skipped[r] = Σ over skipped twisted components of the bound for a 2r-Majorana string. */
  readonly skipped: Float64Array;
}

function modeCovariance(d: Float64Array, sec: SectorModes, n: number, work: Float64Array): ModeCovariance {
  const w = sec.w;
  if (sec.wChiral !== null) {
    // G = Wu·diag(d)·Wvᵀ (Γ''[2k][2k'+1] = Σ_l W[2k][2l]·d_l·W[2k'+1][2l+1]).
    const m = n / 2;
    const { wu, wv } = sec.wChiral;
    for (let r = 0; r < m; r++) for (let l = 0; l < m; l++) work[r * m + l] = wu[r * m + l] * d[l];
    const g = new Float64Array(m * m);
    gemmUnchecked(false, true, m, m, m, 1, work, m, wv, m, 0, g, m);
    return { kind: 'chiral', g };
  }
  if (w === null) return { kind: 'blocks', d };
  // X = W·Γ'₀: X[:, 2k] = −d_k W[:, 2k+1], X[:, 2k+1] = d_k W[:, 2k]; then Γ'' = X·Wᵀ.
  const m = n / 2;
  for (let r = 0; r < n; r++) {
    const o = r * n;
    for (let k = 0; k < m; k++) {
      const a = w[o + 2 * k];
      const b = w[o + 2 * k + 1];
      work[o + 2 * k] = -d[k] * b;
      work[o + 2 * k + 1] = d[k] * a;
    }
  }
  const g = new Float64Array(n * n);
  gemmUnchecked(false, true, n, n, n, 1, work, n, w, n, 0, g, n);
  return { kind: 'dense', g };
}

/**
 * The components at inverse temperature β for the strings measured (rMax = largest half-length
 * 2r/2 of any Pfaffian evaluated).
 */
export function gaussianComponents(
  sectors: readonly SectorModes[], thermo: SectorThermo, beta: number, rMax: number,
): ComponentSet {
  const n = sectors[0].h0.schur.n;
  const m = n / 2;
  const work = sectors.some((s) => s.w !== null || s.wChiral !== null) ? new Float64Array(n * n) : new Float64Array(0);
  const components: GaussianComponent[] = [];
  const skipped = new Float64Array(rMax + 1);
  sectors.forEach((sec, idx) => {
    const weights = thermo.sectors[idx];
    const eps = sec.h0.schur.eps;
    const tau = new Float64Array(m);
    for (let k = 0; k < m; k++) tau[k] = Math.tanh(0.5 * beta * eps[k]);
    const d = new Float64Array(m);
    for (let k = 0; k < m; k++) d[k] = -tau[k];
    if (weights.plain > 0) {
      components.push({
        sector: idx, twisted: false, weightSign: 1, logWeight: Math.log(weights.plain),
        covariance: modeCovariance(d, sec, n, work), borderTau: new Float64Array(0), borderW: null,
        borderModes: new Int32Array(0), scale: 1,
      });
    }
    if (sectors.length === 1 || weights.plain === 0) return;
    // Twisted component: skip when provably negligible for every string measured.
    const bounds = logTwistedBounds(tau, rMax);
    let worst = -Infinity;
    for (let r = 0; r <= rMax; r++) worst = Math.max(worst, bounds[r]);
    const logU = Math.log(weights.plain);
    if (logU + worst < Math.log(TWISTED_SKIP)) {
      for (let r = 0; r <= rMax; r++) skipped[r] += Math.exp(logU + bounds[r]);
      return;
    }
    const zModes: number[] = [];
    let logRest = logU;
    const dR = new Float64Array(m);
    let scale = 1;
    for (let k = 0; k < m; k++) {
      if (tau[k] < TAU_SPLIT) zModes.push(k);
      else {
        dR[k] = -1 / tau[k];
        scale = Math.max(scale, 1 / tau[k]);
        logRest += Math.log(tau[k]);
      }
    }
    const borderModes = Int32Array.from(zModes);
    const borderTau = Float64Array.from(zModes, (k) => tau[k]);
    let borderW: Float64Array | null = null;
    if ((sec.w !== null || sec.wChiral !== null) && zModes.length > 0) {
      const z2 = 2 * zModes.length;
      const m2 = n / 2;
      borderW = new Float64Array(n * z2);
      for (let r = 0; r < n; r++) {
        zModes.forEach((k, c) => {
          if (sec.w !== null) {
            borderW![r * z2 + 2 * c] = sec.w[r * n + 2 * k];
            borderW![r * z2 + 2 * c + 1] = sec.w[r * n + 2 * k + 1];
          } else if (r % 2 === 0) {
            borderW![r * z2 + 2 * c] = sec.wChiral!.wu[(r / 2) * m2 + k];
          } else {
            borderW![r * z2 + 2 * c + 1] = sec.wChiral!.wv[((r - 1) / 2) * m2 + k];
          }
        });
      }
    }
    components.push({
      sector: idx, twisted: true, weightSign: weights.q, logWeight: logRest,
      covariance: modeCovariance(dR, sec, n, work), borderTau, borderW, borderModes, scale,
    });
  });
  return { components, skipped };
}
