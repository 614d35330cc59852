/**
 * Benchmark fixture: the real branch processor with a typical engine that runs a fixed number
 * of samples per β (pilot = cap = BETASWEEP_BENCH_SAMPLES, default 16), so a service run
 * compares with the "16 samples" figure. Every other engine is the registry's.
 */
import { TypicalEngine } from '../../../workers/src/engines/typical/index.js';
import { createBranchProcessor, defaultEngineResolver } from '../../../workers/src/queue/index.js';

const samples = Number(process.env.BETASWEEP_BENCH_SAMPLES ?? 16);
const typical = new TypicalEngine({ maxSamples: samples, pilotSamples: samples });

export default createBranchProcessor({
  resolveEngine: async (spec) => {
    const base = await defaultEngineResolver(spec);
    return base.engine.name === 'typical' ? { ...base, engine: typical } : base;
  },
});
