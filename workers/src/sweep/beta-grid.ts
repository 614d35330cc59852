/**
 * The inverse temperatures of a spec in the order engines use: ascending, repeats removed.
 * Point `betaIndex` b refers to element b of this array.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';

export function betaGrid(spec: Pick<SweepSpec, 'betas'>): number[] {
  return [...new Set(spec.betas.map((b) => (Object.is(b, -0) ? 0 : b)))].sort((a, b) => a - b);
}
