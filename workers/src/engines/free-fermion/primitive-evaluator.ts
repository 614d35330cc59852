/**
 * PrimitiveEvaluator — expectation values of all measured strings at one time t:
 *
 *   ⟨Q⟩(t) = Σ_components w_c · sign · Pf(Γ_c(t)[m, m]),   Γ_c(t) = F(t)·Γ''_c·F(t)ᵀ,
 *
 * with only the rows of F(t) = O1·E(t) that some Pfaffian touches (the index set S). Per time
 * and component: M = F_S·Γ''_c (2|S|n² flops, or O(|S|n) for block-diagonal Γ''), then the
 * needed entries Γ_ab = M_a·F_b (2n flops each; or all |S|² at once by one product when most
 * are needed), then one Pfaffian per string (closed forms for 2 × 2 and 4 × 4, else
 * Parlett–Reid, ≈ (2r)³/3 flops). Chiral Γ'' (only G = Γ''[even][odd] ≠ 0, L × L): with
 * F_e = F[:, even], F_o = F[:, odd] and P = F_e·G (2|S|L² = |S|n²/2 flops),
 *   Γ_ab = Σ G_kk'(F_a,2k F_b,2k'+1 − F_a,2k'+1 F_b,2k) = P_a·F_o,b − P_b·F_o,a. Twisted components with bordered modes use the bordered
 * matrix of gaussian-components.ts.
 *
 * Error estimate per string (not a bound; error-model.ts): for each component
 * |w_c|·max(1, |Pf|)·(Pfaffian order)·scale_c·δΓ, separately for the systematic and the random
 * part of the caller's covariance-entry error δΓ; the bound of skipped twisted components is
 * added to the systematic part.
 */
import { gemmUnchecked } from '../../linalg/gemm.js';
import { pfaffianInPlace } from '../../linalg/pfaffian.js';
import { rotateModePairs } from '../../linalg/rotate-mode-pairs.js';
import type { EntryError } from './error-model.js';
import type { ComponentSet, GaussianComponent } from './gaussian-components.js';
import type { PrimitiveForm } from './primitive-forms.js';
import type { SectorModes } from './sector-modes.js';

/** Evaluates every primitive at a time; buffers are allocated once. */
export class PrimitiveEvaluator {
  readonly #sectors: readonly SectorModes[];
  readonly #forms: readonly PrimitiveForm[];
  readonly #n: number;
  /** Sorted Majorana indices used by any Pfaffian. */
  readonly rows: Int32Array;
  readonly #pos: Int32Array;
  readonly #f: Float64Array[];
  readonly #m: Float64Array;
  readonly #g: Float64Array;
  readonly #dense: boolean;
  readonly #cos: Float64Array;
  readonly #sin: Float64Array;
  /** De-interleaved F rows (even, odd columns), |S| × L each, per sector. */
  readonly #fe: Float64Array[];
  readonly #fo: Float64Array[];
  /** True while the current component is chiral (entries from P = M's first |S|·L and F_o). */
  #chiral = false;
  readonly #maxOrder: number;
  #pfWork: Float64Array;
  #qz: Float64Array;

  constructor(sectors: readonly SectorModes[], forms: readonly PrimitiveForm[]) {
    this.#sectors = sectors;
    this.#forms = forms;
    const n = sectors[0].h1.schur.n;
    this.#n = n;
    const used = new Uint8Array(n);
    let entries = 0;
    let maxOrder = 0;
    for (const f of forms) {
      if (f.zero) continue;
      for (const i of f.indices) used[i] = 1;
      const s = f.indices.length;
      entries += (s * (s - 1)) / 2;
      maxOrder = Math.max(maxOrder, s);
    }
    const rows: number[] = [];
    const pos = new Int32Array(n).fill(-1);
    for (let i = 0; i < n; i++) if (used[i]) { pos[i] = rows.length; rows.push(i); }
    this.rows = Int32Array.from(rows);
    this.#pos = pos;
    const ns = rows.length;
    this.#f = sectors.map(() => new Float64Array(ns * n));
    const chiral = sectors.some((sec) => sec.wChiral !== null);
    this.#fe = sectors.map(() => new Float64Array(chiral ? ns * (n / 2) : 0));
    this.#fo = sectors.map(() => new Float64Array(chiral ? ns * (n / 2) : 0));
    this.#m = new Float64Array(ns * n);
    this.#dense = ns > 0 && entries > (ns * ns) / 4;
    this.#g = new Float64Array(this.#dense ? ns * ns : 0);
    this.#cos = new Float64Array(n / 2);
    this.#sin = new Float64Array(n / 2);
    this.#maxOrder = maxOrder;
    this.#pfWork = new Float64Array(maxOrder * maxOrder);
    this.#qz = new Float64Array(0);
  }

