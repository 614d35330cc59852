/**
 * planFreeFermion — cost, memory and accuracy of the free-fermion engine for a spec, or a
 * refusal (not quadratic, too many sites, over the memory or work budget, or a tolerance below
 * the rounding floor). Never throws on a schema-valid spec. Fan-out: one branch per β (each
 * branch decomposes H0 and H1 itself).
 *
 * Work (flops) per branch, n = 2L Majoranas, |S| = Majorana rows some Pfaffian touches:
 * - each distinct Schur form: SVD_FLOPS_PER_SITE³·L³ (bidiagonal SVD with vectors) plus, unless
 *   A is already tridiagonal, (4/3 + 2)·n³ (Householder reduction and applying Q);
 * - W = O1ᵀO0 per sector with H1 ≠ H0: 2n³; per Gaussian component: 2n³ (Γ'' = WΓ'₀Wᵀ);
 * - per time: 6|S|n per sector (rotations), per component 2|S|n² (F·Γ'') or O(|S|n) when H1 = H0,
 *   the covariance entries (2n each, or 2|S|²n at once), and Σ s³/3 for the Pfaffians;
 * - chiral models (every coupling joins an even and an odd Majorana index: transverse-field and
 *   ZZ + YY chains; sector-modes.ts) need a quarter of W's work, an eighth of Γ''s and a quarter
 *   of F·Γ''s, and a quarter of the memory for W and Γ''.
 * Components: 1 for an open chain, up to 4 for a ring (thermal + twisted per parity sector;
 * twisted ones are counted although they are often skipped at run time).
 * Seconds = flops / ASSUMED_FLOPS_PER_SECOND (measured here: gemm 3–4 Gflop/s, the level-2
 * Householder and rotation loops 1–2 Gflop/s).
 * Memory: the Schur forms and W (n² each), the dense covariances (n² each), transient
 * decomposition buffers (≈ 2.5n²), and the evaluation rows ((sectors + 1)·|S|·n + |S|²).
 * Accuracy: error-model.ts's a-priori entry error at the largest β and t, times the largest
 * Pfaffian order, with the largest Σ|w| (systematic part) and √Σw² (random part) of a series
 * (energies and structure factors are sums).
 */
import type { SweepPlan, SweepSpec } from '../../../../shared-types/src/index.js';
import type { PauliFactor } from '../../physics/pauli-word.js';
import { betaGrid } from '../../sweep/beta-grid.js';
import { timeGrid } from '../../sweep/time-grid.js';
import { refusePlan } from '../plan-refusal.js';
import { priorEntryError } from './error-model.js';
import { freeFermionModel, isModelRefusal, type FreeFermionModel } from './free-fermion-model.js';
import { pauliToMajorana, timesParity, type MajoranaMonomial } from './jordan-wigner.js';
import { sectorForm, type MajoranaHamiltonian } from './majorana-hamiltonian.js';

/** Peak memory one branch may use. */
export const MEMORY_BUDGET_BYTES = 4 * 2 ** 30;
/** Largest work of a sweep the plan accepts (≈ 14 h at the assumed rate). */
export const WORK_BUDGET_FLOPS = 1e14;
/** Rough single-core throughput assumed for the time estimate, flop/s. */
export const ASSUMED_FLOPS_PER_SECOND = 2e9;
/** Bidiagonal SVD with both vector sets ≈ this × L³ flops (about two sweeps per value). */
export const SVD_FLOPS_PER_SITE3 = 12;

const REASON = 'free fermions (Jordan–Wigner): Gaussian thermal states on each parity sector, exact mode rotations for the quench, Pfaffians for string correlators; rounding-level accuracy';

/** What the strings to measure cost. */
interface StringCost {
  strings: number;
  pfaffianFlops: number;
  entries: number;
  maxOrder: number;
  rows: Uint8Array;
  allRows: boolean;
}

function order(q: MajoranaMonomial, sites: number, sectors: 1 | 2): MajoranaMonomial | null {
  if (q.count % 2 === 1) return null;
  if (sectors === 1 || q.count <= sites) return q;
  return timesParity(q, sites);
}

function addString(acc: StringCost, factors: PauliFactor[], sites: number, sectors: 1 | 2, mark = true): void {
  const q = order(pauliToMajorana(factors), sites, sectors);
  acc.strings++;
  if (q === null) return;
  const s = q.count;
  acc.pfaffianFlops += s > 4 ? (s * s * s) / 3 : 0;
  acc.entries += (s * (s - 1)) / 2;
  acc.maxOrder = Math.max(acc.maxOrder, s);
  if (mark && !acc.allRows) for (let r = 0; r < q.lo.length; r++) acc.rows.fill(1, q.lo[r], q.hi[r] + 1);
}

