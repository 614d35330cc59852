/**
 * Reference-only partition function of the classical square-lattice Ising model on an
 * m × n torus (m rows of n spins, periodic both ways, 2mn bonds, every bond coupling K = βJ):
 *
 *   Z = Σ_s exp(K Σ_⟨ij⟩ s_i s_j)
 *     = ½ (2 sinh 2K)^{mn/2} [ Π_{k odd} 2cosh(mγ_k/2) + Π_{k odd} 2sinh(mγ_k/2)
 *                            + Π_{k even} 2cosh(mγ_k/2) + Π_{k even} 2sinh(mγ_k/2) ],
 *   k runs over 0 … 2n−1 (n odd and n even values each),
 *   cosh γ_k = cosh 2K coth 2K − cos(πk/n)  (γ_k > 0 for k ≥ 1),
 *   γ_0 = 2K + ln tanh K  (signed: negative above T_c).
 *
 * Source: B. Kaufman, Phys. Rev. 76, 1232 (1949). The formula is written from memory (the
 * form with cosh 2K* = coth 2K substituted, K* the dual coupling); it is verified against
 * brute-force enumeration and transfer matrices in tests/reference/kaufman-torus.test.ts
 * before any use. Note it describes the standard torus only: each direction needs length ≥ 3
 * (a periodic direction of length 2 would need two bonds per pair of sites).
 *
 * Everything is computed in the log domain, so tori of 64 × 64 at any K > 0 are fine.
 * Cost: O(n²) per call (the derivative excludes each factor in turn).
 */

/** ln Z and its first derivative d ln Z / dK. */
export interface KaufmanValue {
  lnZ: number;
  dLnZdK: number;
}

/** log|2 cosh x|, stable. */
function log2cosh(x: number): number {
  const a = Math.abs(x);
  return a + Math.log1p(Math.exp(-2 * a));
}

/** log|2 sinh x| (−∞ at x = 0), stable. */
function log2sinhAbs(x: number): number {
  const a = Math.abs(x);
  return a + Math.log(-Math.expm1(-2 * a));
}

/** log|sinh x| + ln 2 is log2sinhAbs; log|cosh| similarly: helpers for derivative factors. */
interface Factor {
  /** log|f_k| */
  logAbs: number;
  sign: number;
  /** log|f_k'| and its sign (derivative with respect to K). */
  dLogAbs: number;
  dSign: number;
}

/** γ_k and dγ_k/dK for k ≥ 1 (θ = πk/n), from cosh γ = u + 1/u − cos θ, u = sinh 2K. */
function gammaK(k: number, n: number, K: number): { g: number; dg: number } {
  if (k === 0) {
    return { g: 2 * K + Math.log(Math.tanh(K)), dg: 2 + 2 / Math.sinh(2 * K) };
  }
  const u = Math.sinh(2 * K);
  const s = Math.sin((Math.PI * k) / (2 * n));
  // δ = cosh γ − 1 = (u − 1)²/u + 2 sin²(θ/2), written without cancellation.
  const delta = ((u - 1) * (u - 1)) / u + 2 * s * s;
  const sinhG = Math.sqrt(delta * (2 + delta));
  const g = Math.log1p(delta + sinhG);
  const dCosh = 2 * Math.cosh(2 * K) * (1 - 1 / (u * u));
  return { g, dg: dCosh / sinhG };
}

/**
 * ln Z and d ln Z/dK of the classical Ising model on the m × n torus at coupling K > 0
 * (m, n ≥ 3 for a standard torus). Throws RangeError otherwise.
 */
export function kaufmanTorus(m: number, n: number, K: number): KaufmanValue {
  if (!Number.isInteger(m) || !Number.isInteger(n) || m < 1 || n < 1) throw new RangeError(`kaufmanTorus: m, n must be positive integers, got ${m}, ${n}`);
  if (!(K > 0) || !Number.isFinite(K)) throw new RangeError(`kaufmanTorus: K must be finite and > 0, got ${K}`);
  const gammas = [...Array(2 * n).keys()].map((k) => gammaK(k, n, K));
  const sets = [
    { parity: 1, hyper: 'cosh' }, { parity: 1, hyper: 'sinh' },
    { parity: 0, hyper: 'cosh' }, { parity: 0, hyper: 'sinh' },
  ] as const;
  const products: Factor[][] = sets.map(({ parity, hyper }) => {
    const factors: Factor[] = [];
    for (let k = parity; k < 2 * n; k += 2) {
      const { g, dg } = gammas[k];
      const x = 0.5 * m * g;
      const dx = 0.5 * m * dg;
      if (hyper === 'cosh') {
        // d(2cosh x)/dK = 2 sinh x · dx
        factors.push({ logAbs: log2cosh(x), sign: 1, dLogAbs: log2sinhAbs(x) + Math.log(Math.abs(dx)), dSign: Math.sign(x) * Math.sign(dx) });
      } else {
        factors.push({ logAbs: log2sinhAbs(x), sign: x < 0 ? -1 : 1, dLogAbs: log2cosh(x) + Math.log(Math.abs(dx)), dSign: Math.sign(dx) });
      }
    }
    return factors;
  });
  // Σ_i Z_i in the log domain (signed terms; the total is positive).
  const logs = products.map((f) => f.reduce((s, x) => s + x.logAbs, 0));
  const signs = products.map((f) => f.reduce((s, x) => s * x.sign, 1));
  const top = Math.max(...logs);
  let sum = 0;
  logs.forEach((l, i) => { sum += signs[i] * Math.exp(l - top); });
  const logSum = top + Math.log(sum);
  // d(Σ Z_i)/dK / Σ Z_i, each product differentiated factor by factor.
  let dSum = 0;
  for (const factors of products) {
    for (let k = 0; k < factors.length; k++) {
      let logRest = factors[k].dLogAbs, sign = factors[k].dSign;
      for (let j = 0; j < factors.length; j++) {
        if (j === k) continue;
        logRest += factors[j].logAbs;
        sign *= factors[j].sign;
      }
      if (sign !== 0) dSum += sign * Math.exp(logRest - logSum);
    }
  }
  const mn = m * n;
  const lnZ = -Math.LN2 + 0.5 * mn * Math.log(2 * Math.sinh(2 * K)) + logSum;
  const dLnZdK = mn / Math.tanh(2 * K) + dSum;
  return { lnZ, dLnZdK };
}

/** Onsager's critical coupling K_c = ln(1 + √2)/2 (Onsager, Phys. Rev. 65, 117 (1944)). */
export const ONSAGER_KC = 0.5 * Math.log(1 + Math.SQRT2);
