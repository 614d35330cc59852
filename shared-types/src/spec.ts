/**
 * The sweep spec: what a user submits. The zod schemas here are the only source of the spec
 * types; everything else infers from them. Conventions (Pauli operators, bit order, the
 * doubled state) are fixed in DESIGN.md §2.
 *
 * JSON Schema: every schema here converts with `z.toJSONSchema(…, { target: 'draft-7' })`
 * (no transforms or pipes). Rules across fields are refinements: zod enforces them, the JSON
 * Schema does not show them. Lattice-dependent rules (a site index inside the lattice, a
 * staggered pattern on a bipartite lattice) are checked after parsing, by the sweep runner.
 *
 * Each exported schema carries `.meta({ id })` with its own export name, which becomes its
 * OpenAPI component name.
 */
import { z } from 'zod';
import { LIMITS } from './limits.js';
import {
  choiceMessage, listMessage, numberMessage, stringMessage, tupleMessage,
} from './spec-messages.js';
import type { SpecIssueCode } from './spec-issue.js';

/** A finite real number named `symbol` in messages (z.number() already rejects NaN and ±Infinity). */
const real = (symbol: string) => z.number({ error: numberMessage(symbol) });

/** A whole number named `symbol` in messages. */
const whole = (symbol: string) => z.number({ error: numberMessage(symbol, true) }).int();

/** Boundary condition of one lattice direction. */
export const Boundary = z.enum(['open', 'periodic'], { error: choiceMessage() })
  .meta({ id: 'Boundary' });
export type Boundary = z.infer<typeof Boundary>;

/** Boundaries of a two-direction lattice: [first direction, second direction]. */
const boundaryPair = () =>
  z.tuple([Boundary, Boundary], { error: tupleMessage('a pair of boundaries ["open" | "periodic", "open" | "periodic"]') })
    .default(['open', 'open']);

/** A site index 0..maxSites−1 (lattice-specific bounds are checked after parsing). */
const siteIndex = () => whole('site index').min(0).max(LIMITS.maxSites - 1);
/** A number of unit cells along one direction. */
const extent = (symbol: string) => whole(symbol).min(1).max(LIMITS.maxExtent);
/** An ordered pair of site indices [i, j]. */
const sitePair = () => z.tuple([siteIndex(), siteIndex()], { error: tupleMessage('a site pair [i, j]') });

/** Adds an issue with one of our stable codes (see spec-issue.ts) in `params.code`. */
function report(
  ctx: z.RefinementCtx, code: SpecIssueCode, path: (string | number)[], message: string, input?: unknown,
): void {
  ctx.addIssue({ code: 'custom', path, message, params: { code }, input });
}

/** Sites per unit cell of the planar lattices (honeycomb has two: A and B). */
const CELL_SITES = { square: 1, triangular: 1, honeycomb: 2 } as const;

/** A one-dimensional chain of `length` sites, site x at (x, 0). */
export const ChainLattice = z.object({
  kind: z.literal('chain'),
  /** Number of sites, 1..maxExtent. */
  length: extent('length'),
  /** Boundary along the chain; periodic makes a ring. @defaultValue 'open' */
  boundary: Boundary.default('open'),
}).strict().meta({ id: 'ChainLattice' });

/**
 * A two-leg ladder of `length` rungs (2·length sites, so length ≤ maxSites/2);
 * `boundary` is [along the legs, across the rungs].
 */
export const LadderLattice = z.object({
  kind: z.literal('ladder'),
  /** Number of rungs, 1..maxSites/2. */
  length: whole('length').min(1).max(LIMITS.maxSites / 2),
  /** [along the legs, across the rungs]. @defaultValue ['open', 'open'] */
  boundary: boundaryPair(),
}).strict().meta({ id: 'LadderLattice' });

