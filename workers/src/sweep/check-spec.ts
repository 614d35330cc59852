/**
 * Semantic checks of a parsed spec that need the built lattice (the zod schema cannot know
 * how many sites a lattice has). Returns issues; never throws on a schema-valid spec.
 *
 * Some checks repeat rules the schema also enforces (bond lists, a reversed time grid) so that
 * a spec assembled in code, not parsed, is still caught before an engine sees it.
 */
import { LIMITS, type SpecIssue, type SweepSpec } from '../../../shared-types/src/index.js';
import { buildLattice } from '../lattice/build-lattice.js';
import { pauliFactors } from '../physics/pauli-word.js';
import type { LatticeGraph } from '../physics/types.js';
import { planSeries } from '../observables/plan-series.js';

/**
 * Stable codes of the issues checkSpec reports (append only; never reuse a code). These are
 * semantic codes beside the schema's own (SPEC_ISSUE_CODES in shared-types).
 */
export const CHECK_SPEC_CODES = [
  /** A site index is not on the lattice (a Pauli word, a site or pair list, a bond). */
  'site_out_of_range',
  /** A lattice has more sites than LIMITS.maxSites. */
  'lattice_too_large',
  /** A bond or pair joins a site to itself. */
  'self_bond',
  /** A bond is listed twice (in either order, in bonds or farBonds). */
  'duplicate_bond',
  /** A site appears twice in a Pauli word or a site list. */
  'duplicate_site',
  /** A pair is listed twice (for equal letters, also in reversed order). */
  'duplicate_pair',
  /** positions does not have one entry per site. */
  'positions_mismatch',
  /** A Pauli word is not space-separated factors like "X0 Z3". */
  'invalid_pauli_word',
  /** A staggered pattern was asked on a lattice whose bond graph has an odd cycle. */
  'lattice_not_bipartite',
  /** A pair selection has no pairs on this lattice (e.g. nearest on a lattice without bonds). */
  'empty_pair_selection',
  /** A per-pair report would produce more than LIMITS.maxPairs series. */
  'too_many_pairs',
  /** An even time grid has stop < start. */
  'time_grid_reversed',
  /** An even time grid has count > 1 but stop = start. */
  'time_grid_degenerate',
  /** Two observables produce a series with the same label. */
  'duplicate_series',
] as const;

/** One of {@link CHECK_SPEC_CODES}. */
export type CheckSpecCode = (typeof CHECK_SPEC_CODES)[number];

type Path = (string | number)[];

/** "h0.terms[2].word" for ['h0', 'terms', 2, 'word']. */
function pathText(path: Path): string {
  return path.map((p, k) => (typeof p === 'number' ? `[${p}]` : k === 0 ? p : `.${p}`)).join('');
}

function siteCount(spec: SweepSpec): number {
  const l = spec.lattice;
  switch (l.kind) {
    case 'chain': return l.length;
    case 'ladder': return 2 * l.length;
    case 'square': case 'triangular': return l.size[0] * l.size[1];
    case 'honeycomb': return 2 * l.size[0] * l.size[1];
    case 'bonds': return l.sites;
  }
}

/**
 * Checks a schema-valid spec against its lattice. Each issue names the field path and the
 * allowed range; codes are {@link CHECK_SPEC_CODES}. An empty list means the spec is runnable
 * as far as the lattice is concerned (engines may still refuse it in their plan).
 */