  /** Largest Pfaffian order (2r) among the strings. */
  get maxOrder(): number {
    return this.#maxOrder;
  }

  /**
   * Writes ⟨Q_k⟩(t) into values[k] and its error estimate into sys[k] (systematic) and rnd[k]
   * (random rounding).
   * @param entryError estimated absolute error of one covariance entry at this time.
   */
  evaluate(t: number, set: ComponentSet, entryError: EntryError, values: Float64Array, sys: Float64Array, rnd: Float64Array): void {
    const n = this.#n;
    const rows = this.rows;
    const ns = rows.length;
    values.fill(0);
    sys.fill(0);
    rnd.fill(0);
    this.#forms.forEach((f, k) => {
      if (f.zero) return;
      const r = f.indices.length / 2;
      if (r < set.skipped.length) sys[k] += set.skipped[r];
    });
    if (ns === 0) {
      // Only constants (0-Majorana strings, e.g. the identity or ∝ P on one sector).
      for (const c of set.components) this.#accumulate(c, values, sys, rnd, entryError);
      return;
    }
    const m2 = n / 2;
    this.#sectors.forEach((sec, s) => {
      if (set.components.some((c) => c.sector === s)) {
        const f = this.#f[s];
        rotateModePairs(n, sec.h1.schur.o, sec.h1.schur.eps, t, rows, f, this.#cos, this.#sin);
        if (set.components.some((c) => c.sector === s && c.covariance.kind === 'chiral')) {
          const fe = this.#fe[s];
          const fo = this.#fo[s];
          for (let i = 0; i < ns; i++) {
            for (let k = 0; k < m2; k++) {
              fe[i * m2 + k] = f[i * n + 2 * k];
              fo[i * m2 + k] = f[i * n + 2 * k + 1];
            }
          }
        }
      }
    });
    for (const c of set.components) {
      const f = this.#f[c.sector];
      const cov = c.covariance;
      this.#chiral = cov.kind === 'chiral';
      if (cov.kind === 'chiral') {
        // P = F_e·G into the first |S|·L entries of M.
        gemmUnchecked(false, false, ns, m2, m2, 1, this.#fe[c.sector], m2, cov.g, m2, 0, this.#m, m2);
        if (this.#dense) {
          // g[a][b] = P_a·F_o,b − P_b·F_o,a.
          gemmUnchecked(false, true, ns, ns, m2, 1, this.#m, m2, this.#fo[c.sector], m2, 0, this.#g, ns);
          for (let a = 0; a < ns; a++) {
            for (let b = 0; b < a; b++) {
              const x = this.#g[a * ns + b] - this.#g[b * ns + a];
              this.#g[a * ns + b] = x;
              this.#g[b * ns + a] = -x;
            }
            this.#g[a * ns + a] = 0;
          }
        }
      } else if (cov.kind === 'dense') {
        gemmUnchecked(false, false, ns, n, n, 1, f, n, cov.g, n, 0, this.#m, n);
      } else {
        // Γ'' blocks [[0, d], [−d, 0]]: M[:, 2k] = −d_k F[:, 2k+1], M[:, 2k+1] = d_k F[:, 2k].
        const d = cov.d;
        for (let i = 0; i < ns; i++) {
          const o = i * n;
          for (let q = 0; q < n / 2; q++) {
            const a = f[o + 2 * q];
            const b = f[o + 2 * q + 1];
            this.#m[o + 2 * q] = -d[q] * b;
            this.#m[o + 2 * q + 1] = d[q] * a;
          }
        }
      }
      if (this.#dense && !this.#chiral) gemmUnchecked(false, true, ns, ns, n, 1, this.#m, n, f, n, 0, this.#g, ns);
      const z = c.borderTau.length;
      if (z > 0) {
        const z2 = 2 * z;
        if (this.#qz.length < ns * z2) this.#qz = new Float64Array(ns * z2);
        if (c.borderW !== null) gemmUnchecked(false, false, ns, z2, n, 1, f, n, c.borderW, z2, 0, this.#qz, z2);
        else {
          for (let i = 0; i < ns; i++) {
            c.borderModes.forEach((mode, col) => {
              this.#qz[i * z2 + 2 * col] = f[i * n + 2 * mode];
              this.#qz[i * z2 + 2 * col + 1] = f[i * n + 2 * mode + 1];
            });
          }
        }
      }
      this.#accumulate(c, values, sys, rnd, entryError);
    }
  }

  /** Γ(t)_ab (a, b in S) of the current component. */
  #entry(a: number, b: number, f: Float64Array, sector: number): number {
    const pa = this.#pos[a];
    const pb = this.#pos[b];
    if (this.#dense) return this.#g[pa * this.rows.length + pb];
    if (this.#chiral) {
      const m2 = this.#n / 2;
      const fo = this.#fo[sector];
      const p = this.#m;
      const oa = pa * m2;
      const ob = pb * m2;
      let s = 0;
      for (let k = 0; k < m2; k++) s += p[oa + k] * fo[ob + k] - p[ob + k] * fo[oa + k];
      return s;
    }
    const n = this.#n;
    const oa = pa * n;
    const ob = pb * n;
    const m = this.#m;
    let s0 = 0, s1 = 0;
    let l = 0;
    for (; l + 1 < n; l += 2) {
      s0 += m[oa + l] * f[ob + l];
      s1 += m[oa + l + 1] * f[ob + l + 1];
    }
    for (; l < n; l++) s0 += m[oa + l] * f[ob + l];
    return s0 + s1;
  }

  #accumulate(c: GaussianComponent, values: Float64Array, sys: Float64Array, rnd: Float64Array, entryError: EntryError): void {
    const f = this.#f[c.sector] ?? new Float64Array(0);
    const z = c.borderTau.length;
    const z2 = 2 * z;
    const weight = c.weightSign * Math.exp(c.logWeight);
    const absWeight = Math.exp(c.logWeight);
    this.#forms.forEach((form, k) => {
      if (form.zero) return;
      const idx = form.indices;
      const s = idx.length;
      const sign = form.signs[c.sector];
      let pf: number;
      let order = s;
      if (z === 0) {
        if (s === 0) pf = 1;
        else if (s === 2) pf = -this.#entry(idx[1], idx[0], f, c.sector);
        else if (s === 4) {
          const g01 = -this.#entry(idx[1], idx[0], f, c.sector), g02 = -this.#entry(idx[2], idx[0], f, c.sector);
          const g03 = -this.#entry(idx[3], idx[0], f, c.sector), g12 = -this.#entry(idx[2], idx[1], f, c.sector);
          const g13 = -this.#entry(idx[3], idx[1], f, c.sector), g23 = -this.#entry(idx[3], idx[2], f, c.sector);
          pf = g01 * g23 - g02 * g13 + g03 * g12;
        } else {
          const w = this.#work(s);
          for (let u = 1; u < s; u++) for (let v = 0; v < u; v++) w[u * s + v] = this.#entry(idx[u], idx[v], f, c.sector);
          const lp = pfaffianInPlace(s, w);
          pf = lp.sign * Math.exp(lp.logAbs);
        }
        values[k] += weight * sign * pf;
        const factor = absWeight * Math.max(1, Math.abs(pf)) * Math.max(1, order) * c.scale;
        sys[k] += factor * entryError.systematic;
        rnd[k] += factor * entryError.random;
        return;
      }
      // Bordered: K = [[⊕ τ_k J, Q_Zᵀ], [−Q_Z, C]] of order 2|Z| + s.
      order = z2 + s;
      const w = this.#work(order);
      w.fill(0, 0, order * order);
      for (let q = 0; q < z; q++) w[(2 * q + 1) * order + 2 * q] = -c.borderTau[q];
      for (let u = 0; u < s; u++) {
        const row = (z2 + u) * order;
        const pu = this.#pos[idx[u]] * z2;
        for (let col = 0; col < z2; col++) w[row + col] = -this.#qz[pu + col];
        for (let v = 0; v < u; v++) w[row + z2 + v] = this.#entry(idx[u], idx[v], f, c.sector);
      }
      const lp = pfaffianInPlace(order, w);
      const contribution = lp.sign === 0 ? 0 : c.weightSign * sign * lp.sign * Math.exp(c.logWeight + lp.logAbs);
      values[k] += contribution;
      const factor = (Math.abs(contribution) + absWeight) * order * c.scale;
      sys[k] += factor * entryError.systematic;
      rnd[k] += factor * entryError.random;
    });
  }

  #work(order: number): Float64Array {
    if (this.#pfWork.length < order * order) this.#pfWork = new Float64Array(order * order);
    return this.#pfWork;
  }
}
