/**
 * enumerateConnectedSets — every connected vertex set S of a graph with start ⊆ S and
 * |S| ≤ maxSize, each exactly once, optionally only sets whose other vertices are ≥ `minVertex`.
 *
 * Algorithm: Redelmeier's enumeration of lattice animals (D. H. Redelmeier, "Counting
 * polyominoes: yet another attack", Discrete Math. 36, 191 (1981)), on a general graph: grow S
 * from an "untried" list of frontier vertices; a vertex taken from the list is either added now
 * or never again on that branch, which makes every set appear once. The start vertices are
 * treated as mutually connected (so an observable's support counts as one piece).
 * Cost: O(number of sets × degree × maxSize); memory O(V + maxSize²).
 */

/** Options of {@link enumerateConnectedSets}. */
export interface EnumerateOptions {
  /** Vertices below this index are never added (root-minimum enumeration). @defaultValue 0 */
  minVertex?: number;
  /** Vertices to skip entirely (e.g. outside a sub-cluster). */
  allowed?: (v: number) => boolean;
}

/**
 * Calls `visit(S)` for every connected set S ⊇ start with |S| ≤ maxSize (see file header).
 * `S` is a live array owned by the enumerator: copy it to keep it. Returning `false` from
 * `visit` prunes the sets that extend S.
 * @throws RangeError if start is empty, repeats a vertex or names a vertex outside the graph.
 */
export function enumerateConnectedSets(
  adjacency: ReadonlyArray<ArrayLike<number>>,
  start: readonly number[],
  maxSize: number,
  visit: (set: readonly number[]) => boolean | void,
  options: EnumerateOptions = {},
): void {
  const { minVertex = 0, allowed } = options;
  const n = adjacency.length;
  if (start.length === 0) throw new RangeError('enumerateConnectedSets: start must name at least one vertex');
  const seen = new Uint8Array(n);
  for (const v of start) {
    if (!Number.isInteger(v) || v < 0 || v >= n) throw new RangeError(`enumerateConnectedSets: start vertex ${String(v)} is outside the graph (0..${n - 1})`);
    if (seen[v]) throw new RangeError(`enumerateConnectedSets: start vertex ${v} is repeated`);
    seen[v] = 1;
  }
  if (start.length > maxSize) return;
  const set = [...start];
  const ok = (u: number) => !seen[u] && u >= minVertex && (allowed === undefined || allowed(u));

  const frontier: number[] = [];
  for (const v of start) {
    const nb = adjacency[v];
    for (let k = 0; k < nb.length; k++) {
      const u = nb[k];
      if (ok(u)) { seen[u] = 1; frontier.push(u); }
    }
  }
  if (visit(set) === false) return;
  if (set.length < maxSize) grow(frontier);

  function grow(untried: number[]): void {
    const list = untried.slice();
    while (list.length > 0) {
      const v = list.pop()!;
      set.push(v);
      if (visit(set) !== false && set.length < maxSize) {
        const added: number[] = [];
        const nb = adjacency[v];
        for (let k = 0; k < nb.length; k++) {
          const u = nb[k];
          if (ok(u)) { seen[u] = 1; added.push(u); }
        }
        grow(added.length ? list.concat(added) : list);
        for (const u of added) seen[u] = 0;
      }
      set.pop();
    }
  }
}
