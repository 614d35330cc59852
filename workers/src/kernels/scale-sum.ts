/**
 * scaleSum — s·H for a real-weighted Pauli sum (every weight times s). Cost O(T).
 */
import type { PauliSum } from '../physics/types.js';

/** s·H as a new Pauli sum (same strings, weights times the real factor `factor`). */
export function scaleSum(sum: PauliSum, factor: number): PauliSum {
  return {
    sites: sum.sites,
    terms: sum.terms.map((t) => ({ x: t.x, z: t.z, weight: t.weight * factor })),
  };
}
