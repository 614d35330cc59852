/** Child-process entry of `npm run bench`: runs one bench module and prints its records as JSON. */
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';
import type { BenchRecord } from './bench-record.js';

const file = process.argv[2];
if (!file) throw new Error('usage: run-one.ts <bench file>');
const mod = (await import(pathToFileURL(resolve(file)).href)) as { run?: () => Promise<BenchRecord[]> };
if (typeof mod.run !== 'function') throw new Error(`${file} exports no run()`);
const records = await mod.run();
process.stdout.write(`\n@@records ${JSON.stringify(records)}\n`);
