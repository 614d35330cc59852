/** Public door of the sweep runner (used by the CLI and by the queue processors). */
export { parseSweepSpec, type ParsedSweepSpec } from './parse-sweep-spec.js';
export { selectEngine, ENGINES } from './select-engine.js';
export { sweepHeader } from './sweep-header.js';
export { ResultAssembler, type PointRef } from './result-assembler.js';
export { runSweep, localThreads, MIN_THREADED_SECONDS, type SweepSink, type RunSweepOptions } from './run-sweep.js';
export { resultToCsv } from './result-csv.js';
export { timeGrid } from './time-grid.js';
export { betaGrid } from './beta-grid.js';
export { SpecInvalidError } from './errors/spec-invalid-error.js';
export { SweepRefusedError } from './errors/sweep-refused-error.js';
