/**
 * The canonical form of a spec (same physics → same object) and its physics hash.
 *
 * What the canonical form changes, and why each change leaves the physics alone:
 * - betas: sorted ascending, repeats removed — a repeated β is computed once.
 * - explicit Pauli sums: factors of each word sorted by site and written "X0 Z3" (factors
 *   on different sites commute); like terms merged (their weights summed in ascending
 *   order, so the sum does not depend on the order they were written in); terms whose
 *   weight is exactly 0 dropped (an all-zero sum becomes the single term 0·""); terms
 *   sorted by number of factors, then by (site, letter) factor by factor.
 * - explicit bonds: each written [i, j] with i < j (a bond is unordered), lists sorted.
 * - explicit correlator pairs: for equal letters ("XX", "YY", "ZZ": a symmetric correlator)
 *   each pair written [i, j] with i < j; for mixed letters each pair kept as written (the
 *   first letter of "XY" acts on the first site, so [i, j] ≠ [j, i]); the list sorted by (i, j).
 * - observable site lists and structure-factor momenta: sorted.
 * - time grid: { start, stop, count } kept (stop set to start when count = 1, where it has
 *   no effect); explicit values sorted ascending with repeats removed.
 * - every −0 becomes 0.
 * Observables keep their order (series follow it); label, engine, tolerance and seed are kept.
 *
 * The physics hash covers everything but the label (a free-text name): two specs that differ
 * only in their labels share a hash.
 */
import { createHash } from 'node:crypto';
import type { Hamiltonian, Lattice, Observable, SweepSpec, TimeGrid } from './spec.js';

type Pair = [number, number];

/** −0 → 0; every other number unchanged. */
const z0 = (x: number): number => (x === 0 ? 0 : x);

/** Ascending order of numbers. */
const ascending = (a: number, b: number): number => a - b;

/** Lexicographic order of number tuples. */
function byTuple(p: readonly number[], q: readonly number[]): number {
  for (let k = 0; k < Math.min(p.length, q.length); k++) {
    if (p[k] !== q[k]) return p[k] - q[k];
  }
  return p.length - q.length;
}

/** Sorted ascending with repeats (including −0 vs 0) removed. */
function uniqueSorted(values: readonly number[]): number[] {
  return [...new Set(values.map(z0))].sort(ascending);
}

/**
 * Returns the canonical form of a parsed spec (a new object; the argument is not changed).
 * Idempotent: canonicalSpec(canonicalSpec(s)) deep-equals canonicalSpec(s).
 */
export function canonicalSpec(spec: SweepSpec): SweepSpec {
  return {
    label: spec.label,
    lattice: canonicalLattice(spec.lattice),
    h0: canonicalHamiltonian(spec.h0),
    h1: canonicalHamiltonian(spec.h1),
    betas: uniqueSorted(spec.betas),
    times: canonicalTimes(spec.times),
    observables: spec.observables.map(canonicalObservable),
    engine: spec.engine,
    tolerance: z0(spec.tolerance),
    seed: z0(spec.seed),
    ...(spec.mps === undefined ? {} : { mps: { ...spec.mps } }),
  };
}

/**
 * The text the physics hash is taken of: the canonical spec without its label, as JSON with
 * object keys sorted at every level and no whitespace.
 */
export function canonicalSpecText(spec: SweepSpec): string {
  const { label: _label, ...physics } = canonicalSpec(spec);
  return stableJson(physics);
}

/** The physics hash: hex SHA-256 of {@link canonicalSpecText} (UTF-8). 64 lowercase hex digits. */
export function specHash(spec: SweepSpec): string {
  return createHash('sha256').update(canonicalSpecText(spec), 'utf8').digest('hex');
}

/** JSON with sorted object keys; undefined members are left out, as JSON.stringify does. */
function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? 'null' : stableJson(v))).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const obj = value as Record<string, unknown>;
    const parts: string[] = [];
    for (const key of Object.keys(obj).sort()) {
      if (obj[key] === undefined) continue;
      parts.push(`${JSON.stringify(key)}:${stableJson(obj[key])}`);
    }
    return `{${parts.join(',')}}`;
  }
  return JSON.stringify(typeof value === 'number' ? z0(value) : value);
}

function canonicalBonds(bonds: ReadonlyArray<readonly [number, number]>): Pair[] {
  return bonds.map(([a, b]): Pair => [z0(Math.min(a, b)), z0(Math.max(a, b))]).sort(byTuple);
}

