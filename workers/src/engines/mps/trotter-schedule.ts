/**
 * trotterStages — the layer sequence of `steps` Trotter steps for H = Σ_k H_k over n layers
 * (layer 0: neighbour bonds 0, 2, 4, …; layer 1: neighbour bonds 1, 3, 5, …; layers 2, 3, …:
 * the groups of long bonds of bond-model.ts; the bonds of one layer commute), with adjacent
 * stages of the same layer merged (the last layer-0 stage of a step joins the first of the next):
 *
 *   order 2 (Strang; Suzuki, J. Math. Phys. 32, 400 (1991)), symmetric:
 *     S2(τ) = e^{τH_0/2} ⋯ e^{τH_{n−2}/2} e^{τH_{n−1}} e^{τH_{n−2}/2} ⋯ e^{τH_0/2}
 *     (n = 2: e^{τA/2} e^{τB} e^{τA/2})
 *   order 4 (the symmetric triple jump of Forest & Ruth, Physica D 43, 105 (1990) and
 *     Yoshida, Phys. Lett. A 150, 262 (1990), built on any symmetric S2):
 *     S4(τ) = S2(w₁τ) S2(w₀τ) S2(w₁τ),  w₁ = 1/(2 − 2^{1/3}),  w₀ = 1 − 2w₁ (< 0)
 * A stage is { layer, weight }: apply the layer's gates for the time weight·τ. With one layer
 * (a single bond) the whole sequence merges into one exact stage.
 * Local errors: S2 − e^{τH} = O(τ³), S4 − e^{τH} = O(τ⁵) for any number of layers, so global
 * errors are O(τ²) and O(τ⁴); the negative w₀ step is harmless for the short imaginary-time
 * steps used here.
 */

/** Trotter order. */
export type TrotterOrder = 2 | 4;

/** One stage: the gates of `layer` for the time weight·τ. */
export interface TrotterStage {
  readonly layer: number;
  readonly weight: number;
}

/** w₁ of the fourth-order triple jump. */
export const TRIPLE_JUMP_OUTER = 1 / (2 - 2 ** (1 / 3));
/** w₀ = 1 − 2w₁ of the fourth-order triple jump. */
export const TRIPLE_JUMP_INNER = 1 - 2 * TRIPLE_JUMP_OUTER;

/**
 * Stages of `steps` steps of the given order over `layers` layers, merged (see the file header).
 * @throws RangeError if steps or layers is not a positive integer, or the order is not 2 or 4.
 */
export function trotterStages(order: TrotterOrder, steps: number, layers = 2): TrotterStage[] {
  if (!Number.isInteger(steps) || steps < 1) throw new RangeError(`trotterStages: steps must be a positive integer; got ${steps}`);
  if (order !== 2 && order !== 4) throw new RangeError(`trotterStages: order must be 2 or 4; got ${String(order)}`);
  if (!Number.isInteger(layers) || layers < 1) throw new RangeError(`trotterStages: layers must be a positive integer; got ${layers}`);
  const strang = (w: number): TrotterStage[] => {
    const out: TrotterStage[] = [];
    for (let k = 0; k < layers - 1; k++) out.push({ layer: k, weight: w / 2 });
    out.push({ layer: layers - 1, weight: w });
    for (let k = layers - 2; k >= 0; k--) out.push({ layer: k, weight: w / 2 });
    return out;
  };
  const one = order === 2
    ? strang(1)
    : [...strang(TRIPLE_JUMP_OUTER), ...strang(TRIPLE_JUMP_INNER), ...strang(TRIPLE_JUMP_OUTER)];
  const out: TrotterStage[] = [];
  for (let k = 0; k < steps; k++) {
    for (const st of one) {
      const last = out[out.length - 1];
      if (last !== undefined && last.layer === st.layer) out[out.length - 1] = { layer: st.layer, weight: last.weight + st.weight };
      else out.push(st);
    }
  }
  return out;
}

/**
 * Two-site updates of `steps` Trotter steps when applying layer k once costs layerCosts[k]
 * updates (merged stages counted once; exact: the merged sequence repeats from the second step on).
 */
export function updatesFor(order: TrotterOrder, steps: number, layerCosts: readonly number[]): number {
  if (steps < 1 || layerCosts.length === 0) return 0;
  const cost = (n: number) => trotterStages(order, n, layerCosts.length).reduce((s, st) => s + layerCosts[st.layer], 0);
  const first = cost(1);
  return first + (steps - 1) * (cost(2) - first);
}
