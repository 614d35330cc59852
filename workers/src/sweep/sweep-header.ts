/** The header of a sweep: engine, grids, series labels and the plan. */
import type { SweepHeader, SweepPlan, SweepSpec } from '../../../shared-types/src/index.js';
import type { Engine } from '../engines/engine.js';
import { betaGrid } from './beta-grid.js';
import { timeGrid } from './time-grid.js';

export function sweepHeader(spec: SweepSpec, specHash: string, engine: Engine, plan: SweepPlan): SweepHeader {
  return {
    specHash,
    engine: { name: engine.name, version: engine.version },
    betas: betaGrid(spec),
    times: timeGrid(spec),
    series: engine.series(spec),
    plan,
  };
}
