/**
 * computeSweepSeries — every series a sweep needs, for the spec's own lattice: ln Z in β to the
 * thermo order n, and for each reported observable label the double series of ⟨O(t)⟩_β in
 * (t, β) to total order K.
 *
 * Methods (both exact to the stated orders on the spec's finite lattice):
 * - 'whole-cluster': moments by Pauli algebra on all N sites (thermal-moments.ts,
 *   quench-series.ts). Cost grows like (number of terms)^{⌈n/2⌉}: small lattices.
 * Either way, primitives related by a translation along periodic directions (preset
 * Hamiltonians only, which are invariant) are computed once (site-orbits.ts).
 * - 'linked-cluster': cluster-expansion.ts on the lattice graph. Site orbits under translations
 *   along periodic directions are computed once (site-orbits.ts). When every direction is
 *   periodic and longer than the largest contributing cluster, no cluster wraps: ln Z/N then
 *   equals the infinite lattice's ln Z per site to order n, computed as a root-minimum sum on
 *   a larger torus (`kind: 'infinite-lattice'`); otherwise the result is labelled
 *   'finite-cluster'.
 * Why a torus longer than the cluster bound gives the infinite lattice: a connected cluster of
 * s sites spans at most s − 1 bonds in any direction, so for L > s it lifts uniquely to the
 * infinite lattice with the same terms, and every translation class of clusters occurs N/nb
 * times on the torus (see cluster-expansion.ts for the cluster bound).
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { buildLattice } from '../lattice/build-lattice.js';
import type { LatticeGraph } from '../physics/types.js';
import type { SitePauli } from './cluster-expansion.js';
import { ClusterExpansion } from './cluster-expansion.js';
import { multiplyFlatDouble } from './double-series.js';
import type { LatticeCells } from './lattice-cells.js';
import { centralCell, latticeCells, siteOfCell } from './lattice-cells.js';
import type { LocalModel } from './local-terms.js';
import { buildLocalModel, maxTermSupport } from './local-terms.js';
import { wordsForSites } from './pauli-masks.js';
import { PauliTable } from './pauli-table.js';
import { pointGroupOf } from './point-groups.js';
import { ROUNDING_UNIT } from './power-series.js';
import { quenchSeries } from './quench-series.js';
import type { SeriesObservables } from './series-observables.js';
import { expandSeriesObservables } from './series-observables.js';
import { canonicalTranslate, siteOrbitRepresentatives } from './site-orbits.js';
import { symmetryZero, type SymmetryZero } from './symmetry-zeros.js';
import { hamiltonianPowers, powerMoments } from './thermal-moments.js';
import { lnZSeries } from './thermal-series.js';

/** How the series were computed. */
export type SeriesMethod = 'whole-cluster' | 'linked-cluster';
/** Whether ln Z/N is the infinite lattice's (to the thermo order) or this finite lattice's. */
export type SeriesKind = 'finite-cluster' | 'infinite-lattice';

/** Options of {@link computeSweepSeries}. */
export interface SweepSeriesOptions {
  /** Order n of ln Z in β. @defaultValue 10 */
  thermoOrder?: number;
  /** Total order K of the (t, β) double series of observables. @defaultValue 6 */
  quenchOrder?: number;
  /** @defaultValue 'auto' (chooseSeriesMethod) */
  method?: 'auto' | SeriesMethod;
  signal?: AbortSignal;
}

/** One reported series: coefficient of t^k β^m at index k·(K+1)+m. */
export interface LabelSeries {
  readonly label: string;
  readonly observable: number;
  readonly coefficients: Float64Array;
  /** Rounding bound per coefficient (same layout). */
  readonly rounding: Float64Array;
  /** Exact zero by symmetry (symmetry-zeros.ts): at every (β, t), at t = 0 only, or none. */
  readonly exactZero: SymmetryZero;
}

/** The series of a sweep (see file header). */
export interface SweepSeries {
  readonly kind: SeriesKind;
  readonly method: SeriesMethod;
  readonly sites: number;
  readonly thermoOrder: number;
  readonly quenchOrder: number;
  /** Coefficients of ln Z = ln Tr e^{−βH0} in β (β^0: N ln 2). */
  readonly lnZ: Float64Array;
  /** Rounding bound of each ln Z coefficient. */
  readonly lnZRounding: Float64Array;
  readonly series: readonly LabelSeries[];
  /** Work counters. */
  readonly stats: { primitives: number; distinctPrimitives: number; clusters: number; solved: number; seconds: number };
}