/** Two-dimensional Bravais or honeycomb lattices; `size` = [Lx, Ly] in unit cells. */
const planar = <K extends keyof typeof CELL_SITES>(kind: K) =>
  z.object({
    kind: z.literal(kind),
    /** [Lx, Ly] in unit cells; sites = Lx·Ly (·2 for honeycomb) must not exceed maxSites. */
    size: z.tuple([extent('Lx'), extent('Ly')], { error: tupleMessage('a size [Lx, Ly]') }),
    /** [along a1, along a2]. @defaultValue ['open', 'open'] */
    boundary: boundaryPair(),
  }).strict().superRefine((l, ctx) => {
    const sites = CELL_SITES[kind] * l.size[0] * l.size[1];
    if (sites > LIMITS.maxSites) {
      report(ctx, 'lattice_too_large', ['size'],
        `a ${l.size[0]}×${l.size[1]} ${kind} lattice has ${sites} sites; at most ${LIMITS.maxSites} sites`, l.size);
    }
  });
export const SquareLattice = planar('square').meta({ id: 'SquareLattice' });
export const TriangularLattice = planar('triangular').meta({ id: 'TriangularLattice' });
export const HoneycombLattice = planar('honeycomb').meta({ id: 'HoneycombLattice' });

/**
 * An explicit graph: `sites` sites, nearest-neighbour `bonds`, optional next-nearest
 * `farBonds`. Bonds are unordered; each joins two different existing sites and appears once
 * across both lists.
 */
export const BondListLattice = z.object({
  kind: z.literal('bonds'),
  /** Number of sites, 1..maxSites (a graph with no bonds is allowed: isolated spins). */
  sites: whole('sites').min(1).max(LIMITS.maxSites),
  /** Nearest-neighbour bonds [i, j] (order within a bond does not matter). */
  bonds: z.array(sitePair(), { error: listMessage('bonds', 'bond') }).max(LIMITS.maxBonds),
  /** Next-nearest-neighbour bonds. @defaultValue [] */
  farBonds: z.array(sitePair(), { error: listMessage('bonds', 'bond') }).max(LIMITS.maxBonds).default([]),
  /** Optional site coordinates, one [x, y] per site (for the structure factor and pair distances). */
  positions: z.array(z.tuple([real('x'), real('y')], { error: tupleMessage('a position [x, y]') }),
    { error: listMessage('positions', 'position') }).max(LIMITS.maxSites).optional(),
}).strict().superRefine((l, ctx) => {
  const seen = new Map<number, string>();
  for (const field of ['bonds', 'farBonds'] as const) {
    l[field].forEach(([a, b], k) => {
      let inside = true;
      [a, b].forEach((s, end) => {
        if (s >= l.sites) {
          inside = false;
          report(ctx, 'site_out_of_range', [field, k, end], `site ${s} does not exist: this lattice has sites 0..${l.sites - 1}`, s);
        }
      });
      if (a === b) {
        report(ctx, 'self_bond', [field, k], `a bond joins two different sites, got [${a}, ${b}]`, [a, b]);
        return;
      }
      if (!inside) return;
      const key = Math.min(a, b) * LIMITS.maxSites + Math.max(a, b);
      const first = seen.get(key);
      if (first !== undefined) {
        report(ctx, 'duplicate_bond', [field, k], `the bond ${Math.min(a, b)}–${Math.max(a, b)} is already listed as ${first}`, [a, b]);
      } else {
        seen.set(key, `${field}[${k}]`);
      }
    });
  }
  if (l.positions !== undefined && l.positions.length !== l.sites) {
    report(ctx, 'positions_mismatch', ['positions'],
      `one position per site: expected ${l.sites}, got ${l.positions.length}`, l.positions);
  }
}).meta({ id: 'BondListLattice' });

/** The lattice: its `kind` selects the form. */
export const Lattice = z.discriminatedUnion('kind', [
  ChainLattice, LadderLattice, SquareLattice, TriangularLattice, HoneycombLattice, BondListLattice,
]).meta({ id: 'Lattice' });
export type Lattice = z.infer<typeof Lattice>;

/** One factor: a letter, then a site index without leading zeros. */
const FACTOR = '[XYZ](?:0|[1-9][0-9]*)';
/** Factors separated by spaces; blanks around the word are allowed; "" is the identity. */
const PAULI_WORD = new RegExp(`^ *(?:${FACTOR}(?: +${FACTOR})*)? *$`);
/** Longest Pauli word, in characters. */
const MAX_WORD_CHARS = 4096;

