/**
 * The series engine: the public door of workers/src/engines/series.
 */
export { SeriesEngine } from './series-engine.js';
export type { SeriesEngineOptions } from './series-engine.js';
export { planSeriesEngine, MIN_THERMO_ORDER, MIN_QUENCH_ORDER, PLAN_RADIUS_FACTOR } from './plan-series-engine.js';
export type { SeriesPlanOptions, SeriesEnginePlan } from './plan-series-engine.js';