export function checkSpec(spec: SweepSpec): SpecIssue[] {
  const issues: SpecIssue[] = [];
  const add = (code: CheckSpecCode, path: Path, message: string) =>
    issues.push({ code, path, message: `${pathText(path)}: ${message}` });

  // Lattice: size and explicit bond lists, before anything that needs the graph.
  const n = siteCount(spec);
  const l = spec.lattice;
  if (n > LIMITS.maxSites) {
    add('lattice_too_large', ['lattice', l.kind === 'chain' || l.kind === 'ladder' ? 'length' : l.kind === 'bonds' ? 'sites' : 'size'],
      `the lattice has ${n} sites; at most ${LIMITS.maxSites}`);
    return issues;
  }
  const range = `sites 0..${n - 1}`;
  if (l.kind === 'bonds') {
    const seen = new Map<number, string>();
    for (const field of ['bonds', 'farBonds'] as const) {
      (l[field] ?? []).forEach(([a, b], k) => {
        let inside = true;
        [a, b].forEach((s, end) => {
          if (s < 0 || s >= n) {
            inside = false;
            add('site_out_of_range', ['lattice', field, k, end], `site ${s} is not on the lattice (${range})`);
          }
        });
        if (a === b) {
          add('self_bond', ['lattice', field, k], `a bond joins two different sites, got [${a}, ${b}]`);
          return;
        }
        if (!inside) return;
        const key = Math.min(a, b) * n + Math.max(a, b);
        const first = seen.get(key);
        if (first !== undefined) add('duplicate_bond', ['lattice', field, k], `the bond ${Math.min(a, b)}-${Math.max(a, b)} is already listed as lattice.${first}`);
        else seen.set(key, `${field}[${k}]`);
      });
    }
    if (l.positions !== undefined && l.positions.length !== n) {
      add('positions_mismatch', ['lattice', 'positions'], `one position per site: expected ${n}, got ${l.positions.length}`);
    }
    if (issues.length) return issues;
  }
  const graph: LatticeGraph = buildLattice(l);

  // Hamiltonians: explicit words must act on lattice sites, each site once.
  for (const which of ['h0', 'h1'] as const) {
    const h = spec[which];
    if (h.model !== 'pauli-sum') continue;
    h.terms.forEach((t, k) => {
      const path: Path = [which, 'terms', k, 'word'];
      let factors;
      try {
        factors = pauliFactors(t.word);
      } catch {
        add('invalid_pauli_word', path, `"${t.word}" is not space-separated factors like "X0 Z3"`);
        return;
      }
      const seen = new Set<number>();
      for (const { letter, site } of factors) {
        if (site >= n) add('site_out_of_range', path, `"${letter}${site}" acts on site ${site}, not on the lattice (${range})`);
        else if (seen.has(site)) add('duplicate_site', path, `site ${site} appears more than once in "${t.word}"`);
        seen.add(site);
      }
    });
  }

  // Observables.
  spec.observables.forEach((o, k) => {
    const base: Path = ['observables', k];
    switch (o.kind) {
      case 'site': {
        const seen = new Set<number>();
        o.sites?.forEach((s, m) => {
          if (s >= n) add('site_out_of_range', [...base, 'sites', m], `site ${s} is not on the lattice (${range})`);
          else if (seen.has(s)) add('duplicate_site', [...base, 'sites', m], `site ${s} is listed more than once`);
          seen.add(s);
        });
        break;
      }
      case 'pair': {
        const sel = o.pairs;
        if (Array.isArray(sel)) {
          const symmetric = o.paulis[0] === o.paulis[1];
          const seen = new Map<string, number>();
          sel.forEach(([i, j], m) => {
            let inside = true;
            [i, j].forEach((s, end) => {
              if (s >= n) {
                inside = false;
                add('site_out_of_range', [...base, 'pairs', m, end], `site ${s} is not on the lattice (${range})`);
              }
            });
            if (i === j) {
              add('self_bond', [...base, 'pairs', m], `a pair joins two different sites, got [${i}, ${j}]`);
              return;
            }
            if (!inside) return;
            const key = symmetric ? `${Math.min(i, j)},${Math.max(i, j)}` : `${i},${j}`;
            const first = seen.get(key);
            if (first !== undefined) add('duplicate_pair', [...base, 'pairs', m], `the pair [${i}, ${j}] repeats pairs[${first}]${symmetric ? ` (for ${o.paulis} the order within a pair does not matter)` : ''}`);
            else seen.set(key, m);
          });
        } else {
          const count = sel === 'nearest' ? graph.bonds.length
            : sel === 'next-nearest' ? graph.farBonds.length
              : (n * (n - 1)) / 2;
          if (count === 0) {
            add('empty_pair_selection', [...base, 'pairs'],
              sel === 'by-distance' ? 'a single-site lattice has no pairs' : `this lattice has no ${sel === 'nearest' ? 'nearest-neighbour bonds' : 'next-nearest-neighbour bonds'}`);
          } else if (o.perPair && count > LIMITS.maxPairs) {
            add('too_many_pairs', [...base, 'perPair'], `"${sel}" selects ${count} pairs on this lattice; per-pair series allow at most ${LIMITS.maxPairs}`);
          }
        }
        break;
      }
      case 'magnetisation':
        if (o.pattern === 'staggered' && graph.sublattice === null) {
          add('lattice_not_bipartite', [...base, 'pattern'], 'a staggered pattern needs a bipartite lattice; this lattice\'s bonds form an odd cycle (use "uniform")');
        }
        break;
      case 'energy':
      case 'structure-factor':
        break;
    }
  });

  // Time grid.
  const t = spec.times;
  if ('stop' in t) {
    if (t.stop < t.start) add('time_grid_reversed', ['times', 'stop'], `expected stop ≥ start (${t.start}), got ${t.stop}`);
    else if (t.count > 1 && t.stop === t.start) add('time_grid_degenerate', ['times', 'stop'], `${t.count} points need stop > start (${t.start}); use count 1 for a single time`);
  }

  // Series labels must be unique (only meaningful once everything above holds).
  if (issues.length === 0) {
    const first = new Map<string, number>();
    const reported = new Set<number>();
    for (const s of planSeries(spec, graph)) {
      const prev = first.get(s.label);
      if (prev === undefined) first.set(s.label, s.observable);
      else if (prev !== s.observable && !reported.has(s.observable)) {
        reported.add(s.observable);
        add('duplicate_series', ['observables', s.observable], `series "${s.label}" is already produced by observables[${prev}]; merge the two observables`);
      }
    }
  }
  return issues;
}
