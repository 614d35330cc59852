/**
 * Schema-level limits: what any spec may ask for, whatever the engine. Engines refuse work
 * beyond their own reach in their plan step (with the estimate that refused it).
 */
export const LIMITS = {
  /** Sites of any lattice (the series engine works on large clusters). */
  maxSites: 4096,
  /** Unit cells along one direction. */
  maxExtent: 4096,
  maxBonds: 100_000,
  /** Terms of an explicit Pauli-sum Hamiltonian. */
  maxTerms: 20_000,
  maxBetas: 64,
  maxBeta: 1000,
  maxTime: 1e4,
  maxTimePoints: 10_001,
  maxObservables: 64,
  maxPairs: 10_000,
  maxMomenta: 256,
} as const;
