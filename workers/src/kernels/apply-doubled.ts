/**
 * applyDoubledAffine — out ← α·(A⊗1 + 1⊗B)·in + β·in + γ·out on the doubled (purified) state.
 *
 * Layout (DESIGN.md §2): the 4^N state is the amplitude matrix M (rows physical r, columns
 * auxiliary c) stored column-major, complex interleaved: amplitude of |r⟩⊗|c⟩ at complex index
 * r + dim·c. Physical qubit i = bit i, auxiliary qubit ĩ = bit N+i; each column is a contiguous
 * 2^N vector. (A⊗1) acts inside each column; (1⊗B) mixes whole columns:
 *   ((1⊗B)M)[:, c⊕x] += tB_x[c]·M[:, c]   ⇔   (1⊗B)M = M·Bᵀ.
 *
 * Formula per output column c (A, B compiled as diag + Σ_x F_x·diag(t_x), see compile-operator):
 *   out[:, c] ← (β + α·dB[c] + α·dA[:])∘in[:, c] + γ·out[:, c]          (one fused pass)
 *   out[r, c] += α·Σ_x tA_x[r⊕x]·in[r⊕x, c]       A groups, gathered inside the column, two
 *                                                  groups per pass when both tables are real
 *   out[:, c] += Σ_x (α·tB_x[c⊕x])·in[:, c⊕x]      B groups: contiguous axpys of whole columns,
 *                                                  up to four per pass when the factors are real;
 *                                                  zero factors (e.g. XX+YY on aligned spins) skipped
 * Working column by column keeps out[:, c] and in[:, c] in L1/L2 while all their updates are
 * applied, so main memory sees ≈ one read + one write of out and (1 + G_B) reads of in.
 * Source: matrix-free Pauli-sum application on a purified state (common practice).
 *
 * Groups compiled with `{ tables: false }` are evaluated from their terms on the fly (slower).
 * Cost: ≤ (3 + 8·(G_A + G_B))·4^N flops (half that for real tables); O(G) scratch per call,
 * nothing allocated per column. Caveats: `in` and `out` must not overlap; when γ = 0 `out` is
 * not read (as in BLAS), so garbage or NaN there does not propagate; α, β, γ are real.
 */
import type { CompiledGroup, CompiledOperator } from './compile-operator.js';
import { groupEntryIm, groupEntryRe } from './group-entry.js';

/** Largest N for the doubled state: 2·4^N doubles must index below 2^31 (and 4^15·16 B = 16 GiB). */
export const MAX_DOUBLED_SITES = 15;

/** Up to this many B columns are combined in one pass over the output column. */
const B_FUSE = 4;

/**
 * On the 4^N doubled state (column-major dim × dim complex matrix M, see file header):
 * out ← α·(A⊗1 + 1⊗B)·in + β·in + γ·out, real α, β, γ. Either operator may be null (= 0).
 * For the quench generator K = H1⊗1 − 1⊗H1ᵀ pass a = compileOperator(H1),
 * b = compileOperator(scaleSum(transposeSum(H1), −1)).
 *
 * @param a - physical operator (acts on rows, A⊗1), or null.
 * @param b - auxiliary operator (acts on columns: (1⊗B)M = M·Bᵀ), or null.
 * @param input - at least 2·4^N doubles; must not be `out`.
 * @param out - at least 2·4^N doubles, updated in place.
 * @param sites - number of sites N, needed only when both a and b are null.
 * @throws RangeError when a and b disagree on sites, N is outside [0, MAX_DOUBLED_SITES], a
 *   buffer is too short, both operators are null and `sites` is missing, or `input === out`.
 */