/**
 * A Pauli string written as space-separated site factors, e.g. "X0 Z3" or "Y2 Y5": a letter
 * X, Y or Z, then a site index (no leading zeros). Each site appears at most once. The
 * identity is the empty string "". Factor order does not matter (factors on different sites
 * commute); the canonical form sorts them by site.
 */
export const PauliWord = z.string({
  error: stringMessage(),
}).max(MAX_WORD_CHARS).regex(PAULI_WORD, {
  error: 'a Pauli word is space-separated factors like "X0 Z3": a letter X, Y or Z, then a site index ("" is the identity)',
}).superRefine((word, ctx) => {
  if (!PAULI_WORD.test(word)) return; // the pattern check already reported it
  const seen = new Set<number>();
  for (const token of word.trim().split(/ +/)) {
    if (token === '') continue;
    const site = Number(token.slice(1));
    if (site > LIMITS.maxSites - 1) {
      report(ctx, 'site_out_of_range', [], `site ${site} in "${token}" is above the largest site index ${LIMITS.maxSites - 1}`, word);
    } else if (seen.has(site)) {
      report(ctx, 'duplicate_site', [], `site ${site} appears more than once; write each site once (e.g. "X0 Z3")`, word);
    }
    seen.add(site);
  }
}).meta({ id: 'PauliWord' });

/** One weighted Pauli string of an explicit Hamiltonian. */
export const PauliTerm = z.object({
  /** Real coefficient of the string (energy units). */
  weight: real('weight'),
  /** The Pauli string, e.g. "X0 X1". */
  word: PauliWord,
}).strict().meta({ id: 'PauliTerm' });
export type PauliTerm = z.infer<typeof PauliTerm>;

/** Transverse-field Ising: H = −J Σ⟨ij⟩ Z_i Z_j − hx Σ_i X_i − hz Σ_i Z_i. */
export const IsingModel = z.object({
  model: z.literal('ising'),
  /** Nearest-neighbour ZZ coupling (J > 0 ferromagnetic). @defaultValue 1 */
  J: real('J').default(1),
  /** Transverse field along X. @defaultValue 0 */
  hx: real('hx').default(0),
  /** Longitudinal field along Z. @defaultValue 0 */
  hz: real('hz').default(0),
}).strict().meta({ id: 'IsingModel' });

/** XXZ: H = J Σ⟨ij⟩ (X_i X_j + Y_i Y_j + Δ Z_i Z_j) − hz Σ_i Z_i. */
export const XxzModel = z.object({
  model: z.literal('xxz'),
  /** Exchange coupling (J > 0 antiferromagnetic). @defaultValue 1 */
  J: real('J').default(1),
  /** Anisotropy Δ of the ZZ part (Δ = 1: Heisenberg). @defaultValue 1 */
  delta: real('Δ').default(1),
  /** Field along Z. @defaultValue 0 */
  hz: real('hz').default(0),
}).strict().meta({ id: 'XxzModel' });

/**
 * Any real-weighted sum of Pauli strings (sites must exist on the lattice; checked after
 * parsing). Every term is Hermitian, so the sum is.
 */
export const PauliSumModel = z.object({
  model: z.literal('pauli-sum'),
  /** The terms, 1..maxTerms; like terms are merged in the canonical form. */
  terms: z.array(PauliTerm, { error: listMessage('Pauli terms', 'Pauli term') }).min(1).max(LIMITS.maxTerms),
}).strict().meta({ id: 'PauliSumModel' });

/** A Hamiltonian: its `model` selects the form. */
export const Hamiltonian = z.discriminatedUnion('model', [IsingModel, XxzModel, PauliSumModel])
  .meta({ id: 'Hamiltonian' });
export type Hamiltonian = z.infer<typeof Hamiltonian>;

/** A time of the quench, 0..maxTime (units of 1/energy, ħ = 1). */
const time = (symbol: string) => real(symbol).min(0).max(LIMITS.maxTime);

