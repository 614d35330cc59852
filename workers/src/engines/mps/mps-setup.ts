/**
 * mpsSetup — everything a plan or a run of the mps engine derives from the spec: the lattice,
 * its chain order (chain-order.ts), the merged terms of H0 and H1 (chain-terms.ts) moved to
 * chain positions, their bond models (bond-model.ts), the observable layout, the full list of
 * strings measured at every time (the layout's primitives first, then the terms of H0 and H1
 * for the energies; all on chain positions) and the resolved settings.
 * Returns a refusal (field + message) instead of throwing when the spec is outside the
 * engine's reach.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { buildLattice } from '../../lattice/build-lattice.js';
import type { LatticeGraph } from '../../physics/types.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { bondModel, layerCosts, unsupportedTerm, type BondModel } from './bond-model.js';
import { chainOrder, remapFactors, remapTerms, type ChainOrder } from './chain-order.js';
import { chainTerms, wordOf, type ChainTerm } from './chain-terms.js';
import type { FactorString } from './measure-strings.js';
import { mpsLayout, stringTable, type MpsLayout } from './mps-layout.js';
import { mpsSettings, type MpsRunSettings } from './mps-settings.js';

/** A weighted sum of measured strings plus a constant (an energy). */
export interface MeasuredSum {
  readonly constant: number;
  /** [index into `strings`, weight]. */
  readonly terms: ReadonlyArray<readonly [number, number]>;
  /** Σ|w| over the non-constant terms (a bound on ‖H − c‖). */
  readonly normBound: number;
}

/** The derived setup of a spec. */
export interface MpsSetup {
  readonly graph: LatticeGraph;
  /** Lattice sites ↔ chain positions. */
  readonly order: ChainOrder;
  /** The merged terms of H0 and H1 on chain positions. */
  readonly h0Terms: readonly ChainTerm[];
  readonly h1Terms: readonly ChainTerm[];
  readonly m0: BondModel;
  readonly m1: BondModel;
  readonly layout: MpsLayout;
  /** The layout's primitives (same indices) followed by the energy strings, on chain positions. */
  readonly strings: readonly FactorString[];
  readonly energy0: MeasuredSum;
  readonly energy1: MeasuredSum;
  /** H1 and H0 have the same merged terms (the quench is trivial and the state stationary). */
  readonly h1EqualsH0: boolean;
  readonly betas: readonly number[];
  readonly times: readonly number[];
  readonly settings: MpsRunSettings;
}

/** A refusal: the spec field and why. */
export interface MpsRefusal {
  readonly field: string;
  readonly message: string;
}

function measuredSum(terms: readonly ChainTerm[], add: (f: ChainTerm['factors']) => number): MeasuredSum {
  let constant = 0;
  let normBound = 0;
  const out: Array<readonly [number, number]> = [];
  for (const t of terms) {
    if (t.factors.length === 0) constant += t.weight;
    else {
      out.push([add(t.factors), t.weight]);
      normBound += Math.abs(t.weight);
    }
  }
  return { constant, terms: out, normBound };
}

function sameTerms(a: readonly ChainTerm[], b: readonly ChainTerm[]): boolean {
  if (a.length !== b.length) return false;
  const m = new Map(a.map((t) => [wordOf(t.factors), t.weight]));
  return b.every((t) => m.get(wordOf(t.factors)) === t.weight);
}

/** The setup of `spec`, or a refusal. */
export function mpsSetup(spec: SweepSpec): MpsSetup | MpsRefusal {
  let graph: LatticeGraph;
  try {
    graph = buildLattice(spec.lattice);
  } catch (e) {
    return { field: 'lattice', message: `the lattice cannot be built: ${(e as Error).message}` };
  }
  const order = chainOrder(spec.lattice, graph.sites);
  if ('field' in order) return order;
  let latticeH0: ChainTerm[];
  let latticeH1: ChainTerm[];
  try {
    latticeH0 = chainTerms(spec.h0, graph);
    latticeH1 = chainTerms(spec.h1, graph);
  } catch (e) {
    return { field: 'h0', message: `the Hamiltonians cannot be built: ${(e as Error).message}` };
  }
  for (const [field, terms] of [['h0', latticeH0], ['h1', latticeH1]] as const) {
    const why = unsupportedTerm(terms);
    if (why !== null) return { field, message: `${why}; the mps engine runs one- and two-site terms (longer bonds through swap gates)` };
  }
  let layout: MpsLayout;
  try {
    layout = mpsLayout(spec, graph, latticeH0, latticeH1);
  } catch (e) {
    return { field: 'observables', message: (e as Error).message };
  }
  layout = { ...layout, primitives: layout.primitives.map((p) => ({ factors: remapFactors(p.factors, order) })) };
  const h0Terms = remapTerms(latticeH0, order);
  const h1Terms = remapTerms(latticeH1, order);
  const table = stringTable();
  for (const p of layout.primitives) table.add(p.factors);
  const energy0 = measuredSum(h0Terms, (f) => table.add(f));
  const energy1 = measuredSum(h1Terms, (f) => table.add(f));
  const m0 = bondModel(h0Terms, graph.sites);
  const m1 = bondModel(h1Terms, graph.sites);
  const betas = betaGrid(spec);
  const times = timeGrid(spec);
  let intervals = 0;
  let prev = 0;
  for (const t of times) {
    if (t > prev) intervals++;
    prev = t;
  }
  const settings = mpsSettings(spec, {
    localNorm: Math.max(m0.localNorm, m1.localNorm),
    layerCosts: [layerCosts(m0), layerCosts(m1)],
    imaginaryTime: betas[betas.length - 1] / 2,
    realTime: times[times.length - 1],
    intervals,
  });
  return {
    graph, order, h0Terms, h1Terms, m0, m1, layout, strings: table.list, energy0, energy1,
    h1EqualsH0: sameTerms(h0Terms, h1Terms), betas, times, settings,
  };
}

/** Narrows a setup result. */
export function isRefusal(x: MpsSetup | MpsRefusal): x is MpsRefusal {
  return (x as MpsRefusal).message !== undefined && (x as MpsSetup).graph === undefined;
}
