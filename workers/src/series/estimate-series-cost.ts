/**
 * estimateSeriesCost — a quick a-priori cost of computeSweepSeries for given orders, used by
 * the series engine's plan to pick the highest orders that fit a time budget.
 *
 * Model (calibrated on tests/bench/series, one core of this machine kind):
 * - moments on a cluster of s sites with T terms to order n: the products of forming H^k,
 *   k ≤ ⌈n/2⌉, Σ_k min(4^s, C(T+k−1, k))·T, at SECONDS_PER_PRODUCT each;
 * - a quench series to total order K on s sites: Σ_k |A_k|·T with |A_k| ≤ min(4^s, (2T)^k),
 *   plus its mixed moments (counted like a thermal series of order K);
 * - linked clusters: clusters are counted by enumeration around one site (capped at
 *   COUNT_CAP); distinct clusters ≈ count / |point group|; each costs the moment work of its size.
 * The model is an upper-bound flavoured guess, not a promise; the run reports what it did.
 */
import type { SweepSpec } from '../../../shared-types/src/index.js';
import { buildLattice } from '../lattice/build-lattice.js';
import { chooseSeriesMethod, type SeriesMethod } from './compute-sweep-series.js';
import { enumerateConnectedSets } from './enumerate-connected-sets.js';
import { centralCell, latticeCells, siteOfCell } from './lattice-cells.js';
import { buildLocalModel, maxTermSupport } from './local-terms.js';
import { pointGroupOf } from './point-groups.js';
import { expandSeriesObservables } from './series-observables.js';
import { canonicalTranslate } from './site-orbits.js';

/** Seconds per Pauli-string product including its hash insert and table growth (measured 0.1–0.5 µs). */
export const SECONDS_PER_PRODUCT = 3e-7;
/** Cluster enumeration stops counting here (the estimate is then "too much"). */
export const COUNT_CAP = 2_000_000;
/** Bytes per stored Pauli term (keys, coefficients, hash slots) for one-word masks. */
const BYTES_PER_TERM = 40;

/** Estimated work of one computeSweepSeries call. */
export interface SeriesCostEstimate {
  readonly method: SeriesMethod;
  readonly seconds: number;
  readonly memoryBytes: number;
  /** Clusters counted (linked-cluster), 1 for whole-cluster. */
  readonly clusters: number;
  readonly primitives: number;
}

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

/** Products and peak table size of the thermal moments of s sites, T terms, to order n. */
export function momentWork(s: number, T: number, n: number): { products: number; terms: number } {
  const K = Math.ceil(n / 2);
  let products = 0;
  let terms = 1;
  for (let k = 1; k <= K; k++) {
    const size = Math.min(4 ** s, binomial(T + k - 1, k));
    products += (k > 1 ? terms : 1) * T;
    terms = size;
  }
  return { products, terms };
}

/**
 * Products of a quench series of total order K on s sites: commutators with the T1 terms of H1,
 * |A_k| ≈ min(4^s, g^k) with g = (largest coupling degree) − 1/2 (measured: 1.8 per order on the
 * Ising chain, 3.3 on the square lattice), and mixed moments against the T0 terms of H0.
 */
export function quenchWork(s: number, T1: number, T0: number, K: number, degree = 2): number {
  const g = Math.max(1.5, degree - 0.5);
  let products = 0;
  let size = 1;
  for (let k = 1; k <= K; k++) {
    products += size * T1;
    size = Math.min(4 ** s, size * g);
  }
  return products + momentWork(s, T0, K).products;
}

