/**
 * The stages of the Hermitian eigensolver on their own: the Householder reduction
 * (hermitianTridiagonalize, its real fast path) must satisfy Qᴴ·A·Q = T with T real tridiagonal
 * and Q unitary, where Q is obtained by back-transforming the identity; the tridiagonal QL must
 * satisfy T·Z = Z·diag(λ) and ZᵀZ = I.
 * Tolerance 1e-13·‖A‖ (column 1-norm): each stage is backward stable with error O(n·ε·‖A‖),
 * n·ε ≈ 1.4e−14 at n = 64.
 */
import { describe, expect, it } from 'vitest';
import { hermitianBackTransform } from '../../../workers/src/linalg/hermitian-back-transform.js';
import { hermitianBackTransformReal } from '../../../workers/src/linalg/hermitian-back-transform-real.js';
import { hermitianTridiagonalQl } from '../../../workers/src/linalg/hermitian-tridiagonal-ql.js';
import { hermitianTridiagonalize } from '../../../workers/src/linalg/hermitian-tridiagonalize.js';
import { hermitianTridiagonalizeReal } from '../../../workers/src/linalg/hermitian-tridiagonalize-real.js';
import { seededRandom } from '../../bench/bench-record.js';

function hermitian(n: number, seed: number, real: boolean): Float64Array {
  const r = seededRandom(seed);
  const a = new Float64Array(2 * n * n);
  for (let c = 0; c < n; c++) {
    for (let i = c; i < n; i++) {
      const re = 4 * (r() - 0.5);
      const im = i === c || real ? 0 : 4 * (r() - 0.5);
      a[2 * (i + c * n)] = re; a[2 * (i + c * n) + 1] = im;
      a[2 * (c + i * n)] = re; a[2 * (c + i * n) + 1] = -im;
    }
  }
  return a;
}

/** max |(QᴴAQ − T)_ij| and max |(QᴴQ − I)_ij| for complex Q, A (column-major). */
function check(n: number, a: Float64Array, q: Float64Array, d: Float64Array, e: Float64Array): { reduction: number; unitarity: number } {
  const aq = new Float64Array(2 * n * n);
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) {
    let sr = 0, si = 0;
    for (let k = 0; k < n; k++) {
      const ar = a[2 * (i + k * n)], ai = a[2 * (i + k * n) + 1], br = q[2 * (k + j * n)], bi = q[2 * (k + j * n) + 1];
      sr += ar * br - ai * bi; si += ar * bi + ai * br;
    }
    aq[2 * (i + j * n)] = sr; aq[2 * (i + j * n) + 1] = si;
  }
  let reduction = 0, unitarity = 0;
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) {
    let tr = 0, ti = 0, ur = 0, ui = 0;
    for (let k = 0; k < n; k++) {
      const xr = q[2 * (k + i * n)], xi = -q[2 * (k + i * n) + 1];
      const yr = aq[2 * (k + j * n)], yi = aq[2 * (k + j * n) + 1];
      tr += xr * yr - xi * yi; ti += xr * yi + xi * yr;
      const zr = q[2 * (k + j * n)], zi = q[2 * (k + j * n) + 1];
      ur += xr * zr - xi * zi; ui += xr * zi + xi * zr;
    }
    const t = i === j ? d[i] : i === j + 1 ? e[j] : j === i + 1 ? e[i] : 0;
    reduction = Math.max(reduction, Math.hypot(tr - t, ti));
    unitarity = Math.max(unitarity, Math.hypot(ur - (i === j ? 1 : 0), ui));
  }
  return { reduction, unitarity };
}

