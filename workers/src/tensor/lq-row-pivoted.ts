/**
 * lqRowPivoted — Householder LQ factorisation with row pivoting of a complex m×n row-major
 * matrix, stopped at numerical rank:
 *
 *   Π·A = L·Q_r + E,   L m×r lower trapezoidal, Q_r (r×n) with orthonormal rows,
 *   ‖E‖²_F = the weight of the rows not yet reduced when the factorisation stops.
 *
 * This is LAPACK zgeqp3 (QR with column pivoting: Businger & Golub, Numer. Math. 7, 269
 * (1965)) applied to Aᴴ, written for rows so that every reflector streams contiguous rows of a
 * row-major array. Step j picks the remaining row of largest partial norm (columns j..n−1),
 * swaps it into row j and reflects it onto (β, 0, …, 0) with H_j = I − τ_j·v_j·v_jᴴ acting
 * from the right (v_j[j] = 1; β real — zlarfg's convention applied to the conjugated row).
 * The partial row norms are RECOMPUTED in the same pass that applies H_j (not downdated as in
 * zgeqp3), so the stopping weight Σ_{i≥j} (partial norm)² is exact to rounding and needs no
 * Drmač–Bujanović safeguard.
 *
 * Stop: before step j, if the remaining weight ≤ stopRelative·‖A‖²_F, or j = min(m, n, maxRank);
 * the rank r = j is returned (E is exact whichever rule stops). On exit (in place):
 *   rows i < r:  a[i, 0..i] = L[i, 0..i] (L[i, i] = β_i real), a[i, i+1..n−1] = tail of v_i;
 *   rows i ≥ r:  a[i, 0..r−1] = L[i, ·], a[i, r..n−1] = E (the unreduced rest, row i of Π·A);
 *   perm[i]    = the row of A now in row i (Π·A)[i] = A[perm[i]];
 *   tau[2j..]  = τ_j (complex);  norms[i] (i ≥ r) = ‖E[i, ·]‖²;  weights = [‖A‖²_F, ‖E‖²_F].
 * Q_r's rows are the first r rows of (H_0⋯H_{r−1})ᴴ (applyLqRows forms products with them).
 *
 * Cost: ≈ 8·m·n·r − 4·(m + n)·r² + (8/3)·r³ flops (complex); no allocation.
 * Caveats: no scaling against overflow (entries beyond ~1e150 overflow the norms);
 * pivoting makes the factorisation rank-revealing in practice, not in the worst case (Kahan's
 * matrix) — the caller's truncation still sees the exact ‖E‖.
 */

/**
 * Factorises in place (see the file header); returns the rank r reached.
 * `weights[0]` ← ‖A‖²_F, `weights[1]` ← ‖E‖²_F. Buffers: perm ≥ m, norms ≥ m, tau ≥ 2·min(m, n).
 */
