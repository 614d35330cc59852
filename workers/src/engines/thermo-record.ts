/**
 * thermoRecord — the ThermoRecord of one β from what an engine measures (ln Z, E, C and their
 * absolute errors); the rest follows from DESIGN.md §2:
 *   F = −ln Z/β (null at β = 0),  S = β(E − F) = ln Z + βE (finite at β = 0),
 *   |ΔF| = |Δ ln Z|/β,  |ΔS| ≤ |Δ ln Z| + β|ΔE|.
 * β ≥ 0 (the spec's β grid).
 */
import type { ThermoRecord } from '../../../shared-types/src/index.js';

/** What an engine measures at one β (see the file header). */
export interface MeasuredThermo {
  /** Index into the β grid. */
  readonly betaIndex: number;
  /** The inverse temperature (≥ 0). */
  readonly beta: number;
  /** Number of sites N. */
  readonly sites: number;
  /** ln Z, Z = Tr e^{−βH0}. */
  readonly lnZ: number;
  /** E = ⟨H0⟩_β. */
  readonly energy: number;
  /** C = β²(⟨H0²⟩ − ⟨H0⟩²). */
  readonly heatCapacity: number;
  /** Absolute error estimates of lnZ, energy and heatCapacity. */
  readonly errors: { readonly lnZ: number; readonly energy: number; readonly heatCapacity: number };
}

/** The full record at one β, F and S derived with their errors (see the file header). */
export function thermoRecord(m: MeasuredThermo): ThermoRecord {
  const { betaIndex, beta, lnZ, energy, heatCapacity, errors: e } = m;
  return {
    betaIndex,
    beta,
    lnZ,
    energy,
    heatCapacity,
    freeEnergy: beta === 0 ? null : -lnZ / beta,
    entropy: lnZ + beta * energy,
    errors: {
      lnZ: e.lnZ,
      energy: e.energy,
      heatCapacity: e.heatCapacity,
      freeEnergy: beta === 0 ? null : e.lnZ / beta,
      entropy: e.lnZ + beta * e.energy,
    },
    sites: m.sites,
  };
}