describe('hermitianTridiagonalize', () => {
  it('reduces a complex Hermitian matrix to a real tridiagonal T = QᴴAQ with unitary Q', () => {
    const n = 64;
    const a = hermitian(n, 3, false);
    const work = a.slice();
    const d = new Float64Array(n), e = new Float64Array(n), tau = new Float64Array(2 * n), scratch = new Float64Array(2 * n);
    hermitianTridiagonalize(n, work, d, e, tau, scratch);
    const q = new Float64Array(2 * n * n);
    for (let k = 0; k < n; k++) q[2 * (k + k * n)] = 1;
    hermitianBackTransform(n, work, tau, q, n);
    const { reduction, unitarity } = check(n, a, q, d, e);
    expect(reduction).toBeLessThanOrEqual(1e-13 * 2 * n);
    expect(unitarity).toBeLessThanOrEqual(1e-13);
  });

  it('reduces a real symmetric matrix with the real fast path to the same kind of T', () => {
    const n = 33;
    const a = hermitian(n, 8, true);
    const ar = new Float64Array(n * n);
    for (let k = 0; k < n * n; k++) ar[k] = a[2 * k];
    const d = new Float64Array(n), e = new Float64Array(n), tau = new Float64Array(n), scratch = new Float64Array(n);
    hermitianTridiagonalizeReal(n, ar, d, e, tau, scratch);
    const qr = new Float64Array(n * n);
    for (let k = 0; k < n; k++) qr[k + k * n] = 1;
    hermitianBackTransformReal(n, ar, tau, qr, n);
    const q = new Float64Array(2 * n * n);
    for (let k = 0; k < n * n; k++) q[2 * k] = qr[k];
    const { reduction, unitarity } = check(n, a, q, d, e);
    expect(reduction).toBeLessThanOrEqual(1e-13 * 2 * n);
    expect(unitarity).toBeLessThanOrEqual(1e-13);
  });
});

describe('hermitianTridiagonalQl', () => {
  it('diagonalises a tridiagonal matrix: T·Z = Z·diag(λ), ZᵀZ = I, λ ascending', () => {
    const n = 80;
    const r = seededRandom(12);
    const d0 = Float64Array.from({ length: n }, () => r() - 0.5);
    const e0 = Float64Array.from({ length: n - 1 }, () => r() - 0.5);
    const d = d0.slice(), e = e0.slice();
    const z = new Float64Array(n * n);
    for (let k = 0; k < n; k++) z[k + k * n] = 1;
    expect(hermitianTridiagonalQl(n, d, e, z)).toBe(0);
    let res = 0, orth = 0;
    for (let k = 0; k < n; k++) {
      for (let i = 0; i < n; i++) {
        let y = d0[i] * z[i + k * n] - d[k] * z[i + k * n];
        if (i > 0) y += e0[i - 1] * z[i - 1 + k * n];
        if (i < n - 1) y += e0[i] * z[i + 1 + k * n];
        res = Math.max(res, Math.abs(y));
      }
      for (let l = 0; l < n; l++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += z[i + k * n] * z[i + l * n];
        orth = Math.max(orth, Math.abs(s - (k === l ? 1 : 0)));
      }
      if (k > 0) expect(d[k]).toBeGreaterThanOrEqual(d[k - 1]);
    }
    expect(res).toBeLessThanOrEqual(1e-14 * n);
    expect(orth).toBeLessThanOrEqual(1e-13);
  });

  it('splits at a zero off-diagonal entry and scales tiny and huge blocks without losing accuracy', () => {
    // e[1] = 0 splits T into the blocks {3, 1 | 0.5} and {−2, 5, 0.5 | 0.25, 1}; eigenvalues scale with T.
    const run = (scale: number) => {
      const d = Float64Array.from([3, 1, -2, 5, 0.5].map((x) => x * scale));
      const e = Float64Array.from([0.5, 0, 0.25, 1].map((x) => x * scale));
      expect(hermitianTridiagonalQl(5, d, e, null)).toBe(0);
      return Array.from(d, (x) => x / scale);
    };
    const ref = run(1);
    // The 2×2 block {3, 1 | 0.5} has eigenvalues 2 ± √(1.25) (closed form).
    expect(ref.some((x) => Math.abs(x - (2 + Math.sqrt(1.25))) < 1e-14)).toBe(true);
    expect(ref.some((x) => Math.abs(x - (2 - Math.sqrt(1.25))) < 1e-14)).toBe(true);
    for (const scale of [1e-300, 1e300]) {
      run(scale).forEach((x, k) => expect(Math.abs(x - ref[k])).toBeLessThanOrEqual(1e-14 * 8));
    }
  });
});
