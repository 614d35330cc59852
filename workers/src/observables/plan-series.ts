/**
 * The series a spec's observables produce, in order, with stable labels — without building
 * any Pauli masks, so it works on lattices of any size (labels for `Engine.series`, duplicate
 * checks in checkSpec). {@link expandObservables} turns each entry into weighted Pauli strings.
 *
 * Labels (stable: clients key on them). `P`, `A`, `B` are Pauli letters, `AB` a letter pair:
 * - site:            "P:avg" (mean over all sites, or over `sites` if given); with perSite
 *                    also "P@i" per site, in the listed order.
 * - pair:            "AB:nearest", "AB:next-nearest", "AB:pairs" (explicit list), or for
 *                    by-distance one "AB:d=<r>" per distance class, ascending; with perPair
 *                    also "AB@i-j" per pair (A on site i). connected appends "~conn" to every
 *                    series of the observable, e.g. "ZZ:nearest~conn", "ZZ@0-1~conn".
 * - energy:          "E:h0", "E:h1" (totals).
 * - magnetisation:   "mP:uniform", "mP:staggered" (densities).
 * - structure factor "S_AB(qx,qy)", plus "~conn" when connected.
 * Numbers in labels (distances r, momenta q) are rounded to 4 decimals and written without
 * trailing zeros ("1", "1.4142", "3.1416", "-0.5"); −0 is written "0". Pairs of by-distance
 * are all i < j, grouped by their rounded minimum-image distance.
 */
import type { Observable, SeriesInfo, SweepSpec } from '../../../shared-types/src/index.js';
import type { LatticeGraph } from '../physics/types.js';

/** A single Pauli letter. */
export type PauliLetter = 'X' | 'Y' | 'Z';

/** What one series measures (weights are filled in by {@link expandObservables}). */
export type SeriesRecipe =
  /** Mean of ⟨P_i⟩ over `sites`. */
  | { readonly type: 'site-mean'; readonly letter: PauliLetter; readonly sites: readonly number[] }
  /** Mean of ⟨A_i B_j⟩ (minus ⟨A_i⟩⟨B_j⟩ when connected) over the pairs `pairs()` returns. */
  | {
    readonly type: 'pair-mean'; readonly letters: readonly [PauliLetter, PauliLetter];
    readonly pairs: () => ReadonlyArray<readonly [number, number]>; readonly connected: boolean;
  }
  /** ⟨H0⟩ or ⟨H1⟩. */
  | { readonly type: 'energy'; readonly of: 'h0' | 'h1' }
  /** (1/N) Σ s_i ⟨P_i⟩, s_i = 1 or the sublattice sign. */
  | { readonly type: 'magnetisation'; readonly letter: PauliLetter; readonly pattern: 'uniform' | 'staggered' }
  /** S(q) = (1/N) Σ_ij cos(q·(r_i − r_j)) ⟨P_i P_j⟩ (connected: minus ⟨P_i⟩⟨P_j⟩). */
  | {
    readonly type: 'structure-factor'; readonly letter: PauliLetter;
    readonly q: readonly [number, number]; readonly connected: boolean;
  };

/** One series: its label, the index of its observable in spec.observables, and its recipe. */
export interface SeriesPlanEntry {
  readonly label: string;
  readonly observable: number;
  readonly recipe: SeriesRecipe;
}

/** Rounds to 4 decimals and writes the shortest form: 1 → "1", √2 → "1.4142", −0 → "0". */
export function formatLabelNumber(v: number): string {
  const r = Number(v.toFixed(4));
  return Object.is(r, -0) ? '0' : String(r);
}

type PairObs = Extract<Observable, { kind: 'pair' }>;

/** All pairs i < j grouped by rounded distance, classes ascending, pairs in (i, j) order within a class. */
export function distanceClasses(graph: LatticeGraph): Array<{ name: string; pairs: Array<readonly [number, number]> }> {
  const byName = new Map<string, { value: number; pairs: Array<readonly [number, number]> }>();
  const names = new Map<number, string>();
  for (let i = 0; i < graph.sites; i++) {
    for (let j = i + 1; j < graph.sites; j++) {
      const d = graph.distance(i, j);
      let name = names.get(d);
      if (name === undefined) {
        name = formatLabelNumber(d);
        names.set(d, name);
      }
      let cls = byName.get(name);
      if (cls === undefined) {
        cls = { value: Number(name), pairs: [] };
        byName.set(name, cls);
      }
      cls.pairs.push([i, j]);
    }
  }
  return [...byName.entries()]
    .sort((a, b) => a[1].value - b[1].value)
    .map(([name, c]) => ({ name, pairs: c.pairs }));
}

