/**
 * The optional checkpoint hook of a branch run (`BranchOptions.checkpoints`): where an engine
 * that can resume keeps its state between attempts of one branch. Engine-agnostic: the engine
 * decides what the bytes hold and when to save them; the runner decides where they live (the
 * service: the job store, under the sweep's keys).
 *
 * Contract:
 * - `load()` returns the bytes of this branch's latest save, or null. The engine validates them
 *   (format, lattice, grids) and runs from the start when they do not fit or would skip a point
 *   that is not stored (`resumeFrom`).
 * - `save(bytes)` replaces the branch's checkpoint and resolves only once every record the
 *   engine passed to the sink before the call is stored as well, so a checkpoint never runs
 *   ahead of the stored points. A save that the store refuses (the sweep is over) resolves
 *   quietly; only a store failure rejects.
 * - `intervalSeconds` is the least wall time between two periodic saves (engines may also save
 *   at natural milestones, e.g. the end of the imaginary-time evolution).
 * Engines that cannot resume ignore the hook.
 */
export interface BranchCheckpoints {
  /** The latest saved checkpoint of the branch, or null. */
  load(): Promise<Uint8Array | null>;
  /** Stores (replaces) the branch's checkpoint (see the contract above). */
  save(data: Uint8Array): Promise<void>;
  /** Least wall time between two periodic saves, seconds (0: at every opportunity). */
  readonly intervalSeconds: number;
}
