/**
 * jacobiRows — one-sided (Hestenes) Jacobi orthogonalisation of the r rows of a complex
 * row-major array g (each row a vector of length m):
 *
 *   [g_0; …; g_{r−1}] ↦ rows that are mutually orthogonal, by plane rotations J_pq applied to
 *   pairs of rows; the same rotations are applied to the rows of w (length wn).
 *
 * Read the rows of g as the columns x_p of a matrix X (m×r). A rotation replaces
 *   x_p ← c·x_p − s·e^{−iφ}·x_q,   x_q ← s·x_p + c·e^{−iφ}·x_q,
 * with x_pᴴx_q = |g|·e^{iφ}, ζ = (‖x_q‖² − ‖x_p‖²)/(2|g|), t = sgn ζ/(|ζ| + √(1 + ζ²)),
 * c = 1/√(1 + t²), s = t·c (Golub & Van Loan, Matrix Computations, 4th ed., Alg. 8.5.1, after
 * the phase e^{−iφ} makes the 2×2 Gram block real). So X·J = U·Σ with J unitary: on
 * convergence the rows of g are σ_p·u_p and, when w starts as the identity, row p of w is
 * column p of J (the right singular vector of X belonging to σ_p).
 *
 * Mirrors LAPACK zgesvj (Drmač & Veselić, SIAM J. Matrix Anal. Appl. 29, 1322 and 1343
 * (2008)): row-cyclic sweeps, de Rijk's pivoting (before row p, the remaining row of largest
 * norm is swapped into place: de Rijk, SIAM J. Sci. Stat. Comput. 10, 359 (1989)), and the
 * convergence test |x_pᴴx_q| ≤ tol·‖x_p‖·‖x_q‖ with tol = √m·ε (zgesvj's CTOL). A sweep that
 * rotates nothing ends the iteration. Norms are recomputed in the rotation pass (no
 * downdating), so the test and the final σ are exact to rounding.
 *
 * Accuracy: high RELATIVE accuracy in every σ_p when X = D·Y with D diagonal and Y well
 * conditioned (Demmel & Veselić, SIAM J. Matrix Anal. Appl. 13, 1204 (1992)); in general
 * backward stable. Cost per sweep ≈ r²/2 pairs × (8m flops for x_pᴴx_q, + 20m + 14·wn when the
 * pair rotates); no allocation. Caveats: no scaling against overflow/underflow (rows with
 * norms beyond 1e±150 are not supported).
 */

/** Machine epsilon 2⁻⁵². */
const EPS = 2 ** -52;
/** zgesvj's limit on sweeps. */
export const MAX_JACOBI_SWEEPS = 30;

/**
 * Orthogonalises the rows of g (r rows, length m, leading dimension ldg) and applies the same
 * rotations to the rows of w (r rows, length wn, leading dimension ldw). `norms[p]` receives
 * ‖row p‖². Returns the number of sweeps, or −1 if MAX_JACOBI_SWEEPS did not converge.
 */
export function jacobiRowsUnchecked(
  r: number, m: number, g: Float64Array, ldg: number,
  wn: number, w: Float64Array, ldw: number, norms: Float64Array,
): number {
  const tol = Math.sqrt(m) * EPS;
  for (let p = 0; p < r; p++) {
    let s = 0;
    for (let k = 2 * p * ldg, e = 2 * (p * ldg + m); k < e; k++) s += g[k] * g[k];
    norms[p] = s;
  }
  for (let sweep = 1; sweep <= MAX_JACOBI_SWEEPS; sweep++) {
    let rotations = 0;
    for (let p = 0; p < r - 1; p++) {
      let best = p;
      for (let q = p + 1; q < r; q++) if (norms[q] > norms[best]) best = q;
      if (best !== p) {
        swapRows(g, ldg, p, best, m);
        swapRows(w, ldw, p, best, wn);
        const t = norms[p];
        norms[p] = norms[best];
        norms[best] = t;
      }
      const po = 2 * p * ldg;
      for (let q = p + 1; q < r; q++) {
        const a = norms[p];
        const b = norms[q];
        if (a === 0 || b === 0) continue;
        const qo = 2 * q * ldg;
        let gr = 0;
        let gi = 0;
        for (let k = 0; k < 2 * m; k += 2) {
          const xr = g[po + k];
          const xi = g[po + k + 1];
          const yr = g[qo + k];
          const yi = g[qo + k + 1];
          gr += xr * yr + xi * yi;
          gi += xr * yi - xi * yr;
        }
        const abs = Math.hypot(gr, gi);
        if (abs <= tol * Math.sqrt(a) * Math.sqrt(b)) continue;
        rotations++;
        const zeta = (b - a) / (2 * abs);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        const er = gr / abs; // e^{−iφ} = conj(g)/|g|
        const ei = -gi / abs;
        let na = 0;
        let nb = 0;
        for (let k = 0; k < 2 * m; k += 2) {
          const xr = g[po + k];
          const xi = g[po + k + 1];
          const yr = g[qo + k];
          const yi = g[qo + k + 1];
          const ur = er * yr - ei * yi;
          const ui = er * yi + ei * yr;
          const pr = c * xr - s * ur;
          const pi = c * xi - s * ui;
          const qr = s * xr + c * ur;
          const qi = s * xi + c * ui;
          g[po + k] = pr;
          g[po + k + 1] = pi;
          g[qo + k] = qr;
          g[qo + k + 1] = qi;
          na += pr * pr + pi * pi;
          nb += qr * qr + qi * qi;
        }
        norms[p] = na;
        norms[q] = nb;
        const wp = 2 * p * ldw;
        const wq = 2 * q * ldw;
        for (let k = 0; k < 2 * wn; k += 2) {
          const xr = w[wp + k];
          const xi = w[wp + k + 1];
          const yr = w[wq + k];
          const yi = w[wq + k + 1];
          const ur = er * yr - ei * yi;
          const ui = er * yi + ei * yr;
          w[wp + k] = c * xr - s * ur;
          w[wp + k + 1] = c * xi - s * ui;
          w[wq + k] = s * xr + c * ur;
          w[wq + k + 1] = s * xi + c * ui;
        }
      }
    }
    if (rotations === 0) return sweep;
  }
  return -1;
}

function swapRows(x: Float64Array, ld: number, p: number, q: number, len: number): void {
  const po = 2 * p * ld;
  const qo = 2 * q * ld;
  for (let k = 0; k < 2 * len; k++) {
    const t = x[po + k];
    x[po + k] = x[qo + k];
    x[qo + k] = t;
  }
}
