/**
 * gemm — real matrix product C ← α·op(A)·op(B) + β·C on row-major Float64Arrays.
 *
 * Mirrors BLAS dgemm (Dongarra, Du Croz, Hammarling & Duff, ACM TOMS 16, 1 (1990)) for the
 * row-major layout: element (i, j) of a matrix with leading dimension ld sits at [i·ld + j].
 * op(A) is A (m × k) or Aᵀ (A stored k × m); op(B) is B (k × n) or Bᵀ (B stored n × k). The
 * combination op(A) = Aᵀ with op(B) = Bᵀ is not provided (no caller needs it).
 *
 * Kernels (chosen for a JIT without SIMD; measured ~3–4 Gflop/s at n = 2000 on this machine kind):
 * - op(B) = B: "axpy" form, two rows of C × four terms of the sum per pass over a row tile of
 *   B (tile TILE_COLS columns × TILE_DEPTH rows, so the tile stays in the L2 cache).
 * - op(B) = Bᵀ (op(A) = A): "dot" form, a 4 × 2 block of C per pass over TILE_DOT_DEPTH terms,
 *   both operands read along contiguous rows.
 * Cost: 2·m·n·k flops; no allocation. Rounding: each entry is a sum of k products, error
 * ≲ k·u·Σ|a||b| (u = 2⁻⁵³), as for any dot product (Higham, Accuracy and Stability of
 * Numerical Algorithms, 2nd ed. (2002), §3.1).
 */

/** Columns of B (and C) per tile of the axpy kernel. */
const TILE_COLS = 256;
/** Rows of B per tile of the axpy kernel. */
const TILE_DEPTH = 64;
/** Terms of each dot product per pass of the dot kernel. */
const TILE_DOT_DEPTH = 256;

/** Shape and operand options of {@link gemm}. */
export interface GemmArgs {
  /** Use Aᵀ (A stored k × m). @defaultValue false */
  transA?: boolean;
  /** Use Bᵀ (B stored n × k). @defaultValue false */
  transB?: boolean;
  /** Rows of op(A) and C. */
  m: number;
  /** Columns of op(B) and C. */
  n: number;
  /** Columns of op(A) = rows of op(B). */
  k: number;
  /** @defaultValue 1 */
  alpha?: number;
  a: Float64Array;
  /** Leading dimension of A as stored. @defaultValue k (or m when transA) */
  lda?: number;
  b: Float64Array;
  /** Leading dimension of B as stored. @defaultValue n (or k when transB) */
  ldb?: number;
  /** @defaultValue 0 (C is overwritten; its old contents, even NaN, are ignored) */
  beta?: number;
  c: Float64Array;
  /** Leading dimension of C. @defaultValue n */
  ldc?: number;
}

function need(name: string, arr: Float64Array, rows: number, cols: number, ld: number): void {
  if (!Number.isInteger(ld) || ld < cols) throw new RangeError(`gemm: leading dimension of ${name} must be an integer ≥ ${cols}; got ${ld}`);
  const len = rows === 0 || cols === 0 ? 0 : (rows - 1) * ld + cols;
  if (arr.length < len) throw new RangeError(`gemm: ${name} has ${arr.length} entries; a ${rows} × ${cols} matrix with leading dimension ${ld} needs ${len}`);
}

/**
 * C ← α·op(A)·op(B) + β·C (see the file header).
 * @throws RangeError if a size is negative or not an integer, a leading dimension is too
 *   small, an array is too short, or both transA and transB are set.
 */
export function gemm(args: GemmArgs): void {
  const { transA = false, transB = false, m, n, k, alpha = 1, a, b, beta = 0, c } = args;
  for (const [name, v] of [['m', m], ['n', n], ['k', k]] as const) {
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`gemm: ${name} must be a non-negative integer; got ${v}`);
  }
  if (transA && transB) throw new RangeError('gemm: op(A) = Aᵀ together with op(B) = Bᵀ is not supported');
  const lda = args.lda ?? (transA ? m : k);
  const ldb = args.ldb ?? (transB ? k : n);
  const ldc = args.ldc ?? n;
  if (transA) need('A', a, k, m, lda); else need('A', a, m, k, lda);
  if (transB) need('B', b, n, k, ldb); else need('B', b, k, n, ldb);
  need('C', c, m, n, ldc);
  gemmUnchecked(transA, transB, m, n, k, alpha, a, lda, b, ldb, beta, c, ldc);
}

/** The hot kernel of {@link gemm} without argument checks. */
export function gemmUnchecked(
  transA: boolean, transB: boolean, m: number, n: number, k: number, alpha: number,
  a: Float64Array, lda: number, b: Float64Array, ldb: number, beta: number, c: Float64Array, ldc: number,
): void {
  if (m === 0 || n === 0) return;
  for (let i = 0; i < m; i++) {
    const ci = i * ldc;
    if (beta === 0) for (let j = 0; j < n; j++) c[ci + j] = 0;
    else if (beta !== 1) for (let j = 0; j < n; j++) c[ci + j] *= beta;
  }
  if (k === 0 || alpha === 0) return;
  if (transB) dotKernel(m, n, k, alpha, a, lda, b, ldb, c, ldc);
  else axpyKernel(transA, m, n, k, alpha, a, lda, b, ldb, c, ldc);
}

