/**
 * jackknifeRatio — delete-one jackknife of functions of pooled ratio estimators.
 *
 * Inputs: R samples with non-negative weights w_r and value vectors x_r ∈ ℝ^m. The pooled
 * means are m̄ = Σ_r w_r x_r / Σ_r w_r and the weight mean W̄ = Σ_r w_r / R; a caller's function
 * f(m̄, W̄) ↦ θ ∈ ℝ^k is evaluated on all samples (θ̂) and on each set with sample i left out (θ_(i)).
 *   bias-corrected estimate  θ_J = R·θ̂ − (R − 1)·θ̄,   θ̄ = (1/R) Σ_i θ_(i)
 *   standard error           σ_J = √((R − 1)/R · Σ_i (θ_(i) − θ̄)²)     (one standard deviation)
 * Source: Quenouille (1956) and Tukey (1958), as in B. Efron, "The Jackknife, the Bootstrap and
 * Other Resampling Plans", SIAM (1982), ch. 2 (common practice). For ratio estimators the
 * bias is O(1/R) and the jackknife removes its leading term.
 *
 * Leave-one-out sums are prefix + suffix sums (Σ_{j<i} + Σ_{j>i}), never a total minus one
 * term, so a dominant sample cannot cancel catastrophically. When a leave-one-out weight sum
 * is 0 (all remaining weights underflowed) the jackknife carries no information: every σ_J is
 * +Infinity and the estimates are the plain θ̂.
 * Cost: O(R·m) for the (compensated) sums plus R + 1 evaluations of f; memory 2·(R + 1)·(m + 1) doubles.
 */

/** f(means, weightMean, out): writes the k outputs for pooled means and the mean weight. */
export type RatioFunction = (means: Float64Array, weightMean: number, out: Float64Array) => void;

/** Outputs of {@link jackknifeRatio}, each of length k. */
export interface JackknifeResult {
  /** Bias-corrected estimates θ_J. */
  readonly estimate: Float64Array;
  /** Plain estimates θ̂ on all samples. */
  readonly plain: Float64Array;
  /** Jackknife standard errors σ_J (1σ). */
  readonly stdError: Float64Array;
}

/**
 * Jackknife of f over `count` samples (see file header). `values` holds the samples' vectors
 * row-major (values[r·stride + j], j < stride).
 * @throws RangeError when count < 2, a buffer is too short, or a weight is negative or not finite.
 */
export function jackknifeRatio(
  weights: Float64Array,
  values: Float64Array,
  stride: number,
  count: number,
  f: RatioFunction,
  outputs: number,
): JackknifeResult {
  if (!Number.isInteger(count) || count < 2) throw new RangeError(`count must be an integer ≥ 2 (the jackknife leaves one out); got ${count}`);
  if (!Number.isInteger(stride) || stride < 0) throw new RangeError(`stride must be a non-negative integer; got ${stride}`);
  if (!Number.isInteger(outputs) || outputs < 0) throw new RangeError(`outputs must be a non-negative integer; got ${outputs}`);
  if (weights.length < count) throw new RangeError(`weights must hold ${count} values; got ${weights.length}`);
  if (values.length < count * stride) throw new RangeError(`values must hold ${count * stride} values; got ${values.length}`);
  for (let r = 0; r < count; r++) {
    if (!(weights[r] >= 0) || !Number.isFinite(weights[r])) throw new RangeError(`weights[${r}] must be finite and ≥ 0; got ${weights[r]}`);
  }
  const m = stride;
  // prefix[i] = Σ_{j<i}, suffix[i] = Σ_{j≥i}; slot m of each row holds the weight sum. Running
  // sums are compensated (Neumaier), so every stored partial sum is within ~1 ulp: the
  // bias correction multiplies leave-one-out rounding by R − 1 and would otherwise show it.
  const row = m + 1;
  const prefix = new Float64Array((count + 1) * row);
  const suffix = new Float64Array((count + 1) * row);
  const sum = new Float64Array(row);
  const comp = new Float64Array(row);
  const add = (j: number, term: number) => {
    const t = sum[j] + term;
    comp[j] += Math.abs(sum[j]) >= Math.abs(term) ? (sum[j] - t) + term : (term - t) + sum[j];
    sum[j] = t;
  };
  for (let r = 0; r < count; r++) {
    const w = weights[r];
    const v = r * m, b = (r + 1) * row;
    for (let j = 0; j < m; j++) add(j, w * values[v + j]);
    add(m, w);
    for (let j = 0; j <= m; j++) prefix[b + j] = sum[j] + comp[j];
  }
  sum.fill(0);
  comp.fill(0);
  for (let r = count - 1; r >= 0; r--) {
    const w = weights[r];
    const v = r * m, a = r * row;
    for (let j = 0; j < m; j++) add(j, w * values[v + j]);
    add(m, w);
    for (let j = 0; j <= m; j++) suffix[a + j] = sum[j] + comp[j];
  }

  const means = new Float64Array(m);
  const plain = new Float64Array(outputs);
  const total = prefix[count * row + m];
  for (let j = 0; j < m; j++) means[j] = prefix[count * row + j] / total;
  f(means, total / count, plain);

  const loo = new Float64Array(count * outputs);
  const out = new Float64Array(outputs);
  let degenerate = !(total > 0);
  for (let i = 0; i < count && !degenerate; i++) {
    const a = i * row, b = (i + 1) * row;
    const wsum = prefix[a + m] + suffix[b + m];
    if (!(wsum > 0)) { degenerate = true; break; }
    for (let j = 0; j < m; j++) means[j] = (prefix[a + j] + suffix[b + j]) / wsum;
    f(means, wsum / (count - 1), out);
    loo.set(out, i * outputs);
  }
  const estimate = new Float64Array(outputs);
  const stdError = new Float64Array(outputs);
  if (degenerate) {
    estimate.set(plain);
    stdError.fill(Infinity);
    return { estimate, plain, stdError };
  }
  for (let k = 0; k < outputs; k++) {
    // Deviations from θ̂ are accumulated, not the θ_(i) themselves: R·θ̂ − (R − 1)·θ̄ would
    // amplify the rounding of a plain sum of R values near θ̂ by a factor R.
    const p = plain[k];
    let dev = 0;
    for (let i = 0; i < count; i++) dev += loo[i * outputs + k] - p;
    dev /= count;
    let ss = 0;
    for (let i = 0; i < count; i++) {
      const d = loo[i * outputs + k] - p - dev;
      ss += d * d;
    }
    estimate[k] = p - (count - 1) * dev;
    stdError[k] = Math.sqrt(((count - 1) / count) * ss);
  }
  return { estimate, plain, stdError };
}