/** Adds every pair i < j with letters (a, b) without enumerating them (cost depends on j − i only). */
function addAllPairs(acc: StringCost, a: PauliFactor['letter'], b: PauliFactor['letter'], sites: number, sectors: 1 | 2): void {
  for (let d = 1; d < sites; d++) {
    const q = order(pauliToMajorana([{ letter: a, site: 0 }, { letter: b, site: d }]), sites, sectors);
    const count = sites - d;
    acc.strings += count;
    if (q === null) continue;
    const s = q.count;
    acc.pfaffianFlops += count * (s > 4 ? (s * s * s) / 3 : 0);
    acc.entries += (count * s * (s - 1)) / 2;
    acc.maxOrder = Math.max(acc.maxOrder, s);
    acc.allRows = true;
  }
}

/** Largest Σ|w| (linear) and √Σw² (quadrature) over the series of a spec. */
interface SeriesWeight {
  linear: number;
  quadrature: number;
}

function stringCost(spec: SweepSpec, model: FreeFermionModel): { cost: StringCost; weight: SeriesWeight } {
  const { sites, sectors, graph } = model;
  const acc: StringCost = {
    strings: 0, pfaffianFlops: 0, entries: 0, maxOrder: 0, rows: new Uint8Array(2 * sites), allRows: false,
  };
  const allSites = Array.from({ length: sites }, (_, i) => i);
  const weight: SeriesWeight = { linear: 1, quadrature: 1 };
  const energyWeight = (terms: FreeFermionModel['h0Terms']) => {
    weight.linear = Math.max(weight.linear, terms.reduce((s, t) => s + (t.factors.length ? Math.abs(t.weight) : 0), 0));
    weight.quadrature = Math.max(weight.quadrature, Math.sqrt(terms.reduce((s, t) => s + (t.factors.length ? t.weight * t.weight : 0), 0)));
  };
  for (const t of model.h1Terms) if (t.factors.length) addString(acc, [...t.factors], sites, sectors);
  for (const o of spec.observables) {
    switch (o.kind) {
      case 'site':
        for (const s of o.sites ?? allSites) addString(acc, [{ letter: o.pauli, site: s }], sites, sectors);
        break;
      case 'magnetisation':
        for (const s of allSites) addString(acc, [{ letter: o.pauli, site: s }], sites, sectors);
        break;
      case 'energy': {
        const terms = o.of === 'h0' ? model.h0Terms : model.h1Terms;
        for (const t of terms) if (t.factors.length) addString(acc, [...t.factors], sites, sectors);
        energyWeight(terms);
        break;
      }
      case 'pair': {
        const [a, b] = [o.paulis[0], o.paulis[1]] as [PauliFactor['letter'], PauliFactor['letter']];
        if (o.pairs === 'by-distance') {
          addAllPairs(acc, a, b, sites, sectors);
          if (a !== b) addAllPairs(acc, b, a, sites, sectors);
        } else {
          const list = o.pairs === 'nearest' ? graph.bonds : o.pairs === 'next-nearest' ? graph.farBonds : o.pairs;
          for (const [i, j] of list) addString(acc, [{ letter: a, site: i }, { letter: b, site: j }], sites, sectors);
        }
        if (o.connected) for (const s of allSites) addString(acc, [{ letter: a, site: s }], sites, sectors, true);
        break;
      }
      case 'structure-factor': {
        const letter = o.paulis[0] as PauliFactor['letter'];
        addAllPairs(acc, letter, letter, sites, sectors);
        if (o.connected) for (const s of allSites) addString(acc, [{ letter, site: s }], sites, sectors);
        weight.linear = Math.max(weight.linear, sites);
        weight.quadrature = Math.max(weight.quadrature, Math.SQRT2);
        break;
      }
    }
  }
  return { cost: acc, weight };
}

function sameSectorForms(h0: MajoranaHamiltonian, h1: MajoranaHamiltonian, p: 1 | -1): boolean {
  const a = sectorForm(h0, p).entries;
  const b = sectorForm(h1, p).entries;
  return a.length === b.length && a.every((e, k) => e.m === b[k].m && e.n === b[k].n && e.value === b[k].value);
}

function isChiral(h: MajoranaHamiltonian, p: 1 | -1): boolean {
  return sectorForm(h, p).entries.every((e) => (e.m + e.n) % 2 === 1);
}

function isTridiagonal(h: MajoranaHamiltonian, p: 1 | -1): boolean {
  return sectorForm(h, p).entries.every((e) => e.n - e.m === 1);
}

function normOf(h: MajoranaHamiltonian, p: 1 | -1): number {
  const rows = new Float64Array(2 * h.sites);
  for (const e of sectorForm(h, p).entries) {
    rows[e.m] += Math.abs(e.value);
    rows[e.n] += Math.abs(e.value);
  }
  return rows.reduce((a, b) => Math.max(a, b), 0);
}

