/**
 * trotterStages — the layer sequence of `steps` Trotter steps for H = H_A + H_B (A: bonds
 * 0, 2, 4, …; B: bonds 1, 3, 5, …; the bonds of one layer commute), with adjacent stages of the
 * same layer merged (the last A of a step joins the first A of the next):
 *
 *   order 2 (Strang; Suzuki, J. Math. Phys. 32, 400 (1991)):
 *     S2(τ) = e^{τA/2} e^{τB} e^{τA/2}
 *   order 4 (the symmetric triple jump of Forest & Ruth, Physica D 43, 105 (1990) and
 *     Yoshida, Phys. Lett. A 150, 262 (1990)):
 *     S4(τ) = S2(w₁τ) S2(w₀τ) S2(w₁τ),  w₁ = 1/(2 − 2^{1/3}),  w₀ = 1 − 2w₁ (< 0)
 * A stage is { layer, weight }: apply the layer's gates for the time weight·τ. With one layer
 * (a single bond) the whole sequence merges into one exact stage.
 * Local errors: S2 − e^{τ(A+B)} = O(τ³), S4 − e^{τ(A+B)} = O(τ⁵), so global errors are O(τ²)
 * and O(τ⁴); the negative w₀ step is harmless for the short imaginary-time steps used here.
 */

/** Trotter order. */
export type TrotterOrder = 2 | 4;

/** One stage: the gates of `layer` (0 = A, 1 = B) for the time weight·τ. */
export interface TrotterStage {
  readonly layer: 0 | 1;
  readonly weight: number;
}

/** w₁ of the fourth-order triple jump. */
export const TRIPLE_JUMP_OUTER = 1 / (2 - 2 ** (1 / 3));
/** w₀ = 1 − 2w₁ of the fourth-order triple jump. */
export const TRIPLE_JUMP_INNER = 1 - 2 * TRIPLE_JUMP_OUTER;

/**
 * Stages of `steps` steps of the given order, merged (see the file header); `layers` = 1 when
 * layer B is empty.
 * @throws RangeError if steps is not a positive integer or the order is not 2 or 4.
 */
export function trotterStages(order: TrotterOrder, steps: number, layers: 1 | 2 = 2): TrotterStage[] {
  if (!Number.isInteger(steps) || steps < 1) throw new RangeError(`trotterStages: steps must be a positive integer; got ${steps}`);
  if (order !== 2 && order !== 4) throw new RangeError(`trotterStages: order must be 2 or 4; got ${String(order)}`);
  const strang = (w: number): TrotterStage[] => [
    { layer: 0, weight: w / 2 }, { layer: 1, weight: w }, { layer: 0, weight: w / 2 },
  ];
  const one = order === 2
    ? strang(1)
    : [...strang(TRIPLE_JUMP_OUTER), ...strang(TRIPLE_JUMP_INNER), ...strang(TRIPLE_JUMP_OUTER)];
  const out: TrotterStage[] = [];
  for (let k = 0; k < steps; k++) {
    for (const st of one) {
      if (layers === 1 && st.layer === 1) continue;
      const last = out[out.length - 1];
      if (last !== undefined && last.layer === st.layer) out[out.length - 1] = { layer: st.layer, weight: last.weight + st.weight };
      else out.push(st);
    }
  }
  return out;
}

/** Gate applications (bond gates) of one step, counting merges across steps: for `bonds` bonds. */
export function gatesPerStep(order: TrotterOrder, bonds: number): number {
  if (bonds <= 1) return bonds;
  const stagesPerStep = order === 2 ? 2 : 6;
  return (stagesPerStep * bonds) / 2;
}