/** Largest lattice the whole-cluster method is chosen for by 'auto'. */
export const WHOLE_CLUSTER_MAX_SITES = 16;

/** The method 'auto' picks: whole-cluster on small lattices or when clusters would span the lattice. */
export function chooseSeriesMethod(sites: number, clusterBound: number, maxSupport: number): SeriesMethod {
  if (maxSupport > 4) return 'whole-cluster';
  if (clusterBound >= sites) return 'whole-cluster';
  return sites <= WHOLE_CLUSTER_MAX_SITES && clusterBound > sites / 2 ? 'whole-cluster' : 'linked-cluster';
}

/**
 * Computes the series of a spec (see file header).
 * @throws RangeError for invalid orders or a spec whose lattice/observables cannot be built.
 */
export function computeSweepSeries(spec: SweepSpec, options: SweepSeriesOptions = {}): SweepSeries {
  const { thermoOrder = 10, quenchOrder = 6, method = 'auto', signal } = options;
  for (const [name, v] of [['thermoOrder', thermoOrder], ['quenchOrder', quenchOrder]] as const) {
    if (!Number.isInteger(v) || v < 0) throw new RangeError(`${name} must be a non-negative integer; got ${String(v)}`);
  }
  const started = performance.now();
  const graph = buildLattice(spec.lattice);
  const h0 = buildLocalModel(spec.h0, graph);
  const h1 = buildLocalModel(spec.h1, graph);
  const obs = expandSeriesObservables(spec, graph, h0, h1);
  const r = Math.max(2, maxTermSupport(h0), maxTermSupport(h1));
  const maxPrim = obs.primitives.reduce((m, p) => Math.max(m, p.sites.length), 1);
  const bound = Math.max(r <= 2 ? thermoOrder : 1 + (r - 1) * thermoOrder, maxPrim + (r - 1) * quenchOrder);
  const chosen = method === 'auto' ? chooseSeriesMethod(graph.sites, bound, r) : method;
  const core = chosen === 'whole-cluster'
    ? wholeCluster(graph, h0, h1, obs, thermoOrder, quenchOrder, presets(spec) ? latticeCells(spec.lattice) : null, signal)
    : linkedCluster(spec, graph, h0, h1, obs, thermoOrder, quenchOrder, signal);

  const N = graph.sites;
  const lnZ = core.lnZ;
  lnZ[0] += N * Math.LN2;
  if (lnZ.length > 1) lnZ[1] -= h0.shift;

  const K = quenchOrder;
  const size = (K + 1) * (K + 1);
  const zeros = obs.primitives.map((p) => symmetryZero(p, h0, h1));
  const zeroAt = (z: SymmetryZero, level: 'all' | 'static') => z === 'all' || (level === 'static' && z === 'static');
  const labelZero = (c: SeriesObservables['combinations'][number], level: 'all' | 'static') => c.constant === 0
    && c.linear.every(([p]) => zeroAt(zeros[p], level))
    && c.quadratic.every(([a, b]) => zeroAt(zeros[a], level) || zeroAt(zeros[b], level));
  const series: LabelSeries[] = obs.combinations.map((c) => {
    const coefficients = new Float64Array(size);
    const rounding = new Float64Array(size);
    coefficients[0] += c.constant;
    for (const [p, w] of c.linear) {
      const s = core.prim[p];
      const e = core.primRounding[p];
      for (let q = 0; q < size; q++) { coefficients[q] += w * s[q]; rounding[q] += Math.abs(w) * e[q]; }
    }
    for (const [a, b, w] of c.quadratic) {
      const prod = multiplyFlatDouble(core.prim[a], core.prim[b], K);
      for (let q = 0; q < size; q++) coefficients[q] += w * prod[q];
    }
    const exactZero: SymmetryZero = labelZero(c, 'all') ? 'all' : labelZero(c, 'static') ? 'static' : 'none';
    return { label: c.label, observable: c.observable, coefficients, rounding, exactZero };
  });
  return {
    kind: core.kind,
    method: chosen,
    sites: N,
    thermoOrder,
    quenchOrder,
    lnZ,
    lnZRounding: core.lnZRounding,
    series,
    stats: {
      primitives: obs.primitives.length,
      distinctPrimitives: core.distinct,
      clusters: core.clusters,
      solved: core.solved,
      seconds: (performance.now() - started) / 1000,
    },
  };
}