/** The even grid: `count` points from `start` to `stop` inclusive. */
const EvenTimeGrid = z.object({
  /** First time. @defaultValue 0 */
  start: time('start').default(0),
  /** Last time, ≥ start (> start when count > 1). */
  stop: time('stop'),
  /** Number of points, 1..maxTimePoints; count = 1 gives the single time `start`. */
  count: whole('count').min(1).max(LIMITS.maxTimePoints, {
    error: (iss) => `at most ${LIMITS.maxTimePoints} time points, got ${String(iss.input)}`,
  }),
}).strict().superRefine((g, ctx) => {
  if (g.stop < g.start) {
    report(ctx, 'time_grid_reversed', ['stop'], `expected stop ≥ start (${g.start}), got ${g.stop}`, g.stop);
  } else if (g.count > 1 && g.stop === g.start) {
    report(ctx, 'time_grid_degenerate', ['stop'], `${g.count} points need stop > start; use count 1 for the single time ${g.start}`, g.stop);
  }
});

/** Explicit times, in any order; repeats are computed once. */
const ExplicitTimeGrid = z.object({
  /** The times, 1..maxTimePoints of them; sorted ascending and de-duplicated in the canonical form. */
  values: z.array(time('t'), {
    error: listMessage('time points', 'time point'),
  }).min(1).max(LIMITS.maxTimePoints),
}).strict();

/**
 * Time grid of the quench: `count` evenly spaced points from `start` to `stop` inclusive, or
 * explicit `values`.
 */
export const TimeGrid = z.union([EvenTimeGrid, ExplicitTimeGrid], {
  error: (iss) => iss.code === 'invalid_union'
    ? 'a time grid is either { start?, stop, count } or { values: [t, …] }'
    : undefined,
}).meta({ id: 'TimeGrid' });
export type TimeGrid = z.infer<typeof TimeGrid>;

/** A single-site Pauli operator. */
export const PauliLetter = z.enum(['X', 'Y', 'Z'], { error: choiceMessage() }).meta({ id: 'PauliLetter' });
/** Two Pauli letters for a two-site correlator, e.g. "ZZ" or "XY" (first letter on the first site). */
export const PauliPair = z.enum(['XX', 'XY', 'XZ', 'YX', 'YY', 'YZ', 'ZX', 'ZY', 'ZZ'], {
  error: choiceMessage(),
}).meta({ id: 'PauliPair' });

/** Reports repeated entries of a list of numbers or number tuples (compared by value) with `code`. */
function noRepeats(noun: string, code: SpecIssueCode) {
  return (list: ReadonlyArray<number | readonly number[]>, ctx: z.RefinementCtx) => {
    const seen = new Map<string, number>();
    list.forEach((item, k) => {
      // String(±0) is "0": −0 and 0 are the same site or momentum.
      const key = Array.isArray(item) ? item.map(String).join(',') : String(item);
      const first = seen.get(key);
      if (first !== undefined) {
        report(ctx, code, [k], `repeats the ${noun} at index ${first}; list each ${noun} once`, item);
      } else {
        seen.set(key, k);
      }
    });
  };
}

/**
 * Which pairs a correlator runs over: the lattice's nearest or next-nearest bonds, every pair
 * grouped by distance, or explicit [i, j] pairs (ordered: the first letter acts on i; for
 * equal letters such as "ZZ" the order does not matter and the canonical form writes i < j).
 */
export const PairSelection = z.union([
  z.enum(['nearest', 'next-nearest', 'by-distance']),
  z.array(sitePair(), { error: listMessage('site pairs', 'site pair') }).min(1).max(LIMITS.maxPairs)
    .superRefine((pairs, ctx) => {
      pairs.forEach(([i, j], k) => {
        if (i === j) report(ctx, 'self_bond', [k], `a pair joins two different sites, got [${i}, ${j}]`, [i, j]);
      });
      noRepeats('pair', 'duplicate_pair')(pairs, ctx);
    }),
], {
  error: (iss) => iss.code === 'invalid_union'
    ? 'pairs must be "nearest", "next-nearest", "by-distance" or a list of site pairs [[i, j], …]'
    : undefined,
}).meta({ id: 'PairSelection' });

