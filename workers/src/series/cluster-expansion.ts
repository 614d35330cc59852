/**
 * ClusterExpansion — exact truncated series of a finite lattice (or, on a large torus, per site
 * of the infinite lattice) as a sum over connected site clusters (linked-cluster expansion).
 *
 * Identity used (exact on any finite graph): for a cluster S let H_S be the terms of H acting
 * only inside S and P(S) = ln(Z_S/2^|S|) (or ⟨O(t)⟩_β on S for an observable O). Möbius
 * inversion over subsets defines weights W(S) = Σ_{T⊆S} (−1)^{|S∖T|} P(T), so that
 * P(whole) = Σ_S W(S). As power series in the couplings, W(S) collects exactly the monomials
 * whose terms cover S, and vanishes unless S is connected (through the terms; for an
 * observable, S ⊇ supp O with supp O counted as connected). Hence W(S) = P(S) − Σ_{T⊊S} W(T)
 * over connected T only (Oitmaa, Hamer & Zheng, "Series Expansion Methods for Strongly
 * Interacting Lattice Models", CUP 2006, ch. 2; the cluster form of M. Rigol, T. Bryant and
 * R. R. P. Singh, PRL 97, 187202 (2006), here truncated in order instead of summed numerically).
 *
 * Truncation (why finite clusters suffice): a monomial of order n uses n terms; with terms
 * acting on ≤ r sites it covers ≤ 1 + (r−1)n sites. For ln Z with two-site terms the bound is
 * |S| ≤ n: with |S|−1 factors the terms form a spanning tree used once each, every sub-product
 * has a leaf site carrying one non-identity Pauli factor, so all moments and hence the joint
 * cumulant vanish. For ⟨O(t)⟩_β at total order K (β^m t^k, m+k ≤ K): |S| ≤ |supp O| + (r−1)K.
 * Clusters are enumerated with enumerate-connected-sets.ts; P(S) comes from moments by Pauli
 * algebra on the cluster (thermal-moments.ts, quench-series.ts). Weights are memoised by a key
 * that encodes H_S (and O) with sites relabelled by their rank in S, so translated copies of a
 * cluster share one computation whenever the site numbering is translation-covariant.
 * Cost: (#distinct clusters) × (moment cost on ≤ size-bound sites) + (#clusters) × (#connected
 * sub-clusters) key look-ups. Memory: one series per distinct key.
 */
import { enumerateConnectedSets } from './enumerate-connected-sets.js';
import type { PlaneMap } from './point-groups.js';
import type { LocalModel, LocalTerm } from './local-terms.js';
import { wordsForSites } from './pauli-masks.js';
import { PauliTable } from './pauli-table.js';
import { quenchSeries } from './quench-series.js';
import { hamiltonianPowers, powerMoments } from './thermal-moments.js';
import { lnZSeries } from './thermal-series.js';

/** A Pauli string by sites (ascending) and letter codes (1 = X, 2 = Z, 3 = Y). */
export interface SitePauli {
  readonly sites: readonly number[];
  readonly codes: readonly number[];
}

/** Options of a {@link ClusterExpansion}. */
export interface ClusterExpansionOptions {
  /** Order n of the ln Z series in β. @defaultValue 8 */
  thermoOrder?: number;
  /** Total order K of the double series (t, β) of observables. @defaultValue 6 */
  quenchOrder?: number;
  /** Checked between clusters. */
  signal?: AbortSignal;
  /**
   * Site coordinates; with `pointGroup`, clusters related by these maps (and by translation)
   * share one memo entry. Without them sites are relabelled by index order only.
   */
  positions?: ReadonlyArray<readonly [number, number]>;
  /** Plane maps tried as relabellings (point-groups.ts). @defaultValue identity only */
  pointGroup?: readonly PlaneMap[];
}

/** Counters of the work done (for diagnostics and benchmarks). */
export interface ClusterStats {
  /** Cluster visits in the sums (each enumerated set once). */
  visits: number;
  /** Distinct clusters solved (moments computed). */
  solved: number;
  /** Möbius sub-cluster look-ups. */
  lookups: number;
  /** Distinct clusters skipped because their weight vanishes to the order asked. */
  skipped: number;
}

