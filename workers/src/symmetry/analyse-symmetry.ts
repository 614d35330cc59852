/**
 * analyseSymmetry — which symmetries a quench H0 → H1 on a lattice lets the spectral engine
 * use, decided from the Pauli terms alone (no model names), for a requested mode:
 *   'none'           one block (the whole 2^N space; for checks);
 *   'magnetisation'  conserved Σ_i Z_i only (popcount sectors);
 *   'translations'   magnetisation and the lattice translations both Hamiltonians keep;
 *   'all'            as 'translations', plus one reflection both keep (default).
 * Spatial symmetries must be shared by H0 and H1 (the quench needs ρ and U block-diagonal in
 * one basis). Magnetisation may be H0's alone: H0 is then decomposed in (sector, M) blocks that
 * refine the joint sector blocks H1 is decomposed in (spectral-setup.ts), as before spatial
 * symmetries existed. Observables never restrict the choice: they are group-averaged
 * (symmetrise-terms.ts explains why that is exact), so no fallback is needed for them.
 * Cost: O(T·N) algebra per candidate permutation; no 2^N tables (plans call this).
 */
import type { Lattice } from '../../../shared-types/src/index.js';
import type { PauliSum } from '../physics/types.js';
import { conservesMagnetisation } from './conserves-magnetisation.js';
import { groupSectors } from './group-sectors.js';
import type { Sector } from './group-sectors.js';
import { termTable } from './invariant-under.js';
import { latticePermutations } from './lattice-permutations.js';
import { chooseSpatialGroup, trivialGroup } from './spatial-group.js';
import type { SpatialGroup } from './spatial-group.js';

/** Which symmetries may split the basis (see the file header). */
export type SymmetryMode = 'none' | 'magnetisation' | 'translations' | 'all';

/** The modes, for option checks. */
export const SYMMETRY_MODES: readonly SymmetryMode[] = ['none', 'magnetisation', 'translations', 'all'];

/** What a quench may use. */
export interface SymmetryAnalysis {
  readonly mode: SymmetryMode;
  readonly group: SpatialGroup;
  readonly sectors: readonly Sector[];
  /** Σ Z_i conserved by H0 (its blocks resolve M). */
  readonly magnetisation0: boolean;
  /** Σ Z_i conserved by H0 and H1 (the joint blocks resolve M). */
  readonly magnetisationJoint: boolean;
  /** Symmetries used, e.g. 'magnetisation', 'translation a1 (order 8)', 'reflection inversion'. */
  readonly used: readonly string[];
  /** Candidates dropped and why, e.g. 'reflection inversion: broken by h1'. */
  readonly rejected: readonly string[];
  /** used joined by ' + ', or 'none'. */
  readonly label: string;
}

/** The symmetry analysis of a quench (see the file header). */
export function analyseSymmetry(lattice: Lattice, h0: PauliSum, h1: PauliSum, mode: SymmetryMode): SymmetryAnalysis {
  const sites = h0.sites;
  const used: string[] = [];
  const rejected: string[] = [];
  const m0 = mode !== 'none' && conservesMagnetisation(h0);
  const m1 = mode !== 'none' && conservesMagnetisation(h1);
  if (m0 && m1) used.push('magnetisation');
  else if (m0) {
    used.push('magnetisation (H0 only)');
    rejected.push('magnetisation: broken by h1');
  } else if (mode !== 'none') rejected.push(`magnetisation: broken by ${m1 ? 'h0' : 'h0 and h1'}`);
  let group = trivialGroup(sites);
  if (mode === 'translations' || mode === 'all') {
    const choice = chooseSpatialGroup(
      sites, latticePermutations(lattice, sites),
      [{ name: 'h0', table: termTable(h0.terms) }, { name: 'h1', table: termTable(h1.terms) }],
      { translations: true, reflection: mode === 'all' },
    );
    group = choice.group;
    used.push(...choice.used);
    rejected.push(...choice.rejected);
  }
  return {
    mode, group, sectors: groupSectors(group), magnetisation0: m0, magnetisationJoint: m0 && m1,
    used, rejected, label: used.length > 0 ? used.join(' + ') : 'none',
  };
}
