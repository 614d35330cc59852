/**
 * jackknifeRatio: the delete-one jackknife of functions of pooled ratio means (Quenouille 1956,
 * Tukey 1958; B. Efron, The Jackknife, the Bootstrap and Other Resampling Plans, SIAM (1982)).
 */
import { describe, expect, it } from 'vitest';
import { jackknifeRatio } from '../../../workers/src/engines/typical/index.js';
import { seededRandom } from '../kernels/dense-reference.js';

const identity = (m: Float64Array, _w: number, out: Float64Array) => { out.set(m); };

describe('jackknifeRatio', () => {
  it('gives the standard error of the mean, s/√R, for a plain mean (equal weights)', () => {
    // Exact identity for linear statistics (Efron 1982, §2.1); sums of ~20 O(1) numbers: 1e-14.
    const rand = seededRandom(3);
    const R = 20;
    const x = Float64Array.from({ length: R }, () => rand() * 4 - 1);
    const w = new Float64Array(R).fill(1);
    const j = jackknifeRatio(w, x, 1, R, identity, 1);
    const mean = x.reduce((a, v) => a + v, 0) / R;
    const s2 = x.reduce((a, v) => a + (v - mean) ** 2, 0) / (R - 1);
    expect(j.plain[0]).toBeCloseTo(mean, 14);
    expect(j.estimate[0]).toBeCloseTo(mean, 14); // no bias for a linear statistic
    expect(Math.abs(j.stdError[0] - Math.sqrt(s2 / R))).toBeLessThan(1e-14);
  });

  it('removes the O(1/R) bias of a squared mean exactly: θ_J = x̄² − s²/R', () => {
    // Known closed form of the jackknife for θ = x̄² (Efron 1982, §2.2).
    const rand = seededRandom(4);
    const R = 11;
    const x = Float64Array.from({ length: R }, () => rand());
    const w = new Float64Array(R).fill(1);
    const j = jackknifeRatio(w, x, 1, R, (m, _w, out) => { out[0] = m[0] * m[0]; }, 1);
    const mean = x.reduce((a, v) => a + v, 0) / R;
    const s2 = x.reduce((a, v) => a + (v - mean) ** 2, 0) / (R - 1);
    expect(Math.abs(j.estimate[0] - (mean * mean - s2 / R))).toBeLessThan(1e-14);
  });

  it('matches a direct leave-one-out computation for weighted ratios and the weight mean', () => {
    // Direct O(R²) reference: each leave-one-out ratio and mean weight recomputed from scratch.
    const rand = seededRandom(8);
    const R = 9, m = 3;
    const w = Float64Array.from({ length: R }, () => Math.exp(4 * rand()));
    const x = Float64Array.from({ length: R * m }, () => rand() - 0.5);
    const f = (mm: Float64Array, wMean: number, out: Float64Array) => {
      out[0] = mm[0] * mm[1] + mm[2];
      out[1] = Math.log(wMean);
    };
    const j = jackknifeRatio(w, x, m, R, f, 2);
    const direct = (skip: number) => {
      let sw = 0; const s = new Float64Array(m); let n = 0;
      for (let r = 0; r < R; r++) {
        if (r === skip) continue;
        sw += w[r]; n++;
        for (let k = 0; k < m; k++) s[k] += w[r] * x[r * m + k];
      }
      const out = new Float64Array(2);
      f(s.map((v) => v / sw), sw / n, out);
      return out;
    };
    const full = direct(-1);
    const loo = Array.from({ length: R }, (_, i) => direct(i));
    for (let k = 0; k < 2; k++) {
      const mean = loo.reduce((a, v) => a + v[k], 0) / R;
      const se = Math.sqrt(((R - 1) / R) * loo.reduce((a, v) => a + (v[k] - mean) ** 2, 0));
      expect(j.plain[k]).toBeCloseTo(full[k], 13);
      expect(j.estimate[k]).toBeCloseTo(R * full[k] - (R - 1) * mean, 12);
      expect(j.stdError[k]).toBeCloseTo(se, 13);
    }
  });

  it('keeps the error and the bias correction at rounding level when every sample agrees, whatever R', () => {
    // Each θ_(i) carries the rounding of its leave-one-out sums, and R·θ̂ − (R − 1)·θ̄ multiplies
    // that by R − 1: plain running sums gave 8.6e-11 at R = 1000, compensated ones ~1e-13.
    // Bounds: σ ≤ 1e-13 and |θ_J − θ| ≤ R·ε·|θ| ≈ 6e-13 → 1e-12.
    const v = 5.545177444479562;
    for (const R of [2, 100, 1000]) {
      const j = jackknifeRatio(new Float64Array(R).fill(1), new Float64Array(R).fill(v), 1, R, identity, 1);
      expect(j.stdError[0]).toBeLessThan(1e-13);
      expect(Math.abs(j.estimate[0] - v)).toBeLessThan(1e-12);
      // Through the weight path alone (ln of the mean weight), equal weights are exact.
      const k = jackknifeRatio(new Float64Array(R).fill(1), new Float64Array(0), 0, R, (_m, w, out) => { out[0] = v + Math.log(w); }, 1);
      expect(k.stdError[0]).toBe(0);
      expect(k.estimate[0]).toBe(v);
    }
  });

  it('does not cancel catastrophically when one sample carries almost all the weight', () => {
    // Leave-one-out sums by prefix + suffix: removing the 1e30 sample leaves the 1e-3 samples'
    // own ratio (0.25), which a total-minus-one subtraction would lose entirely.
    const w = Float64Array.from([1e30, 1e-3, 1e-3]);
    const x = Float64Array.from([1, 0, 0.5]);
    const j = jackknifeRatio(w, x, 1, 3, identity, 1);
    expect(j.plain[0]).toBe(1);
    // θ_(0) = 0.25, θ_(1) = θ_(2) = 1: θ̄ = 0.75, σ = √(2/3 · (0.25² + 2·0.125²))… computed directly:
    const loo = [0.25, 1, 1];
    const mean = 0.75;
    expect(j.stdError[0]).toBeCloseTo(Math.sqrt((2 / 3) * loo.reduce((a, v) => a + (v - mean) ** 2, 0)), 14);
  });

  it('says "no information" (σ = ∞) when a leave-one-out weight sum is zero', () => {
    const j = jackknifeRatio(Float64Array.from([1, 0, 0]), Float64Array.from([1, 2, 3]), 1, 3, identity, 1);
    expect(j.stdError[0]).toBe(Infinity);
    expect(j.estimate[0]).toBe(1);
  });

  it('rejects fewer than 2 samples, short buffers and negative or non-finite weights', () => {
    const one = new Float64Array(1);
    expect(() => jackknifeRatio(one, one, 1, 1, identity, 1)).toThrow(/count/);
    expect(() => jackknifeRatio(new Float64Array(2), one, 1, 2, identity, 1)).toThrow(/values/);
    expect(() => jackknifeRatio(Float64Array.from([1, -1]), new Float64Array(2), 1, 2, identity, 1)).toThrow(/weights\[1\]/);
    expect(() => jackknifeRatio(Float64Array.from([1, Number.NaN]), new Float64Array(2), 1, 2, identity, 1)).toThrow(/weights\[1\]/);
    expect(() => jackknifeRatio(Float64Array.from([1, 1]), new Float64Array(2), -1, 2, identity, 1)).toThrow(/stride/);
  });
});
