/**
 * realTransposeProduct — C = Aᵀ·B for real column-major A (k×m) and B (k×n), the real
 * counterpart of complexAdjointProduct used when a block's eigenvectors are real (real
 * symmetric H0 and H1, e.g. Ising and XXZ): every entry is a dot product of two contiguous
 * columns, computed in 2×2 register tiles (mirrors BLAS dgemm TRANSA = 'T' / dsyrk).
 * Output entry (i, j) goes to c[stride·idx + offset] with idx = i + j·m ('full') or
 * j(j+1)/2 + i for i ≤ j ('upper-packed', m = n), so stride 2 / offset 0 or 1 writes the real
 * or imaginary part of a complex interleaved result directly (the other part is not touched).
 *
 * Source: BLAS dgemm / dsyrk (Dongarra et al., ACM TOMS 16, 1 (1990)); common practice.
 * Cost: 2·k·m·n flops full, ≈ k·n² upper-packed — a quarter of the complex product; no
 * allocation. Caveats: `c` must not overlap `a` or `b`.
 */
import type { ProductLayout } from '../../linalg/complex-adjoint-product.js';

/**
 * C ← Aᵀ·B written with the given stride and offset (see file header); O(1) argument checks.
 * @throws RangeError naming the argument: a bad size, stride or offset, a short buffer, m ≠ n
 *   for 'upper-packed', or `c` being the same array as `a` or `b`.
 */
export function realTransposeProduct(
  k: number, m: number, n: number, a: Float64Array, b: Float64Array, c: Float64Array,
  layout: ProductLayout = 'full', stride = 1, offset = 0,
): void {
  const packed = layout === 'upper-packed';
  for (const [name, v] of [['k', k], ['m', m], ['n', n], ['offset', offset]] as const) {
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`${name} must be a non-negative integer; got ${v}`);
  }
  if (!Number.isInteger(stride) || stride < 1 || offset >= stride) throw new RangeError(`need an integer stride ≥ 1 and offset < stride; got stride ${stride}, offset ${offset}`);
  if (packed && m !== n) throw new RangeError(`'upper-packed' needs m = n; got m = ${m}, n = ${n}`);
  if (a.length < k * m) throw new RangeError(`a must hold at least k·m = ${k * m} doubles; got ${a.length}`);
  if (b.length < k * n) throw new RangeError(`b must hold at least k·n = ${k * n} doubles; got ${b.length}`);
  const entries = packed ? (n * (n + 1)) / 2 : m * n;
  if (entries > 0 && c.length < stride * (entries - 1) + offset + 1) {
    throw new RangeError(`c must hold at least ${stride * (entries - 1) + offset + 1} doubles; got ${c.length}`);
  }
  if (c === a || c === b) throw new RangeError('c must not be the same array as a or b');
  const idx = (i: number, j: number) => stride * (packed ? (j * (j + 1)) / 2 + i : i + j * m) + offset;
  for (let j = 0; j < n; j += 2) {
    const twoJ = j + 1 < n;
    const iEnd = packed ? Math.min(j + 2, m) : m;
    const b0 = j * k;
    const b1 = b0 + k;
    for (let i = 0; i < iEnd; i += 2) {
      const twoI = i + 1 < iEnd;
      const a0 = i * k;
      const a1 = a0 + k;
      if (twoI && twoJ) {
        let s00 = 0, s10 = 0, s01 = 0, s11 = 0;
        for (let r = 0; r < k; r++) {
          const x = a[a0 + r], y = a[a1 + r], u = b[b0 + r], v = b[b1 + r];
          s00 += x * u; s10 += y * u; s01 += x * v; s11 += y * v;
        }
        c[idx(i, j)] = s00;
        if (!packed || i + 1 <= j) c[idx(i + 1, j)] = s10;
        c[idx(i, j + 1)] = s01;
        c[idx(i + 1, j + 1)] = s11;
      } else {
        for (let ii = i; ii < (twoI ? i + 2 : i + 1); ii++) {
          for (let jj = j; jj < (twoJ ? j + 2 : j + 1); jj++) {
            if (packed && ii > jj) continue;
            const ao = ii * k, bo = jj * k;
            let s = 0;
            for (let r = 0; r < k; r++) s += a[ao + r] * b[bo + r];
            c[idx(ii, jj)] = s;
          }
        }
      }
    }
  }
}
