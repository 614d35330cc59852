/**
 * complexAdjointProduct — C = Aᴴ·B for complex column-major A (k×m) and B (k×n): every entry
 * C_ij = Σ_r conj(A_ri)·B_rj is a dot product of two contiguous columns (mirrors BLAS zgemm with
 * TRANSA = 'C', TRANSB = 'N'; with layout 'upper-packed' and m = n it computes only i ≤ j, as
 * zherk does for A = B, and stores column j's entries 0..j at 2·(j(j+1)/2 + i), LAPACK's
 * packed 'U' order).
 * Columns are taken two by two (2×2 register tiles: 8 loads feed 32 flops), so the inner loop
 * is four complex multiply-adds over unit-stride data.
 * Storage: complex interleaved; A(r, i) at 2·(r + i·k), B(r, j) at 2·(r + j·k); full C(i, j)
 * at 2·(i + j·m).
 *
 * Source: BLAS zgemm / zherk (Dongarra et al., ACM TOMS 16, 1 (1990)); common practice.
 * Cost: 8·k·m·n flops full, ≈ 4·k·n² upper-packed; no allocation.
 * Caveats: no blocking for cache beyond the 2×2 tiles (fine while two columns fit in L1:
 * k ≲ 2000). `c` must not overlap `a` or `b`. Rounding: each entry carries the usual dot-product
 * error ≤ k·ε·Σ_r |A_ri|·|B_rj| (Higham, Accuracy and Stability, 2nd ed., §3.1).
 */

/** Output layout of {@link complexAdjointProduct}. */
export type ProductLayout = 'full' | 'upper-packed';

/**
 * C ← Aᴴ·B (see the file header). For 'upper-packed', m must equal n and C needs n(n+1)
 * doubles; for 'full', 2·m·n doubles. The checks are O(1), so there is no separate unchecked
 * layer.
 * @throws RangeError naming the argument: a size that is not a non-negative integer, a short
 *   buffer, m ≠ n for 'upper-packed', or `c` being the same array as `a` or `b`.
 */
export function complexAdjointProduct(
  k: number, m: number, n: number,
  a: Float64Array, b: Float64Array, c: Float64Array,
  layout: ProductLayout = 'full',
): void {
  const packed = layout === 'upper-packed';
  for (const [name, v] of [['k', k], ['m', m], ['n', n]] as const) {
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`${name} must be a non-negative integer; got ${v}`);
  }
  if (packed && m !== n) throw new RangeError(`'upper-packed' needs m = n; got m = ${m}, n = ${n}`);
  if (a.length < 2 * k * m) throw new RangeError(`a must hold at least 2·k·m = ${2 * k * m} doubles; got ${a.length}`);
  if (b.length < 2 * k * n) throw new RangeError(`b must hold at least 2·k·n = ${2 * k * n} doubles; got ${b.length}`);
  const need = packed ? n * (n + 1) : 2 * m * n;
  if (c.length < need) throw new RangeError(`c must hold at least ${need} doubles; got ${c.length}`);
  if (c === a || c === b) throw new RangeError('c must not be the same array as a or b');
  const k2 = 2 * k;
  for (let j = 0; j < n; j += 2) {
    const twoJ = j + 1 < n;
    const iEnd = packed ? Math.min(j + 2, m) : m;
    const cj0 = packed ? j * (j + 1) : 2 * j * m;
    const cj1 = packed ? (j + 1) * (j + 2) : 2 * (j + 1) * m;
    const b0 = j * k2;
    const b1 = b0 + k2;
    for (let i = 0; i < iEnd; i += 2) {
      const twoI = i + 1 < iEnd;
      const a0 = i * k2;
      const a1 = a0 + k2;
      if (twoI && twoJ) {
        let r00 = 0, i00 = 0, r10 = 0, i10 = 0, r01 = 0, i01 = 0, r11 = 0, i11 = 0;
        for (let r = 0; r < k2; r += 2) {
          const xr = a[a0 + r], xi = a[a0 + r + 1];
          const yr = a[a1 + r], yi = a[a1 + r + 1];
          const ur = b[b0 + r], ui = b[b0 + r + 1];
          const vr = b[b1 + r], vi = b[b1 + r + 1];
          r00 += xr * ur + xi * ui; i00 += xr * ui - xi * ur;
          r10 += yr * ur + yi * ui; i10 += yr * ui - yi * ur;
          r01 += xr * vr + xi * vi; i01 += xr * vi - xi * vr;
          r11 += yr * vr + yi * vi; i11 += yr * vi - yi * vr;
        }
        c[cj0 + 2 * i] = r00; c[cj0 + 2 * i + 1] = i00;
        if (!packed || i + 1 <= j) { c[cj0 + 2 * i + 2] = r10; c[cj0 + 2 * i + 3] = i10; }
        c[cj1 + 2 * i] = r01; c[cj1 + 2 * i + 1] = i01;
        c[cj1 + 2 * i + 2] = r11; c[cj1 + 2 * i + 3] = i11;
      } else {
        // Edge tiles: one row and/or one column.
        for (let ii = i; ii < (twoI ? i + 2 : i + 1); ii++) {
          for (let jj = j; jj < (twoJ ? j + 2 : j + 1); jj++) {
            if (packed && ii > jj) continue;
            const ao = ii * k2;
            const bo = jj * k2;
            let sr = 0, si = 0;
            for (let r = 0; r < k2; r += 2) {
              const xr = a[ao + r], xi = a[ao + r + 1];
              const ur = b[bo + r], ui = b[bo + r + 1];
              sr += xr * ur + xi * ui;
              si += xr * ui - xi * ur;
            }
            const co = (jj === j ? cj0 : cj1) + 2 * ii;
            c[co] = sr;
            c[co + 1] = si;
          }
        }
      }
    }
  }
}