/** Plan of the free-fermion engine (see file header). Never throws on a valid spec. */
export function planFreeFermion(spec: SweepSpec, name = 'free-fermion'): SweepPlan {
  const betas = betaGrid(spec);
  const times = timeGrid(spec);
  const base = {
    engine: name, reason: REASON, memoryBytes: 0, flops: 0, seconds: 0,
    accuracy: spec.tolerance, branches: betas.map((_, b) => [b]),
  };
  const model = freeFermionModel(spec);
  if (isModelRefusal(model)) {
    return { ...base, feasible: false, refusal: { ...model }, sites: 0 };
  }
  const { sites, sectors } = model;
  const n = 2 * sites;
  let cost: StringCost;
  let weight: SeriesWeight;
  try {
    ({ cost, weight } = stringCost(spec, model));
  } catch (e) {
    return refusePlan(base, sites, 'observables', 0, 0, `the observables cannot be set up: ${(e as Error).message}`);
  }
  const parities: Array<1 | -1> = sectors === 2 ? [1, -1] : [1];
  const ns = cost.allRows ? n : cost.rows.reduce((s, v) => s + v, 0);

  // Decompositions (distinct matrices only, as sector-modes.ts shares them).
  const seen: string[] = [];
  let decompositionFlops = 0;
  let distinct = 0;
  let wCount = 0;
  let denseComponents = 0;
  const L3 = sites ** 3;
  for (const p of parities) {
    for (const h of [model.h0, model.h1]) {
      const key = JSON.stringify(sectorForm(h, p).entries);
      if (seen.includes(key)) continue;
      seen.push(key);
      distinct++;
      decompositionFlops += SVD_FLOPS_PER_SITE3 * L3 + (isTridiagonal(h, p) ? 0 : (10 / 3) * n ** 3);
    }
    const same = sameSectorForms(model.h0, model.h1, p);
    if (!same) {
      wCount++;
      decompositionFlops += 2 * n ** 3;
      denseComponents += sectors === 2 ? 2 : 1;
    }
  }
  const chiral = parities.every((p) => isChiral(model.h0, p) && isChiral(model.h1, p));
  // Work and memory of W and of a dense Γ'' relative to the general case (chiral: L × L blocks).
  const wShare = chiral ? 0.25 : 1;
  const gShare = chiral ? 0.125 : 1;
  if (chiral) decompositionFlops -= wCount * 2 * n ** 3 * (1 - wShare);
  const components = sectors === 2 ? 4 : 1;
  const perBeta = denseComponents * 2 * n ** 3 * gShare;
  const denseEntries = ns > 0 && cost.entries > (ns * ns) / 4;
  const mFlops = (denseComponents / components) * 2 * ns * n * n * (chiral ? 0.25 : 1)
    + (1 - denseComponents / components) * 2 * ns * n;
  const perTime = sectors * 6 * ns * n
    + components * (mFlops + (denseEntries ? 2 * ns * ns * n : 2 * cost.entries * n) + cost.pfaffianFlops);
  const perBranch = decompositionFlops + perBeta + times.length * perTime;
  const flops = betas.length * perBranch;
  const seconds = flops / ASSUMED_FLOPS_PER_SECOND;

  const memShare = chiral ? 0.25 : 1;
  const doubles = (distinct + 2.5 + memShare * (wCount + denseComponents) + (denseComponents > 0 ? 1 : 0)) * n * n
    + (sectors + 1) * ns * n + (denseEntries ? ns * ns : 0) + cost.maxOrder * cost.maxOrder;
  const memoryBytes = 8 * doubles;
  const planned = { ...base, memoryBytes, flops, seconds };
  if (memoryBytes > MEMORY_BUDGET_BYTES) {
    return refusePlan(planned, sites, 'memory', MEMORY_BUDGET_BYTES, memoryBytes,
      `one branch needs ${memoryBytes} bytes (n = ${n} Majoranas: n² doubles per matrix), above the budget of ${MEMORY_BUDGET_BYTES} bytes`);
  }
  if (flops > WORK_BUDGET_FLOPS) {
    return refusePlan(planned, sites, 'work', WORK_BUDGET_FLOPS, flops,
      `the sweep needs ~${flops.toExponential(2)} flops (~${Math.round(seconds / 3600)} h on one core), above the budget of ${WORK_BUDGET_FLOPS.toExponential(0)}; long string correlators (by-distance, structure factors of ZZ/YY) cost O(L⁵) per time`);
  }
  let norm0 = 0;
  let norm1 = 0;
  for (const p of parities) {
    norm0 = Math.max(norm0, normOf(model.h0, p));
    norm1 = Math.max(norm1, normOf(model.h1, p));
  }
  const entry = priorEntryError(n, norm0, norm1, betas[betas.length - 1], times[times.length - 1]);
  const accuracy = Math.max(2, cost.maxOrder) * (entry.systematic * weight.linear + entry.random * weight.quadrature);
  if (accuracy > spec.tolerance) {
    return refusePlan({ ...planned, accuracy }, sites, 'tolerance', spec.tolerance, accuracy,
      `the rounding estimate ~${accuracy.toExponential(2)} (n = ${n} Majoranas, Pfaffians up to order ${cost.maxOrder}) exceeds the tolerance ${spec.tolerance}`);
  }
  return { ...planned, accuracy, feasible: true, refusal: null, sites };
}
