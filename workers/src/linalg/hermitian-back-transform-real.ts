/**
 * hermitianBackTransformReal — the real fast path of hermitianBackTransform: V ← Q·V for the
 * orthogonal Q = H(0)·…·H(n−2) left by hermitianTridiagonalizeReal (mirrors LAPACK dormtr,
 * SIDE = 'L', UPLO = 'L', TRANS = 'N', unblocked as dorm2r).
 *
 * H(i) = I − τ_i·v_i·v_iᵀ on rows i+1..n−1, v_i[i+1] = 1, v_i[r] = A(r, i) for r ≥ i+2.
 * Per column x: s = v_iᵀ·x, x ← x − τ_i·s·v_i. Columns in chunks of COLUMN_CHUNK (cache reuse),
 * four at a time inside a chunk (one read of v_i feeds four independent dot products).
 * Storage: real column-major n×n, element (r, c) at r + c·n.
 *
 * Source: LAPACK 3.x dormtr / dorm2r. Cost: ≈ 2·n³ flops for n×n V; no allocation.
 * Caveats: `a` and `tau` must be exactly as hermitianTridiagonalizeReal left them.
 */
import { COLUMN_CHUNK } from './hermitian-back-transform.js';

/** Unchecked kernel: V (n·cols doubles, ld = n) ← Q·V. */
export function hermitianBackTransformReal(n: number, a: Float64Array, tau: Float64Array, v: Float64Array, cols: number): void {
  const chunk = 2 * COLUMN_CHUNK; // real columns are half the bytes
  for (let c0 = 0; c0 < cols; c0 += chunk) {
    const c1 = Math.min(cols, c0 + chunk);
    for (let i = n - 2; i >= 0; i--) {
      const t = tau[i];
      if (t === 0) continue;
      const vo = i + 1 + i * n;
      const len = n - i - 1;
      let c = c0;
      // Four columns per pass: the reflector is read once for four independent dot products.
      for (; c + 3 < c1; c += 4) {
        const x0 = i + 1 + c * n, x1 = x0 + n, x2 = x1 + n, x3 = x2 + n;
        let s0 = v[x0], s1 = v[x1], s2 = v[x2], s3 = v[x3];
        for (let k = 1; k < len; k++) {
          const u = a[vo + k];
          s0 += u * v[x0 + k]; s1 += u * v[x1 + k]; s2 += u * v[x2 + k]; s3 += u * v[x3 + k];
        }
        const g0 = t * s0, g1 = t * s1, g2 = t * s2, g3 = t * s3;
        v[x0] -= g0; v[x1] -= g1; v[x2] -= g2; v[x3] -= g3;
        for (let k = 1; k < len; k++) {
          const u = a[vo + k];
          v[x0 + k] -= g0 * u; v[x1 + k] -= g1 * u; v[x2 + k] -= g2 * u; v[x3 + k] -= g3 * u;
        }
      }
      for (; c < c1; c++) {
        const xo = i + 1 + c * n;
        let s = v[xo];
        for (let k = 1; k < len; k++) s += a[vo + k] * v[xo + k];
        const g = t * s;
        v[xo] -= g;
        for (let k = 1; k < len; k++) v[xo + k] -= g * a[vo + k];
      }
    }
  }
}
