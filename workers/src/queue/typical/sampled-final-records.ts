/**
 * The final records of a sampled sweep, from its stored samples: every branch's rounds are
 * replayed (they must all be final) and estimated on exactly the samples the local run uses,
 * so the assembled result equals `betasweep run`'s for the same spec and seed.
 */
import type { JobStore } from '../../store/index.js';
import { SweepIncompleteError } from '../errors/sweep-incomplete-error.js';
import type { FinalRecords, FinalRecordSource } from '../finalize-sweep.js';
import { SampledBranch, type SampledEngine } from './sampled-branch.js';

/** A finalize record source for sweeps of a sampled engine (see file header). */
export function sampledFinalRecords(store: JobStore, engine: SampledEngine): FinalRecordSource {
  return async (record) => {
    const out: FinalRecords = { thermo: [], points: [], diagnostics: [] };
    for (const [index, betaIndices] of record.plan.branches.entries()) {
      const branch = new SampledBranch(store, record.id, index, record.spec, engine, betaIndices);
      const replay = await branch.replay();
      const est = replay.final ? branch.estimates(replay, replay.targets.length) : null;
      if (!est) {
        const target = replay.targets[replay.targets.length - 1];
        throw new SweepIncompleteError(`branch ${index} reported done but holds ${replay.stored} of the ${target} samples of round ${replay.targets.length}`);
      }
      out.thermo.push(...est.thermo);
      out.points.push(...est.points);
      out.diagnostics.push(...est.diagnostics);
    }
    return out;
  };
}