interface CoreSeries {
  kind: SeriesKind;
  lnZ: Float64Array;
  lnZRounding: Float64Array;
  prim: Float64Array[];
  primRounding: Float64Array[];
  distinct: number;
  clusters: number;
  solved: number;
}

function wholeCluster(
  graph: LatticeGraph, h0: LocalModel, h1: LocalModel, obs: SeriesObservables, n: number, K: number,
  cells: LatticeCells | null, signal?: AbortSignal,
): CoreSeries {
  const words = wordsForSites(graph.sites);
  const t0 = PauliTable.fromTerms(words, h0.terms);
  const t1 = PauliTable.fromTerms(words, h1.terms);
  const powers = hamiltonianPowers(t0, Math.max(n, K), signal);
  const moments = powerMoments(powers);
  const lz = lnZSeries(moments.subarray(0, n + 1));
  const lnZ = lz.value.slice();
  const lnZRounding = lz.magnitude.map((m) => ROUNDING_UNIT * 4 * (n + 1) * m);
  const { reps, repOf } = primitiveOrbits(obs, cells);
  const repValue: Float64Array[] = [];
  const repRounding: Float64Array[] = [];
  for (const p of reps) {
    signal?.throwIfAborted();
    const observable = PauliTable.fromTerms(words, [{ sites: p.sites, codes: p.codes, weight: 1 }]);
    const q = quenchSeries({ observable, h1: t1, h0Powers: powers, h0Moments: moments, order: K, signal });
    repValue.push(q.value);
    repRounding.push(q.magnitude.map((m) => ROUNDING_UNIT * 4 * (K + 1) * m));
  }
  return {
    kind: 'finite-cluster', lnZ, lnZRounding, prim: repOf.map((k) => repValue[k]), primRounding: repOf.map((k) => repRounding[k]),
    distinct: reps.length, clusters: 1, solved: 1,
  };
}

/** One representative per translation orbit of the primitives (all distinct when cells is null). */
function primitiveOrbits(obs: SeriesObservables, cells: LatticeCells | null): { reps: SitePauli[]; repOf: number[] } {
  const canon = new Map<string, number>();
  const reps: SitePauli[] = [];
  const repOf = obs.primitives.map((p) => {
    const c = cells !== null ? canonicalTranslate(cells, p) : p;
    const key = `${c.sites.join(',')}|${c.codes.join('')}`;
    let k = canon.get(key);
    if (k === undefined) {
      k = reps.length;
      reps.push(c);
      canon.set(key, k);
    }
    return k;
  });
  return { reps, repOf };
}

/** True when H0 and H1 are presets (translation-invariant on generated lattices). */
function presets(spec: SweepSpec): boolean {
  return spec.h0.model !== 'pauli-sum' && spec.h1.model !== 'pauli-sum';
}