/** Cost estimate of the series of a spec at the given orders (see file header). */
export function estimateSeriesCost(spec: SweepSpec, thermoOrder: number, quenchOrder: number): SeriesCostEstimate {
  const graph = buildLattice(spec.lattice);
  const h0 = buildLocalModel(spec.h0, graph);
  const h1 = buildLocalModel(spec.h1, graph);
  const obs = expandSeriesObservables(spec, graph, h0, h1);
  const N = graph.sites;
  const r = Math.max(2, maxTermSupport(h0), maxTermSupport(h1));
  const maxPrim = obs.primitives.reduce((m, p) => Math.max(m, p.sites.length), 1);
  const lnZBound = r <= 2 ? thermoOrder : 1 + (r - 1) * thermoOrder;
  const obsBound = maxPrim + (r - 1) * quenchOrder;
  const method = chooseSeriesMethod(N, Math.max(lnZBound, obsBound), r);
  const t0PerSite = h0.terms.length / Math.max(1, N);
  const degree = Math.max(1, ...graph.bonds.reduce((d, [i, j]) => { d[i]++; d[j]++; return d; }, new Array<number>(N).fill(0)));
  const t1PerSite = h1.terms.length / Math.max(1, N);
  const cells = latticeCells(spec.lattice);
  const presets = spec.h0.model !== 'pauli-sum' && spec.h1.model !== 'pauli-sum';
  let distinct = obs.primitives.length;
  if (cells !== null && presets) {
    const seen = new Set<string>();
    for (const p of obs.primitives) {
      const c = canonicalTranslate(cells, p);
      seen.add(`${c.sites.join(',')}|${c.codes.join('')}`);
    }
    distinct = seen.size;
  }
  if (method === 'whole-cluster') {
    const T0 = h0.terms.length;
    const T1 = h1.terms.length;
    const m = momentWork(N, T0, Math.max(thermoOrder, quenchOrder));
    const products = m.products + distinct * quenchWork(N, T1, T0, quenchOrder, degree);
    return {
      method, seconds: products * SECONDS_PER_PRODUCT, memoryBytes: 2 * m.terms * BYTES_PER_TERM * Math.ceil(N / 32),
      clusters: 1, primitives: obs.primitives.length,
    };
  }
  // Linked clusters: count clusters around a central site.
  const adj: number[][] = Array.from({ length: N }, () => []);
  for (const m of [h0, h1]) {
    for (const t of m.terms) for (const a of t.sites) for (const b of t.sites) if (a !== b && !adj[a].includes(b)) adj[a].push(b);
  }
  let root = 0;
  if (cells !== null) {
    const [cx, cy] = centralCell(cells);
    root = siteOfCell(cells, 0, cx, cy);
  }
  const group = presets ? pointGroupOf(spec.lattice.kind).length : 1;
  // Clusters by size that survive the first-order bound of cluster-expansion.ts (a leaf outside
  // the anchor costs one extra order), as the run skips the others without solving them.
  const mark = new Int32Array(N).fill(-1);
  const countBySize = (start: number[], bound: number, order: number): number[] => {
    const counts = new Array<number>(bound + 1).fill(0);
    const anchor = new Set(start);
    let total = 0;
    try {
      enumerateConnectedSets(adj, start, bound, (set) => {
        if (++total > COUNT_CAP) throw new RangeError('cap');
        set.forEach((v, k) => { mark[v] = k; });
        let leaves = 0;
        for (const v of set) {
          if (anchor.has(v) && start.length > 1) continue;
          let deg = 0;
          for (const u of adj[v]) if (mark[u] >= 0) deg++;
          if (deg === 1) leaves++;
        }
        for (const v of set) mark[v] = -1;
        const free = set.length - (start.length > 1 ? start.length : 1);
        const first = set.length <= 2 ? free : free + leaves;
        if (first <= order) counts[set.length]++;
      });
    } catch {
      return counts.map(() => Infinity);
    }
    return counts;
  };
  let products = 0;
  let clusters = 0;
  const thermoCounts = countBySize([root], lnZBound, thermoOrder);
  thermoCounts.forEach((count, s) => {
    if (s === 0 || count === 0) return;
    clusters += count;
    products += (count / (s * group) + 1) * momentWork(s, Math.ceil(t0PerSite * s), thermoOrder).products;
  });
  const probe = obs.primitives.find((p) => p.sites.includes(root)) ?? obs.primitives[0];
  if (probe !== undefined) {
    const obsCounts = countBySize([...probe.sites], obsBound, quenchOrder);
    let perPrimitive = 0;
    obsCounts.forEach((count, s) => {
      if (s === 0 || count === 0) return;
      clusters += count * distinct;
      perPrimitive += (count / group + 1) * quenchWork(s, Math.ceil(t1PerSite * s), Math.ceil(t0PerSite * s), quenchOrder, degree);
    });
    products += distinct * perPrimitive;
  }
  const biggest = Math.max(lnZBound, obsBound);
  return {
    method,
    seconds: products * SECONDS_PER_PRODUCT,
    memoryBytes: momentWork(biggest, Math.ceil(t0PerSite * biggest), Math.max(thermoOrder, quenchOrder)).terms * BYTES_PER_TERM
      + clusters * 8 * (thermoOrder + 1),
    clusters,
    primitives: obs.primitives.length,
  };
}
