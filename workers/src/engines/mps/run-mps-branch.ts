/**
 * runMpsBranch — one branch of the mps engine: the β indices in ascending β, the thermal state
 * carried upward in β (mps-engine.ts describes the physics).
 *
 * Per β: imaginary time from the previous β (the state and its half-step copy), a 'thermal'
 * checkpoint, thermodynamics and the stationarity residual, then the quench on a copy (on the
 * state itself for the last β) with a 'quench' checkpoint after a grid time whenever
 * `checkpoints.intervalSeconds` of wall time have passed since the last save
 * (mps-checkpoint.ts). A retried branch starts from the checkpoint when loadResumePoint
 * accepts it (mps-resume.ts): a 'thermal' one skips the imaginary time below its β, a 'quench'
 * one also the grid times already done; the values are those of the uninterrupted run (same
 * steps from the same state). Points below `resumeFrom[β]` are computed but not emitted.
 */
import type { BranchOptions, BranchSink } from '../engine.js';
import { abortError } from './abort-error.js';
import { createGateWorkspace } from './apply-gate.js';
import type { AuxiliaryMode } from './bond-gates.js';
import { emptyStats, type EvolveWorkspace } from './evolve-stages.js';
import { localMpo, type LegCopy, type LocalMpo } from './local-mpo.js';
import { createMoveWorkspace } from './move-center.js';
import { mpoSquareNorm } from './mpo-square-norm.js';
import { encodeCheckpoint, type MpsCheckpointState, type ThermalCarry, type ThermalSummary } from './mps-checkpoint.js';
import { mpsDiagnostics } from './mps-diagnostics.js';
import { MpsMeasurement } from './mps-measurement.js';
import { loadResumePoint } from './mps-resume.js';
import type { MpsSetup } from './mps-setup.js';
import { mpsThermo } from './mps-thermo.js';
import { cloneMps, identityPurification, type PurifiedMps } from './purified-mps.js';
import { runMpsQuench, type QuenchProgress } from './run-mps-quench.js';
import { runChunked, stepsFor, TrotterPropagator } from './trotter-propagator.js';

/** Inputs of {@link runMpsBranch}. */
export interface MpsBranchInput {
  readonly setup: MpsSetup;
  readonly auxiliary: AuxiliaryMode;
  /** The branch's β indices, ascending in β, without repeats. */
  readonly order: readonly number[];
  readonly sink: BranchSink;
  readonly options: BranchOptions;
}

/** K = H1 ⊗ 1 plus the auxiliary part of the mode, as an MPO, when H1 = H0 (else null). */
function stationarityMpo(setup: MpsSetup, auxiliary: AuxiliaryMode): LocalMpo | null {
  if (!setup.h1EqualsH0) return null;
  const copies: LegCopy[] = [{ leg: 'physical', sign: 1, transposed: false }];
  if (auxiliary !== 'none') copies.push({ leg: 'auxiliary', sign: -1, transposed: auxiliary !== 'plain' });
  return localMpo(setup.h1Terms, setup.graph.sites, copies);
}

/** Thermodynamics of the thermal state at β (emitted) and what the diagnostics need. */
function thermalStep(
  setup: MpsSetup, measurement: MpsMeasurement, carry: ThermalCarry, beta: number, betaIndex: number,
  sink: BranchSink, kMpo: LocalMpo | null,
): ThermalSummary {
  const values = new Float64Array(setup.strings.length);
  const halfValues = new Float64Array(setup.strings.length);
  const factor = 1 / (1 - 2 ** -setup.settings.order);
  const maxImag = measurement.measure(carry.state, values);
  measurement.measure(carry.half, halfValues);
  let trotter = 0;
  for (let p = 0; p < setup.layout.primitives.length; p++) trotter = Math.max(trotter, factor * Math.abs(values[p] - halfValues[p]));
  sink.thermo(mpsThermo(setup, beta, betaIndex, { state: carry.state, values, lnNorm: carry.stats.lnNorm },
    { state: carry.half, values: halfValues, lnNorm: carry.halfStats.lnNorm }, setup.settings.order, carry.stats.discardedSum));
  const stationarityResidual = kMpo === null ? null : Math.sqrt(Math.max(0, mpoSquareNorm(carry.state, kMpo)));
  return { stats: { ...carry.stats }, trotter, stationarityResidual, maxImag };
}

