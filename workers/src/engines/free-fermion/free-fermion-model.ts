/**
 * freeFermionModel — the lattice, merged Hamiltonian terms and Majorana forms of a spec, or the
 * reason the free-fermion engine cannot run it. Shared by the plan and the run so that both
 * decide the same way.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import type { LatticeGraph } from '../../physics/types.js';
import {
  isNotQuadratic, majoranaHamiltonian, type MajoranaHamiltonian,
} from './majorana-hamiltonian.js';
import { siteTerms, type SiteTerm } from '../../physics/site-terms.js';

/** Largest lattice the engine accepts (the schema's own site limit). */
export const MAX_FREE_FERMION_SITES = 4096;

/** A spec the engine can run. */
export interface FreeFermionModel {
  readonly graph: LatticeGraph;
  readonly sites: number;
  readonly h0Terms: readonly SiteTerm[];
  readonly h1Terms: readonly SiteTerm[];
  readonly h0: MajoranaHamiltonian;
  readonly h1: MajoranaHamiltonian;
  /** 2 when either Hamiltonian depends on the fermion parity (a ring), else 1. */
  readonly sectors: 1 | 2;
}

/** Why not: the plan's refusal fields. */
export interface ModelRefusal {
  readonly field: string;
  readonly limit: number;
  readonly estimate: number;
  readonly message: string;
}

/** The model of `spec`, or a refusal. Never throws on a schema-valid spec. */
export function freeFermionModel(spec: SweepSpec): FreeFermionModel | ModelRefusal {
  let graph: LatticeGraph;
  try {
    graph = buildLattice(spec.lattice);
  } catch (e) {
    return { field: 'lattice', limit: 0, estimate: 0, message: `the lattice cannot be built: ${(e as Error).message}` };
  }
  const sites = graph.sites;
  if (sites > MAX_FREE_FERMION_SITES) {
    return {
      field: 'lattice', limit: MAX_FREE_FERMION_SITES, estimate: sites,
      message: `the free-fermion engine is limited to ${MAX_FREE_FERMION_SITES} sites; this lattice has ${sites}`,
    };
  }
  const forms: Partial<Record<'h0' | 'h1', { terms: SiteTerm[]; form: MajoranaHamiltonian }>> = {};
  for (const which of ['h0', 'h1'] as const) {
    let terms: SiteTerm[];
    try {
      terms = siteTerms(spec[which], graph);
    } catch (e) {
      return { field: which, limit: 0, estimate: 0, message: `${which} cannot be built: ${(e as Error).message}` };
    }
    const form = majoranaHamiltonian(terms, sites);
    if (isNotQuadratic(form)) {
      return {
        field: which, limit: 2, estimate: form.majoranas,
        message: `${which} is not quadratic in Jordan–Wigner fermions: ${form.message}`,
      };
    }
    forms[which] = { terms, form };
  }
  const h0 = forms.h0!;
  const h1 = forms.h1!;
  return {
    graph, sites, h0Terms: h0.terms, h1Terms: h1.terms, h0: h0.form, h1: h1.form,
    sectors: h0.form.sectorDependent || h1.form.sectorDependent ? 2 : 1,
  };
}

/** True for the refusal branch of {@link freeFermionModel}. */
export function isModelRefusal(x: FreeFermionModel | ModelRefusal): x is ModelRefusal {
  return (x as ModelRefusal).message !== undefined;
}