export function applyDoubledAffine(
  a: CompiledOperator | null,
  b: CompiledOperator | null,
  input: Float64Array,
  out: Float64Array,
  alpha: number,
  beta: number,
  gamma: number,
  sites?: number,
): void {
  const n = a?.sites ?? b?.sites ?? sites;
  if (n === undefined) throw new RangeError('sites must be given when both a and b are null');
  if (!Number.isInteger(n) || n < 0 || n > MAX_DOUBLED_SITES) {
    throw new RangeError(`sites must be an integer in [0, ${MAX_DOUBLED_SITES}] for the doubled state; got ${n}`);
  }
  if (a !== null && b !== null && a.sites !== b.sites) {
    throw new RangeError(`a.sites (${a.sites}) and b.sites (${b.sites}) must agree`);
  }
  const dim = 1 << n; // an int, not a double (2 ** n): keeps all index arithmetic in small integers
  const need = 2 * dim * dim;
  if (input.length < need) throw new RangeError(`input must hold at least ${need} doubles; got ${input.length}`);
  if (out.length < need) throw new RangeError(`out must hold at least ${need} doubles; got ${out.length}`);
  if (input === out) throw new RangeError('input and out must be different buffers');

  const dA = a === null ? null : a.diagonal;
  const dB = b === null ? null : b.diagonal;
  const gA = a === null || alpha === 0 ? NO_GROUPS : a.groups;
  const gB = b === null || alpha === 0 ? NO_GROUPS : b.groups;
  const col = 2 * dim;

  // Per-call scratch, O(G): which A tables are real; the B factors of the current column.
  const aReal = gA.map((g) => g.real && g.table.length > 0);
  const nB = gB.length;
  const bOff = new Int32Array(nB); // 2·4^N < 2^31 for every N whose doubled state fits in memory
  const bRe = new Float64Array(nB);
  const bIm = new Float64Array(nB);

  for (let c = 0; c < dim; c++) {
    const ob = col * c;
    diagonalPass(dA, beta + (dB === null ? 0 : alpha * dB[c]), alpha, gamma, input, out, ob, dim);

    for (let g = 0; g < gA.length; g++) {
      if (aReal[g] && g + 1 < gA.length && aReal[g + 1]) {
        gatherRealPair(gA[g], gA[g + 1], alpha, input, out, ob, dim);
        g++;
      } else if (aReal[g]) {
        gatherReal(gA[g], alpha, input, out, ob, dim);
      } else if (gA[g].table.length === 0) {
        gatherCompact(gA[g], alpha, input, out, ob, dim);
      } else {
        gatherComplex(gA[g], alpha, input, out, ob, dim);
      }
    }

    // Collect the non-zero B factors for this output column.
    let m = 0;
    for (let g = 0; g < nB; g++) {
      const grp = gB[g];
      const cc = c ^ grp.x;
      const t = grp.table;
      const tabulated = t.length > 0;
      const cr = alpha * (tabulated ? t[2 * cc] : groupEntryRe(grp, cc));
      const ci = alpha * (tabulated ? t[2 * cc + 1] : groupEntryIm(grp, cc));
      if (cr !== 0 || ci !== 0) {
        bOff[m] = col * cc;
        bRe[m] = cr;
        bIm[m] = ci;
        m++;
      }
    }
    let k = 0;
    while (k < m) {
      let run = 0;
      while (run < B_FUSE && k + run < m && bIm[k + run] === 0) run++;
      if (run >= 4) {
        axpyReal4(out, ob, input, bOff[k], bRe[k], bOff[k + 1], bRe[k + 1], bOff[k + 2], bRe[k + 2], bOff[k + 3], bRe[k + 3], col);
        k += 4;
      } else if (run >= 2) {
        axpyReal2(out, ob, input, bOff[k], bRe[k], bOff[k + 1], bRe[k + 1], col);
        k += 2;
      } else if (run === 1) {
        axpyReal1(out, ob, input, bOff[k], bRe[k], col);
        k += 1;
      } else {
        axpyComplexColumn(out, ob, input, bOff[k], bRe[k], bIm[k], col);
        k += 1;
      }
    }
  }
}

const NO_GROUPS: readonly CompiledGroup[] = [];

/** out[r] += α·entry(r⊕x)·in[r⊕x] inside one column, entries computed from the group's terms. */
function gatherCompact(g: CompiledGroup, alpha: number, input: Float64Array, out: Float64Array, ob: number, dim: number): void {
  const x = g.x;
  for (let r = 0, k = ob; r < dim; r++, k += 2) {
    const q = r ^ x;
    const p = 2 * q;
    const tr = alpha * groupEntryRe(g, q);
    const ti = g.real ? 0 : alpha * groupEntryIm(g, q);
    const ir = input[ob + p];
    const ii = input[ob + p + 1];
    out[k] += tr * ir - ti * ii;
    out[k + 1] += tr * ii + ti * ir;
  }
}

