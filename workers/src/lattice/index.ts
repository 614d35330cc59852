/** Lattice builders (public door of workers/src/lattice). */
export { buildLattice } from './build-lattice.js';