/** Linked-cluster sums for one pair (H0, H1) on one finite graph (see the file header). */
export class ClusterExpansion {
  readonly sites: number;
  readonly thermoOrder: number;
  readonly quenchOrder: number;
  /** Sites sharing a term of H0 or H1 (the connectivity of clusters). */
  readonly adjacency: number[][];
  /** Sites sharing a term of H0 (the connectivity of ln Z clusters). */
  readonly adjacency0: number[][];
  readonly stats: ClusterStats = { visits: 0, solved: 0, lookups: 0, skipped: 0 };
  readonly #h0: LocalModel;
  readonly #h1: LocalModel;
  readonly #incident0: number[][];
  readonly #incident1: number[][];
  readonly #rank: Int32Array;
  readonly #weightIds = new Map<number, number>();
  readonly #lnZMemo = new Map<string, Float64Array>();
  readonly #obsMemo = new Map<string, Float64Array>();
  /** First-level memo: translation-only key (index order) → the same weight arrays. */
  readonly #quickMemo = new Map<string, Float64Array>();
  readonly #maxSupport: number;
  readonly #signal: AbortSignal | undefined;
  readonly #positions: ReadonlyArray<readonly [number, number]> | null;
  readonly #maps: readonly PlaneMap[];

  constructor(h0: LocalModel, h1: LocalModel, options: ClusterExpansionOptions = {}) {
    const { thermoOrder = 8, quenchOrder = 6, signal, positions, pointGroup = [[1, 0, 0, 1]] } = options;
    if (positions !== undefined && positions.length !== h0.sites) {
      throw new RangeError(`positions has ${positions.length} entries, expected ${h0.sites}`);
    }
    if (pointGroup.length === 0) throw new RangeError('pointGroup must hold at least one map (the identity)');
    this.#positions = positions ?? null;
    this.#maps = pointGroup;
    for (const [name, v] of [['thermoOrder', thermoOrder], ['quenchOrder', quenchOrder]] as const) {
      if (!Number.isInteger(v) || v < 0) throw new RangeError(`${name} must be a non-negative integer; got ${String(v)}`);
    }
    if (h0.sites !== h1.sites) throw new RangeError(`h0 has ${h0.sites} sites but h1 has ${h1.sites}`);
    this.sites = h0.sites;
    this.thermoOrder = thermoOrder;
    this.quenchOrder = quenchOrder;
    this.#h0 = h0;
    this.#h1 = h1;
    this.#signal = signal;
    this.#rank = new Int32Array(this.sites).fill(-1);
    const links = Array.from({ length: this.sites }, () => new Set<number>());
    const incident = (m: LocalModel) => {
      const inc: number[][] = Array.from({ length: this.sites }, () => []);
      m.terms.forEach((t, k) => {
        inc[t.sites[0]].push(k);
        for (const a of t.sites) for (const b of t.sites) if (a !== b) links[a].add(b);
      });
      return inc;
    };
    this.#incident0 = incident(h0);
    this.adjacency0 = links.map((s) => [...s].sort((a, b) => a - b));
    this.#incident1 = incident(h1);
    this.adjacency = links.map((s) => [...s].sort((a, b) => a - b));
    let r = 1;
    for (const t of h0.terms) r = Math.max(r, t.sites.length);
    for (const t of h1.terms) r = Math.max(r, t.sites.length);
    this.#maxSupport = r;
  }

  /** Largest cluster that contributes to ln Z at the thermo order (see file header). */
  lnZClusterBound(): number {
    const n = this.thermoOrder;
    if (n === 0) return 1;
    return this.#maxSupport <= 2 ? Math.max(1, n) : 1 + (this.#maxSupport - 1) * n;
  }