/** out[:, c] ← f∘in[:, c] + γ·out[:, c] with f = f0 + α·dA (or f0 when dA is null). */
function diagonalPass(
  dA: Float64Array | null, f0: number, alpha: number, gamma: number,
  input: Float64Array, out: Float64Array, ob: number, dim: number,
): void {
  if (dA !== null) {
    if (gamma === 0) {
      for (let r = 0, k = ob; r < dim; r++, k += 2) {
        const f = f0 + alpha * dA[r];
        out[k] = f * input[k];
        out[k + 1] = f * input[k + 1];
      }
    } else {
      for (let r = 0, k = ob; r < dim; r++, k += 2) {
        const f = f0 + alpha * dA[r];
        out[k] = f * input[k] + gamma * out[k];
        out[k + 1] = f * input[k + 1] + gamma * out[k + 1];
      }
    }
  } else if (gamma === 0) {
    for (let k = ob, end = ob + 2 * dim; k < end; k++) out[k] = f0 * input[k];
  } else {
    for (let k = ob, end = ob + 2 * dim; k < end; k++) out[k] = f0 * input[k] + gamma * out[k];
  }
}

/** out[r] += α·Σ_{two groups} t[r⊕x]·in[r⊕x] inside one column, real tables. */
function gatherRealPair(
  g1: CompiledGroup, g2: CompiledGroup, alpha: number,
  input: Float64Array, out: Float64Array, ob: number, dim: number,
): void {
  const x1 = g1.x, t1 = g1.table, x2 = g2.x, t2 = g2.table;
  for (let r = 0, k = ob; r < dim; r++, k += 2) {
    const p1 = 2 * (r ^ x1);
    const p2 = 2 * (r ^ x2);
    const w1 = t1[p1];
    const w2 = t2[p2];
    out[k] += alpha * (w1 * input[ob + p1] + w2 * input[ob + p2]);
    out[k + 1] += alpha * (w1 * input[ob + p1 + 1] + w2 * input[ob + p2 + 1]);
  }
}

/** out[r] += α·t[r⊕x]·in[r⊕x] inside one column, real table. */
function gatherReal(g: CompiledGroup, alpha: number, input: Float64Array, out: Float64Array, ob: number, dim: number): void {
  const x = g.x, t = g.table;
  for (let r = 0, k = ob; r < dim; r++, k += 2) {
    const p = 2 * (r ^ x);
    const w = alpha * t[p];
    out[k] += w * input[ob + p];
    out[k + 1] += w * input[ob + p + 1];
  }
}

/** out[r] += α·t[r⊕x]·in[r⊕x] inside one column, complex table. */
function gatherComplex(g: CompiledGroup, alpha: number, input: Float64Array, out: Float64Array, ob: number, dim: number): void {
  const x = g.x, t = g.table;
  for (let r = 0, k = ob; r < dim; r++, k += 2) {
    const p = 2 * (r ^ x);
    const tr = alpha * t[p];
    const ti = alpha * t[p + 1];
    const ir = input[ob + p];
    const ii = input[ob + p + 1];
    out[k] += tr * ir - ti * ii;
    out[k + 1] += tr * ii + ti * ir;
  }
}

function axpyReal4(
  out: Float64Array, ob: number, input: Float64Array,
  o1: number, c1: number, o2: number, c2: number, o3: number, c3: number, o4: number, c4: number, len: number,
): void {
  for (let j = 0; j < len; j++) {
    out[ob + j] += c1 * input[o1 + j] + c2 * input[o2 + j] + c3 * input[o3 + j] + c4 * input[o4 + j];
  }
}

function axpyReal2(out: Float64Array, ob: number, input: Float64Array, o1: number, c1: number, o2: number, c2: number, len: number): void {
  for (let j = 0; j < len; j++) out[ob + j] += c1 * input[o1 + j] + c2 * input[o2 + j];
}

function axpyReal1(out: Float64Array, ob: number, input: Float64Array, o1: number, c1: number, len: number): void {
  for (let j = 0; j < len; j++) out[ob + j] += c1 * input[o1 + j];
}

function axpyComplexColumn(out: Float64Array, ob: number, input: Float64Array, o1: number, cr: number, ci: number, len: number): void {
  if (cr === 0) {
    for (let j = 0; j < len; j += 2) {
      out[ob + j] -= ci * input[o1 + j + 1];
      out[ob + j + 1] += ci * input[o1 + j];
    }
    return;
  }
  for (let j = 0; j < len; j += 2) {
    const ir = input[o1 + j];
    const ii = input[o1 + j + 1];
    out[ob + j] += cr * ir - ci * ii;
    out[ob + j + 1] += cr * ii + ci * ir;
  }
}