function canonicalLattice(l: Lattice): Lattice {
  switch (l.kind) {
    case 'chain':
      return { kind: l.kind, length: l.length, boundary: l.boundary };
    case 'ladder':
      return { kind: l.kind, length: l.length, boundary: [l.boundary[0], l.boundary[1]] };
    case 'square':
    case 'triangular':
    case 'honeycomb':
      return { kind: l.kind, size: [l.size[0], l.size[1]], boundary: [l.boundary[0], l.boundary[1]] };
    case 'bonds': {
      const out: Lattice = {
        kind: l.kind, sites: l.sites, bonds: canonicalBonds(l.bonds), farBonds: canonicalBonds(l.farBonds),
      };
      if (l.positions !== undefined) out.positions = l.positions.map(([x, y]): Pair => [z0(x), z0(y)]);
      return out;
    }
  }
}

/** Letter order within a site, for sorting terms. */
const LETTER_RANK: Record<string, number> = { X: 0, Y: 1, Z: 2 };

interface Factor {
  letter: string;
  site: number;
}

/** The factors of a (schema-valid) word, sorted by site. */
function factorsOf(word: string): Factor[] {
  const out: Factor[] = [];
  for (const token of word.trim().split(/\s+/)) {
    if (token !== '') out.push({ letter: token[0], site: Number(token.slice(1)) });
  }
  return out.sort((f, g) => f.site - g.site);
}

/** Sort key of a word: factor count, then (site, letter) per factor. */
const sortKey = (factors: readonly Factor[]): number[] =>
  [factors.length, ...factors.flatMap((f) => [f.site, LETTER_RANK[f.letter]])];

function canonicalHamiltonian(h: Hamiltonian): Hamiltonian {
  switch (h.model) {
    case 'ising':
      return { model: h.model, J: z0(h.J), hx: z0(h.hx), hz: z0(h.hz) };
    case 'xxz':
      return { model: h.model, J: z0(h.J), delta: z0(h.delta), hz: z0(h.hz) };
    case 'pauli-sum': {
      const like = new Map<string, { key: number[]; weights: number[] }>();
      for (const term of h.terms) {
        const factors = factorsOf(term.word);
        const word = factors.map((f) => `${f.letter}${f.site}`).join(' ');
        const entry = like.get(word);
        if (entry) entry.weights.push(term.weight);
        else like.set(word, { key: sortKey(factors), weights: [term.weight] });
      }
      const terms = [...like]
        .map(([word, { key, weights }]) => ({
          word,
          key,
          // Summing in ascending order makes the merged weight independent of term order.
          weight: z0(weights.sort(ascending).reduce((s, w) => s + w, 0)),
        }))
        .filter((t) => t.weight !== 0)
        .sort((p, q) => byTuple(p.key, q.key))
        .map(({ weight, word }) => ({ weight, word }));
      return { model: h.model, terms: terms.length > 0 ? terms : [{ weight: 0, word: '' }] };
    }
  }
}

function canonicalTimes(t: TimeGrid): TimeGrid {
  if ('values' in t) return { values: uniqueSorted(t.values) };
  const start = z0(t.start);
  return { start, stop: t.count === 1 ? start : z0(t.stop), count: t.count };
}

function canonicalObservable(o: Observable): Observable {
  switch (o.kind) {
    case 'site': {
      const out: Observable = { kind: o.kind, pauli: o.pauli, perSite: o.perSite };
      if (o.sites !== undefined) out.sites = [...o.sites].map(z0).sort(ascending);
      return out;
    }
    case 'pair': {
      const symmetric = o.paulis[0] === o.paulis[1];
      const pair = ([i, j]: readonly [number, number]): Pair =>
        (symmetric && j < i ? [z0(j), z0(i)] : [z0(i), z0(j)]);
      return {
        kind: o.kind,
        paulis: o.paulis,
        pairs: typeof o.pairs === 'string' ? o.pairs : o.pairs.map(pair).sort(byTuple),
        perPair: o.perPair,
        connected: o.connected,
      };
    }
    case 'energy':
      return { kind: o.kind, of: o.of };
    case 'magnetisation':
      return { kind: o.kind, pauli: o.pauli, pattern: o.pattern };
    case 'structure-factor':
      return {
        kind: o.kind,
        paulis: o.paulis,
        momenta: o.momenta.map(([x, y]): Pair => [z0(x), z0(y)]).sort(byTuple),
        connected: o.connected,
      };
  }
}