/** Runs the branch (see the file header). Rejects with an AbortError when the signal fires. */
export async function runMpsBranch(input: MpsBranchInput): Promise<void> {
  const { setup, auxiliary, order, sink } = input;
  const { signal, resumeFrom = {}, checkpoints } = input.options;
  const { betas, settings, graph, times } = setup;
  const L = graph.sites;
  const timeCount = times.length;
  const truncation = { maxBond: settings.maxBond, maxWeight: settings.truncation };
  const imag = new TrotterPropagator(setup.m0, { kind: 'imaginary' }, settings.order, truncation);
  const real = new TrotterPropagator(setup.m1, { kind: 'real', auxiliary }, settings.order, truncation, setup.m0);
  const move = createMoveWorkspace();
  const ws: EvolveWorkspace = { gate: createGateWorkspace(), move };
  const measurement = new MpsMeasurement(setup.strings, L, move);
  const kMpo = stationarityMpo(setup, auxiliary);

  const start = await loadResumePoint(checkpoints, { sites: L, betas, order, timeCount, resumeFrom });
  const c = start.checkpoint;
  const carry: ThermalCarry = c?.carry
    ?? { state: identityPurification(L), stats: emptyStats(), half: identityPurification(L), halfStats: emptyStats() };
  let currentBeta = c === null ? 0 : c.beta;
  const k0 = c === null ? 0 : order.indexOf(c.betaIndex);
  let lastSave = performance.now();
  const save = async (state: MpsCheckpointState) => {
    await checkpoints!.save(encodeCheckpoint(state));
    lastSave = performance.now();
  };

  for (let k = k0; k < order.length; k++) {
    await new Promise<void>((resolve) => setImmediate(resolve));
    if (signal?.aborted) throw abortError(signal);
    const betaIndex = order[k];
    const beta = betas[betaIndex];
    const last = k === order.length - 1;
    let saved = 0;
    let resumedFrom = 'start';
    let imaginaryUpdatesRun = 0;
    let thermal: ThermalSummary;
    let quench: PurifiedMps;
    let resume: QuenchProgress | undefined;
    if (k === k0 && c?.kind === 'quench') {
      ({ thermal, quench } = c);
      resume = c.progress;
      resumedFrom = `quench:t=${resume.nextTimeIndex}`;
    } else {
      if (k === k0 && c?.kind === 'thermal') resumedFrom = 'thermal';
      else {
        const before = carry.stats.gates + carry.halfStats.gates;
        const span = (beta - currentBeta) / 2;
        const n = stepsFor(span, settings.dt);
        if (n > 0) {
          await runChunked(imag, carry.state, n, span / n, ws, carry.stats, signal, abortError);
          await runChunked(imag, carry.half, 2 * n, span / (2 * n), ws, carry.halfStats, signal, abortError);
          currentBeta = beta;
        }
        imaginaryUpdatesRun = carry.stats.gates + carry.halfStats.gates - before;
        if (checkpoints !== undefined) {
          await save({ kind: 'thermal', betaIndex, beta, sites: L, timeCount, carry });
          saved++;
        }
      }
      thermal = thermalStep(setup, measurement, carry, beta, betaIndex, sink, kMpo);
      quench = last ? carry.state : cloneMps(carry.state);
    }
    const skipBelow = resumeFrom[betaIndex] ?? 0;
    const q = await runMpsQuench({
      setup, prop: real, measurement, ws, state: quench, dt: settings.dt, resume,
      thermalDiscarded: thermal.stats.discardedSum, thermalGates: thermal.stats.gates, thermalTrotter: thermal.trotter, signal,
      onPoint(timeIndex, v, e) {
        if (timeIndex < skipBelow) return;
        sink.point({ betaIndex, timeIndex, values: Array.from(v), errors: Array.from(e) });
      },
      afterPoint: checkpoints === undefined ? undefined : async (_ti, snapshot) => {
        if (performance.now() - lastSave < checkpoints.intervalSeconds * 1000) return;
        await save({ kind: 'quench', betaIndex, beta, sites: L, timeCount, thermal, progress: snapshot(), quench, carry: last ? null : carry });
        saved++;
      },
    });
    sink.diagnostics(mpsDiagnostics(betaIndex, thermal, q, settings, auxiliary, {
      resumedFrom, checkpointIgnored: k === k0 ? start.ignored : '', imaginaryUpdatesRun,
      realUpdatesRun: q.stats.gates - (resume?.stats.gates ?? 0), checkpointsSaved: saved,
    }));
  }
}
