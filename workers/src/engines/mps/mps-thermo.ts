/**
 * mpsThermo — thermodynamics at one β from the purified MPS ψ(β) ∝ (e^{−βH0/2} ⊗ 1)|I⟩ and its
 * half-step copy ψ'(β) (same evolution with dt/2):
 *
 *   ln Z = L ln 2 + 2·lnNorm − β·c      (lnNorm of the gates' norm growth; c = H0's constant)
 *   E = ⟨H0⟩ = c + Σ w⟨P⟩,  C = β²·‖(H0 − E)ψ‖² (mpoSquareNorm: no cancellation),
 *   F = −ln Z/β (null at β = 0),  S = ln Z + βE.
 * Error estimates (not bounds): Trotter part |X − X'|/(1 − 2^{−p}) for X = ln Z, E, C (step
 * doubling); truncation part with W = Σ relative discarded weight: ln Z: 2W (each truncation
 * lowers ‖ψ‖² by its weight), E: 2a√W, C: 4β²a²√W, a = Σ|w| of H0 (≥ ‖H0 − c‖).
 */
import type { ThermoRecord } from '../../../../shared-types/src/index.js';
import { localMpo } from './local-mpo.js';
import { mpoSquareNorm } from './mpo-square-norm.js';
import type { MpsSetup } from './mps-setup.js';
import { sumOf } from './mps-measurement.js';
import type { PurifiedMps } from './purified-mps.js';

/** One state with its measured strings and the log of its norm growth. */
export interface ThermalSample {
  readonly state: PurifiedMps;
  readonly values: Float64Array;
  readonly lnNorm: number;
}

/** Energy variance ‖(H0 − E)ψ‖² of a normalised state. */
export function energyVariance(setup: MpsSetup, state: PurifiedMps, energy: number): number {
  const mpo = localMpo(setup.h0Terms, setup.graph.sites, [{ leg: 'physical', sign: 1, transposed: false }], -energy);
  return Math.max(0, mpoSquareNorm(state, mpo));
}

/** The thermo record (see the file header). */
export function mpsThermo(
  setup: MpsSetup, beta: number, betaIndex: number, main: ThermalSample, half: ThermalSample,
  order: number, discarded: number,
): ThermoRecord {
  const L = setup.graph.sites;
  const c = setup.energy0.constant;
  const lnZ = L * Math.LN2 + 2 * main.lnNorm - beta * c;
  const lnZh = L * Math.LN2 + 2 * half.lnNorm - beta * c;
  const energy = sumOf(setup.energy0, main.values);
  const energyH = sumOf(setup.energy0, half.values);
  const heat = beta === 0 ? 0 : beta * beta * energyVariance(setup, main.state, energy);
  const heatH = beta === 0 ? 0 : beta * beta * energyVariance(setup, half.state, energyH);
  const f = 1 / (1 - 2 ** -order);
  const a = setup.energy0.normBound;
  const root = Math.sqrt(discarded);
  const eLnZ = f * Math.abs(lnZ - lnZh) + 2 * discarded + 1e-14 * Math.abs(lnZ);
  const eE = f * Math.abs(energy - energyH) + 2 * a * root + 1e-14 * a;
  const eC = f * Math.abs(heat - heatH) + 4 * beta * beta * a * a * root;
  return {
    betaIndex, beta, lnZ, energy, heatCapacity: heat,
    freeEnergy: beta === 0 ? null : -lnZ / beta,
    entropy: lnZ + beta * energy,
    errors: {
      lnZ: eLnZ, energy: eE, heatCapacity: eC,
      freeEnergy: beta === 0 ? null : eLnZ / beta,
      entropy: eLnZ + beta * eE,
    },
    sites: L,
  };
}
