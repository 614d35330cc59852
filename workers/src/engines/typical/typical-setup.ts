/**
 * typicalSetup — the compiled operators of the typical engine on 2^N vectors.
 *
 *   imaginary time: H0 on [shift0 − a0, shift0 + a0]
 *   quench:         H1 on [shift1 − a1, shift1 + a1]      (a = Σ|w| over non-identity terms)
 * These rigorous bounds are also kept as h0Bound/h1Bound; a runner narrows h0Interval/h1Interval
 * to Lanczos estimates (typical-intervals.ts) and falls back to the bounds when a sample
 * detects a miss.
 * Only the physical generator H1 appears: the auxiliary half −1 ⊗ H1ᵀ of the doubled generator
 * rotates the auxiliary basis, which the sampled trace does not see (typical-engine.ts header).
 *
 * Tables: compileOperator's per-flip-group tables cost 16·2^N bytes each (a TFIM on 24 sites
 * has 24 groups: 6 GiB). Up to TABLE_SITES_MAX sites they are built (faster passes); above,
 * the kernels compute entries from the terms on the fly ({ tables: false }). The diagonal
 * (8·2^N bytes) is always tabulated.
 */
import type { SweepSpec } from '../../../../shared-types/src/index.js';
import { compileOperator } from '../../kernels/index.js';
import type { CompiledOperator } from '../../kernels/index.js';
import type { SpectralInterval } from '../../propagators/index.js';
import { pauliBatch } from './measure-pauli-batch.js';
import type { PauliBatch } from './measure-pauli-batch.js';
import { measuredPrimitives, typicalLayout } from './typical-layout.js';
import type { TypicalLayout } from './typical-layout.js';

/** Largest N at which flip-group tables are built (16·2^18 B = 4 MiB per group). */
export const TABLE_SITES_MAX = 18;

/** Largest lattice the typical engine runs (2^26 amplitudes: 1 GiB per vector). */
export const MAX_TYPICAL_SITES = 26;

/** Everything a sample needs: the layout plus compiled H0, H1 and the measurement batch. */
export interface TypicalSetup extends TypicalLayout {
  readonly dim: number;
  readonly h0Op: CompiledOperator;
  readonly h1Op: CompiledOperator;
  /** Chebyshev interval of H0 (the bound, or a narrower estimate: typical-intervals.ts). */
  readonly h0Interval: SpectralInterval;
  /** Chebyshev interval of H1 (as h0Interval). */
  readonly h1Interval: SpectralInterval;
  /** Rigorous spectral bound of H0: shift ± Σ|w|. */
  readonly h0Bound: SpectralInterval;
  /** Rigorous spectral bound of H1. */
  readonly h1Bound: SpectralInterval;
  /** Upper bound on H0's lowest eigenvalue, in h0Interval (h0Interval.hi when nothing better is known). */
  readonly h0Ground: number;
  /** The primitives some series uses, grouped by flip mask for one-pass measurement. */
  readonly batch: PauliBatch;
  /** Layout index of each string of `batch` (unused primitives are not measured; their value stays 0). */
  readonly measured: Int32Array;
  /** Whether flip-group tables were built. */
  readonly tables: boolean;
}

/** Whether the typical engine tabulates flip groups on N sites (see file header). */
export function usesTables(sites: number): boolean {
  return sites <= TABLE_SITES_MAX;
}

/**
 * Builds the setup of a spec.
 * @throws RangeError when the lattice has more than MAX_TYPICAL_SITES sites or cannot be built.
 */
export function typicalSetup(spec: SweepSpec): TypicalSetup {
  const base = typicalLayout(spec);
  if (base.sites > MAX_TYPICAL_SITES) {
    throw new RangeError(`the typical engine is limited to ${MAX_TYPICAL_SITES} sites; this lattice has ${base.sites}`);
  }
  const tables = usesTables(base.sites);
  const h0Op = compileOperator(base.h0, { tables });
  const h1Op = compileOperator(base.h1, { tables });
  const measured = measuredPrimitives(base.layout);
  const h0Bound = { lo: h0Op.shift - h0Op.normBound, hi: h0Op.shift + h0Op.normBound };
  const h1Bound = { lo: h1Op.shift - h1Op.normBound, hi: h1Op.shift + h1Op.normBound };
  return {
    ...base,
    dim: h0Op.dim,
    h0Op,
    h1Op,
    h0Interval: h0Bound,
    h1Interval: h1Bound,
    h0Bound,
    h1Bound,
    h0Ground: h0Bound.hi,
    batch: pauliBatch(Array.from(measured, (p) => base.layout.primitives[p]), h0Op.dim),
    measured,
    tables,
  };
}