/** C += α·op(A)·B, rows of B streamed (op(A) = A or Aᵀ: only the scalar loads differ). */
function axpyKernel(
  transA: boolean, m: number, n: number, k: number, alpha: number,
  a: Float64Array, lda: number, b: Float64Array, ldb: number, c: Float64Array, ldc: number,
): void {
  // Element (i, p) of op(A) is a[i·si + p·sp].
  const si = transA ? 1 : lda;
  const sp = transA ? lda : 1;
  for (let j0 = 0; j0 < n; j0 += TILE_COLS) {
    const j1 = Math.min(n, j0 + TILE_COLS);
    for (let p0 = 0; p0 < k; p0 += TILE_DEPTH) {
      const p1 = Math.min(k, p0 + TILE_DEPTH);
      let i = 0;
      for (; i + 1 < m; i += 2) {
        const c0 = i * ldc;
        const c1 = c0 + ldc;
        const r0 = i * si;
        const r1 = r0 + si;
        let p = p0;
        for (; p + 3 < p1; p += 4) {
          const q = p * sp;
          const a0 = alpha * a[r0 + q], a1 = alpha * a[r0 + q + sp], a2 = alpha * a[r0 + q + 2 * sp], a3 = alpha * a[r0 + q + 3 * sp];
          const e0 = alpha * a[r1 + q], e1 = alpha * a[r1 + q + sp], e2 = alpha * a[r1 + q + 2 * sp], e3 = alpha * a[r1 + q + 3 * sp];
          const b0 = p * ldb, b1 = b0 + ldb, b2 = b1 + ldb, b3 = b2 + ldb;
          for (let j = j0; j < j1; j++) {
            const x0 = b[b0 + j], x1 = b[b1 + j], x2 = b[b2 + j], x3 = b[b3 + j];
            c[c0 + j] += a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
            c[c1 + j] += e0 * x0 + e1 * x1 + e2 * x2 + e3 * x3;
          }
        }
        for (; p < p1; p++) {
          const a0 = alpha * a[r0 + p * sp];
          const e0 = alpha * a[r1 + p * sp];
          const b0 = p * ldb;
          for (let j = j0; j < j1; j++) {
            const x = b[b0 + j];
            c[c0 + j] += a0 * x;
            c[c1 + j] += e0 * x;
          }
        }
      }
      for (; i < m; i++) {
        const c0 = i * ldc;
        const r0 = i * si;
        for (let p = p0; p < p1; p++) {
          const a0 = alpha * a[r0 + p * sp];
          const b0 = p * ldb;
          for (let j = j0; j < j1; j++) c[c0 + j] += a0 * b[b0 + j];
        }
      }
    }
  }
}

/** C += α·A·Bᵀ as dot products of rows of A (m × k) with rows of B (n × k). */
function dotKernel(
  m: number, n: number, k: number, alpha: number,
  a: Float64Array, lda: number, b: Float64Array, ldb: number, c: Float64Array, ldc: number,
): void {
  for (let p0 = 0; p0 < k; p0 += TILE_DOT_DEPTH) {
    const p1 = Math.min(k, p0 + TILE_DOT_DEPTH);
    let i = 0;
    for (; i + 3 < m; i += 4) {
      const a0 = i * lda, a1 = a0 + lda, a2 = a1 + lda, a3 = a2 + lda;
      const c0 = i * ldc, c1 = c0 + ldc, c2 = c1 + ldc, c3 = c2 + ldc;
      let j = 0;
      for (; j + 1 < n; j += 2) {
        const b0 = j * ldb, b1 = b0 + ldb;
        let s00 = 0, s01 = 0, s10 = 0, s11 = 0, s20 = 0, s21 = 0, s30 = 0, s31 = 0;
        for (let p = p0; p < p1; p++) {
          const y0 = b[b0 + p], y1 = b[b1 + p];
          let x = a[a0 + p]; s00 += x * y0; s01 += x * y1;
          x = a[a1 + p]; s10 += x * y0; s11 += x * y1;
          x = a[a2 + p]; s20 += x * y0; s21 += x * y1;
          x = a[a3 + p]; s30 += x * y0; s31 += x * y1;
        }
        c[c0 + j] += alpha * s00; c[c0 + j + 1] += alpha * s01;
        c[c1 + j] += alpha * s10; c[c1 + j + 1] += alpha * s11;
        c[c2 + j] += alpha * s20; c[c2 + j + 1] += alpha * s21;
        c[c3 + j] += alpha * s30; c[c3 + j + 1] += alpha * s31;
      }
      for (; j < n; j++) {
        const b0 = j * ldb;
        let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        for (let p = p0; p < p1; p++) {
          const y = b[b0 + p];
          s0 += a[a0 + p] * y; s1 += a[a1 + p] * y; s2 += a[a2 + p] * y; s3 += a[a3 + p] * y;
        }
        c[c0 + j] += alpha * s0; c[c1 + j] += alpha * s1; c[c2 + j] += alpha * s2; c[c3 + j] += alpha * s3;
      }
    }
    for (; i < m; i++) {
      const a0 = i * lda;
      const c0 = i * ldc;
      for (let j = 0; j < n; j++) {
        const b0 = j * ldb;
        let s = 0;
        for (let p = p0; p < p1; p++) s += a[a0 + p] * b[b0 + p];
        c[c0 + j] += alpha * s;
      }
    }
  }
}
