/** Test inputs for the linear-algebra kernels: seeded random matrices (mulberry32; common practice). */

/** Seeded uniform RNG on [0, 1). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A random m × n matrix, entries uniform in [−1, 1), row-major. */
export function randomMatrix(m: number, n: number, seed: number): Float64Array {
  const r = rng(seed);
  return Float64Array.from({ length: m * n }, () => 2 * r() - 1);
}

/** A random n × n skew-symmetric matrix (full storage), optionally banded to |i − j| ≤ band. */
export function randomSkew(n: number, seed: number, band = Infinity): Float64Array {
  const r = rng(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const v = i - j <= band ? 2 * r() - 1 : 0;
      a[i * n + j] = v;
      a[j * n + i] = -v;
    }
  }
  return a;
}

/** C = A·B for row-major square matrices (plain triple loop: the reference for gemm). */
export function naiveProduct(a: Float64Array, b: Float64Array, m: number, k: number, n: number): Float64Array {
  const c = new Float64Array(m * n);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) {
    let s = 0;
    for (let p = 0; p < k; p++) s += a[i * k + p] * b[p * n + j];
    c[i * n + j] = s;
  }
  return c;
}

/** Transpose of a row-major m × n matrix. */
export function transposed(a: Float64Array, m: number, n: number): Float64Array {
  const t = new Float64Array(m * n);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) t[j * m + i] = a[i * n + j];
  return t;
}

/** max |a − b|. */
export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

/** max |OᵀO − 1| over entries. */
export function orthogonalityError(o: Float64Array, n: number): number {
  let worst = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += o[k * n + i] * o[k * n + j];
    worst = Math.max(worst, Math.abs(s - (i === j ? 1 : 0)));
  }
  return worst;
}

/** det of a row-major n × n matrix by Gaussian elimination with partial pivoting (common practice). */
export function determinant(a: ArrayLike<number>, n: number): number {
  const m = Float64Array.from(a);
  let d = 1;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(m[i * n + k]) > Math.abs(m[p * n + k])) p = i;
    if (m[p * n + k] === 0) return 0;
    if (p !== k) {
      for (let j = 0; j < n; j++) { const t = m[k * n + j]; m[k * n + j] = m[p * n + j]; m[p * n + j] = t; }
      d = -d;
    }
    d *= m[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = m[i * n + k] / m[k * n + k];
      for (let j = k; j < n; j++) m[i * n + j] -= f * m[k * n + j];
    }
  }
  return d;
}