/** Single-site Pauli expectation, lattice-averaged and optionally per site. */
export const SiteObservable = z.object({
  kind: z.literal('site'),
  /** The Pauli operator measured on each site. */
  pauli: PauliLetter,
  /** Restrict to these sites (each once; sorted in the canonical form). Default: every site. */
  sites: z.array(siteIndex(), { error: listMessage('sites', 'site') }).min(1).max(LIMITS.maxSites)
    .superRefine(noRepeats('site', 'duplicate_site')).optional(),
  /** Also report one series per site. @defaultValue false */
  perSite: z.boolean().default(false),
}).strict().meta({ id: 'SiteObservable' });

/** Two-site Pauli correlator ⟨σ^a_i σ^b_j⟩, averaged over the selected pairs (or per distance class). */
export const PairObservable = z.object({
  kind: z.literal('pair'),
  /** The two letters a, b: a on the first site of each pair, b on the second. */
  paulis: PauliPair,
  /**
   * The pairs. For equal letters [i, j] and [j, i] are the same pair; listing both is caught
   * by the sweep runner's semantic checks (duplicate_pair). @defaultValue 'nearest'
   */
  pairs: PairSelection.default('nearest'),
  /** Also report one series per pair. @defaultValue false */
  perPair: z.boolean().default(false),
  /** Subtract ⟨σ^a_i⟩⟨σ^b_j⟩. @defaultValue false */
  connected: z.boolean().default(false),
}).strict().meta({ id: 'PairObservable' });

/** ⟨H0⟩ or ⟨H1⟩ (total; per-site values are derived). */
export const EnergyObservable = z.object({
  kind: z.literal('energy'),
  /** Which Hamiltonian. */
  of: z.enum(['h0', 'h1'], { error: choiceMessage() }),
}).strict().meta({ id: 'EnergyObservable' });

/** Magnetisation density (1/N) Σ s_i σ_i with s_i = 1 (uniform) or ±1 by sublattice (staggered). */
export const MagnetisationObservable = z.object({
  kind: z.literal('magnetisation'),
  /** The Pauli operator summed. */
  pauli: PauliLetter,
  /** Sign pattern; staggered needs a bipartite lattice (checked after parsing). @defaultValue 'uniform' */
  pattern: z.enum(['uniform', 'staggered'], { error: choiceMessage() }).default('uniform'),
}).strict().meta({ id: 'MagnetisationObservable' });

/** Static structure factor S(q) = (1/N) Σ_ij cos(q·(r_i − r_j)) ⟨σ_i σ_j⟩ at the given momenta. */
export const StructureFactorObservable = z.object({
  kind: z.literal('structure-factor'),
  /** Which diagonal correlator. */
  paulis: z.enum(['XX', 'YY', 'ZZ'], { error: choiceMessage() }),
  /** Momenta q = [qx, qy] (inverse lattice spacings), each once; sorted in the canonical form. */
  momenta: z.array(z.tuple([real('qx'), real('qy')], { error: tupleMessage('a momentum [qx, qy]') }),
    { error: listMessage('momenta', 'momentum') }).min(1).max(LIMITS.maxMomenta).superRefine(noRepeats('momentum', 'duplicate_momentum')),
  /** Subtract ⟨σ_i⟩⟨σ_j⟩. @defaultValue false */
  connected: z.boolean().default(false),
}).strict().meta({ id: 'StructureFactorObservable' });

/** What to measure: its `kind` selects the form. Series are reported in this order. */
export const Observable = z.discriminatedUnion('kind', [
  SiteObservable, PairObservable, EnergyObservable, MagnetisationObservable, StructureFactorObservable,
]).meta({ id: 'Observable' });
export type Observable = z.infer<typeof Observable>;

/** Engine names. `auto` picks one from the spec and the tolerance and says why. */
export const EngineName = z.enum(['auto', 'exact', 'spectral', 'free-fermion', 'typical', 'mps', 'series'], { error: choiceMessage() }).meta({ id: 'EngineName' });
export type EngineName = z.infer<typeof EngineName>;

