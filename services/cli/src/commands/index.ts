/** Every CLI command, in the order `betasweep --help` lists them. */
import type { Command } from 'commander';
import { registerRun } from './run.js';
import { registerPlan } from './plan.js';
import { registerServe } from './serve.js';
import { registerWork } from './work.js';
import { registerToken } from './token.js';
import { registerSubmit } from './submit.js';
import { registerStatus } from './status.js';
import { registerWatch } from './watch.js';
import { registerFetch } from './fetch.js';
import { registerCheck } from './check.js';
import { registerCancel } from './cancel.js';
import { registerList } from './list.js';
import { registerClientConfig } from './client-config.js';
import { registerPlot } from './plot.js';

/** A command module registers one (or a group of) sub-command(s) on the program. */
export type RegisterCommand = (program: Command) => void;

export const commands: RegisterCommand[] = [
  // local, no server
  registerRun,
  registerPlan,
  // (run, plan are added by the lead; service commands by the service work)
  // service: server side
  registerServe,
  registerWork,
  registerToken,
  // service: lab-machine client
  registerSubmit,
  registerStatus,
  registerWatch,
  registerFetch,
  registerCheck,
  registerCancel,
  registerList,
  registerClientConfig,
  registerPlot,
];