function linkedCluster(
  spec: SweepSpec, graph: LatticeGraph, h0: LocalModel, h1: LocalModel, obs: SeriesObservables,
  n: number, K: number, signal?: AbortSignal,
): CoreSeries {
  const cells = presets(spec) ? latticeCells(spec.lattice) : null;
  const pointGroup = presets(spec) ? pointGroupOf(spec.lattice.kind) : undefined;
  const ce = new ClusterExpansion(h0, h1, { thermoOrder: n, quenchOrder: K, signal, positions: graph.positions, pointGroup });
  const bound = ce.lnZClusterBound();

  // ln Z.
  let kind: SeriesKind = 'finite-cluster';
  let lnZ: Float64Array;
  if (cells !== null && translationInvariantLongerThan(cells, bound)) {
    kind = 'infinite-lattice';
    const perSite = infiniteLatticeLnZ(spec, n, bound, signal);
    lnZ = perSite.map((v) => v * graph.sites);
  } else if (cells !== null && (cells.periodic[0] || cells.periodic[1])) {
    lnZ = new Float64Array(n + 1);
    for (const { site, multiplicity } of siteOrbitRepresentatives(cells)) {
      const share = ce.lnZShare(site);
      for (let k = 0; k <= n; k++) lnZ[k] += multiplicity * share[k];
    }
  } else {
    lnZ = ce.lnZTotal();
  }

  // Observables: one LCE sum per translation orbit of primitives.
  const size = (K + 1) * (K + 1);
  const { reps, repOf } = primitiveOrbits(obs, cells);
  const repSeries = reps.map((p) => {
    signal?.throwIfAborted();
    return ce.observable(p);
  });
  const prim = repOf.map((k) => repSeries[k]);
  const zero = new Float64Array(size);
  return {
    kind, lnZ, lnZRounding: new Float64Array(n + 1), prim, primRounding: prim.map(() => zero),
    distinct: reps.length, clusters: ce.stats.visits, solved: ce.stats.solved,
  };
}

/**
 * True when every direction of the lattice is either trivial (length 1), of length 2 (where
 * open and periodic give the same bonds), or periodic and longer than `bound`: then no cluster
 * of up to `bound` sites wraps and all sites of a translation cell see the infinite lattice.
 */
export function translationInvariantLongerThan(c: LatticeCells, bound: number): boolean {
  const ok = (len: number, periodic: boolean) => len === 1 || len === 2 || (periodic && len > bound);
  const long = (c.periodic[0] && c.lx > 2) || (c.periodic[1] && c.ly > 2);
  return long && ok(c.lx, c.periodic[0]) && ok(c.ly, c.periodic[1]);
}

/** The lattice spec with every periodic direction longer than 2 stretched to `side`. */
function stretched(lattice: SweepSpec['lattice'], side: number): SweepSpec['lattice'] {
  switch (lattice.kind) {
    case 'chain': return { ...lattice, length: side };
    case 'ladder': return { ...lattice, length: side };
    case 'square':
    case 'triangular':
    case 'honeycomb': {
      const size: [number, number] = [
        lattice.boundary[0] === 'periodic' && lattice.size[0] > 2 ? side : lattice.size[0],
        lattice.boundary[1] === 'periodic' && lattice.size[1] > 2 ? side : lattice.size[1],
      ];
      return { ...lattice, size };
    }
    default: throw new RangeError(`the infinite-lattice series needs a generated lattice; got "${lattice.kind}"`);
  }
}

/**
 * ln(Z/2^N)/N of the infinite lattice to order n (periodic directions of the spec's lattice
 * taken infinite): root-minimum cluster sums at the sites of one translation cell in the middle
 * of the lattice stretched to side 2·bound + 2, where the numbering is translation-covariant
 * around the roots (so the lowest-numbered site picks one copy of each translation class).
 * @throws RangeError for explicit bond lists.
 */
export function infiniteLatticeLnZ(spec: SweepSpec, n: number, bound: number, signal?: AbortSignal): Float64Array {
  const lattice = stretched(spec.lattice, 2 * bound + 2);
  const graph = buildLattice(lattice);
  const h0 = buildLocalModel(spec.h0, graph);
  const ce = new ClusterExpansion(h0, h0, { thermoOrder: n, quenchOrder: 0, signal, positions: graph.positions, pointGroup: pointGroupOf(lattice.kind) });
  const big = latticeCells(lattice)!;
  const [cx, cy] = centralCell(big);
  const xs = big.periodic[0] && big.lx > 2 ? [cx] : Array.from({ length: big.lx }, (_, x) => x);
  const ys = big.periodic[1] && big.ly > 2 ? [cy] : Array.from({ length: big.ly }, (_, y) => y);
  const out = new Float64Array(n + 1);
  let roots = 0;
  for (const y of ys) {
    for (const x of xs) {
      for (let b = 0; b < big.nb; b++) {
        const part = ce.lnZRootMin(siteOfCell(big, b, x, y));
        for (let k = 0; k <= n; k++) out[k] += part[k];
        roots++;
      }
    }
  }
  for (let k = 0; k <= n; k++) out[k] /= roots;
  return out;
}
