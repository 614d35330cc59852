/**
 * hermitianBackTransform — V ← Q·V for the unitary Q = H(0)·H(1)·…·H(n−2) left in a matrix by
 * hermitianTridiagonalize, turning eigenvectors of the tridiagonal T into eigenvectors of A
 * (mirrors LAPACK zunmtr with SIDE = 'L', UPLO = 'L', TRANS = 'N', unblocked as zunm2r).
 *
 * H(i) = I − τ_i·v_i·v_iᴴ acts on rows i+1..n−1; v_i[i+1] = 1 and v_i[r] = A(r, i) for r ≥ i+2.
 * For every column x of V (reflectors applied last-first): s = v_iᴴ·x, x ← x − τ_i·s·v_i.
 * Columns are processed in chunks of COLUMN_CHUNK so a chunk stays in cache while every
 * reflector streams past it once, two at a time inside a chunk (one read of v_i per pair).
 * Storage: column-major, complex interleaved, element (r, c) at 2·(r + c·n); `v` may start
 * real (imaginary parts 0, as produced by the tridiagonal QL) and becomes complex.
 *
 * Source: LAPACK 3.x zunmtr / zunm2r; Golub & Van Loan, Matrix Computations, 4th ed., §5.1.6.
 * Cost: ≈ 8·n³ real flops for n×n V (16 per entry and reflector row); no allocation.
 * Caveats: `a` and `tau` must be exactly as hermitianTridiagonalize left them.
 */

/** Columns per chunk: 32 complex columns of n ≤ 2048 fit in 1 MiB. */
export const COLUMN_CHUNK = 32;

/** Unchecked kernel: V (2·n·cols doubles, ld = n) ← Q·V. */
export function hermitianBackTransform(n: number, a: Float64Array, tau: Float64Array, v: Float64Array, cols: number): void {
  for (let c0 = 0; c0 < cols; c0 += COLUMN_CHUNK) {
    const c1 = Math.min(cols, c0 + COLUMN_CHUNK);
    for (let i = n - 2; i >= 0; i--) {
      const tr = tau[2 * i];
      const ti = tau[2 * i + 1];
      if (tr === 0 && ti === 0) continue;
      const vo = 2 * (i + 1 + i * n); // v_i[i+1] (implicitly 1), then the stored tail
      const end = 2 * (n - i - 1);
      let c = c0;
      // Two columns per pass: one read of v_i feeds two independent complex dot products.
      for (; c + 1 < c1; c += 2) {
        const xo = 2 * (i + 1 + c * n);
        const yo = xo + 2 * n;
        let sr = v[xo], si = v[xo + 1], pr = v[yo], pi = v[yo + 1];
        for (let k = 2; k < end; k += 2) {
          const ur = a[vo + k], ui = a[vo + k + 1];
          const xr = v[xo + k], xi = v[xo + k + 1];
          const yr = v[yo + k], yi = v[yo + k + 1];
          sr += ur * xr + ui * xi; si += ur * xi - ui * xr;
          pr += ur * yr + ui * yi; pi += ur * yi - ui * yr;
        }
        const gr = tr * sr - ti * si, gi = tr * si + ti * sr;
        const hr = tr * pr - ti * pi, hi = tr * pi + ti * pr;
        v[xo] -= gr; v[xo + 1] -= gi;
        v[yo] -= hr; v[yo + 1] -= hi;
        for (let k = 2; k < end; k += 2) {
          const ur = a[vo + k], ui = a[vo + k + 1];
          v[xo + k] -= gr * ur - gi * ui; v[xo + k + 1] -= gr * ui + gi * ur;
          v[yo + k] -= hr * ur - hi * ui; v[yo + k + 1] -= hr * ui + hi * ur;
        }
      }
      for (; c < c1; c++) {
        const xo = 2 * (i + 1 + c * n);
        // s = v_iᴴ·x over rows i+1..n−1 (first entry v = 1).
        let sr = v[xo];
        let si = v[xo + 1];
        for (let k = 2; k < end; k += 2) {
          const ur = a[vo + k], ui = a[vo + k + 1];
          const xr = v[xo + k], xi = v[xo + k + 1];
          sr += ur * xr + ui * xi;
          si += ur * xi - ui * xr;
        }
        // x ← x − (τ·s)·v_i
        const gr = tr * sr - ti * si;
        const gi = tr * si + ti * sr;
        v[xo] -= gr;
        v[xo + 1] -= gi;
        for (let k = 2; k < end; k += 2) {
          const ur = a[vo + k], ui = a[vo + k + 1];
          v[xo + k] -= gr * ur - gi * ui;
          v[xo + k + 1] -= gr * ui + gi * ur;
        }
      }
    }
  }
}
