/** Observables: series labels, the Pauli strings to measure, and series evaluation (public door). */
export { planSeries, seriesLabels, formatLabelNumber, distanceClasses } from './plan-series.js';
export type { SeriesPlanEntry, SeriesRecipe, PauliLetter } from './plan-series.js';
export { expandObservables, COS_ZERO } from './expand-observables.js';
export { evaluateSeries } from './evaluate-series.js';
export type { ObservableLayout, SeriesTerms } from './observable-layout.js';
