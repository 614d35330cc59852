/**
 * Seeded pseudorandom numbers: the public door of workers/src/random. Every random choice an
 * engine makes comes from here, keyed by (spec.seed, stream), so runs are reproducible and
 * streams (e.g. one per typicality sample) can be generated independently on any machine.
 */
export { Xoshiro128 } from './xoshiro128.js';
export { mix32 } from './mix32.js';
export { fillRandomPhaseVector } from './random-phase-vector.js';
