/**
 * sameTerms — whether two Pauli sums have the same strings with the same merged weights
 * (order ignored, exact comparison). When H1 and H0 agree term by term the doubled state is
 * stationary under the quench (DESIGN.md §2): the exact engine then measures ‖Kψ‖, and the
 * spectral engine reuses one decomposition and reports the stationarity check. Cost: O(T).
 */
import type { PauliSum } from './types.js';

/** True when a and b are the same operator term by term (weights merged, zeros dropped; false when the site counts differ). */
export function sameTerms(a: PauliSum, b: PauliSum): boolean {
  if (a.sites !== b.sites) return false;
  const merge = (s: PauliSum) => {
    const m = new Map<string, number>();
    for (const t of s.terms) {
      const key = `${t.x},${t.z}`;
      m.set(key, (m.get(key) ?? 0) + t.weight);
    }
    for (const [k, w] of m) if (w === 0) m.delete(k);
    return m;
  };
  const ma = merge(a);
  const mb = merge(b);
  if (ma.size !== mb.size) return false;
  for (const [k, w] of ma) if (mb.get(k) !== w) return false;
  return true;
}
