/**
 * Core physics types shared by the lattice builders, the Pauli algebra, the kernels and the
 * engines. Conventions: DESIGN.md §2 (Pauli matrices, site i = bit i of a basis index,
 * Z|0⟩ = +|0⟩).
 */

/**
 * A Pauli string on up to 30 sites as two bit masks: bit i of `x` set → X or Y on site i;
 * bit i of `z` set → Z or Y on site i (Y = both). The operator is ⊗_i σ_i with the usual
 * Hermitian Pauli matrices (no extra phase): on a basis state |s⟩ it gives
 *   P|s⟩ = i^{popcount(x & z)} · (−1)^{popcount(s & z)} · |s ⊕ x⟩.
 */
export interface PauliString {
  readonly x: number;
  readonly z: number;
}

/** A real-weighted Pauli string. */
export interface PauliTermMask extends PauliString {
  readonly weight: number;
}

/** A real-weighted sum of Pauli strings on `sites` sites (a Hermitian operator). */
export interface PauliSum {
  readonly sites: number;
  readonly terms: readonly PauliTermMask[];
}

/** A lattice after building: sites, bonds and geometry. */
export interface LatticeGraph {
  readonly sites: number;
  /** Nearest-neighbour bonds, i < j, each once (a periodic direction of length 2 gives one bond). */
  readonly bonds: ReadonlyArray<readonly [number, number]>;
  /** Next-nearest-neighbour bonds, i < j, each once. */
  readonly farBonds: ReadonlyArray<readonly [number, number]>;
  /** Real-space coordinates of each site (unit lattice spacing). */
  readonly positions: ReadonlyArray<readonly [number, number]>;
  /** ±1 per site if the nearest-neighbour graph is bipartite, else null. */
  readonly sublattice: readonly number[] | null;
  /** Distance between sites i and j (minimum image along periodic directions). */
  distance(i: number, j: number): number;
}
