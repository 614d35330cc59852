/**
 * The `betasweep` command line. Each command lives in its own file under commands/ and
 * registers itself on the program; this file only assembles them.
 */
import { Command } from 'commander';
import { commands } from './commands/index.js';

const program = new Command();
program
  .name('betasweep')
  .description('Finite-temperature quench sweeps of spin-1/2 lattices (thermofield double)')
  .version('0.1.0')
  .showHelpAfterError();

for (const register of commands) register(program);

program.parseAsync(process.argv).catch((err: unknown) => {
  const message = err instanceof Error ? err.message : String(err);
  process.stderr.write(`betasweep: ${message}\n`);
  process.exitCode = process.exitCode || 1;
});