  /** Largest cluster that contributes to an observable on `support` sites at the quench order. */
  observableClusterBound(support: number): number {
    return support + (this.#maxSupport - 1) * this.quenchOrder;
  }

  /**
   * Σ over all connected clusters of W(S): the ln(Z/2^N) series of the whole graph (coefficients
   * of β^0..β^n), each cluster enumerated once (as its lowest site). Add N ln 2 for ln Z.
   */
  lnZTotal(): Float64Array {
    const out = new Float64Array(this.thermoOrder + 1);
    const bound = this.lnZClusterBound();
    for (let root = 0; root < this.sites; root++) {
      this.#signal?.throwIfAborted();
      enumerateConnectedSets(this.adjacency0, [root], bound, (set) => {
        this.stats.visits++;
        addInto(out, this.#lnZWeight(sortedCopy(set)), 1);
      }, { minVertex: root });
    }
    return out;
  }

  /**
   * Σ over connected clusters whose lowest-numbered site is `root` of W(S). On a lattice numbered
   * translation-covariantly around `root` (no wrap within the cluster bound) the sum over the
   * sites of one unit cell is the ln(Z/2^N) series per unit cell of the infinite lattice.
   */
  lnZRootMin(root: number): Float64Array {
    checkSite(root, this.sites);
    const out = new Float64Array(this.thermoOrder + 1);
    enumerateConnectedSets(this.adjacency0, [root], this.lnZClusterBound(), (set) => {
      this.stats.visits++;
      addInto(out, this.#lnZWeight(sortedCopy(set)), 1);
    }, { minVertex: root });
    return out;
  }

  /**
   * Σ_{S ∋ site} W(S)/|S|: the share of ln(Z/2^N) attributed to `site`. Summed over all sites it
   * gives lnZTotal(); on a lattice whose sites are all equivalent it is the per-site value.
   */
  lnZShare(site: number): Float64Array {
    checkSite(site, this.sites);
    const out = new Float64Array(this.thermoOrder + 1);
    enumerateConnectedSets(this.adjacency0, [site], this.lnZClusterBound(), (set) => {
      this.stats.visits++;
      addInto(out, this.#lnZWeight(sortedCopy(set)), 1 / set.length);
    });
    return out;
  }

  /**
   * The double series of ⟨O(t)⟩_β (t^k β^m at index k·(K+1)+m, k+m ≤ K) for one Pauli string O
   * on the whole graph.
   * @throws RangeError if O names a site outside the graph or no site.
   */
  observable(o: SitePauli): Float64Array {
    if (o.sites.length === 0) throw new RangeError('observable: the identity needs no series (its value is 1)');
    o.sites.forEach((s) => checkSite(s, this.sites));
    const K = this.quenchOrder;
    const out = new Float64Array((K + 1) * (K + 1));
    const sortedAnchor = sortPauli(o);
    enumerateConnectedSets(this.adjacency, [...sortedAnchor.sites], this.observableClusterBound(o.sites.length), (set) => {
      this.stats.visits++;
      addInto(out, this.#obsWeight(sortedCopy(set), sortedAnchor), 1);
    });
    return out;
  }

  /** Distinct clusters held in the memo tables. */
  memoSize(): number {
    return this.#lnZMemo.size + this.#obsMemo.size;
  }

  #lnZWeight(sorted: number[]): Float64Array {
    const quick = this.#quickKey(sorted, null);
    const seen = this.#quickMemo.get(quick);
    if (seen !== undefined) return seen;
    const key = this.#key(sorted, null);
    const hit = this.#lnZMemo.get(key);
    if (hit !== undefined) {
      this.#quickMemo.set(quick, hit);
      return hit;
    }
    this.#signal?.throwIfAborted();
    const local = this.#localAdjacency(sorted, this.adjacency0);
    const first = this.#firstOrder(sorted.length, local, null);
    let w: Float64Array;
    if (first > this.thermoOrder) {
      // Vanishes to this order (file header): no moments, no sub-clusters.
      w = new Float64Array(this.thermoOrder + 1);
      this.stats.skipped++;
    } else {
      w = this.#solveLnZ(sorted);
      for (let root = 0; root < sorted.length; root++) {
        enumerateConnectedSets(local, [root], sorted.length, (sub) => {
          if (sub.length === sorted.length) return;
          this.stats.lookups++;
          addInto(w, this.#lnZWeight(ranksToSites(sub, sorted)), -1);
        }, { minVertex: root });
      }
      // Orders below the cluster's first possible order vanish exactly; clearing them removes
      // the rounding left by the subtraction instead of summing it over many clusters.
      w.fill(0, 0, Math.min(w.length, first));
    }
    this.#lnZMemo.set(key, w);
    this.#quickMemo.set(quick, w);
    return w;
  }

  #obsWeight(sorted: number[], o: SitePauli): Float64Array {
    const quick = this.#quickKey(sorted, o);
    const seen = this.#quickMemo.get(quick);
    if (seen !== undefined) return seen;
    const key = this.#key(sorted, o);
    const hit = this.#obsMemo.get(key);
    if (hit !== undefined) {
      this.#quickMemo.set(quick, hit);
      return hit;
    }
    this.#signal?.throwIfAborted();
    const local = this.#localAdjacency(sorted, this.adjacency);
    const anchorRanks = o.sites.map((s) => sorted.indexOf(s));
    const first = this.#firstOrder(sorted.length, local, anchorRanks);
    const K = this.quenchOrder;
    let w: Float64Array;
    if (first > K) {
      w = new Float64Array((K + 1) * (K + 1));
      this.stats.skipped++;
    } else {
      w = this.#solveObservable(sorted, o);
      enumerateConnectedSets(local, anchorRanks, sorted.length, (sub) => {
        if (sub.length === sorted.length) return;
        this.stats.lookups++;
        addInto(w, this.#obsWeight(ranksToSites(sub, sorted), o), -1);
      });
      for (let k = 0; k <= K; k++) for (let m = 0; m <= K - k && k + m < first; m++) w[k * (K + 1) + m] = 0;
    }
    this.#obsMemo.set(key, w);
    this.#quickMemo.set(quick, w);
    return w;
  }

  /**
   * Lowest order at which W(S) can be non-zero. Terms on ≤ 2 sites: every site outside the
   * anchor needs ≥ 2 Pauli factors (one leaves a non-identity factor and a zero trace), at
   * least |S| − |A| factors connect S to the anchor A (|S| − 1 for ln Z), and a leaf v ∉ A of the
   * induced graph is reached only through its one neighbour, so its second factor is an extra
   * one (a second term on that bond or a field on v) that serves no other leaf once |S∖A| ≥ 2:
   *   first ≥ (|S| − |A|) + ℓ  (ln Z: max(|S|, |S| − 1 + ℓ) for |S| ≥ 3, |S| for |S| ≤ 2).
   * For longer terms only the covering bound ⌈(|S| − |A|)/(r − 1)⌉ is used.
   */
  #firstOrder(size: number, local: number[][], anchor: number[] | null): number {
    const r = this.#maxSupport;
    const a = anchor === null ? 1 : anchor.length;
    if (r > 2) return Math.ceil((size - a) / (r - 1));
    if (anchor === null) {
      if (size <= 2) return size;
      let leaves = 0;
      for (const nb of local) if (nb.length === 1) leaves++;
      return Math.max(size, size - 1 + leaves);
    }
    if (size - a < 2) return size - a;
    const inAnchor = new Uint8Array(size);
    for (const q of anchor) inAnchor[q] = 1;
    let leaves = 0;
    for (let v = 0; v < size; v++) {
      if (inAnchor[v]) continue;
      // Neighbours, counting the anchor as one blob (its sites are mutually connected).
      let deg = 0;
      let touchesAnchor = false;
      for (const u of local[v]) {
        if (inAnchor[u]) touchesAnchor = true;
        else deg++;
      }
      if (deg + (touchesAnchor ? 1 : 0) === 1) leaves++;
    }
    return size - a + leaves;
  }

  #localAdjacency(sorted: number[], adjacency: number[][]): number[][] {
    const rank = this.#rank;
    sorted.forEach((s, r) => { rank[s] = r; });
    const local = sorted.map((s) => {
      const out: number[] = [];
      for (const u of adjacency[s]) if (rank[u] >= 0) out.push(rank[u]);
      return out;
    });
    for (const s of sorted) rank[s] = -1;
    return local;
  }

  /**
   * Cheap key: sites ranked by index, terms in incidence order (translation-covariant when the
   * numbering is), no sorting. Prefixed 'L' (ln Z) or 'O' (observable) so the two never mix.
   */
  #quickKey(sorted: number[], o: SitePauli | null): string {
    const rank = this.#rank;
    for (let r = 0; r < sorted.length; r++) rank[sorted[r]] = r;
    let key = o === null ? 'L' : 'O';
    key += sorted.length;
    // Exact packing into one double needs ranks < 64 and at most 4 sites per term.
    const packed = sorted.length <= RANK_LIMIT + 1 && this.#maxSupport <= MAX_PACKED_SITES;
    const add = (model: LocalModel, incident: number[][], tag: string) => {
      for (let r = 0; r < sorted.length; r++) {
        const inc = incident[sorted[r]];
        for (let q = 0; q < inc.length; q++) {
          const t = model.terms[inc[q]];
          const ts = t.sites;
          let code = 0;
          let inside = true;
          for (let p = 0; p < ts.length; p++) {
            const rr = rank[ts[p]];
            if (rr < 0) { inside = false; break; }
            code = code * 256 + rr * 4 + t.codes[p];
          }
          if (!inside) continue;
          if (packed) key += `${tag}${this.#weightId(t.weight)}:${code}`;
          else {
            key += `${tag}${this.#weightId(t.weight)}:`;
            for (let p = 0; p < ts.length; p++) key += `${rank[ts[p]] * 4 + t.codes[p]}.`;
          }
        }
      }
    };
    add(this.#h0, this.#incident0, ',');
    if (o !== null) {
      add(this.#h1, this.#incident1, ';');
      key += '|';
      for (let p = 0; p < o.sites.length; p++) key += `${rank[o.sites[p]] * 4 + o.codes[p]}.`;
    }
    for (let r = 0; r < sorted.length; r++) rank[sorted[r]] = -1;
    return key;
  }

  /**
   * Key of H_S (and O): every candidate relabelling (a plane map of the positions, then sort by
   * (y, x); or index order) encodes each term as one number (tag, weight id, ranks, letters),
   * the numbers are sorted, and the smallest sequence wins. Equal keys ⇒ the relabelled H_S
   * (and O) are identical ⇒ equal series.
   */
  #key(sorted: number[], o: SitePauli | null): string {
    const rank = this.#rank;
    sorted.forEach((s, r) => { rank[s] = r; });
    const terms: Array<{ tag: number; t: LocalTerm }> = [];
    const collect = (tag: number, model: LocalModel, incident: number[][]) => {
      for (const s of sorted) {
        for (const k of incident[s]) {
          const t = model.terms[k];
          let inside = true;
          for (const u of t.sites) if (rank[u] < 0) { inside = false; break; }
          if (inside) terms.push({ tag, t });
        }
      }
    };
    collect(0, this.#h0, this.#incident0);
    if (o !== null) {
      collect(1, this.#h1, this.#incident1);
      terms.push({ tag: 2, t: { sites: o.sites, codes: o.codes, weight: 0 } });
    }
    const n = sorted.length;
    const wids = terms.map(({ t }) => this.#weightId(t.weight));
    const wide = n > RANK_LIMIT || wids.some((w) => w >= WEIGHT_ID_LIMIT)
      || terms.some(({ t }) => t.sites.length > MAX_PACKED_SITES);
    let best: Float64Array | null = null;
    let bestText = '';
    const maps = this.#positions === null ? null : this.#maps;
    const candidates = maps === null ? 1 : maps.length;
    const order = sorted.map((_, r) => r);
    const keyY = new Float64Array(n);
    const keyX = new Float64Array(n);
    for (let c = 0; c < candidates; c++) {
      if (maps !== null) {
        const [a, b, cc, d] = maps[c];
        const p0 = this.#positions![sorted[0]];
        for (let r = 0; r < n; r++) {
          const p = this.#positions![sorted[r]];
          const dx = p[0] - p0[0], dy = p[1] - p0[1];
          keyX[r] = Math.round((a * dx + b * dy) * POSITION_SCALE);
          keyY[r] = Math.round((cc * dx + d * dy) * POSITION_SCALE);
        }
        order.sort((i, j) => keyY[i] - keyY[j] || keyX[i] - keyX[j]);
        order.forEach((r, newRank) => { rank[sorted[r]] = newRank; });
      }
      if (wide) {
        const text = terms.map(({ tag, t }, q) => termText(tag, wids[q], t, rank)).sort().join(';');
        if (c === 0 || text < bestText) bestText = text;
        continue;
      }
      const enc = new Float64Array(terms.length);
      for (let q = 0; q < terms.length; q++) enc[q] = packTerm(terms[q].tag, wids[q], terms[q].t, rank);
      enc.sort();
      if (best === null || lexLess(enc, best)) best = enc;
    }
    for (const s of sorted) rank[s] = -1;
    return wide ? `${n}w${bestText}` : `${n}:${best!.join(',')}`;
  }

  #weightId(w: number): number {
    let id = this.#weightIds.get(w);
    if (id === undefined) {
      id = this.#weightIds.size;
      this.#weightIds.set(w, id);
    }
    return id;
  }

  #table(sorted: number[], model: LocalModel, incident: number[][]): PauliTable {
    const rank = this.#rank;
    sorted.forEach((s, r) => { rank[s] = r; });
    const terms: LocalTerm[] = [];
    for (const s of sorted) {
      for (const k of incident[s]) {
        const t = model.terms[k];
        if (t.sites.every((u) => rank[u] >= 0)) terms.push({ sites: t.sites.map((u) => rank[u]), codes: t.codes, weight: t.weight });
      }
    }
    for (const s of sorted) rank[s] = -1;
    return PauliTable.fromTerms(wordsForSites(sorted.length), terms);
  }

  #solveLnZ(sorted: number[]): Float64Array {
    this.stats.solved++;
    const h = this.#table(sorted, this.#h0, this.#incident0);
    return lnZSeries(powerMoments(hamiltonianPowers(h, this.thermoOrder))).value.slice();
  }

  #solveObservable(sorted: number[], o: SitePauli): Float64Array {
    this.stats.solved++;
    const words = wordsForSites(sorted.length);
    const h0 = this.#table(sorted, this.#h0, this.#incident0);
    const h1 = this.#table(sorted, this.#h1, this.#incident1);
    const observable = PauliTable.fromTerms(words, [{ sites: o.sites.map((s) => sorted.indexOf(s)), codes: o.codes, weight: 1 }]);
    const K = this.quenchOrder;
    const s = quenchSeries({ observable, h1, h0Powers: hamiltonianPowers(h0, K), order: K });
    return s.value.slice();
  }
}

/** Ranks up to this fit the packed term encoding (6 bits). */
const RANK_LIMIT = 63;
/** Terms on up to this many sites fit one double (tag 2 + weight id 12 + 8 bits per site ≤ 53). */
const MAX_PACKED_SITES = 4;
/** Distinct weights the packed encoding can name (12 bits). */
const WEIGHT_ID_LIMIT = 4096;
/** Positions are compared on a grid of 1e−6 lattice spacings. */
const POSITION_SCALE = 1e6;

function packTerm(tag: number, wid: number, t: LocalTerm, rank: Int32Array): number {
  const n = t.sites.length;
  const rs: number[] = new Array(n);
  for (let q = 0; q < n; q++) rs[q] = rank[t.sites[q]] * 4 + t.codes[q];
  rs.sort((a, b) => a - b);
  let v = tag * WEIGHT_ID_LIMIT + wid;
  for (let q = 0; q < n; q++) v = v * 256 + rs[q];
  // Distinguish lengths: shift by the site count so "a" and "a·256+0" cannot collide.
  return v * 8 + n;
}

function termText(tag: number, wid: number, t: LocalTerm, rank: Int32Array): string {
  const rs = t.sites.map((u, q) => rank[u] * 4 + t.codes[q]).sort((a, b) => a - b);
  return `${tag}.${wid}.${rs.join('.')}`;
}

function lexLess(a: Float64Array, b: Float64Array): boolean {
  for (let q = 0; q < a.length; q++) if (a[q] !== b[q]) return a[q] < b[q];
  return false;
}

function checkSite(site: number, sites: number): void {
  if (!Number.isInteger(site) || site < 0 || site >= sites) throw new RangeError(`site ${String(site)} is outside the graph (0..${sites - 1})`);
}

function sortedCopy(set: readonly number[]): number[] {
  return [...set].sort((a, b) => a - b);
}

function ranksToSites(ranks: readonly number[], sorted: readonly number[]): number[] {
  return ranks.map((r) => sorted[r]).sort((a, b) => a - b);
}

function sortPauli(o: SitePauli): SitePauli {
  const idx = o.sites.map((_, k) => k).sort((a, b) => o.sites[a] - o.sites[b]);
  return { sites: idx.map((k) => o.sites[k]), codes: idx.map((k) => o.codes[k]) };
}

function addInto(out: Float64Array, w: Float64Array, f: number): void {
  for (let k = 0; k < out.length; k++) out[k] += f * w[k];
}