/** The distinct rounded distance names of all pairs i < j, ascending (no pair lists kept). */
function distanceNames(graph: LatticeGraph): string[] {
  const names = new Map<number, string>();
  const seen = new Set<string>();
  for (let i = 0; i < graph.sites; i++) {
    for (let j = i + 1; j < graph.sites; j++) {
      const d = graph.distance(i, j);
      let name = names.get(d);
      if (name === undefined) {
        name = formatLabelNumber(d);
        names.set(d, name);
      }
      seen.add(name);
    }
  }
  return [...seen].sort((a, b) => Number(a) - Number(b));
}

function allPairs(sites: number): Array<readonly [number, number]> {
  const out: Array<readonly [number, number]> = [];
  for (let i = 0; i < sites; i++) for (let j = i + 1; j < sites; j++) out.push([i, j]);
  return out;
}

function planPair(o: PairObs, k: number, graph: LatticeGraph, out: SeriesPlanEntry[]): void {
  const letters = [o.paulis[0], o.paulis[1]] as const as readonly [PauliLetter, PauliLetter];
  const suffix = o.connected ? '~conn' : '';
  const mean = (name: string, pairs: () => ReadonlyArray<readonly [number, number]>) =>
    out.push({ label: `${o.paulis}:${name}${suffix}`, observable: k, recipe: { type: 'pair-mean', letters, pairs, connected: o.connected } });
  let list: () => ReadonlyArray<readonly [number, number]>;
  if (o.pairs === 'nearest') {
    list = () => graph.bonds;
    mean('nearest', list);
  } else if (o.pairs === 'next-nearest') {
    list = () => graph.farBonds;
    mean('next-nearest', list);
  } else if (o.pairs === 'by-distance') {
    let classes: ReturnType<typeof distanceClasses> | null = null;
    const getClasses = () => (classes ??= distanceClasses(graph));
    distanceNames(graph).forEach((name, c) => mean(`d=${name}`, () => getClasses()[c].pairs));
    list = () => allPairs(graph.sites);
  } else {
    const pairs = o.pairs;
    list = () => pairs;
    mean('pairs', list);
  }
  if (!o.perPair) return;
  // Per-pair labels only need the pair list itself; for the lattice selections it is cheap.
  for (const p of list()) {
    const pair = [p] as const;
    out.push({
      label: `${o.paulis}@${p[0]}-${p[1]}${suffix}`, observable: k,
      recipe: { type: 'pair-mean', letters, pairs: () => pair, connected: o.connected },
    });
  }
}

/** The series of every observable of the spec, in order (see the file comment for labels). */
export function planSeries(spec: SweepSpec, graph: LatticeGraph): SeriesPlanEntry[] {
  const out: SeriesPlanEntry[] = [];
  spec.observables.forEach((o, k) => {
    switch (o.kind) {
      case 'site': {
        const sites = o.sites ?? Array.from({ length: graph.sites }, (_, i) => i);
        out.push({ label: `${o.pauli}:avg`, observable: k, recipe: { type: 'site-mean', letter: o.pauli, sites } });
        if (o.perSite) {
          for (const s of sites) {
            out.push({ label: `${o.pauli}@${s}`, observable: k, recipe: { type: 'site-mean', letter: o.pauli, sites: [s] } });
          }
        }
        break;
      }
      case 'pair':
        planPair(o, k, graph, out);
        break;
      case 'energy':
        out.push({ label: `E:${o.of}`, observable: k, recipe: { type: 'energy', of: o.of } });
        break;
      case 'magnetisation':
        out.push({ label: `m${o.pauli}:${o.pattern}`, observable: k, recipe: { type: 'magnetisation', letter: o.pauli, pattern: o.pattern } });
        break;
      case 'structure-factor':
        for (const q of o.momenta) {
          out.push({
            label: `S_${o.paulis}(${formatLabelNumber(q[0])},${formatLabelNumber(q[1])})${o.connected ? '~conn' : ''}`,
            observable: k,
            recipe: { type: 'structure-factor', letter: o.paulis[0] as PauliLetter, q: [q[0], q[1]], connected: o.connected },
          });
        }
        break;
      default: {
        const never: never = o;
        throw new TypeError(`planSeries: unknown observable ${JSON.stringify(never)}`);
      }
    }
  });
  return out;
}

/** The series headers (label and observable index) of a spec, in order. */
export function seriesLabels(spec: SweepSpec, graph: LatticeGraph): SeriesInfo[] {
  return planSeries(spec, graph).map(({ label, observable }) => ({ label, observable }));
}
