/**
 * Evaluates the series of an {@link ObservableLayout} from measured primitive expectations,
 * with first-order (worst-case, absolute) error propagation:
 *   value = c + Σ w·⟨P⟩ + Σ w·⟨A⟩⟨B⟩
 *   error = Σ |w|·δP + Σ |w|·(|⟨B⟩|·δA + |⟨A⟩|·δB + δA·δB)
 * The δA·δB term keeps the bound rigorous for products (|ab − a'b'| ≤ |b|δa + |a|δb + δaδb);
 * errors add linearly, not in quadrature, so the result is a bound, not a standard error.
 * Common practice (interval arithmetic).
 */
import type { ObservableLayout } from './observable-layout.js';

/**
 * Writes every series' value and error bound into `outValues[k]`, `outErrors[k]` (k = series index).
 * @throws RangeError if an input or output array is shorter than the layout needs.
 */
export function evaluateSeries(
  layout: ObservableLayout,
  primitiveValues: Float64Array,
  primitiveErrors: Float64Array,
  outValues: Float64Array | number[],
  outErrors: Float64Array | number[],
): void {
  const np = layout.primitives.length;
  if (primitiveValues.length < np) throw new RangeError(`evaluateSeries: primitiveValues has ${primitiveValues.length} entries, needs ${np}`);
  if (primitiveErrors.length < np) throw new RangeError(`evaluateSeries: primitiveErrors has ${primitiveErrors.length} entries, needs ${np}`);
  const ns = layout.series.length;
  if (outValues.length < ns) throw new RangeError(`evaluateSeries: outValues has ${outValues.length} entries, needs ${ns}`);
  if (outErrors.length < ns) throw new RangeError(`evaluateSeries: outErrors has ${outErrors.length} entries, needs ${ns}`);
  for (let k = 0; k < ns; k++) {
    const s = layout.series[k];
    let v = s.constant;
    let e = 0;
    for (const [p, w] of s.linear) {
      v += w * primitiveValues[p];
      e += Math.abs(w) * primitiveErrors[p];
    }
    for (const [a, b, w] of s.quadratic) {
      const va = primitiveValues[a];
      const vb = primitiveValues[b];
      const ea = primitiveErrors[a];
      const eb = primitiveErrors[b];
      v += w * va * vb;
      e += Math.abs(w) * (Math.abs(vb) * ea + Math.abs(va) * eb + ea * eb);
    }
    outValues[k] = v;
    outErrors[k] = e;
  }
}
