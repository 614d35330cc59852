/**
 * Build of the dashboard: `npm run build:dashboard` (or buildDashboard() in build-dashboard.ts)
 * bundles src/ with its libraries (uPlot, Observable Plot, zod and the shared spec schemas)
 * into dist/, which the API serves at `/`. Nothing is fetched from elsewhere at run time.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

export default defineConfig({
  root: fileURLToPath(new URL('.', import.meta.url)),
  base: '/',
  logLevel: 'warn',
  clearScreen: false,
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    assetsDir: 'assets',
    sourcemap: false,
    // One page with two plotting libraries: a single bundle of ~0.5 MB is expected.
    chunkSizeWarningLimit: 1500,
    // Every asset is a file under /assets (the API's content-security policy allows no inline code).
    assetsInlineLimit: 0,
  },
});
