/**
 * orthogonalityDefect — a cheap estimate of ‖OᵀO − 1‖₂ for an n × n matrix O that should be
 * orthogonal: the largest ‖Oᵀ(O z) − z‖/‖z‖ over `probes` random vectors z (seeded, so the
 * estimate is reproducible). It is a lower bound on the 2-norm of the defect and, for the
 * rounding-level defects of computed orthogonal factors, typically within a small factor of it
 * (power-method-free randomised norm estimation; Halko, Martinsson & Tropp, SIAM Rev. 53, 217
 * (2011), §4.3). Not a rigorous bound: use it for error ESTIMATES only.
 * Cost: 4·n²·probes flops; scratch: 3n doubles (allocated once per call).
 */

/** Default number of random probes. */
export const DEFECT_PROBES = 4;

/**
 * Estimate of ‖OᵀO − 1‖₂ (see the file header).
 * @throws RangeError if o has fewer than n² entries or probes < 1.
 */
export function orthogonalityDefect(n: number, o: Float64Array, probes = DEFECT_PROBES, seed = 12345): number {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`orthogonalityDefect: n must be a non-negative integer; got ${n}`);
  if (o.length < n * n) throw new RangeError(`orthogonalityDefect: o needs ${n * n} entries; got ${o.length}`);
  if (!Number.isInteger(probes) || probes < 1) throw new RangeError(`orthogonalityDefect: probes must be a positive integer; got ${probes}`);
  if (n === 0) return 0;
  let state = seed >>> 0;
  const rand = () => {
    // mulberry32 (common practice for reproducible test inputs).
    state = (state + 0x6d2b79f5) >>> 0;
    let x = state;
    x = Math.imul(x ^ (x >>> 15), x | 1);
    x ^= x + Math.imul(x ^ (x >>> 7), x | 61);
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296 - 0.5;
  };
  const z = new Float64Array(n);
  const y = new Float64Array(n);
  const x = new Float64Array(n);
  let worst = 0;
  for (let p = 0; p < probes; p++) {
    let zz = 0;
    for (let i = 0; i < n; i++) { z[i] = rand(); zz += z[i] * z[i]; }
    for (let i = 0; i < n; i++) {
      let s = 0;
      const row = i * n;
      for (let j = 0; j < n; j++) s += o[row + j] * z[j];
      y[i] = s;
    }
    x.fill(0);
    for (let i = 0; i < n; i++) {
      const yi = y[i];
      const row = i * n;
      for (let j = 0; j < n; j++) x[j] += o[row + j] * yi;
    }
    let dd = 0;
    for (let i = 0; i < n; i++) { const d = x[i] - z[i]; dd += d * d; }
    worst = Math.max(worst, Math.sqrt(dd / zz));
  }
  return worst;
}
