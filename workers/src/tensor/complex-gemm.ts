/**
 * complexGemm — C ← op(A)·B (or C ← C + op(A)·B) for complex row-major matrices, op(A) = A or
 * Aᴴ. Mirrors the NN and CN cases of BLAS zgemm (Dongarra, Du Croz, Hammarling & Duff, ACM
 * TOMS 16, 1 (1990)) with α = 1 and β ∈ {0, 1}, in ROW-MAJOR storage (the layout of every
 * routine in workers/src/tensor): element (i, j) of a matrix with leading dimension ld sits at
 * 2·(i·ld + j) (re) and 2·(i·ld + j) + 1 (im).
 *
 *   'N': A is m×k (lda ≥ k), C[i, j] (+)= Σ_l A[i, l]·B[l, j]
 *   'C': A is k×m (lda ≥ m), C[i, j] (+)= Σ_l conj(A[l, i])·B[l, j]
 * B is k×n (ldb ≥ n), C is m×n (ldc ≥ n). The innermost loop runs along a row of B and C
 * (contiguous), so no transposed copy is needed in either case.
 *
 * Cost: 8·m·n·k flops; no allocation. Caveat: C must not overlap A or B.
 */

/** C ← op(A)·B, or C ← C + op(A)·B when `accumulate` (no checks; see the file header). */
export function complexGemmUnchecked(
  trans: 'N' | 'C', m: number, n: number, k: number,
  a: Float64Array, lda: number, b: Float64Array, ldb: number,
  c: Float64Array, ldc: number, accumulate: boolean,
): void {
  if (!accumulate) {
    for (let i = 0; i < m; i++) c.fill(0, 2 * i * ldc, 2 * (i * ldc + n));
  }
  if (trans === 'N') {
    for (let i = 0; i < m; i++) {
      const ci = 2 * i * ldc;
      for (let l = 0; l < k; l++) {
        const ar = a[2 * (i * lda + l)];
        const ai = a[2 * (i * lda + l) + 1];
        if (ar === 0 && ai === 0) continue;
        let bo = 2 * l * ldb;
        let co = ci;
        for (let j = 0; j < n; j++, bo += 2, co += 2) {
          const br = b[bo];
          const bi = b[bo + 1];
          c[co] += ar * br - ai * bi;
          c[co + 1] += ar * bi + ai * br;
        }
      }
    }
    return;
  }
  for (let l = 0; l < k; l++) {
    const al = 2 * l * lda;
    const bl = 2 * l * ldb;
    for (let i = 0; i < m; i++) {
      const ar = a[al + 2 * i];
      const ai = -a[al + 2 * i + 1];
      if (ar === 0 && ai === 0) continue;
      let bo = bl;
      let co = 2 * i * ldc;
      for (let j = 0; j < n; j++, bo += 2, co += 2) {
        const br = b[bo];
        const bi = b[bo + 1];
        c[co] += ar * br - ai * bi;
        c[co + 1] += ar * bi + ai * br;
      }
    }
  }
}

/**
 * Checked entry of {@link complexGemmUnchecked}.
 * @throws RangeError naming the argument when a size is negative or not an integer, a leading
 *   dimension is too small, or a buffer is too short.
 */
export function complexGemm(
  trans: 'N' | 'C', m: number, n: number, k: number,
  a: Float64Array, lda: number, b: Float64Array, ldb: number,
  c: Float64Array, ldc: number, accumulate = false,
): void {
  for (const [name, v] of [['m', m], ['n', n], ['k', k]] as const) {
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`complexGemm: ${name} must be a non-negative integer; got ${v}`);
  }
  if (trans !== 'N' && trans !== 'C') throw new TypeError(`complexGemm: trans must be 'N' or 'C'; got ${String(trans)}`);
  const [ar, ac] = trans === 'N' ? [m, k] : [k, m];
  if (lda < Math.max(1, ac)) throw new RangeError(`complexGemm: lda must be ≥ ${ac}; got ${lda}`);
  if (ldb < Math.max(1, n)) throw new RangeError(`complexGemm: ldb must be ≥ ${n}; got ${ldb}`);
  if (ldc < Math.max(1, n)) throw new RangeError(`complexGemm: ldc must be ≥ ${n}; got ${ldc}`);
  if (ar > 0 && a.length < 2 * ((ar - 1) * lda + ac)) throw new RangeError(`complexGemm: a has ${a.length} doubles, needs ${2 * ((ar - 1) * lda + ac)}`);
  if (k > 0 && b.length < 2 * ((k - 1) * ldb + n)) throw new RangeError(`complexGemm: b has ${b.length} doubles, needs ${2 * ((k - 1) * ldb + n)}`);
  if (m > 0 && c.length < 2 * ((m - 1) * ldc + n)) throw new RangeError(`complexGemm: c has ${c.length} doubles, needs ${2 * ((m - 1) * ldc + n)}`);
  complexGemmUnchecked(trans, m, n, k, a, lda, b, ldb, c, ldc, accumulate);
}
