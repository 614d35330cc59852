/**
 * skewExp (e^{At} from the Schur form) against the general-purpose library mathjs (expm, Padé
 * with scaling and squaring), and orthogonality of the result; orthogonalityDefect on exact and
 * perturbed orthogonal matrices.
 */
import * as math from 'mathjs';
import { describe, expect, it } from 'vitest';
import { orthogonalityDefect } from '../../../workers/src/linalg/orthogonality-defect.js';
import { skewExp } from '../../../workers/src/linalg/skew-exp.js';
import { skewSchur } from '../../../workers/src/linalg/skew-schur.js';
import { maxAbsDiff, orthogonalityError, randomSkew } from './random-matrices.js';

describe('skewExp', () => {
  for (const t of [0, 0.3, 2.5, 17]) {
    it(`matches mathjs expm(A·t) and is orthogonal at t = ${t}`, () => {
      const n = 10;
      const a = randomSkew(n, 40);
      const out = new Float64Array(n * n);
      skewExp(skewSchur(n, a.slice()), t, out, new Float64Array(n * n));
      const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n)).map((v) => v * t));
      const ref = (math.expm(math.matrix(rows)).toArray() as number[][]).flat();
      // ‖At‖ ≲ 3t: Padé/scaling rounding grows ~‖At‖·u; 1e−12·(1 + t) covers both routes.
      expect(maxAbsDiff(out, ref)).toBeLessThan(1e-12 * (1 + t));
      expect(orthogonalityError(out, n)).toBeLessThan(1e-13);
    });
  }
});

describe('orthogonalityDefect', () => {
  it('is rounding-level for computed orthogonal factors and sees a perturbation', () => {
    const n = 30;
    const s = skewSchur(n, randomSkew(n, 41));
    expect(orthogonalityDefect(n, s.o)).toBeLessThan(1e-14);
    const bent = s.o.slice();
    for (let i = 0; i < n; i++) bent[i * n + 3] *= 1 + 1e-6; // column 3 lengthened by 1e−6
    const d = orthogonalityDefect(n, bent, 8);
    // ‖OᵀO − 1‖₂ = 2e−6 + 1e−12; a random probe sees a fraction ≥ 1/(few·√n) of it typically.
    expect(d).toBeGreaterThan(1e-8);
    expect(d).toBeLessThanOrEqual(2.1e-6);
  });

  it('is 0 for the empty matrix and rejects bad arguments', () => {
    expect(orthogonalityDefect(0, new Float64Array(0))).toBe(0);
    expect(() => orthogonalityDefect(3, new Float64Array(8))).toThrow(RangeError);
    expect(() => orthogonalityDefect(2, new Float64Array(4), 0)).toThrow(RangeError);
  });
});
