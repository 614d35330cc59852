/**
 * spectralSetup — what both the plan and a branch of the spectral engine derive from a spec:
 * the lattice, H0 and H1 as Pauli sums, the observable layout and what is measured, the
 * symmetries the quench keeps and the shapes of its blocks, and whether H1 = H0 term by term.
 * buildSpectralBasis then builds the 2^N-sized tables a branch needs (plans never do).
 *
 * Blocks: one symmetry-adapted basis (symmetry/sector-basis.ts) for the spatial group that H0
 * and H1 share. H0 is decomposed over its own blocks P0 (sector × magnetisation when H0
 * conserves Σ Z_i), H1 over the joint blocks J (sector × magnetisation only when both conserve
 * it), which P0 refines: ρ and U(t) are then both block-diagonal in J. Observables are
 * measured through their group averages (symmetry/symmetrise-terms.ts; exact because ρ(t) is
 * group-invariant), whose off-block parts are dropped (only diagonal blocks enter
 * Tr(ρU†OU)); so ⟨X_i⟩ comes out exactly 0 when both Hamiltonians conserve Σ Z_i. When
 * H1 = H0, P0 = J and one decomposition serves both.
 * Cost: setup O(T·N) algebra per symmetry candidate and O(|G|²·N²) block counting; the basis
 * O(2^N·|G|) with ≈ 10·2^N bytes of tables.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import { expandObservables } from '../../observables/expand-observables.js';
import type { ObservableLayout } from '../../observables/expand-observables.js';
import { buildHamiltonian } from '../../physics/build-hamiltonian.js';
import { popcount } from '../../physics/pauli-algebra.js';
import { sameTerms } from '../../physics/same-terms.js';
import type { LatticeGraph, PauliSum } from '../../physics/types.js';
import {
  analyseSymmetry, blockShapes, sectorBasis, sectorPartition, symmetriseTerms,
} from '../../symmetry/index.js';
import type {
  BasisPartition, BlockShape, SectorBasis, SymmetryAnalysis, SymmetryMode,
} from '../../symmetry/index.js';
import { measurementPlan } from './measurement-plan.js';
import type { MeasurementPlan } from './measurement-plan.js';

/** Spectral bounds of a Pauli sum: shift (identity weight) and a = Σ|w| over the other terms. */
export interface SumFigures {
  readonly shift: number;
  readonly normBound: number;
  /** No string with an odd number of Y factors (the matrix is real). */
  readonly real: boolean;
}

/** The derived problem of one spec. */
export interface SpectralSetup {
  readonly graph: LatticeGraph;
  readonly sites: number;
  readonly h0: PauliSum;
  readonly h1: PauliSum;
  readonly fig0: SumFigures;
  readonly fig1: SumFigures;
  readonly layout: ObservableLayout;
  /** What is transformed into the eigenbasis (measurement-plan.ts), group-averaged. */
  readonly measure: MeasurementPlan;
  /** The symmetries used and dropped. */
  readonly symmetry: SymmetryAnalysis;
  /** Shapes of H0's blocks and of the joint blocks (for estimates and reports). */
  readonly shapes0: readonly BlockShape[];
  readonly shapesJoint: readonly BlockShape[];
  /** H1 = H0 term by term. */
  readonly same: boolean;
}

/** The tables of a branch. */
export interface SpectralBasis {
  readonly basis: SectorBasis;
  /** Blocks of H0 (refine `joint`). */
  readonly partition0: BasisPartition;
  /** Joint blocks of H0 and H1 (H1 is decomposed over these). */
  readonly joint: BasisPartition;
}

function figures(h: PauliSum): SumFigures {
  let shift = 0;
  let normBound = 0;
  let real = true;
  for (const t of h.terms) {
    if (t.x === 0 && t.z === 0) shift += t.weight;
    else normBound += Math.abs(t.weight);
    if ((popcount(t.x & t.z) & 1) === 1) real = false;
  }
  return { shift, normBound, real };
}

/**
 * Builds the setup. `graph` may be passed when already built.
 * @throws RangeError from the lattice, Hamiltonian or observable builders on an invalid spec.
 */
export function spectralSetup(spec: SweepSpec, mode: SymmetryMode, graph: LatticeGraph = buildLattice(spec.lattice)): SpectralSetup {
  const h0 = buildHamiltonian(spec.h0, graph);
  const h1 = buildHamiltonian(spec.h1, graph);
  const layout = expandObservables(spec, graph, h0, h1);
  const same = sameTerms(h0, h1);
  const symmetry = analyseSymmetry(spec.lattice, h0, h1, mode);
  const { group, sectors } = symmetry;
  const canonical = group.elements.length > 1 ? (terms: Parameters<typeof symmetriseTerms>[1]) => symmetriseTerms(group, terms) : undefined;
  return {
    graph, sites: graph.sites, h0, h1, fig0: figures(h0), fig1: figures(h1), layout,
    measure: measurementPlan(layout, canonical), symmetry,
    shapes0: blockShapes(group, sectors, symmetry.magnetisation0),
    shapesJoint: blockShapes(group, sectors, symmetry.magnetisationJoint),
    same,
  };
}

/** The symmetry-adapted basis and both partitions of a setup. */
export function buildSpectralBasis(setup: SpectralSetup): SpectralBasis {
  const { group, sectors, magnetisation0, magnetisationJoint, label } = setup.symmetry;
  const basis = sectorBasis(group, sectors);
  const partition0 = sectorPartition(basis, magnetisation0, label);
  const joint = magnetisation0 === magnetisationJoint ? partition0 : sectorPartition(basis, magnetisationJoint, label);
  return { basis, partition0, joint };
}
