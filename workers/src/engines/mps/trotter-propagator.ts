/**
 * TrotterPropagator — evolves a purified MPS by whole Trotter steps of one generator: the
 * imaginary-time steps e^{−τ H0} ⊗ 1 or the real-time steps of K = H1 ⊗ 1 − 1 ⊗ H1ᵀ
 * (bond-gates.ts), in the order-2 or order-4 splitting of trotter-schedule.ts over the
 * model's layers (neighbour bonds, then the layers of long bonds applied through swap gates:
 * bond-model.ts, apply-long-gate.ts), with the truncation of apply-gate.ts. Gates are built
 * once per distinct stage time weight·τ and cached (a grid of equal intervals needs a handful
 * of gate sets).
 */
import type { Truncation } from './apply-gate.js';
import { bondGates, longBondGates, swapGate, type GateKind } from './bond-gates.js';
import { layerCosts, type BondModel } from './bond-model.js';
import { evolveStages, type EvolutionStats, type EvolveWorkspace, type LongLayout, type StageGates } from './evolve-stages.js';
import type { PurifiedMps } from './purified-mps.js';
import { trotterStages, type TrotterOrder } from './trotter-schedule.js';

/** Most cached gate sets before the cache is cleared. */
const MAX_CACHED = 256;

/** Steps one generator (see the file header). */
export class TrotterPropagator {
  readonly #model: BondModel;
  readonly #kind: GateKind;
  readonly #order: TrotterOrder;
  readonly #truncation: Truncation;
  readonly #cache = new Map<number, StageGates>();
  readonly #auxModel: BondModel;
  readonly #layers: number;
  readonly #layout: LongLayout;

  /** `auxModel`: generator of the auxiliary spins in the 'echo' mode (bond-gates.ts). */
  constructor(model: BondModel, kind: GateKind, order: TrotterOrder, truncation: Truncation, auxModel: BondModel = model) {
    this.#model = model;
    this.#auxModel = auxModel;
    this.#kind = kind;
    this.#order = order;
    this.#truncation = truncation;
    this.#layers = layerCosts(model).length;
    this.#layout = { long: model.long, longLayers: model.longLayers, swap: model.long.length > 0 ? swapGate() : null };
    // Builds (and checks) the long-bond gates of the 'echo' mode once, before any run.
    if (model.long.length > 0) longBondGates(model, 0, kind, auxModel);
  }

  /** Trotter order. */
  get order(): TrotterOrder {
    return this.#order;
  }

  /** Evolves `mps` by `steps` steps of length τ (imaginary time: e^{−τH} per step). */
  run(mps: PurifiedMps, steps: number, tau: number, ws: EvolveWorkspace, stats: EvolutionStats): void {
    if (steps === 0) return;
    const stages = trotterStages(this.#order, steps, this.#layers);
    evolveStages(mps, stages, (w) => this.#gates(w * tau), this.#truncation, ws, stats, this.#layout);
  }

  #gates(time: number): StageGates {
    let g = this.#cache.get(time);
    if (g === undefined) {
      if (this.#cache.size >= MAX_CACHED) this.#cache.clear();
      g = {
        bonds: bondGates(this.#model, time, this.#kind, this.#auxModel),
        long: longBondGates(this.#model, time, this.#kind, this.#auxModel),
      };
      this.#cache.set(time, g);
    }
    return g;
  }
}

/** Trotter steps run between two checks of the abort signal (merging across chunks is lost: +2% work at order 4). */
export const CHUNK_STEPS = 8;

/**
 * {@link TrotterPropagator.run} in chunks of CHUNK_STEPS steps, giving the event loop a turn and
 * checking the abort signal between chunks. Rejects with `abort(signal)` when it fires.
 */
export async function runChunked(
  prop: TrotterPropagator, mps: PurifiedMps, steps: number, tau: number, ws: EvolveWorkspace,
  stats: EvolutionStats, signal: AbortSignal | undefined, abort: (s: AbortSignal) => Error,
): Promise<void> {
  for (let done = 0; done < steps; done += CHUNK_STEPS) {
    if (done > 0) {
      await new Promise<void>((resolve) => setImmediate(resolve));
      if (signal?.aborted) throw abort(signal);
    }
    prop.run(mps, Math.min(CHUNK_STEPS, steps - done), tau, ws, stats);
  }
}

/** Steps of at most dt covering a span: n = ⌈span/dt⌉ (at least 1 for a positive span). */
export function stepsFor(span: number, dt: number): number {
  if (!(span > 0)) return 0;
  return Math.max(1, Math.ceil(span / dt - 1e-9));
}
