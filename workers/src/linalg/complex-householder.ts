/**
 * complexHouseholder — generate an elementary reflector H = I − τ·v·vᴴ (v₀ = 1) with
 *   Hᴴ·(α, x₁, …, x_{n−1})ᵀ = (β, 0, …, 0)ᵀ,   β REAL.
 * Mirrors LAPACK zlarfg: β = −sign(Re α)·‖(α, x)‖₂, τ = (β − Re α)/β − i·Im α/β,
 * v_k = x_k/(α − β). When x = 0 and α is real, τ = 0 (H = I). Because β is real, a
 * Householder reduction built from these reflectors yields a REAL tridiagonal matrix
 * (hermitian-tridiagonalize.ts) — no extra diagonal phase transform is needed.
 *
 * Source: LAPACK 3.x zlarfg (Anderson et al., LAPACK Users' Guide, 3rd ed., SIAM 1999, §5.4).
 * Cost: ~6n flops for the norm (two passes, scaled against overflow) + 6n for the scaling of x;
 * no allocation.
 * Caveats: if |β| < SAFE_MINIMUM the vector is rescaled up (at most a few times) before τ is
 * formed, as in zlarfg; inputs must be finite (the checked drivers verify this).
 */

/** Smallest normal double divided by ε: below this |β| loses relative accuracy (zlarfg's safmin/eps). */
export const SAFE_MINIMUM = 2 ** -1022 / Number.EPSILON;
const SAFE_MINIMUM_INVERSE = 1 / SAFE_MINIMUM;
/** Most rescaling rounds for tiny vectors (zlarfg loops until |β| ≥ safmin; 20 covers every double). */
const MAX_RESCALES = 20;

/** ‖x‖₂ over `count` complex entries at double offset `off`, scaled to avoid overflow/underflow. */
function scaledNorm(a: Float64Array, off: number, count: number): number {
  let big = 0;
  const end = off + 2 * count;
  for (let k = off; k < end; k++) {
    const v = Math.abs(a[k]);
    if (v > big) big = v;
  }
  if (big === 0) return 0;
  const inv = 1 / big;
  let sum = 0;
  for (let k = off; k < end; k++) {
    const v = a[k] * inv;
    sum += v * v;
  }
  return big * Math.sqrt(sum);
}

/** √(a² + b² + c²) without overflow. */
function hypot3(a: number, b: number, c: number): number {
  const m = Math.max(Math.abs(a), Math.abs(b), Math.abs(c));
  if (m === 0) return 0;
  const x = a / m, y = b / m, z = c / m;
  return m * Math.sqrt(x * x + y * y + z * z);
}

/**
 * In place on a[off .. off + 2n): on entry (α, x₁, …, x_{n−1}) complex interleaved; on return
 * (β, v₁, …, v_{n−1}) with Im β = 0. Writes τ to tau[tauOff] (re) and tau[tauOff + 1] (im).
 * Unchecked kernel: n ≥ 1 and the ranges must lie inside the arrays.
 */
export function complexHouseholder(n: number, a: Float64Array, off: number, tau: Float64Array, tauOff: number): void {
  let alphr = a[off];
  let alphi = a[off + 1];
  let xnorm = n > 1 ? scaledNorm(a, off + 2, n - 1) : 0;
  if (xnorm === 0 && alphi === 0) {
    tau[tauOff] = 0;
    tau[tauOff + 1] = 0;
    return;
  }
  let beta = -Math.sign(alphr || 1) * hypot3(alphr, alphi, xnorm);
  let rescales = 0;
  if (Math.abs(beta) < SAFE_MINIMUM) {
    // Tiny vector: scale up until β is safely normal (zlarfg), then undo on β at the end.
    const end = off + 2 * n;
    do {
      rescales++;
      for (let k = off + 2; k < end; k++) a[k] *= SAFE_MINIMUM_INVERSE;
      beta *= SAFE_MINIMUM_INVERSE;
      alphr *= SAFE_MINIMUM_INVERSE;
      alphi *= SAFE_MINIMUM_INVERSE;
    } while (Math.abs(beta) < SAFE_MINIMUM && rescales < MAX_RESCALES);
    xnorm = n > 1 ? scaledNorm(a, off + 2, n - 1) : 0;
    beta = -Math.sign(alphr || 1) * hypot3(alphr, alphi, xnorm);
  }
  tau[tauOff] = (beta - alphr) / beta;
  tau[tauOff + 1] = -alphi / beta;
  // scale = 1/(α − β), by Smith's algorithm (robust complex division, as zladiv).
  const cr = alphr - beta;
  const ci = alphi;
  let sr: number;
  let si: number;
  if (Math.abs(ci) <= Math.abs(cr)) {
    const r = ci / cr;
    const den = cr + ci * r;
    sr = 1 / den;
    si = -r / den;
  } else {
    const r = cr / ci;
    const den = cr * r + ci;
    sr = r / den;
    si = -1 / den;
  }
  const end = off + 2 * n;
  for (let k = off + 2; k < end; k += 2) {
    const xr = a[k], xi = a[k + 1];
    a[k] = sr * xr - si * xi;
    a[k + 1] = sr * xi + si * xr;
  }
  for (let j = 0; j < rescales; j++) beta *= SAFE_MINIMUM;
  a[off] = beta;
  a[off + 1] = 0;
}
