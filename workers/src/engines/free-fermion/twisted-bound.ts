/**
 * twistedBound — a rigorous bound on the contribution of a sector's twisted Gaussian component
 * to the expectation of a string of 2r Majoranas, used to skip that component when it cannot
 * matter (high temperature, long rings).
 *
 * The twisted term is v·Pf(Γ̃_sub) with v = u·q·Π_k τ_k and Γ̃_sub = Q·D·Qᵀ, D = ⊕(−coth x_k)J,
 * Q = 2r rows of an orthogonal matrix (in the mode basis of H0). The Cauchy–Binet formula for
 * Pfaffians gives Pf(QDQᵀ) = Σ_{|S| = r modes} det(Q_S)·Π_{k∈S}(−coth x_k), so
 *   |v·Pf(Γ̃_sub)| = u·|Σ_S det(Q_S)·Π_{k∉S} τ_k| ≤ u·√(Σ_S det(Q_S)²)·√(Σ_S Π_{k∉S} τ_k²)
 *                 = u·√(e_{L−r}(τ²))
 * (Cauchy–Schwarz; Σ_S det(Q_S)² = det(QQᵀ) = 1), with e_j the elementary symmetric polynomial.
 * With z of the τ_k equal to 0: e_{L−r}(τ²) = 0 if z > r, else Π_{τ≠0} τ² · e_{r−z}(1/τ²) over
 * the non-zero τ. Evaluated in logs (values range over hundreds of decades).
 * Cost: O(L·r_max).
 */

/**
 * ln of √(e_{L−r}(τ²)) for every r = 0..rMax (−∞ where it is 0); τ_k ∈ [0, 1].
 * @throws RangeError if rMax is negative or not an integer.
 */
export function logTwistedBounds(tau: ArrayLike<number>, rMax: number): Float64Array {
  if (!Number.isInteger(rMax) || rMax < 0) throw new RangeError(`logTwistedBounds: rMax must be a non-negative integer; got ${rMax}`);
  const L = tau.length;
  let zeros = 0;
  let logProd = 0;
  const logInvSq: number[] = [];
  for (let k = 0; k < L; k++) {
    const t = tau[k];
    if (t === 0) zeros++;
    else {
      logProd += 2 * Math.log(t);
      logInvSq.push(-2 * Math.log(t));
    }
  }
  const top = Math.min(rMax, L);
  // logE[j] = ln e_j(1/τ²) over the non-zero τ, j = 0..top.
  const logE = new Float64Array(top + 1).fill(-Infinity);
  logE[0] = 0;
  for (const y of logInvSq) {
    for (let j = Math.min(top, L) ; j >= 1; j--) {
      const add = y + logE[j - 1];
      const cur = logE[j];
      if (add === -Infinity) continue;
      logE[j] = cur === -Infinity ? add : Math.max(cur, add) + Math.log1p(Math.exp(-Math.abs(cur - add)));
    }
  }
  const out = new Float64Array(rMax + 1).fill(-Infinity);
  for (let r = 0; r <= rMax; r++) {
    if (r > L || zeros > r) continue;
    out[r] = 0.5 * (logProd + logE[r - zeros]);
  }
  return out;
}
