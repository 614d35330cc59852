/** `betasweep plan SPEC.json`: validate a spec and print the engine's estimate, running nothing. */
import type { Command } from 'commander';
import { selectEngine } from '../../../../workers/src/sweep/index.js';
import { formatPlan } from '../format-plan.js';
import { loadSpec } from '../load-spec.js';

export function registerPlan(program: Command): void {
  program
    .command('plan')
    .description('validate a spec and print the cost estimate and accuracy (runs nothing)')
    .argument('<spec>', 'sweep spec JSON file')
    .option('--json', 'print the plan as JSON')
    .action(async (file: string, opts: { json?: boolean }) => {
      const { spec, hash } = await loadSpec(file).catch((err) => { process.exitCode = 2; throw err; });
      const { plan } = selectEngine(spec);
      process.stdout.write(opts.json ? JSON.stringify({ specHash: hash, plan }, null, 2) + '\n' : formatPlan(plan, hash) + '\n');
      if (!plan.feasible) process.exitCode = 3;
    });
}
