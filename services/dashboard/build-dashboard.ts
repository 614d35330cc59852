/**
 * Builds the dashboard into services/dashboard/dist with vite. `dist/` is not committed: the
 * browser test builds it before it starts, and `betasweep serve` builds it at start when it is
 * missing (vite is a development dependency: without it the API runs and `/` says how to build).
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The dashboard's folder. */
export const DASHBOARD_ROOT = fileURLToPath(new URL('.', import.meta.url));
/** Where the build goes (the API serves it). */
export const DASHBOARD_DIST = fileURLToPath(new URL('./dist/', import.meta.url));
const CONFIG = fileURLToPath(new URL('./vite.config.ts', import.meta.url));

/** True when dist/index.html exists. */
export function dashboardBuilt(): boolean {
  return existsSync(`${DASHBOARD_DIST}index.html`);
}

/** Runs the vite build (tens of seconds on a busy machine). */
export async function buildDashboard(): Promise<void> {
  const { build } = await import('vite');
  await build({ configFile: CONFIG, logLevel: 'warn' });
}

/**
 * Builds the dashboard unless it is built already. Returns what happened; never throws (a
 * failed build leaves the API serving its "not built" page).
 */
export async function ensureDashboardBuilt(log: (line: string) => void = () => undefined): Promise<'present' | 'built' | 'unavailable'> {
  if (dashboardBuilt()) return 'present';
  try {
    log('building the dashboard (services/dashboard/dist is missing)…');
    await buildDashboard();
    return 'built';
  } catch (err) {
    log(`could not build the dashboard (${(err as Error).message.split('\n')[0]}); the API runs without it — run \`npm run build:dashboard\``);
    return 'unavailable';
  }
}