/**
 * Printable text: no control characters (tab and newline included), no lone surrogates, no
 * line/paragraph separators and no bidirectional overrides (which could disguise a label).
 */
const PRINTABLE = /^[^\p{Cc}\p{Cs}\p{Zl}\p{Zp}\u202A-\u202E\u2066-\u2069]*$/u;
/** Longest label, in UTF-16 code units. */
const MAX_LABEL = 200;

/**
 * Settings of the `mps` engine (purified MPS with TEBD). Every field is optional: the engine
 * derives what is missing from `tolerance` and says so in its plan. Other engines ignore it.
 */
export const MpsSettings = z.object({
  /** Bond-dimension cap χ of the doubled state, 1..2048. @defaultValue 128 */
  maxBond: whole('maxBond').min(1).max(2048).optional(),
  /**
   * Largest discarded weight per two-site update, relative to the state's squared norm,
   * 0..1e−2. @defaultValue derived from tolerance (tolerance²/16 per expected update, clamped to 1e−16..1e−8)
   */
  truncation: real('truncation').min(0).max(1e-2).optional(),
  /** Trotter order: 2 (Strang) or 4 (Forest–Ruth/Yoshida triple jump). @defaultValue 4 */
  trotterOrder: z.union([z.literal(2), z.literal(4)], { error: choiceMessage() }).optional(),
  /**
   * Largest Trotter step, in time units for the quench and in units of β/2 for the imaginary
   * time, 1e−4..1. @defaultValue derived from tolerance (see the engine's plan)
   */
  dt: real('dt').min(1e-4).max(1).optional(),
}).strict().meta({ id: 'MpsSettings' });
export type MpsSettings = z.infer<typeof MpsSettings>;

/** The sweep spec. */
export const SweepSpec = z.object({
  /** Free-text label, printable, ≤ 200 characters; not part of the physics hash. @defaultValue '' */
  label: z.string({ error: stringMessage() }).max(MAX_LABEL).regex(PRINTABLE, {
    error: 'must be printable text on one line (no control characters, line breaks or direction overrides)',
  }).default(''),
  /** The lattice of spin-1/2 sites. */
  lattice: Lattice,
  /** Hamiltonian of the thermal state (imaginary-time generator). */
  h0: Hamiltonian,
  /** Quench Hamiltonian (real-time generator H1 ⊗ 1 − 1 ⊗ H1ᵀ). */
  h1: Hamiltonian,
  /**
   * Inverse temperatures β = 1/T, each 0 ≤ β ≤ maxBeta, 1..maxBetas of them in any order.
   * The canonical form sorts them ascending and removes repeats: a repeated β is computed
   * once.
   */
  betas: z.array(real('β').min(0).max(LIMITS.maxBeta), {
    error: listMessage('inverse temperatures', 'inverse temperature'),
  }).min(1).max(LIMITS.maxBetas),
  /** Time grid of the quench. */
  times: TimeGrid,
  /** What to measure, 1..maxObservables entries; series follow this order. */
  observables: z.array(Observable, { error: listMessage('observables', 'observable') })
    .min(1).max(LIMITS.maxObservables),
  /** Which engine runs the sweep. @defaultValue 'auto' */
  engine: EngineName.default('auto'),
  /** Absolute accuracy asked of every observable value, 1e-13..1. @defaultValue 1e-8 */
  tolerance: real('tolerance').min(1e-13).max(1).default(1e-8),
  /** Seed for every random choice an engine makes, 0..2³¹−1. @defaultValue 1 */
  seed: whole('seed').min(0).max(2 ** 31 - 1).default(1),
  /** Settings of the `mps` engine (optional; see {@link MpsSettings}). */
  mps: MpsSettings.optional(),
}).strict().meta({ id: 'SweepSpec' });

/** A spec after defaults are applied (what engines receive). */
export type SweepSpec = z.infer<typeof SweepSpec>;
/** A spec as a user may write it (defaults optional). */
export type SweepSpecInput = z.input<typeof SweepSpec>;
