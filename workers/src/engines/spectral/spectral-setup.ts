/**
 * spectralSetup — what both the plan and a branch of the spectral engine derive from a spec:
 * the lattice, H0 and H1 as Pauli sums and compiled tables, the observable layout, the symmetry
 * partitions, and whether H1 = H0 term by term.
 *
 * Partitions: H0 is decomposed over its own blocks P0 (symmetryBlocks); H1 over the joint blocks
 * J = join(P0, P1), the finest split both Hamiltonians respect, which is what the quench needs
 * (ρ and U(t) must both be block-diagonal). Observables need no symmetry: only the diagonal
 * blocks P_JJ of a Pauli string enter Tr(ρU†PU) (transform-pauli.ts), so, e.g., ⟨X_i⟩ comes out
 * exactly 0 when both Hamiltonians conserve Σ Z_i. When H1 = H0, P0 = J and one decomposition
 * serves both.
 * Cost: O(T·N) algebra + O(2^N) tables per partition; compiled tables 16·2^N bytes per flip group.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { compileOperator } from '../../kernels/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { expandObservables } from '../../observables/expand-observables.js';
import type { ObservableLayout } from '../../observables/expand-observables.js';
import { buildHamiltonian } from '../../physics/build-hamiltonian.js';
import type { LatticeGraph, PauliSum } from '../../physics/types.js';
import { joinPartitions, symmetryBlocks } from '../../symmetry/index.js';
import type { BasisPartition, SymmetryMode } from '../../symmetry/index.js';
import { measurementPlan } from './measurement-plan.js';
import type { MeasurementPlan } from './measurement-plan.js';
import { sameTerms } from './same-terms.js';

/** The derived problem of one spec. */
export interface SpectralSetup {
  readonly graph: LatticeGraph;
  readonly sites: number;
  readonly h0: PauliSum;
  readonly h1: PauliSum;
  readonly op0: CompiledOperator;
  readonly op1: CompiledOperator;
  readonly layout: ObservableLayout;
  /** What is transformed into the eigenbasis (measurement-plan.ts). */
  readonly measure: MeasurementPlan;
  /** Blocks of H0 (refine `joint`). */
  readonly partition0: BasisPartition;
  /** Joint blocks of H0 and H1 (H1 is decomposed over these). */
  readonly joint: BasisPartition;
  /** H1 = H0 term by term. */
  readonly same: boolean;
}

/**
 * Builds the setup. `graph` may be passed when already built.
 * @throws RangeError from the lattice, Hamiltonian or observable builders on an invalid spec.
 */
export function spectralSetup(spec: SweepSpec, mode: SymmetryMode, graph: LatticeGraph = buildLattice(spec.lattice)): SpectralSetup {
  const h0 = buildHamiltonian(spec.h0, graph);
  const h1 = buildHamiltonian(spec.h1, graph);
  const layout = expandObservables(spec, graph, h0, h1);
  const op0 = compileOperator(h0);
  const op1 = compileOperator(h1);
  const same = sameTerms(h0, h1);
  const p0 = symmetryBlocks(h0, mode);
  const joint = same ? p0 : joinPartitions(p0, symmetryBlocks(h1, mode));
  return { graph, sites: graph.sites, h0, h1, op0, op1, layout, measure: measurementPlan(layout), partition0: p0, joint, same };
}