export function lqRowPivotedUnchecked(
  m: number, n: number, a: Float64Array, lda: number,
  perm: Int32Array, tau: Float64Array, norms: Float64Array,
  stopRelative: number, weights: Float64Array, maxRank = Infinity,
): number {
  const kmax = Math.min(m, n, maxRank);
  let total = 0;
  for (let i = 0; i < m; i++) {
    perm[i] = i;
    let s = 0;
    const o = 2 * i * lda;
    for (let k = 0; k < 2 * n; k++) s += a[o + k] * a[o + k];
    norms[i] = s;
    total += s;
  }
  weights[0] = total;
  const stop = stopRelative * total;
  let rank = kmax;
  for (let j = 0; j < kmax; j++) {
    let p = j;
    let best = norms[j];
    let rest = 0;
    for (let i = j; i < m; i++) {
      const w = norms[i];
      rest += w;
      if (w > best) {
        best = w;
        p = i;
      }
    }
    if (rest <= stop || best === 0) {
      rank = j;
      break;
    }
    if (p !== j) {
      const oj = 2 * j * lda;
      const op = 2 * p * lda;
      for (let k = 0; k < 2 * n; k++) {
        const t = a[oj + k];
        a[oj + k] = a[op + k];
        a[op + k] = t;
      }
      const tp = perm[j];
      perm[j] = perm[p];
      perm[p] = tp;
      norms[p] = norms[j];
      norms[j] = best;
    }
    const d = 2 * (j * lda + j);
    const xr = a[d];
    const xi = a[d + 1];
    let tail = 0;
    for (let k = d + 2; k < 2 * (j * lda + n); k++) tail += a[k] * a[k];
    // The reflector is built for the conjugated row c = conj(a[j, j..]) (zlarfg): α = conj(x_j).
    const alphr = xr;
    const alphi = -xi;
    let taur = 0;
    let taui = 0;
    if (tail !== 0 || alphi !== 0) {
      const nrm = Math.sqrt(alphr * alphr + alphi * alphi + tail);
      const beta = alphr >= 0 ? -nrm : nrm;
      taur = (beta - alphr) / beta;
      taui = -alphi / beta;
      // v_k = c_k / (α − β) for k > j.
      const dr = alphr - beta;
      const di = alphi;
      const den = dr * dr + di * di;
      const sr = dr / den;
      const si = -di / den;
      for (let k = d + 2; k < 2 * (j * lda + n); k += 2) {
        const cr = a[k];
        const ci = -a[k + 1];
        a[k] = cr * sr - ci * si;
        a[k + 1] = cr * si + ci * sr;
      }
      a[d] = beta;
      a[d + 1] = 0;
    }
    tau[2 * j] = taur;
    tau[2 * j + 1] = taui;
    const vEnd = 2 * (j * lda + n);
    for (let i = j + 1; i < m; i++) {
      const yo = 2 * (i * lda + j);
      if (taur !== 0 || taui !== 0) {
        // w = y·v (v_j = 1), then y ← y − (τ·w)·vᴴ.
        let wr = a[yo];
        let wi = a[yo + 1];
        for (let k = d + 2, y = yo + 2; k < vEnd; k += 2, y += 2) {
          const vr = a[k];
          const vi = a[k + 1];
          const yr = a[y];
          const yi = a[y + 1];
          wr += yr * vr - yi * vi;
          wi += yr * vi + yi * vr;
        }
        const tr = taur * wr - taui * wi;
        const ti = taur * wi + taui * wr;
        a[yo] -= tr;
        a[yo + 1] -= ti;
        let s = 0;
        for (let k = d + 2, y = yo + 2; k < vEnd; k += 2, y += 2) {
          const vr = a[k];
          const vi = a[k + 1];
          // y −= t·conj(v)
          const yr = a[y] - (tr * vr + ti * vi);
          const yi = a[y + 1] - (ti * vr - tr * vi);
          a[y] = yr;
          a[y + 1] = yi;
          s += yr * yr + yi * yi;
        }
        norms[i] = s;
      } else {
        let s = 0;
        for (let y = yo + 2; y < 2 * (i * lda + n); y++) s += a[y] * a[y];
        norms[i] = s;
      }
    }
  }
  let residual = 0;
  for (let i = rank; i < m; i++) residual += norms[i];
  weights[1] = residual;
  return rank;
}

/**
 * Z ← [Z, 0]·(H_0⋯H_{r−1})ᴴ for the reflectors left in `a` by {@link lqRowPivotedUnchecked}:
 * row q of the k×n row-major `z` (ldz ≥ n) enters holding its first r entries (the rest is
 * overwritten with 0) and leaves as z_q·Q_r. With z = [I_r, 0] this forms Q_r itself.
 * Cost: 8·k·Σ_j (n − j) ≈ 8·k·r·n flops; no allocation.
 */
export function applyLqRowsUnchecked(
  r: number, n: number, a: Float64Array, lda: number, tau: Float64Array,
  k: number, z: Float64Array, ldz: number,
): void {
  for (let q = 0; q < k; q++) z.fill(0, 2 * (q * ldz + r), 2 * (q * ldz + n));
  for (let j = r - 1; j >= 0; j--) {
    // z·H_jᴴ = z − conj(τ_j)·(z·v_j)·v_jᴴ
    const tr = tau[2 * j];
    const ti = -tau[2 * j + 1];
    if (tr === 0 && ti === 0) continue;
    const v0 = 2 * (j * lda + j);
    const vEnd = 2 * (j * lda + n);
    for (let q = 0; q < k; q++) {
      const zo = 2 * (q * ldz + j);
      let wr = z[zo];
      let wi = z[zo + 1];
      for (let kk = v0 + 2, y = zo + 2; kk < vEnd; kk += 2, y += 2) {
        const vr = a[kk];
        const vi = a[kk + 1];
        wr += z[y] * vr - z[y + 1] * vi;
        wi += z[y] * vi + z[y + 1] * vr;
      }
      const pr = tr * wr - ti * wi;
      const pi = tr * wi + ti * wr;
      z[zo] -= pr;
      z[zo + 1] -= pi;
      for (let kk = v0 + 2, y = zo + 2; kk < vEnd; kk += 2, y += 2) {
        const vr = a[kk];
        const vi = a[kk + 1];
        z[y] -= pr * vr + pi * vi;
        z[y + 1] -= pi * vr - pr * vi;
      }
    }
  }
}
