/**
 * High-temperature and short-time series (public door of workers/src/series): Pauli-string
 * algebra on any number of sites, thermal moments and cumulants, quench double series, linked
 * clusters, Padé resummation with truncation estimates, and the sweep check report.
 */
export { PauliTable } from './pauli-table.js';
export { multiplyTables } from './multiply-tables.js';
export type { MultiplyOptions } from './multiply-tables.js';
export { traceProduct } from './trace-product.js';
export {
  BITS_PER_WORD, wordsForSites, popcount32, letterCode, letterOf, writeMask, maskToWord, maskSupport,
} from './pauli-masks.js';
export type { LetterCode } from './pauli-masks.js';
export { hamiltonianPowers, powerMoments, mixedMoments } from './thermal-moments.js';
export type { HamiltonianPowers } from './thermal-moments.js';
export { lnZSeries, expectationSeries } from './thermal-series.js';
export {
  seriesLog, seriesDivide, seriesMultiply, sumSeries, seriesDerivative, ROUNDING_UNIT,
} from './power-series.js';
export type { TrackedSeries } from './power-series.js';
export { quenchSeries } from './quench-series.js';
export type { QuenchSeriesInput } from './quench-series.js';
export { emptyDoubleSeries, thermalColumn, thermalColumnMagnitude, multiplyFlatDouble } from './double-series.js';
export type { DoubleSeries } from './double-series.js';
export { buildLocalModel, maxTermSupport } from './local-terms.js';
export type { LocalModel, LocalTerm } from './local-terms.js';
export { enumerateConnectedSets } from './enumerate-connected-sets.js';
export type { EnumerateOptions } from './enumerate-connected-sets.js';
export { ClusterExpansion } from './cluster-expansion.js';
export type { ClusterExpansionOptions, ClusterStats, SitePauli } from './cluster-expansion.js';
export { pointGroupOf } from './point-groups.js';
export type { PlaneMap } from './point-groups.js';
export { latticeCells, cellCoordinates, siteOfCell, translateSite, centralCell } from './lattice-cells.js';
export type { LatticeCells } from './lattice-cells.js';
export { siteOrbitRepresentatives, canonicalTranslate } from './site-orbits.js';
export { expandSeriesObservables } from './series-observables.js';
export type { SeriesCombination, SeriesObservables } from './series-observables.js';
export {
  computeSweepSeries, chooseSeriesMethod, infiniteLatticeLnZ, translationInvariantLongerThan, WHOLE_CLUSTER_MAX_SITES,
} from './compute-sweep-series.js';
export type { SweepSeries, SweepSeriesOptions, LabelSeries, SeriesKind, SeriesMethod } from './compute-sweep-series.js';
export { padeApproximant, evaluatePade, padeDenominator, SINGULAR_PIVOT } from './pade.js';
export type { PadeApproximant } from './pade.js';
export {
  resumSeries, seriesShape, TAIL_SAFETY, SHORT_SERIES_SAFETY, PADE_SAFETY, PADE_FLOOR, PADE_REACH, MIN_PADE_AGREE, ROOT_TERMS,
} from './resum-series.js';
export type { ResumOptions, SeriesEstimate } from './resum-series.js';
export { thermoAt, seriesAt, scaledCoefficients, localEnergyScale, FALLBACK_RADIUS_FACTOR } from './evaluate-sweep-series.js';
export type { ThermoEstimate } from './evaluate-sweep-series.js';
export { estimateSeriesCost, momentWork, quenchWork, SECONDS_PER_PRODUCT } from './estimate-series-cost.js';
export type { SeriesCostEstimate } from './estimate-series-cost.js';
export { symmetryZero } from './symmetry-zeros.js';
export type { SymmetryZero } from './symmetry-zeros.js';
export { checkReport, checkVerdict, ROUNDING_FLOOR } from './check-report.js';
export type { CheckReport, CheckEntry, CheckVerdict, CheckReportOptions } from './check-report.js';
