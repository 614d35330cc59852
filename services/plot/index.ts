/** Public door of the figure building shared by the dashboard and `betasweep plot`. */
export { buildFigures, plotDataFromResult, BAND_MIN_FRACTION, THERMO_QUANTITIES, TREND_COLOUR } from './figure-model.js';
export type { Figure, FigureLine, FigureMarker, FigureCheck, LegendEntry, PlotData, BuildFiguresOptions } from './figure-model.js';
export { CheckReportBody, CheckEntryBody, CheckVerdictBody, CHECK_UNAVAILABLE, usableCheck } from './check-report-body.js';
export { renderFigureSvg, renderFiguresSvg, escapeXml, SVG_FONT, type RenderSvgOptions } from './render-figure-svg.js';
export { figureCsv, figureFileStem } from './figure-csv.js';
export { temperatureColours, temperatureColourAt, parseHexColour, TEMPERATURE_STOPS } from './temperature-scale.js';
export { formatBeta, formatNumber, plainNumber } from './format-number.js';
export { describeSeries } from './describe-series.js';
