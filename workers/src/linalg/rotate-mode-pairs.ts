/**
 * rotateModePairs — selected rows of F = O·E(t), where O holds the Schur vectors of a real
 * skew-symmetric A = O(⊕ε_k J)Oᵀ (see skew-schur.ts) and
 *
 *   E(t) = e^{(⊕ε_k J)t} = ⊕_k [[cos ε_k t, sin ε_k t], [−sin ε_k t, cos ε_k t]],
 *
 * so that e^{At} = F·Oᵀ and, for any Γ' in the mode basis, e^{At}·(OΓ'Oᵀ)·e^{Aᵀt} = F·Γ'·Fᵀ.
 * (e^{θJ} = cos θ·1 + sin θ·J because J² = −1; common practice.)
 *
 * out[r, 2k]   = cos(ε_k t)·O[row_r, 2k] − sin(ε_k t)·O[row_r, 2k+1]
 * out[r, 2k+1] = sin(ε_k t)·O[row_r, 2k] + cos(ε_k t)·O[row_r, 2k+1]
 * Cost: 6·n flops per row plus n/2 sine/cosine pairs (into the caller's `cos`, `sin`);
 * no allocation. Exactly orthogonal rotations: the rounding is one ulp per entry.
 */

/**
 * Writes rows `rows[r]` of O·E(t) into out[r·n …] (O is n × n row-major, ε has n/2 entries).
 * @throws RangeError on bad sizes or a row index outside 0..n−1.
 */
export function rotateModePairs(
  n: number, o: Float64Array, eps: Float64Array, t: number, rows: ArrayLike<number>,
  out: Float64Array, cos: Float64Array, sin: Float64Array,
): void {
  if (!Number.isInteger(n) || n < 0 || n % 2 !== 0) throw new RangeError(`rotateModePairs: n must be a non-negative even integer; got ${n}`);
  const m = n / 2;
  if (o.length < n * n) throw new RangeError(`rotateModePairs: o needs ${n * n} entries; got ${o.length}`);
  if (eps.length < m || cos.length < m || sin.length < m) throw new RangeError(`rotateModePairs: eps, cos and sin need ${m} entries each`);
  if (out.length < rows.length * n) throw new RangeError(`rotateModePairs: out needs ${rows.length * n} entries; got ${out.length}`);
  if (!Number.isFinite(t)) throw new RangeError(`rotateModePairs: t must be finite; got ${t}`);
  for (let k = 0; k < m; k++) {
    cos[k] = Math.cos(eps[k] * t);
    sin[k] = Math.sin(eps[k] * t);
  }
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r];
    if (!Number.isInteger(row) || row < 0 || row >= n) throw new RangeError(`rotateModePairs: row ${row} is outside 0..${n - 1}`);
    const src = row * n;
    const dst = r * n;
    for (let k = 0; k < m; k++) {
      const a = o[src + 2 * k];
      const b = o[src + 2 * k + 1];
      out[dst + 2 * k] = cos[k] * a - sin[k] * b;
      out[dst + 2 * k + 1] = sin[k] * a + cos[k] * b;
    }
  }
}
